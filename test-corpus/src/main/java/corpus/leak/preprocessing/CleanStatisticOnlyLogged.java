package corpus.leak.preprocessing;

import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;

/** Clean: the mean of all rows is only printed, never used to rescale anything. */
class CleanStatisticOnlyLogged {
  SplitTestAndTrain describe(DataSet samples) {
    INDArray mean = samples.getFeatures().mean(0); // clean: leak.preprocessing-before-split
    System.out.println("feature means: " + mean);
    return samples.splitTestAndTrain(0.8);
  }
}
