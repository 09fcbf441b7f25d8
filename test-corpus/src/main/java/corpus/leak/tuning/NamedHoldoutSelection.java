package corpus.leak.tuning;

import java.io.File;
import java.io.IOException;
import org.datavec.api.records.reader.RecordReader;
import org.datavec.api.records.reader.impl.csv.CSVRecordReader;
import org.datavec.api.split.FileSplit;
import org.deeplearning4j.datasets.datavec.RecordReaderDataSetIterator;
import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;

/** Only the file name says the rows are held out for testing: reported as a warning. */
class NamedHoldoutSelection {
  int pick(MultiLayerNetwork net, DataSetIterator train, File root) throws IOException, InterruptedException {
    RecordReader reader = new CSVRecordReader(1, ',');
    reader.initialize(new FileSplit(new File(root, "holdout.csv")));
    DataSetIterator batches = new RecordReaderDataSetIterator(reader, 32, 4, 3);
    double best = 0;
    int bestEpoch = 0;
    for (int epoch = 0; epoch < 10; epoch++) {
      net.fit(train);
      double f1 = net.evaluate(batches).f1(); // expect: leak.test-in-tuning
      if (f1 > best) {
        best = f1;
        bestEpoch = epoch;
      }
    }
    return bestEpoch;
  }
}
