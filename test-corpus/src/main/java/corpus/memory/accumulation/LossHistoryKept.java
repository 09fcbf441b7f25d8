package corpus.memory.accumulation;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDList;
import ai.djl.training.GradientCollector;
import ai.djl.training.Trainer;
import java.util.ArrayList;
import java.util.List;

/** Full-batch training on arrays from a long-lived manager: the loss history keeps every graph. */
class LossHistoryKept {
  List<NDArray> trainFullBatch(Trainer trainer, NDArray features, NDArray targets, int epochs) {
    List<NDArray> lossHistory = new ArrayList<>();
    for (int epoch = 0; epoch < epochs; epoch++) {
      try (GradientCollector collector = trainer.newGradientCollector()) {
        // The outputs also land in the manager of 'features', which outlives the loop.
        NDList predictions = trainer.forward(new NDList(features)); // expect: memory.scope-escape
        NDArray loss = trainer.getLoss().evaluate(new NDList(targets), predictions);
        collector.backward(loss);
        lossHistory.add(loss); // expect: memory.graph-accumulation
      }
      trainer.step();
    }
    return lossHistory;
  }

  List<Float> trainFullBatchKeepingNumbers(Trainer trainer, NDArray features, NDArray targets, int epochs) {
    List<Float> lossHistory = new ArrayList<>();
    for (int epoch = 0; epoch < epochs; epoch++) {
      try (GradientCollector collector = trainer.newGradientCollector()) {
        NDList predictions = trainer.forward(new NDList(features));
        NDArray loss = trainer.getLoss().evaluate(new NDList(targets), predictions);
        collector.backward(loss);
        lossHistory.add(loss.getFloat()); // clean: memory.graph-accumulation
        loss.close();
        predictions.close();
      }
      trainer.step();
    }
    return lossHistory;
  }
}
