package corpus.leak.tuning;

import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;

/** The epoch is picked by its test accuracy (defect), and by validation accuracy (clean). */
class BestEpochOnTest {
  int pickOnTest(MultiLayerNetwork net, DataSet rows) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    DataSetIterator trainBatches = Networks.batches(split.getTrain());
    DataSetIterator testBatches = Networks.batches(split.getTest());
    double best = 0;
    int bestEpoch = -1;
    for (int epoch = 0; epoch < 20; epoch++) {
      net.fit(trainBatches);
      double accuracy = net.evaluate(testBatches).accuracy(); // expect: leak.test-in-tuning
      if (accuracy > best) {
        best = accuracy;
        bestEpoch = epoch;
      }
    }
    return bestEpoch;
  }

  int pickOnValidation(MultiLayerNetwork net, DataSet rows) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    SplitTestAndTrain inner = split.getTrain().splitTestAndTrain(0.85);
    DataSetIterator trainBatches = Networks.batches(inner.getTrain());
    DataSetIterator validationBatches = Networks.batches(inner.getTest());
    DataSetIterator testBatches = Networks.batches(split.getTest());
    double best = 0;
    int bestEpoch = -1;
    for (int epoch = 0; epoch < 20; epoch++) {
      net.fit(trainBatches);
      double accuracy = net.evaluate(validationBatches).accuracy(); // clean: leak.test-in-tuning
      if (accuracy > best) {
        best = accuracy;
        bestEpoch = epoch;
      }
    }
    System.out.println("test accuracy: " + net.evaluate(testBatches).accuracy()); // clean: leak.test-in-tuning
    return bestEpoch;
  }

  void reportEachEpoch(MultiLayerNetwork net, DataSet rows) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    DataSetIterator trainBatches = Networks.batches(split.getTrain());
    DataSetIterator testBatches = Networks.batches(split.getTest());
    for (int epoch = 0; epoch < 20; epoch++) {
      net.fit(trainBatches);
      double accuracy = net.evaluate(testBatches).accuracy(); // clean: leak.test-in-tuning
      System.out.printf("epoch %d test accuracy %.3f%n", epoch, accuracy);
    }
  }

  int pickOnTrainingLoss(MultiLayerNetwork net, DataSet rows) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    DataSet train = split.getTrain();
    double lowest = Double.MAX_VALUE;
    int bestEpoch = -1;
    for (int epoch = 0; epoch < 20; epoch++) {
      net.fit(train);
      double loss = net.score(train); // clean: leak.test-in-tuning
      if (loss < lowest) {
        lowest = loss;
        bestEpoch = epoch;
      }
    }
    return bestEpoch;
  }
}
