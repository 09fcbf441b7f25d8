package corpus.leak.tuning;

import org.deeplearning4j.earlystopping.EarlyStoppingConfiguration;
import org.deeplearning4j.earlystopping.scorecalc.ClassificationScoreCalculator;
import org.deeplearning4j.earlystopping.scorecalc.DataSetLossCalculator;
import org.deeplearning4j.earlystopping.termination.MaxEpochsTerminationCondition;
import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
import org.nd4j.evaluation.classification.Evaluation;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;

/** DL4J early stopping scored on the test iterator (defects) or a validation iterator (clean). */
class EarlyStoppingOnTest {
  EarlyStoppingConfiguration<MultiLayerNetwork> lossOnTest(DataSet rows) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    DataSetIterator testIterator = Networks.batches(split.getTest());
    return new EarlyStoppingConfiguration.Builder<MultiLayerNetwork>()
        .epochTerminationConditions(new MaxEpochsTerminationCondition(50))
        .scoreCalculator(new DataSetLossCalculator(testIterator, true)) // expect: leak.test-in-tuning
        .build();
  }

  EarlyStoppingConfiguration<MultiLayerNetwork> accuracyOnTest(DataSet rows) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    DataSetIterator testIterator = Networks.batches(split.getTest());
    return new EarlyStoppingConfiguration.Builder<MultiLayerNetwork>()
        .scoreCalculator(new ClassificationScoreCalculator(Evaluation.Metric.ACCURACY, testIterator)) // expect: leak.test-in-tuning
        .build();
  }

  EarlyStoppingConfiguration<MultiLayerNetwork> lossOnValidation(DataSet rows) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    SplitTestAndTrain inner = split.getTrain().splitTestAndTrain(0.8);
    DataSetIterator validationIterator = Networks.batches(inner.getTest());
    return new EarlyStoppingConfiguration.Builder<MultiLayerNetwork>()
        .epochTerminationConditions(new MaxEpochsTerminationCondition(50))
        .scoreCalculator(new DataSetLossCalculator(validationIterator, true)) // clean: leak.test-in-tuning
        .build();
  }
}
