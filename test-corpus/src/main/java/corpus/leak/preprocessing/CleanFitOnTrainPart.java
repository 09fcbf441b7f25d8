package corpus.leak.preprocessing;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** Clean: split first, fit on the training part, apply to both. */
class CleanFitOnTrainPart {
  DataSet[] prepare(DataSetIterator readings) {
    DataSet all = readings.next();
    SplitTestAndTrain split = all.splitTestAndTrain(0.8);
    DataSet train = split.getTrain();
    DataSet test = split.getTest();
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(train); // clean: leak.preprocessing-before-split
    normalizer.transform(train);
    normalizer.transform(test);
    return new DataSet[] {train, test};
  }
}
