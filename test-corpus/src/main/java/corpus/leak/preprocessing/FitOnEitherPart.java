package corpus.leak.preprocessing;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** Defect on one path only: reported as possible, with a lower severity. */
class FitOnEitherPart {
  void prepare(DataSet data, boolean quick) {
    SplitTestAndTrain split = data.splitTestAndTrain(0.9);
    DataSet fitSource = quick ? data : split.getTrain();
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(fitSource); // expect: leak.preprocessing-before-split
  }
}
