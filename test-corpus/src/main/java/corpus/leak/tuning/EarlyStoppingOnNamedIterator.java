package corpus.leak.tuning;

import org.datavec.api.records.reader.RecordReader;
import org.deeplearning4j.datasets.datavec.RecordReaderDataSetIterator;
import org.deeplearning4j.earlystopping.EarlyStoppingConfiguration;
import org.deeplearning4j.earlystopping.scorecalc.DataSetLossCalculator;
import org.deeplearning4j.earlystopping.termination.MaxEpochsTerminationCondition;
import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;

/**
 * Early stopping for a tide-height regressor scored on an iterator loaded here: only its name
 * says which rows it holds, so the finding says so and is a warning.
 */
class EarlyStoppingOnNamedIterator {
  EarlyStoppingConfiguration<MultiLayerNetwork> stopOnTestNamed(RecordReader reader) {
    DataSetIterator tideTest = new RecordReaderDataSetIterator(reader, 32, 6, 6, true);
    return new EarlyStoppingConfiguration.Builder<MultiLayerNetwork>()
        .epochTerminationConditions(new MaxEpochsTerminationCondition(40))
        .scoreCalculator(new DataSetLossCalculator(tideTest, true)) // expect: leak.test-in-tuning
        .build();
  }

  EarlyStoppingConfiguration<MultiLayerNetwork> stopOnValidationNamed(RecordReader reader) {
    DataSetIterator tideValidation = new RecordReaderDataSetIterator(reader, 32, 6, 6, true);
    return new EarlyStoppingConfiguration.Builder<MultiLayerNetwork>()
        .epochTerminationConditions(new MaxEpochsTerminationCondition(40))
        .scoreCalculator(new DataSetLossCalculator(tideValidation, true)) // clean: leak.test-in-tuning
        .build();
  }
}
