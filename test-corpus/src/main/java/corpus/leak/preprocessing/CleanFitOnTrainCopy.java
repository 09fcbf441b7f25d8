package corpus.leak.preprocessing;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** Clean: a copy of the training part holds only training rows. */
class CleanFitOnTrainCopy {
  NormalizerStandardize prepare(DataSet all) {
    SplitTestAndTrain split = all.splitTestAndTrain(0.85);
    DataSet trainCopy = split.getTrain().copy();
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(trainCopy); // clean: leak.preprocessing-before-split
    return normalizer;
  }
}
