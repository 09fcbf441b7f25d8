package corpus.memory.accumulation;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;
import ai.djl.training.GradientCollector;
import ai.djl.training.Trainer;
import ai.djl.training.dataset.Batch;
import ai.djl.training.dataset.Dataset;
import ai.djl.translate.TranslateException;
import java.io.IOException;

/** The value added is detached only when a flag says so: on the other path it keeps the graph. */
class AttachedOnSomePaths {
  float epoch(Trainer trainer, Dataset data, NDManager manager, boolean detachForLogging)
      throws IOException, TranslateException {
    NDArray total = manager.zeros(new Shape());
    for (Batch batch : trainer.iterateDataset(data)) {
      try (GradientCollector collector = trainer.newGradientCollector()) {
        NDArray loss = trainer.getLoss().evaluate(batch.getLabels(), trainer.forward(batch.getData()));
        collector.backward(loss);
        NDArray logged = detachForLogging ? loss.stopGradient() : loss;
        total = total.add(logged); // expect: memory.graph-accumulation
      }
      trainer.step();
      batch.close();
    }
    return total.getFloat();
  }
}
