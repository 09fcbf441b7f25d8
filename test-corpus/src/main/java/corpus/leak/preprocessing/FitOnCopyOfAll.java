package corpus.leak.preprocessing;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** Defect: a copy still holds every row. */
class FitOnCopyOfAll {
  SplitTestAndTrain prepare(DataSetIterator source) {
    DataSet everything = source.next();
    DataSet snapshot = everything.copy();
    NormalizerStandardize standardizer = new NormalizerStandardize();
    standardizer.fit(snapshot); // expect: leak.preprocessing-before-split
    everything.shuffle(42);
    return everything.splitTestAndTrain(0.75);
  }
}
