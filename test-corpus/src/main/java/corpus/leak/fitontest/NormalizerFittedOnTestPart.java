package corpus.leak.fitontest;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** Defect: the standardizer learns mean and deviation from the test part. */
class NormalizerFittedOnTestPart {
  void prepare(DataSet readings) {
    SplitTestAndTrain split = readings.splitTestAndTrain(0.8);
    DataSet train = split.getTrain();
    DataSet test = split.getTest();
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(test); // expect: leak.fit-on-test
    normalizer.transform(train);
  }
}
