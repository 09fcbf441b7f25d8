package corpus.leak.preprocessing;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerMinMaxScaler;

/** Clean: the scaler is fitted on a calibration set; a different data set is split. */
class CleanDifferentDataSplit {
  SplitTestAndTrain prepare(DataSet calibration, DataSet experiment) {
    NormalizerMinMaxScaler scaler = new NormalizerMinMaxScaler();
    scaler.fit(calibration); // clean: leak.preprocessing-before-split
    scaler.transform(experiment);
    return experiment.splitTestAndTrain(0.8);
  }
}
