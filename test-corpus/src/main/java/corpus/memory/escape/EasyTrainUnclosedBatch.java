package corpus.memory.escape;

import ai.djl.training.EasyTrain;
import ai.djl.training.Trainer;
import ai.djl.training.dataset.Batch;
import ai.djl.training.dataset.Dataset;
import ai.djl.translate.TranslateException;
import java.io.IOException;

/** EasyTrain-style epochs: every batch owns a manager that only close() releases. */
class EasyTrainUnclosedBatch {
  void fit(Trainer trainer, Dataset train, int epochs) throws IOException, TranslateException {
    for (int epoch = 0; epoch < epochs; epoch++) {
      for (Batch batch : trainer.iterateDataset(train)) { // expect: memory.scope-escape
        EasyTrain.trainBatch(trainer, batch);
        trainer.step();
      }
    }
  }

  void fitClosing(Trainer trainer, Dataset train, int epochs) throws IOException, TranslateException {
    for (int epoch = 0; epoch < epochs; epoch++) {
      for (Batch batch : trainer.iterateDataset(train)) { // clean: memory.scope-escape
        try {
          EasyTrain.trainBatch(trainer, batch);
          trainer.step();
        } finally {
          batch.close();
        }
      }
    }
  }

  void fitWithHelper(Trainer trainer, Dataset train) throws IOException, TranslateException {
    for (Batch batch : trainer.iterateDataset(train)) { // clean: memory.scope-escape
      trainAndRelease(trainer, batch);
    }
  }

  void fitWithBatchAsResource(Trainer trainer, Dataset train) throws IOException, TranslateException {
    for (Batch batch : trainer.iterateDataset(train)) { // clean: memory.scope-escape
      try (batch) {
        EasyTrain.trainBatch(trainer, batch);
        trainer.step();
      }
    }
  }

  private void trainAndRelease(Trainer trainer, Batch batch) {
    EasyTrain.trainBatch(trainer, batch);
    trainer.step();
    batch.close();
  }
}
