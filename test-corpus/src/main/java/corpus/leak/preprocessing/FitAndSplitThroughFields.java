package corpus.leak.preprocessing;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** All rows live in a field: one method fits on them, another splits them. */
class FitAndSplitThroughFields {
  private DataSet allRows;
  private DataSet trainingRows;
  private final NormalizerStandardize normalizer = new NormalizerStandardize();

  void load(DataSetIterator source) {
    allRows = source.next();
  }

  void normalize() {
    normalizer.fit(allRows); // expect: leak.preprocessing-before-split
    normalizer.transform(allRows);
  }

  SplitTestAndTrain split() {
    SplitTestAndTrain split = allRows.splitTestAndTrain(0.8);
    trainingRows = split.getTrain();
    return split;
  }

  void normalizeTraining() {
    normalizer.fit(trainingRows); // clean: leak.preprocessing-before-split
  }
}
