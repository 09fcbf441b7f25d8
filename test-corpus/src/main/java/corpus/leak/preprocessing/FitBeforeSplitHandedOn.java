package corpus.leak.preprocessing;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/**
 * Defect without a safe fix: the iterator is given the standardizer before the fit, so moving
 * the fit could change what the iterator hands out in between. The file must stay as it is.
 */
class FitBeforeSplitHandedOn {
  DataSet[] prepare(DataSetIterator turbineLog) {
    NormalizerStandardize standardizer = new NormalizerStandardize();
    turbineLog.setPreProcessor(standardizer);
    DataSet pooled = turbineLog.next();
    standardizer.fit(pooled); // expect: leak.preprocessing-before-split
    SplitTestAndTrain split = pooled.splitTestAndTrain(0.75);
    DataSet train = split.getTrain();
    return new DataSet[] {train, split.getTest()};
  }
}
