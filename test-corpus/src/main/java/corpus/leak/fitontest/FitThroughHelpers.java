package corpus.leak.fitontest;

import org.deeplearning4j.datasets.iterator.utilty.ListDataSetIterator;
import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerMinMaxScaler;

/** Defects through helpers in another file: one fits a scaler, one trains a model. */
class FitThroughHelpers {
  NormalizerMinMaxScaler scaleOnHeldBack(DataSet rows) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    DataSet heldBack = split.getTest();
    return ScalerHelpers.scalerFor(heldBack); // expect: leak.fit-on-test
  }

  void trainOnHeldBack(MultiLayerNetwork net, DataSet rows) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    ScalerHelpers.trainOn(net, new ListDataSetIterator<>(split.getTest().asList(), 16), 5); // expect: leak.fit-on-test
  }

  NormalizerMinMaxScaler scaleOnTraining(DataSet rows) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    return ScalerHelpers.scalerFor(split.getTrain()); // clean: leak.fit-on-test
  }
}
