package corpus.leak.tuning;

import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;

/** Hand-written early stopping: on the test loss (defect) and on a validation loss (clean). */
class StopWhenTestLossRises {
  void onTest(MultiLayerNetwork net, DataSet rows) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    DataSet train = split.getTrain();
    DataSet test = split.getTest();
    double previous = Double.MAX_VALUE;
    for (int epoch = 0; epoch < 100; epoch++) {
      net.fit(train);
      double loss = net.score(test); // expect: leak.test-in-tuning
      if (loss > previous) {
        break;
      }
      previous = loss;
    }
  }

  void onValidation(MultiLayerNetwork net, DataSet rows) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    SplitTestAndTrain inner = split.getTrain().splitTestAndTrain(0.9);
    DataSet train = inner.getTrain();
    DataSet validation = inner.getTest();
    double previous = Double.MAX_VALUE;
    for (int epoch = 0; epoch < 100; epoch++) {
      net.fit(train);
      double loss = net.score(validation); // clean: leak.test-in-tuning
      if (loss > previous) {
        break;
      }
      previous = loss;
    }
    double finalLoss = net.score(split.getTest()); // clean: leak.test-in-tuning
    if (finalLoss > 1.0) {
      System.err.println("final test loss is high: " + finalLoss);
    }
  }
}
