package dev.plumbline.analysis.rowcount;

import java.util.Optional;

/**
 * How DL4J's {@code DataSet.splitTestAndTrain} sizes its parts (nd4j-api 1.0.0-M2.1, read from
 * the bytecode and checked by running the real library in module {@code library-checks}):
 * {@code splitTestAndTrain(int n)} keeps the first {@code n} rows for training and the rest for
 * testing, and throws unless {@code 1 < rows} and {@code n < rows};
 * {@code splitTestAndTrain(double f)} requires {@code 0 < f < 1} and trains on
 * {@code max(1, (int) (f * rows))} rows.
 */
public final class SplitSizes {
  /** Training and test rows of one split. */
  public record Parts(long train, long test) {}

  private SplitSizes() {}

  /** Parts of {@code splitTestAndTrain(trainRows)} on {@code rows} rows; empty if it throws. */
  public static Optional<Parts> byTrainCount(long rows, long trainRows) {
    if (rows <= 1 || rows > Integer.MAX_VALUE || trainRows <= 0 || trainRows >= rows) {
      return Optional.empty();
    }
    return Optional.of(new Parts(trainRows, rows - trainRows));
  }

  /** Parts of {@code splitTestAndTrain(fraction)} on {@code rows} rows; empty if it throws. */
  public static Optional<Parts> byFraction(long rows, double fraction) {
    if (!(fraction > 0.0 && fraction < 1.0) || rows > Integer.MAX_VALUE) {
      return Optional.empty();
    }
    int train = (int) (fraction * (int) rows); // the library's own arithmetic, double to int
    return byTrainCount(rows, train <= 0 ? 1 : train);
  }
}
