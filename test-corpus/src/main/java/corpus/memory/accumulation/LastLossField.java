package corpus.memory.accumulation;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDList;
import ai.djl.training.GradientCollector;
import ai.djl.training.Trainer;

/** A training step that keeps its loss in a field for a progress display. */
class LastLossField {
  private NDArray lastLoss;
  private float lastLossValue;

  void step(Trainer trainer, NDList inputs, NDList targets) {
    try (GradientCollector collector = trainer.newGradientCollector()) {
      NDArray loss = trainer.getLoss().evaluate(targets, trainer.forward(inputs));
      collector.backward(loss);
      this.lastLoss = loss; // expect: memory.graph-accumulation
      this.lastLossValue = loss.getFloat(); // clean: memory.graph-accumulation
    }
    trainer.step();
  }

  String progress() {
    return lastLoss + " " + lastLossValue;
  }
}
