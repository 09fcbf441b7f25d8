package corpus.shape.mismatch;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;

/** DJL: stacking feature blocks of different widths along the batch axis. */
class JoinedFeatureBlocks {
  NDArray appendRows(NDManager manager, long a, long b) {
    NDArray first = manager.zeros(new Shape(a, 4));
    NDArray second = manager.zeros(new Shape(b, 3));
    return first.concat(second, 0); // expect: shape.mismatch
  }

  NDArray appendColumns(NDManager manager, long a) {
    NDArray first = manager.zeros(new Shape(a, 4));
    NDArray second = manager.zeros(new Shape(a, 3));
    return first.concat(second, 1); // clean: shape.mismatch
  }

  NDArray swapAxes(NDManager manager) {
    NDArray sequence = manager.zeros(new Shape(8, 20, 3));
    return sequence.transpose(1, 0); // expect: shape.mismatch
  }
}
