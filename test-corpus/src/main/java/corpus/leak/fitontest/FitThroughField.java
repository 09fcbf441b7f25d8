package corpus.leak.fitontest;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** Defect through fields: the test part is kept in one method and fitted in another. */
class FitThroughField {
  private DataSet training;
  private DataSet heldBack;
  private final NormalizerStandardize normalizer = new NormalizerStandardize();

  void load(DataSet rows) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    training = split.getTrain();
    heldBack = split.getTest();
  }

  void prepareWrongly() {
    normalizer.fit(heldBack); // expect: leak.fit-on-test
  }

  void prepare() {
    normalizer.fit(training); // clean: leak.fit-on-test
    normalizer.transform(heldBack);
  }
}
