package corpus.leak.fitontest;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;

/** Keeps the parts of a split in fields and hands them out through getters. */
class RowStore {
  private DataSet training;
  private DataSet heldOut;

  void load(DataSet rows) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    training = split.getTrain();
    heldOut = split.getTest();
  }

  DataSet training() {
    return training;
  }

  DataSet heldOut() {
    return heldOut;
  }
}
