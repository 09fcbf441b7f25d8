package corpus.shape.reshape;

import java.util.Arrays;
import org.nd4j.common.base.Preconditions;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/** Flattening a batch of images before a dense projection. */
class FlattenWithComputedBatch {
  private static final int FEATURES = 64;

  INDArray project(INDArray images, long batchSize, INDArray weights) {
    INDArray flat = images.reshape(batchSize, -1); // expect: shape.unchecked-reshape
    return flat.mmul(weights);
  }

  INDArray projectChecked(INDArray images, long batchSize, INDArray weights) {
    INDArray flat = images.reshape(batchSize, -1); // clean: shape.unchecked-reshape
    if (flat.size(1) != FEATURES) {
      throw new IllegalStateException("flattened to " + Arrays.toString(flat.shape()));
    }
    return flat.mmul(weights);
  }

  INDArray projectInputChecked(INDArray images, long batchSize, INDArray weights) {
    Preconditions.checkArgument(images.rank() == 4, "images must be [batch, channels, height, width]");
    INDArray flat = images.reshape(batchSize, -1); // clean: shape.unchecked-reshape
    return flat.mmul(weights);
  }

  /** Constant sizes: a wrong count fails loudly, the layout is the author's choice. */
  INDArray projectFixed(INDArray images, INDArray weights) {
    INDArray flat = images.reshape(32, FEATURES); // clean: shape.unchecked-reshape
    return flat.mmul(weights);
  }

  /** The analysis proves the result: [batch, 4, 4] to [batch, 16]. */
  INDArray projectProven(long batch) {
    INDArray images = Nd4j.zeros(batch, 4, 4);
    INDArray flat = images.reshape(batch, -1); // clean: shape.unchecked-reshape
    return flat.mmul(Nd4j.rand(16, 2));
  }

  /** Returned without a shape-sensitive use here. */
  INDArray onlyReshape(INDArray images, long batchSize) {
    INDArray flat = images.reshape(batchSize, -1); // clean: shape.unchecked-reshape
    return flat;
  }

  INDArray splitHeads(INDArray hidden, long batch, long heads, INDArray mask) {
    long perHead = hidden.size(1) / heads;
    INDArray split = hidden.reshape(batch, heads, perHead); // expect: shape.unchecked-reshape
    return split.mul(mask);
  }

  INDArray timeMajor(INDArray sequence, long steps, long batch, INDArray bias) {
    INDArray stepsFirst = sequence.reshape(steps, batch, -1); // expect: shape.unchecked-reshape
    return stepsFirst.add(bias);
  }

  /** One free size: the element count decides it, and a wrong count fails loudly. */
  INDArray column(INDArray scores, long n, INDArray weights) {
    INDArray asColumn = scores.reshape(n, 1); // clean: shape.unchecked-reshape
    return asColumn.mul(weights);
  }
}
