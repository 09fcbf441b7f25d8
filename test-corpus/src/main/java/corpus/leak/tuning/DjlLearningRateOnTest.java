package corpus.leak.tuning;

import ai.djl.Model;
import ai.djl.basicdataset.cv.classification.Mnist;
import ai.djl.training.DefaultTrainingConfig;
import ai.djl.training.EasyTrain;
import ai.djl.training.Trainer;
import ai.djl.training.dataset.Dataset;
import ai.djl.training.loss.Loss;
import ai.djl.training.optimizer.Optimizer;
import ai.djl.training.tracker.Tracker;
import ai.djl.translate.TranslateException;
import java.io.IOException;

/** DJL: each learning rate is validated on the test usage and the best one kept (defect). */
class DjlLearningRateOnTest {
  float searchOnTest(Model model) throws IOException, TranslateException {
    Mnist training = Mnist.builder().optUsage(Dataset.Usage.TRAIN).setSampling(64, false).build();
    Mnist testing = Mnist.builder().optUsage(Dataset.Usage.TEST).setSampling(64, false).build();
    float bestLoss = Float.MAX_VALUE;
    float bestRate = 0;
    for (float rate : new float[] {0.01f, 0.003f, 0.001f}) {
      DefaultTrainingConfig config = new DefaultTrainingConfig(Loss.softmaxCrossEntropyLoss())
          .optOptimizer(Optimizer.adam().optLearningRateTracker(Tracker.fixed(rate)).build());
      try (Trainer trainer = model.newTrainer(config)) {
        EasyTrain.fit(trainer, 2, training, testing); // expect: leak.test-in-tuning
        float loss = trainer.getTrainingResult().getValidateLoss();
        if (loss < bestLoss) {
          bestLoss = loss;
          bestRate = rate;
        }
      }
    }
    return bestRate;
  }

  float searchOnValidation(Model model) throws IOException, TranslateException {
    Mnist training = Mnist.builder().optUsage(Dataset.Usage.TRAIN).setSampling(64, false).build();
    Mnist validation = Mnist.builder().optUsage(Dataset.Usage.VALIDATION).setSampling(64, false).build();
    float bestLoss = Float.MAX_VALUE;
    float bestRate = 0;
    for (float rate : new float[] {0.01f, 0.003f, 0.001f}) {
      DefaultTrainingConfig config = new DefaultTrainingConfig(Loss.softmaxCrossEntropyLoss())
          .optOptimizer(Optimizer.adam().optLearningRateTracker(Tracker.fixed(rate)).build());
      try (Trainer trainer = model.newTrainer(config)) {
        EasyTrain.fit(trainer, 2, training, validation); // clean: leak.test-in-tuning
        float loss = trainer.getTrainingResult().getValidateLoss();
        if (loss < bestLoss) {
          bestLoss = loss;
          bestRate = rate;
        }
      }
    }
    return bestRate;
  }
}
