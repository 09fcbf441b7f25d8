package corpus.leak.preprocessing;

import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;

/** Defect: hand-rolled standardization with statistics of all rows. */
class StatisticsBeforeSplit {
  SplitTestAndTrain standardize(DataSet samples) {
    INDArray features = samples.getFeatures();
    INDArray mean = features.mean(0); // expect: leak.preprocessing-before-split
    INDArray spread = features.std(0); // expect: leak.preprocessing-before-split
    features.subiRowVector(mean);
    features.diviRowVector(spread);
    return samples.splitTestAndTrain(0.8);
  }
}
