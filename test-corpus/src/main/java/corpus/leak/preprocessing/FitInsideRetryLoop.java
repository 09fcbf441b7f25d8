package corpus.leak.preprocessing;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerMinMaxScaler;

/** Defect inside a loop and a try block: the flow analysis follows both. */
class FitInsideRetryLoop {
  SplitTestAndTrain prepare(DataSetIterator source, int attempts) {
    DataSet loaded = null;
    for (int i = 0; i < attempts && loaded == null; i++) {
      try {
        loaded = source.next();
      } catch (IllegalStateException e) {
        source.reset();
      }
    }
    NormalizerMinMaxScaler scaler = new NormalizerMinMaxScaler();
    if (loaded != null) {
      scaler.fit(loaded); // expect: leak.preprocessing-before-split
    }
    return loaded.splitTestAndTrain(0.8);
  }
}
