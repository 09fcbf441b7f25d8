package corpus.leak.preprocessing;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** Project helpers: one fits a standardizer on its argument, one splits its argument. */
final class Preparation {
  private Preparation() {}

  static NormalizerStandardize fitted(DataSet rows) {
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(rows); // clean: leak.preprocessing-before-split
    return normalizer;
  }

  static SplitTestAndTrain holdOut(DataSet rows, double fraction) {
    return rows.splitTestAndTrain(fraction);
  }
}
