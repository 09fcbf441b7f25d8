package corpus.shape.broadcast;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;

/** DJL: a regression head outputs [n, 1] while the targets are [n]; the error silently becomes [n, n]. */
class ResidualOfColumnAndVector {
  NDArray residual(NDArray predictions, NDArray targets, long n) {
    NDArray column = predictions.reshape(n, 1);
    NDArray flat = targets.reshape(n);
    return column.sub(flat); // expect: shape.implicit-broadcast
  }

  NDArray residualAligned(NDArray predictions, NDArray targets, long n) {
    NDArray column = predictions.reshape(n, 1);
    NDArray alsoColumn = targets.reshape(n, 1);
    return column.sub(alsoColumn); // clean: shape.implicit-broadcast
  }

  NDArray residualFlattened(NDManager manager, long n) {
    NDArray column = manager.zeros(new Shape(n, 1));
    NDArray flat = manager.ones(new Shape(n));
    return column.reshape(-1).sub(flat); // clean: shape.implicit-broadcast
  }

  NDArray weighting(NDManager manager) {
    NDArray weights = manager.ones(new Shape(4));
    NDArray column = manager.ones(new Shape(4, 1));
    return weights.mul(column); // expect: shape.implicit-broadcast
  }

  NDArray gateByFeature(NDManager manager, long batch) {
    NDArray perExample = manager.zeros(new Shape(batch, 1));
    NDArray perFeature = manager.ones(new Shape(1, 8));
    return perExample.mul(perFeature); // expect: shape.implicit-broadcast
  }
}
