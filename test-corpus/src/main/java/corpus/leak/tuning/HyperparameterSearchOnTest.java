package corpus.leak.tuning;

import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;

/** Hyperparameter loops whose values reach the network configuration through a helper. */
class HyperparameterSearchOnTest {
  double learningRateOnTest(DataSet rows) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    DataSetIterator train = Networks.batches(split.getTrain());
    DataSetIterator test = Networks.batches(split.getTest());
    double bestAccuracy = 0;
    double bestRate = 0;
    for (double rate : new double[] {1e-2, 3e-3, 1e-3}) {
      MultiLayerNetwork net = Networks.build(32, rate);
      net.fit(train);
      double accuracy = net.evaluate(test).accuracy(); // expect: leak.test-in-tuning
      if (accuracy > bestAccuracy) {
        bestAccuracy = accuracy;
        bestRate = rate;
      }
    }
    return bestRate;
  }

  void layerSizesPrintedOnTest(DataSet rows) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    DataSetIterator train = Networks.batches(split.getTrain());
    DataSetIterator test = Networks.batches(split.getTest());
    for (int hidden = 8; hidden <= 64; hidden *= 2) {
      MultiLayerNetwork net = Networks.build(hidden, 1e-3);
      net.fit(train);
      System.out.println(hidden + " units: " + net.evaluate(test).accuracy()); // expect: leak.test-in-tuning
    }
  }

  double learningRateOnValidation(DataSet rows) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    SplitTestAndTrain inner = split.getTrain().splitTestAndTrain(0.8);
    DataSetIterator train = Networks.batches(inner.getTrain());
    DataSetIterator validation = Networks.batches(inner.getTest());
    double bestAccuracy = 0;
    double bestRate = 0;
    for (double rate : new double[] {1e-2, 3e-3, 1e-3}) {
      MultiLayerNetwork net = Networks.build(32, rate);
      net.fit(train);
      double accuracy = net.evaluate(validation).accuracy(); // clean: leak.test-in-tuning
      if (accuracy > bestAccuracy) {
        bestAccuracy = accuracy;
        bestRate = rate;
      }
    }
    return bestRate;
  }

  void repeatedSeedsOnTest(DataSet rows) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    DataSetIterator train = Networks.batches(split.getTrain());
    DataSetIterator test = Networks.batches(split.getTest());
    for (int run = 0; run < 3; run++) {
      MultiLayerNetwork net = Networks.build(32, 1e-3);
      net.fit(train);
      System.out.println("run " + run + ": " + net.evaluate(test).accuracy()); // clean: leak.test-in-tuning
    }
  }
}
