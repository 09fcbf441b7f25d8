package corpus.suppression;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerMinMaxScaler;

/** Leaks accepted with a suppression comment, after the code and on the line above it. */
class AcceptedWithComment {
  SplitTestAndTrain trailing(DataSet gauges) {
    NormalizerMinMaxScaler scaler = new NormalizerMinMaxScaler();
    scaler.fit(gauges); /* clean: suppression.invalid */ // plumbline:accept leak.preprocessing-before-split because the gauges' range is fixed by the hardware
    return gauges.splitTestAndTrain(0.8);
  }

  SplitTestAndTrain above(DataSet gauges) {
    NormalizerMinMaxScaler scaler = new NormalizerMinMaxScaler();
    // plumbline:accept leak.preprocessing-before-split because the split only feeds a plot
    scaler.fit(
        gauges);
    return gauges.splitTestAndTrain(0.8);
  }
}
