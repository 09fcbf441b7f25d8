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

/** DJL manual training loop: a running total of loss tensors versus a running float. */
class ManualLoopRunningTotal {
  float epochWithTensorTotal(Trainer trainer, Dataset data, NDManager manager)
      throws IOException, TranslateException {
    NDArray totalLoss = manager.zeros(new Shape());
    for (Batch batch : trainer.iterateDataset(data)) {
      try (GradientCollector collector = trainer.newGradientCollector()) {
        NDList predictions = trainer.forward(batch.getData());
        NDArray loss = trainer.getLoss().evaluate(batch.getLabels(), predictions);
        collector.backward(loss);
        totalLoss = totalLoss.add(loss); // expect: memory.graph-accumulation
      }
      trainer.step();
      batch.close();
    }
    return totalLoss.getFloat();
  }

  float epochWithFloatTotal(Trainer trainer, Dataset data) throws IOException, TranslateException {
    float totalLoss = 0f;
    for (Batch batch : trainer.iterateDataset(data)) { // clean: memory.scope-escape
      try (GradientCollector collector = trainer.newGradientCollector()) {
        NDList predictions = trainer.forward(batch.getData());
        NDArray loss = trainer.getLoss().evaluate(batch.getLabels(), predictions);
        collector.backward(loss);
        totalLoss += loss.getFloat(); // clean: memory.graph-accumulation
      }
      trainer.step();
      batch.close();
    }
    return totalLoss;
  }

  float epochWithDetachedTensorTotal(Trainer trainer, Dataset data, NDManager manager)
      throws IOException, TranslateException {
    NDArray totalLoss = manager.zeros(new Shape());
    for (Batch batch : trainer.iterateDataset(data)) {
      try (GradientCollector collector = trainer.newGradientCollector()) {
        NDList predictions = trainer.forward(batch.getData());
        NDArray loss = trainer.getLoss().evaluate(batch.getLabels(), predictions);
        collector.backward(loss);
        totalLoss.addi(loss.stopGradient()); // clean: memory.graph-accumulation, memory.scope-escape
      }
      trainer.step();
      batch.close();
    }
    return totalLoss.getFloat();
  }
}
