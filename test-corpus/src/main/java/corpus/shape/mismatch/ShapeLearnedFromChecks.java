package corpus.shape.mismatch;

import java.util.Arrays;
import org.nd4j.common.base.Preconditions;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/** After a check that throws, the code that continues knows the shape it checked. */
class ShapeLearnedFromChecks {
  INDArray afterEqualsCheck(INDArray features, long batch) {
    if (!Arrays.equals(features.shape(), new long[] {batch, 12})) {
      throw new IllegalArgumentException("features must be [batch, 12]");
    }
    return features.mmul(Nd4j.rand(10, 3)); // expect: shape.mismatch
  }

  INDArray afterPrecondition(INDArray features) {
    Preconditions.checkArgument(features.rank() == 2 && features.size(1) == 20, "need 20 columns");
    return features.mmul(Nd4j.rand(10, 2)); // expect: shape.mismatch
  }

  INDArray afterMatchingCheck(INDArray features) {
    if (features.rank() != 2 || features.size(1) != 10) {
      throw new IllegalArgumentException("need 10 columns");
    }
    return features.mmul(Nd4j.rand(10, 2)); // clean: shape.mismatch
  }

  /** Only one branch checks: after the merge the width is unknown again. */
  INDArray checkedOnOnePath(INDArray features, boolean strict) {
    if (strict) {
      Preconditions.checkArgument(features.rank() == 2 && features.size(1) == 20);
    }
    return features.mmul(Nd4j.rand(10, 2)); // clean: shape.mismatch
  }
}
