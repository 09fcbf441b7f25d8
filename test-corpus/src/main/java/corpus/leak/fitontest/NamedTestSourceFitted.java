package corpus.leak.fitontest;

import java.io.File;
import java.io.IOException;
import org.datavec.api.records.reader.RecordReader;
import org.datavec.api.records.reader.impl.csv.CSVRecordReader;
import org.datavec.api.split.FileSplit;
import org.deeplearning4j.datasets.datavec.RecordReaderDataSetIterator;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** Only the folder name says these are test rows: reported, with a lower severity. */
class NamedTestSourceFitted {
  NormalizerStandardize prepare(File root) throws IOException, InterruptedException {
    RecordReader reader = new CSVRecordReader(1, ',');
    reader.initialize(new FileSplit(new File(root, "holdout")));
    DataSetIterator batches = new RecordReaderDataSetIterator(reader, 32, 4, 3);
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(batches); // expect: leak.fit-on-test
    return normalizer;
  }

  NormalizerStandardize prepareOnContestEntries(File root) throws IOException, InterruptedException {
    RecordReader reader = new CSVRecordReader(1, ',');
    reader.initialize(new FileSplit(new File(root, "contest-entries")));
    DataSetIterator latestBatches = new RecordReaderDataSetIterator(reader, 32, 4, 3);
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(latestBatches); // clean: leak.fit-on-test
    return normalizer;
  }
}
