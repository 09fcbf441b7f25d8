package corpus.memory.accumulation;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDList;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;
import ai.djl.nn.Block;
import ai.djl.training.GradientCollector;
import ai.djl.training.ParameterStore;
import ai.djl.training.Trainer;
import ai.djl.training.dataset.Batch;
import ai.djl.training.dataset.Dataset;
import ai.djl.translate.TranslateException;
import java.io.IOException;

/**
 * A recurrent cell trained over consecutive batches of one long sequence (truncated
 * backpropagation through time). The hidden state is carried from batch to batch; it must be
 * cut loose from the previous batch's graph at every batch.
 */
class RecurrentStateAcrossBatches {
  private final Block cell;
  private final ParameterStore parameters = new ParameterStore();

  RecurrentStateAcrossBatches(Block cell) {
    this.cell = cell;
  }

  void trainCarryingGraph(Trainer trainer, Dataset sequence, NDManager manager)
      throws IOException, TranslateException {
    NDArray hidden = manager.zeros(new Shape(1, 32));
    for (Batch batch : trainer.iterateDataset(sequence)) {
      hidden.stopGradient(); // expect: tensor.discarded-result
      try (GradientCollector collector = trainer.newGradientCollector()) {
        NDArray input = batch.getData().head();
        hidden = cell.forward(parameters, new NDList(input, hidden), true).head(); // expect: memory.graph-accumulation
        NDArray loss = trainer.getLoss().evaluate(batch.getLabels(), new NDList(hidden));
        collector.backward(loss);
      }
      trainer.step();
      batch.close();
    }
  }

  void trainDetachingEachBatch(Trainer trainer, Dataset sequence, NDManager manager)
      throws IOException, TranslateException {
    NDArray hidden = manager.zeros(new Shape(1, 32));
    for (Batch batch : trainer.iterateDataset(sequence)) {
      hidden = hidden.stopGradient(); // clean: tensor.discarded-result
      try (GradientCollector collector = trainer.newGradientCollector()) {
        NDArray input = batch.getData().head();
        hidden = cell.forward(parameters, new NDList(input, hidden), true).head(); // clean: memory.graph-accumulation
        NDArray loss = trainer.getLoss().evaluate(batch.getLabels(), new NDList(hidden));
        collector.backward(loss);
      }
      trainer.step();
      batch.close();
    }
  }

  /** Within one batch the graph must span the time steps: that is what backpropagation needs. */
  void trainUnrolled(Trainer trainer, Dataset sequences, NDManager manager, int steps)
      throws IOException, TranslateException {
    for (Batch batch : trainer.iterateDataset(sequences)) {
      try (GradientCollector collector = trainer.newGradientCollector()) {
        NDArray input = batch.getData().head();
        NDArray state = batch.getManager().zeros(new Shape(1, 32));
        for (int t = 0; t < steps; t++) {
          state = cell.forward(parameters, new NDList(input, state), true).head(); // clean: memory.graph-accumulation
        }
        NDArray loss = trainer.getLoss().evaluate(batch.getLabels(), new NDList(state));
        collector.backward(loss);
      }
      trainer.step();
      batch.close();
    }
  }
}
