package corpus.leak.temporal;

import java.io.File;
import java.io.IOException;
import org.datavec.api.records.reader.SequenceRecordReader;
import org.datavec.api.records.reader.impl.csv.CSVSequenceRecordReader;
import org.datavec.api.split.FileSplit;
import org.deeplearning4j.datasets.datavec.SequenceRecordReaderDataSetIterator;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;

/** Project helpers: readers of time-ordered sensor traces, and a shuffling helper. */
final class SequenceReaders {
  private SequenceReaders() {}

  static DataSetIterator traces(File folder) throws IOException, InterruptedException {
    SequenceRecordReader reader = new CSVSequenceRecordReader(1, ",");
    reader.initialize(new FileSplit(folder));
    return new SequenceRecordReaderDataSetIterator(reader, 64, 3, 5);
  }

  static void mix(DataSet rows) {
    rows.shuffle(99);
  }
}
