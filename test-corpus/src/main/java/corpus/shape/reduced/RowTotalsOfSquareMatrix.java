package corpus.shape.reduced;

import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/** Turning a square affinity matrix into row-stochastic form. */
class RowTotalsOfSquareMatrix {
  INDArray normalize() {
    INDArray affinity = Nd4j.rand(4, 4);
    return affinity.div(affinity.sum(1)); // expect: shape.reduced-dim-broadcast
  }

  INDArray normalizeKept() {
    INDArray affinity = Nd4j.rand(4, 4);
    return affinity.div(affinity.sum(true, 1)); // clean: shape.reduced-dim-broadcast
  }

  INDArray normalizeByColumnVector() {
    INDArray affinity = Nd4j.rand(4, 4);
    return affinity.divColumnVector(affinity.sum(1)); // clean: shape.reduced-dim-broadcast
  }

  void normalizeInPlace() {
    INDArray affinity = Nd4j.rand(4, 4);
    affinity.divi(affinity.sum(1)); // expect: shape.reduced-dim-broadcast
  }

  /** Centering columns: the mean over axis 0 lines up with the columns, as intended. */
  INDArray centerColumns(int batch) {
    INDArray features = Nd4j.rand(batch, 8);
    return features.sub(features.mean(0)); // clean: shape.reduced-dim-broadcast
  }

  /** Batch size and width are unknown to each other: this fails or silently uses the wrong axis. */
  INDArray centerRows(int batch) {
    INDArray features = Nd4j.rand(batch, 8);
    return features.sub(features.mean(1)); // expect: shape.reduced-dim-broadcast
  }

  /** Totals of another matrix: not the reduced tensor's own source. */
  INDArray otherTotals() {
    INDArray a = Nd4j.rand(4, 4);
    INDArray b = Nd4j.rand(4, 4);
    return b.div(a.sum(1)); // clean: shape.reduced-dim-broadcast
  }

  /** A grand total is a scalar: it divides every entry alike. */
  INDArray grandTotal() {
    INDArray a = Nd4j.rand(4, 4);
    return a.div(a.sum()); // clean: shape.reduced-dim-broadcast
  }
}
