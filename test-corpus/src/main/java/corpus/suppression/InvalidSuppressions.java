package corpus.suppression;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** Suppressions that suppress nothing: the leaks they meant to accept are still reported. */
class InvalidSuppressions {
  @SuppressWarnings("plumbline:leak.preprocesing-before-split") /* expect: suppression.invalid */
  SplitTestAndTrain misspelt(DataSet rows) {
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(rows); // expect: leak.preprocessing-before-split
    return rows.splitTestAndTrain(0.8);
  }

  SplitTestAndTrain noReason(DataSet rows) {
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(rows); /* expect: leak.preprocessing-before-split, suppression.invalid */ // plumbline:accept leak.preprocessing-before-split
    return rows.splitTestAndTrain(0.8);
  }
}
