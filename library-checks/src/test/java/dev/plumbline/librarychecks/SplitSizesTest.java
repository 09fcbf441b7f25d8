package dev.plumbline.librarychecks;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import dev.plumbline.analysis.rowcount.SplitSizes;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.factory.Nd4j;

/**
 * The sizes the row-count analysis gives the parts of {@code DataSet.splitTestAndTrain}
 * ({@link SplitSizes}) against the real ND4J on the CPU: for each row count and split argument,
 * the library's own train and test parts, or the exception it throws where the analysis says
 * there are no parts.
 */
class SplitSizesTest {
  private static final int[] ROWS = {1, 2, 3, 10, 100, 1_001, 2_000};
  private static final double[] FRACTIONS = {0.01, 0.29, 0.5, 0.8, 0.999};
  private static final int[] COUNTS = {0, 1, 2, 9, 10, 99, 750, 1_600};

  private static DataSet rows(int n) {
    return new DataSet(Nd4j.rand(n, 3), Nd4j.rand(n, 2));
  }

  private static void check(int rows, Optional<SplitSizes.Parts> predicted,
      java.util.function.Function<DataSet, SplitTestAndTrain> split, String what) {
    DataSet data = rows(rows);
    if (predicted.isEmpty()) {
      assertThrows(RuntimeException.class, () -> split.apply(data), what + " should throw");
      return;
    }
    SplitTestAndTrain parts = split.apply(data);
    assertEquals(predicted.get().train(), parts.getTrain().numExamples(), what + " train rows");
    assertEquals(predicted.get().test(), parts.getTest().numExamples(), what + " test rows");
  }

  @Test
  void fractionSplitsMatchTheLibrary() {
    for (int rows : ROWS) {
      for (double f : FRACTIONS) {
        check(rows, SplitSizes.byFraction(rows, f), d -> d.splitTestAndTrain(f),
            rows + " rows split at " + f);
      }
    }
  }

  @Test
  void countSplitsMatchTheLibrary() {
    for (int rows : ROWS) {
      for (int n : COUNTS) {
        if (n == 0) {
          continue; // the analysis gives no size for 0, whatever the library does with it
        }
        check(rows, SplitSizes.byTrainCount(rows, n), d -> d.splitTestAndTrain(n),
            rows + " rows split at " + n);
      }
    }
  }
}
