package corpus.leak.tuning;

import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;

/** The test iterator is kept in a field; the score comes from a helper in another file. */
class SelectionThroughHelperAndField {
  private DataSetIterator trainBatches;
  private DataSetIterator testBatches;
  private DataSetIterator validationBatches;

  void load(DataSet rows) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    SplitTestAndTrain inner = split.getTrain().splitTestAndTrain(0.9);
    trainBatches = Networks.batches(inner.getTrain());
    validationBatches = Networks.batches(inner.getTest());
    testBatches = Networks.batches(split.getTest());
  }

  MultiLayerNetwork keepBestOnTest(MultiLayerNetwork net) {
    double best = 0;
    MultiLayerNetwork kept = net;
    for (int epoch = 0; epoch < 30; epoch++) {
      net.fit(trainBatches);
      double score = Networks.accuracyOn(net, testBatches); // expect: leak.test-in-tuning
      if (score > best) {
        best = score;
        kept = net.clone();
      }
    }
    return kept;
  }

  int stopOnFieldTest(MultiLayerNetwork net) {
    int epoch = 0;
    while (net.evaluate(testBatches).accuracy() < 0.95) { // expect: leak.test-in-tuning
      net.fit(trainBatches);
      epoch++;
    }
    return epoch;
  }

  MultiLayerNetwork keepBestOnValidation(MultiLayerNetwork net) {
    double best = 0;
    MultiLayerNetwork kept = net;
    for (int epoch = 0; epoch < 30; epoch++) {
      net.fit(trainBatches);
      double score = Networks.accuracyOn(net, validationBatches); // clean: leak.test-in-tuning
      if (score > best) {
        best = score;
        kept = net.clone();
      }
    }
    System.out.println("test: " + Networks.accuracyOn(kept, testBatches)); // clean: leak.test-in-tuning
    return kept;
  }
}
