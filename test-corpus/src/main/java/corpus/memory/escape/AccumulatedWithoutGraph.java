package corpus.memory.escape;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;
import ai.djl.training.GradientCollector;
import ai.djl.training.Trainer;
import ai.djl.training.dataset.Batch;
import ai.djl.training.dataset.Dataset;
import ai.djl.translate.TranslateException;
import java.io.IOException;

/**
 * A detached running total still leaks: each add makes a new array in the total's manager and
 * the previous total is never closed.
 */
class AccumulatedWithoutGraph {
  float epoch(Trainer trainer, Dataset data, NDManager manager) throws IOException, TranslateException {
    NDArray total = manager.zeros(new Shape());
    for (Batch batch : trainer.iterateDataset(data)) {
      NDArray loss;
      try (GradientCollector collector = trainer.newGradientCollector()) {
        loss = trainer.getLoss().evaluate(batch.getLabels(), trainer.forward(batch.getData()));
        collector.backward(loss);
      }
      total = total.add(loss.stopGradient()); // expect: memory.scope-escape
      trainer.step();
      batch.close();
    }
    return total.getFloat();
  }
}
