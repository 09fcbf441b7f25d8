package corpus.leak.fitontest;

import org.deeplearning4j.datasets.iterator.utilty.ListDataSetIterator;
import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;

/** Clean: trained on the training rows, evaluated once on the test rows. */
class CleanModelEvaluatedOnTest {
  double train(MultiLayerNetwork net, DataSet pooled) {
    SplitTestAndTrain split = pooled.splitTestAndTrain(0.75);
    DataSetIterator testBatches = new ListDataSetIterator<>(split.getTest().asList(), 32);
    DataSetIterator trainBatches = new ListDataSetIterator<>(split.getTrain().asList(), 32);
    net.fit(trainBatches); // clean: leak.fit-on-test
    return net.evaluate(testBatches).accuracy(); // clean: leak.fit-on-test
  }
}
