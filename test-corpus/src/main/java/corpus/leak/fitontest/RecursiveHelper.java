package corpus.leak.fitontest;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** A recursive helper returns a test part: its summary settles by iteration over the cycle. */
class RecursiveHelper {
  static DataSet innermostTestPart(DataSet rows, int depth) {
    if (depth <= 0) {
      return rows.splitTestAndTrain(0.5).getTest();
    }
    return innermostTestPart(rows.splitTestAndTrain(0.9).getTrain(), depth - 1);
  }

  static DataSet evenOdd(DataSet rows, int depth) {
    return depth % 2 == 0 ? oddStep(rows, depth) : rows.splitTestAndTrain(0.8).getTrain();
  }

  static DataSet oddStep(DataSet rows, int depth) {
    return depth > 0 ? evenOdd(rows, depth - 1) : rows;
  }

  void prepare(DataSet rows) {
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(innermostTestPart(rows, 3)); // expect: leak.fit-on-test
  }

  void prepareOnTraining(DataSet rows) {
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(evenOdd(rows.splitTestAndTrain(0.8).getTrain(), 4)); // clean: leak.fit-on-test
  }
}
