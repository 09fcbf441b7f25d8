package corpus.leak.fitontest;

import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerMinMaxScaler;

/** Project helpers: what they do with their arguments is known at every call through summaries. */
final class ScalerHelpers {
  private ScalerHelpers() {}

  static NormalizerMinMaxScaler scalerFor(DataSet rows) {
    NormalizerMinMaxScaler scaler = new NormalizerMinMaxScaler(0, 1);
    scaler.fit(rows); // clean: leak.fit-on-test
    return scaler;
  }

  static void trainOn(MultiLayerNetwork net, DataSetIterator batches, int epochs) {
    for (int i = 0; i < epochs; i++) {
      net.fit(batches); // clean: leak.fit-on-test
      batches.reset();
    }
  }
}
