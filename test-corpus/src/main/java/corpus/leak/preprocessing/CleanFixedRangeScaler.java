package corpus.leak.preprocessing;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
import org.nd4j.linalg.dataset.api.preprocessor.ImagePreProcessingScaler;

/** Clean: a fixed-range pixel scaler learns nothing from the rows it is fitted on. */
class CleanFixedRangeScaler {
  SplitTestAndTrain prepare(DataSetIterator images) {
    DataSet all = images.next();
    ImagePreProcessingScaler scaler = new ImagePreProcessingScaler(0, 1);
    scaler.fit(all); // clean: leak.preprocessing-before-split
    scaler.transform(all);
    return all.splitTestAndTrain(0.8);
  }
}
