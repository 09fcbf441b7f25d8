package corpus.shape.mismatch;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;

/** DJL: a dense step written by hand, with the weight shape transposed. */
class MatMulOfDjlLayers {
  NDArray forward(NDManager manager, long batch) {
    NDArray x = manager.randomUniform(0f, 1f, new Shape(batch, 12));
    NDArray w = manager.randomUniform(0f, 1f, new Shape(3, 12));
    return x.matMul(w); // expect: shape.mismatch
  }

  NDArray forwardTransposed(NDManager manager, long batch) {
    NDArray x = manager.randomUniform(0f, 1f, new Shape(batch, 12));
    NDArray w = manager.randomUniform(0f, 1f, new Shape(3, 12));
    return x.matMul(w.transpose()); // clean: shape.mismatch
  }

  /** Inputs of unknown shape: no claim. */
  NDArray forwardUnknown(NDArray x, NDArray w) {
    return x.matMul(w); // clean: shape.mismatch
  }
}
