package corpus.leak.fitontest;

import ai.djl.basicdataset.cv.classification.Mnist;
import ai.djl.training.EasyTrain;
import ai.djl.training.Trainer;
import ai.djl.training.dataset.Dataset;
import ai.djl.translate.TranslateException;
import java.io.IOException;

/** DJL: the dataset built for Usage.TEST is the one trained on. */
class DjlTrainedOnTestUsage {
  void train(Trainer trainer) throws IOException, TranslateException {
    Mnist digitsTest = Mnist.builder().optUsage(Dataset.Usage.TEST).setSampling(64, false).build();
    Mnist digitsTrain = Mnist.builder().optUsage(Dataset.Usage.TRAIN).setSampling(64, false).build();
    EasyTrain.fit(trainer, 3, digitsTest, digitsTrain); // expect: leak.fit-on-test
  }

  void trainCorrectly(Trainer trainer) throws IOException, TranslateException {
    Mnist digitsTest = Mnist.builder().optUsage(Dataset.Usage.TEST).setSampling(64, false).build();
    Mnist digitsTrain = Mnist.builder().optUsage(Dataset.Usage.TRAIN).setSampling(64, false).build();
    EasyTrain.fit(trainer, 3, digitsTrain, null); // clean: leak.fit-on-test
    EasyTrain.evaluateDataset(trainer, digitsTest); // clean: leak.fit-on-test
  }
}
