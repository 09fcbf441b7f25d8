package corpus.leak.preprocessing;

import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;

/** Clean: statistics of the training rows, applied to both parts. */
class CleanStatisticsFromTrain {
  void standardize(DataSet samples) {
    SplitTestAndTrain split = samples.splitTestAndTrain(0.8);
    INDArray trainX = split.getTrain().getFeatures();
    INDArray testX = split.getTest().getFeatures();
    INDArray mean = trainX.mean(0); // clean: leak.preprocessing-before-split
    INDArray spread = trainX.std(0); // clean: leak.preprocessing-before-split
    trainX.subiRowVector(mean).diviRowVector(spread);
    testX.subiRowVector(mean).diviRowVector(spread);
  }
}
