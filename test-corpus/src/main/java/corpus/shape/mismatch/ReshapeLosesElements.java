package corpus.shape.mismatch;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/** Flattening image patches with a width that drops half of each patch. */
class ReshapeLosesElements {
  INDArray flattenPatches(long batch) {
    INDArray patches = Nd4j.zeros(batch, 4, 4);
    return patches.reshape(batch, 8); // expect: shape.mismatch
  }

  INDArray flattenPatchesWhole(long batch) {
    INDArray patches = Nd4j.zeros(batch, 4, 4);
    return patches.reshape(batch, 16); // clean: shape.mismatch
  }

  NDArray regroupDjl(NDManager manager) {
    NDArray readings = manager.zeros(new Shape(6, 5));
    return readings.reshape(4, -1); // expect: shape.mismatch
  }

  NDArray regroupDjlEvenly(NDManager manager) {
    NDArray readings = manager.zeros(new Shape(6, 5));
    return readings.reshape(3, -1); // clean: shape.mismatch
  }
}
