package corpus.leak.fitontest;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** Clean: fitted on the training part, only applied to the test part. */
class CleanNormalizerFittedOnTrainPart {
  void prepare(DataSet readings) {
    SplitTestAndTrain split = readings.splitTestAndTrain(0.8);
    DataSet train = split.getTrain();
    DataSet test = split.getTest();
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(train); // clean: leak.fit-on-test
    normalizer.transform(test); // clean: leak.fit-on-test
  }
}
