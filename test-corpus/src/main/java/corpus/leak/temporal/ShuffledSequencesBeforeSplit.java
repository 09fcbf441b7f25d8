package corpus.leak.temporal;

import java.io.File;
import java.io.IOException;
import org.datavec.api.records.reader.SequenceRecordReader;
import org.datavec.api.records.reader.impl.csv.CSVSequenceRecordReader;
import org.datavec.api.split.FileSplit;
import org.deeplearning4j.datasets.datavec.SequenceRecordReaderDataSetIterator;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;

/** Rows read by a sequence reader are shuffled before the split (defects) or after it (clean). */
class ShuffledSequencesBeforeSplit {
  SplitTestAndTrain shuffleThenSplit(File folder) throws IOException, InterruptedException {
    SequenceRecordReader reader = new CSVSequenceRecordReader(1, ",");
    reader.initialize(new FileSplit(folder));
    DataSetIterator windows = new SequenceRecordReaderDataSetIterator(reader, 128, 3, 5);
    DataSet all = windows.next();
    all.shuffle(5); // expect: leak.temporal-shuffle
    return all.splitTestAndTrain(0.8);
  }

  SplitTestAndTrain throughHelpers(File folder) throws IOException, InterruptedException {
    DataSet all = SequenceReaders.traces(folder).next();
    SequenceReaders.mix(all); // expect: leak.temporal-shuffle
    return all.splitTestAndTrain(0.8);
  }

  DataSet splitThenShuffleTraining(File folder) throws IOException, InterruptedException {
    DataSet all = SequenceReaders.traces(folder).next();
    SplitTestAndTrain split = all.splitTestAndTrain(0.8); // clean: leak.temporal-shuffle
    DataSet train = split.getTrain();
    train.shuffle(5); // clean: leak.temporal-shuffle
    SequenceReaders.mix(train); // clean: leak.temporal-shuffle
    return train;
  }
}
