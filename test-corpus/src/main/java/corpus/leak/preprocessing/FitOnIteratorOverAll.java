package corpus.leak.preprocessing;

import java.util.List;
import org.deeplearning4j.datasets.iterator.utilty.ListDataSetIterator;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** Defect: the iterator wraps every row of the data that is split below. */
class FitOnIteratorOverAll {
  SplitTestAndTrain prepare(DataSet pooled) {
    List<DataSet> rows = pooled.asList();
    DataSetIterator batches = new ListDataSetIterator<>(rows, 16);
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(batches); // expect: leak.preprocessing-before-split
    return pooled.splitTestAndTrain(0.7);
  }
}
