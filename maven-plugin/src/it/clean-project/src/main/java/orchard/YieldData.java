package orchard;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** Prepares orchard sensor rows for a yield model. */
public final class YieldData {
  private YieldData() {}

  public static DataSet[] prepare(DataSet readings) {
    SplitTestAndTrain split = readings.splitTestAndTrain(0.8);
    DataSet train = split.getTrain();
    DataSet test = split.getTest();
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(train);
    normalizer.transform(train);
    normalizer.transform(test);
    return new DataSet[] {train, test};
  }
}
