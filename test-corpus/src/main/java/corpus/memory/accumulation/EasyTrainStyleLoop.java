package corpus.memory.accumulation;

import ai.djl.ndarray.NDArray;
import ai.djl.training.EasyTrain;
import ai.djl.training.Trainer;
import ai.djl.training.dataset.Batch;
import ai.djl.training.dataset.Dataset;
import ai.djl.translate.TranslateException;
import java.io.IOException;
import java.util.ArrayList;
import java.util.List;

/** EasyTrain-style epoch: each batch closes its manager, so arrays from it cannot be kept. */
class EasyTrainStyleLoop {
  List<NDArray> epochKeepingPredictions(Trainer trainer, Dataset train) throws IOException, TranslateException {
    List<NDArray> predictions = new ArrayList<>();
    for (Batch batch : trainer.iterateDataset(train)) {
      EasyTrain.trainBatch(trainer, batch);
      trainer.step();
      NDArray scores = trainer.evaluate(batch.getData()).singletonOrThrow();
      predictions.add(scores); // expect: memory.graph-accumulation
      batch.close();
    }
    return predictions;
  }

  List<float[]> epochKeepingValues(Trainer trainer, Dataset train) throws IOException, TranslateException {
    List<float[]> predictions = new ArrayList<>();
    for (Batch batch : trainer.iterateDataset(train)) {
      EasyTrain.trainBatch(trainer, batch);
      trainer.step();
      NDArray scores = trainer.evaluate(batch.getData()).singletonOrThrow();
      predictions.add(scores.toFloatArray()); // clean: memory.graph-accumulation
      batch.close();
    }
    return predictions;
  }

  float epochScoringEachBatch(Trainer trainer, Dataset train) throws IOException, TranslateException {
    List<NDArray> pending = new ArrayList<>();
    float sum = 0f;
    for (Batch batch : trainer.iterateDataset(train)) {
      EasyTrain.trainBatch(trainer, batch);
      trainer.step();
      pending.add(trainer.evaluate(batch.getData()).singletonOrThrow()); // clean: memory.graph-accumulation
      for (NDArray scores : pending) {
        sum += scores.sum().getFloat();
      }
      pending.clear();
      batch.close();
    }
    return sum;
  }

  float epochReadingAccumulator(Trainer trainer, Dataset train) throws IOException, TranslateException {
    for (Batch batch : trainer.iterateDataset(train)) { // clean: memory.scope-escape
      EasyTrain.trainBatch(trainer, batch);
      trainer.step();
      batch.close();
    }
    return trainer.getLoss().getAccumulator("train_all"); // clean: memory.graph-accumulation
  }
}
