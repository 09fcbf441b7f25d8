package corpus.shape.mismatch;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/** Shapes made or changed in the project's own helper methods still count. */
class WidthThroughHelpers {
  private static final int EMBEDDING = 16;

  INDArray embed(int rows) {
    return Nd4j.rand(rows, EMBEDDING);
  }

  NDArray flatten(NDArray images) {
    return images.reshape(images.getShape().get(0), -1);
  }

  INDArray score(int batch) {
    return embed(batch).mmul(Nd4j.rand(32, 4)); // expect: shape.mismatch
  }

  INDArray scoreRight(int batch) {
    return embed(batch).mmul(Nd4j.rand(EMBEDDING, 4)); // clean: shape.mismatch
  }

  NDArray classify(NDManager manager, long batch) {
    NDArray images = manager.zeros(new Shape(batch, 4, 4));
    NDArray flat = flatten(images);
    return flat.matMul(manager.zeros(new Shape(8, 2))); // expect: shape.mismatch
  }

  NDArray classifyRight(NDManager manager, long batch) {
    NDArray images = manager.zeros(new Shape(batch, 4, 4));
    NDArray flat = flatten(images);
    return flat.matMul(manager.zeros(new Shape(16, 2))); // clean: shape.mismatch
  }
}
