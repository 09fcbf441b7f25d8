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
import java.util.ArrayDeque;
import java.util.Deque;

/** Losses computed in helper methods: the analysis follows them through summaries. */
class LossHelpers {
  private final Trainer trainer;

  LossHelpers(Trainer trainer) {
    this.trainer = trainer;
  }

  /** Computes the loss of one batch; attached when called under gradient recording. */
  private NDArray batchLoss(Batch batch) {
    NDList predictions = trainer.forward(batch.getData());
    return trainer.getLoss().evaluate(batch.getLabels(), predictions);
  }

  /** One training step; returns the loss, still attached to the step's graph. */
  private NDArray trainStep(NDList inputs, NDList targets) {
    try (GradientCollector collector = trainer.newGradientCollector()) {
      NDArray loss = trainer.getLoss().evaluate(targets, trainer.forward(inputs));
      collector.backward(loss);
      trainer.step();
      return loss;
    }
  }

  /** One training step; returns the loss as a number. */
  private float trainStepValue(NDList inputs, NDList targets) {
    try (GradientCollector collector = trainer.newGradientCollector()) {
      NDArray loss = trainer.getLoss().evaluate(targets, trainer.forward(inputs));
      collector.backward(loss);
      trainer.step();
      return loss.getFloat();
    }
  }

  float epoch(Dataset data, NDManager manager) throws IOException, TranslateException {
    NDArray running = manager.zeros(new Shape());
    for (Batch batch : trainer.iterateDataset(data)) {
      try (GradientCollector collector = trainer.newGradientCollector()) {
        NDArray loss = batchLoss(batch);
        collector.backward(loss);
        running = running.add(loss); // expect: memory.graph-accumulation
      }
      trainer.step();
      batch.close();
    }
    return running.getFloat();
  }

  Deque<NDArray> recentLosses(NDList inputs, NDList targets, int steps) {
    Deque<NDArray> recent = new ArrayDeque<>();
    for (int step = 0; step < steps; step++) {
      recent.addLast(trainStep(inputs, targets)); // expect: memory.graph-accumulation
    }
    return recent;
  }

  float meanLoss(NDList inputs, NDList targets, int steps) {
    float sum = 0f;
    for (int step = 0; step < steps; step++) {
      sum += trainStepValue(inputs, targets); // clean: memory.graph-accumulation
    }
    return sum / steps;
  }

  float evaluationLoss(Dataset validation) throws IOException, TranslateException {
    float sum = 0f;
    for (Batch batch : trainer.iterateDataset(validation)) {
      // Outside gradient recording the helper's loss carries no graph.
      NDArray loss = batchLoss(batch);
      sum += loss.getFloat(); // clean: memory.graph-accumulation
      batch.close();
    }
    return sum;
  }
}
