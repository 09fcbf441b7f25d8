package corpus.leak.preprocessing;

import java.io.File;
import java.io.IOException;
import org.datavec.api.records.reader.RecordReader;
import org.datavec.api.records.reader.impl.csv.CSVRecordReader;
import org.datavec.api.split.FileSplit;
import org.deeplearning4j.datasets.datavec.RecordReaderDataSetIterator;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/**
 * A bird-song feature table kept in a file called "test-run.csv", loaded whole, normalized, then
 * split into training and test parts by this code. The name says test; the split says these are
 * all the rows. The fit before the split is the leak, reported as such and not as a fit on test
 * rows.
 */
class NamedTestFileSplitAfterFit {
  DataSet[] prepare(File folder) throws IOException, InterruptedException {
    RecordReader reader = new CSVRecordReader(0, ',');
    reader.initialize(new FileSplit(new File(folder, "test-run.csv")));
    DataSet songs = new RecordReaderDataSetIterator(reader, 400, 6, 4).next();
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(songs); // expect: leak.preprocessing-before-split // clean: leak.fit-on-test
    normalizer.transform(songs);
    SplitTestAndTrain parts = songs.splitTestAndTrain(0.7);
    return new DataSet[] {parts.getTrain(), parts.getTest()};
  }
}
