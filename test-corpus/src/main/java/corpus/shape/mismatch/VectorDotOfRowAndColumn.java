package corpus.shape.mismatch;

import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/**
 * Look-alikes that run: ND4J multiplies a [1, n] row by an [m, 1] column as a dot product
 * whatever n and m are (measured), and a loop whose widths change is not given a fixed shape.
 */
class VectorDotOfRowAndColumn {
  INDArray rowTimesColumn() {
    INDArray row = Nd4j.rand(1, 4);
    INDArray column = Nd4j.rand(3, 1);
    return row.mmul(column); // clean: shape.mismatch
  }

  INDArray growing(int steps) {
    INDArray state = Nd4j.rand(2, 2);
    for (int i = 0; i < steps; i++) {
      state = Nd4j.concat(1, state, state);
    }
    return state.mmul(Nd4j.rand(2, 2)); // clean: shape.mismatch
  }
}
