package corpus.shape.mismatch;

import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/** A hidden projection whose weight matrix was sized for the wrong input width. */
class ProjectionWidthDisagrees {
  INDArray project(int batch) {
    INDArray activations = Nd4j.rand(batch, 16);
    INDArray weights = Nd4j.rand(8, 4);
    return activations.mmul(weights); // expect: shape.mismatch
  }

  INDArray projectRight(int batch) {
    INDArray activations = Nd4j.rand(batch, 16);
    INDArray weights = Nd4j.rand(16, 4);
    return activations.mmul(weights); // clean: shape.mismatch
  }

  /** The batch size is a symbol: whether 'batch' equals 16 is unknown, so nothing is claimed. */
  INDArray batchAgainstWidth(int batch) {
    INDArray activations = Nd4j.rand(16, batch);
    INDArray weights = Nd4j.rand(16, 4);
    return activations.mmul(weights); // clean: shape.mismatch
  }
}
