package corpus.leak.preprocessing;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerMinMaxScaler;

/** Defect: the split exists, but the scaler is still fitted on the unsplit rows. */
class MinMaxAfterSplitOnWhole {
  void prepare(DataSet measurements) {
    SplitTestAndTrain split = measurements.splitTestAndTrain(120);
    DataSet train = split.getTrain();
    DataSet test = split.getTest();
    NormalizerMinMaxScaler scaler = new NormalizerMinMaxScaler(0, 1);
    scaler.fit(measurements); // expect: leak.preprocessing-before-split
    scaler.transform(train);
    scaler.transform(test);
  }
}
