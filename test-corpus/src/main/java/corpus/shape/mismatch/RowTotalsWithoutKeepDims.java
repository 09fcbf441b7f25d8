package corpus.shape.mismatch;

import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/** Normalizing rows by their totals: without kept dimensions the [32] totals meet the 10 columns. */
class RowTotalsWithoutKeepDims {
  INDArray normalize() {
    INDArray counts = Nd4j.rand(32, 10);
    return counts.div(counts.sum(1)); // expect: shape.mismatch
  }

  INDArray normalizeKept() {
    INDArray counts = Nd4j.rand(32, 10);
    return counts.div(counts.sum(true, 1)); // clean: shape.mismatch
  }
}
