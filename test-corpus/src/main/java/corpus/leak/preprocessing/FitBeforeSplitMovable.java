package corpus.leak.preprocessing;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/**
 * Defect with a safe mechanical fix: nothing uses the standardizer between the fit and the
 * training part's declaration, so the fit moves below it and learns from training rows only.
 */
class FitBeforeSplitMovable {
  DataSet[] prepare(DataSetIterator vibrationLog) {
    DataSet pooled = vibrationLog.next();
    NormalizerStandardize standardizer = new NormalizerStandardize();
    standardizer.fitLabel(false);
    standardizer.fit(pooled); // expect: leak.preprocessing-before-split
    pooled.shuffle(5);
    SplitTestAndTrain split = pooled.splitTestAndTrain(0.75);
    DataSet train = split.getTrain();
    DataSet test = split.getTest();
    standardizer.transform(train);
    standardizer.transform(test);
    return new DataSet[] {train, test};
  }
}
