package corpus.memory.accumulation;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDList;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;
import ai.djl.training.GradientCollector;
import ai.djl.training.Trainer;
import ai.djl.training.dataset.Batch;
import ai.djl.training.dataset.Dataset;
import ai.djl.translate.TranslateException;
import java.io.IOException;

/** An in-place sum inside the gradient scope chains every batch's graph into one tensor. */
class InPlaceEpochSum {
  NDArray sumLosses(Trainer trainer, Dataset data, NDManager manager) throws IOException, TranslateException {
    NDArray epochLoss = manager.zeros(new Shape());
    for (Batch batch : trainer.iterateDataset(data)) {
      try (GradientCollector collector = trainer.newGradientCollector()) {
        NDArray loss = trainer.getLoss().evaluate(batch.getLabels(), trainer.forward(batch.getData()));
        epochLoss.addi(loss); // expect: memory.graph-accumulation
        collector.backward(loss);
      }
      trainer.step();
      batch.close();
    }
    return epochLoss;
  }

  NDArray sumLossesAfterRecording(Trainer trainer, Dataset data, NDManager manager)
      throws IOException, TranslateException {
    NDArray epochLoss = manager.zeros(new Shape());
    for (Batch batch : trainer.iterateDataset(data)) {
      NDArray loss;
      try (GradientCollector collector = trainer.newGradientCollector()) {
        loss = trainer.getLoss().evaluate(batch.getLabels(), trainer.forward(batch.getData()));
        collector.backward(loss);
      }
      // Gradient recording is off here: the in-place sum copies values and records nothing.
      epochLoss.addi(loss); // clean: memory.graph-accumulation
      trainer.step();
      batch.close();
    }
    return epochLoss;
  }
}
