package corpus.shape.broadcast;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;

/** The [n, 1] output comes from a helper; the expansion is found all the same. */
class HeadOutputThroughHelper {
  NDArray scores(NDManager manager, long n) {
    return manager.randomUniform(0f, 1f, new Shape(n, 1));
  }

  NDArray labels(NDManager manager, long n) {
    return manager.zeros(new Shape(n));
  }

  NDArray error(NDManager manager, long n) {
    return scores(manager, n).sub(labels(manager, n)); // expect: shape.implicit-broadcast
  }

  NDArray errorAligned(NDManager manager, long n) {
    return scores(manager, n).sub(labels(manager, n).reshape(n, 1)); // clean: shape.implicit-broadcast
  }

  /** A bias row only gains the batch axis: the intended use of broadcasting. */
  NDArray addBias(NDManager manager, long n) {
    NDArray hidden = manager.zeros(new Shape(n, 16));
    NDArray bias = manager.ones(new Shape(16));
    return hidden.add(bias); // clean: shape.implicit-broadcast
  }

  void addBiasInPlace(NDManager manager, long n) {
    NDArray hidden = manager.zeros(new Shape(n, 16));
    hidden.addi(manager.ones(new Shape(16))); // clean: shape.implicit-broadcast
  }

  /** Attention-like scores: [b, 1, t] against [b, t, 1] becomes [b, t, t]. */
  NDArray pairwise(NDManager manager, long b, long t) {
    NDArray queries = manager.zeros(new Shape(b, 1, t));
    NDArray keys = manager.zeros(new Shape(b, t, 1));
    return queries.add(keys); // expect: shape.implicit-broadcast
  }
}
