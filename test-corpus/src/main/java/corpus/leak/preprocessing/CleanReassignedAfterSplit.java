package corpus.leak.preprocessing;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** Clean: the variable that held all rows is reassigned to the training part before the fit. */
class CleanReassignedAfterSplit {
  DataSet prepare(DataSet data) {
    SplitTestAndTrain split = data.splitTestAndTrain(0.8);
    DataSet held = split.getTest();
    data = split.getTrain();
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(data); // clean: leak.preprocessing-before-split
    normalizer.transform(held);
    return held;
  }
}
