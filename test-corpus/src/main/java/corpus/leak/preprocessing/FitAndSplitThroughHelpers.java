package corpus.leak.preprocessing;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerMinMaxScaler;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** The fit, the split, or both happen inside helpers in another file. */
class FitAndSplitThroughHelpers {
  SplitTestAndTrain helperFitsBeforeSplit(DataSet all) {
    NormalizerStandardize normalizer = Preparation.fitted(all); // expect: leak.preprocessing-before-split
    normalizer.transform(all);
    return all.splitTestAndTrain(0.8);
  }

  SplitTestAndTrain helperSplitsAfterFit(DataSet all) {
    NormalizerMinMaxScaler scaler = new NormalizerMinMaxScaler();
    scaler.fit(all); // expect: leak.preprocessing-before-split
    return Preparation.holdOut(all, 0.8);
  }

  SplitTestAndTrain bothInHelpers(DataSet all) {
    Preparation.fitted(all); // expect: leak.preprocessing-before-split
    return Preparation.holdOut(all, 0.75);
  }

  NormalizerStandardize helperFitsTrainingPart(DataSet all) {
    SplitTestAndTrain split = Preparation.holdOut(all, 0.8);
    return Preparation.fitted(split.getTrain()); // clean: leak.preprocessing-before-split
  }
}
