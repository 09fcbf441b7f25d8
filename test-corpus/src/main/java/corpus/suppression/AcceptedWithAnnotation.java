package corpus.suppression;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** A leak accepted on purpose with Java's own annotation; the reason is the comment above it. */
class AcceptedWithAnnotation {
  // Smoke check only: the held-out rows are printed for a human, never scored.
  @SuppressWarnings("plumbline:leak.preprocessing-before-split") /* clean: suppression.invalid */
  SplitTestAndTrain smokeCheck(DataSet sample) {
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(sample);
    return sample.splitTestAndTrain(0.9);
  }

  @SuppressWarnings({"unchecked", "plumbline:suppression.invalid"}) /* clean: suppression.invalid */
  SplitTestAndTrain unrelated(DataSet sample) {
    return sample.splitTestAndTrain(0.5);
  }
}
