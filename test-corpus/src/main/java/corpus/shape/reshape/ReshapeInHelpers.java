package corpus.shape.reshape;

import org.nd4j.linalg.api.ndarray.INDArray;

/** The reshape happens in a helper; the caller uses the result. */
class ReshapeInHelpers {
  INDArray toMatrix(INDArray x) {
    return x.reshape(x.size(0), -1);
  }

  void requireWidth(INDArray x, long width) {
    if (x.rank() != 2 || x.size(1) != width) {
      throw new IllegalArgumentException("expected width " + width);
    }
  }

  INDArray score(INDArray images, INDArray weights) {
    return toMatrix(images).mmul(weights); // expect: shape.unchecked-reshape
  }

  INDArray scoreChecked(INDArray images, INDArray weights) {
    INDArray m = toMatrix(images); // clean: shape.unchecked-reshape
    requireWidth(m, 64);
    return m.mmul(weights);
  }

  INDArray reorder(INDArray sequence, int[] order, INDArray bias) {
    INDArray permuted = sequence.permute(order); // expect: shape.unchecked-reshape
    return permuted.add(bias);
  }

  INDArray reorderFixed(INDArray sequence, INDArray bias) {
    INDArray permuted = sequence.permute(0, 2, 1); // clean: shape.unchecked-reshape
    return permuted.add(bias);
  }

  INDArray asserted(INDArray images, long batch, INDArray weights) {
    INDArray flat = images.reshape(batch, -1); // clean: shape.unchecked-reshape
    assert flat.size(1) == 64; // expect: check.assert-validation
    return flat.mmul(weights);
  }
}
