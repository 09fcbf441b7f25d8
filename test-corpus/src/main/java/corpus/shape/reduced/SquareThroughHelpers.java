package corpus.shape.reduced;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/** The square matrix, or the reduction, comes from the project's own helpers. */
class SquareThroughHelpers {
  INDArray transitions(int states) {
    return Nd4j.rand(states, states);
  }

  INDArray rowTotals(INDArray m) {
    return m.sum(1);
  }

  INDArray normalize(int states) {
    INDArray t = transitions(states);
    return t.div(t.sum(1)); // expect: shape.reduced-dim-broadcast
  }

  INDArray normalizeWithHelper() {
    INDArray t = Nd4j.rand(5, 5);
    return t.div(rowTotals(t)); // expect: shape.reduced-dim-broadcast
  }

  /** The source was replaced before the totals are used: a different tensor. */
  INDArray replacedSource() {
    INDArray t = Nd4j.rand(5, 5);
    INDArray totals = t.sum(1);
    t = Nd4j.rand(5, 5);
    return t.div(totals); // clean: shape.reduced-dim-broadcast
  }

  NDArray softmaxByHand(NDManager manager, long n) {
    NDArray logits = manager.randomUniform(0f, 1f, new Shape(n, n));
    return logits.sub(logits.sum(new int[] {1})); // expect: shape.reduced-dim-broadcast
  }

  NDArray softmaxByHandKept(NDManager manager, long n) {
    NDArray logits = manager.randomUniform(0f, 1f, new Shape(n, n));
    return logits.sub(logits.sum(new int[] {1}, true)); // clean: shape.reduced-dim-broadcast
  }

  NDArray centerSteps(NDManager manager, long batch, long steps) {
    NDArray sequence = manager.zeros(new Shape(batch, steps, 6));
    return sequence.sub(sequence.mean(new int[] {1})); // expect: shape.reduced-dim-broadcast
  }

  NDArray centerBatch(NDManager manager, long batch, long steps) {
    NDArray sequence = manager.zeros(new Shape(batch, steps, 6));
    return sequence.sub(sequence.mean(new int[] {0})); // clean: shape.reduced-dim-broadcast
  }

  NDArray squareDjl(NDManager manager) {
    NDArray m = manager.ones(new Shape(3, 3));
    return m.div(m.sum(new int[] {1})); // expect: shape.reduced-dim-broadcast
  }
}
