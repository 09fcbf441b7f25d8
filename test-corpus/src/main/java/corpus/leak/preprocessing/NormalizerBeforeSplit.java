package corpus.leak.preprocessing;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** Defect: the standardizer learns mean and deviation from every row, test rows included. */
class NormalizerBeforeSplit {
  DataSet[] prepare(DataSetIterator readings) {
    DataSet all = readings.next();
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(all); // expect: leak.preprocessing-before-split
    normalizer.transform(all);
    SplitTestAndTrain split = all.splitTestAndTrain(0.8);
    return new DataSet[] {split.getTrain(), split.getTest()};
  }
}
