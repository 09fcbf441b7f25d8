package corpus.leak.preprocessing;

import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** Clean: training and test rows come from separate sources; nothing here is split. */
class CleanNoSplitHere {
  NormalizerStandardize prepare(DataSetIterator trainingSource, DataSetIterator evaluationSource) {
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(trainingSource); // clean: leak.preprocessing-before-split
    trainingSource.setPreProcessor(normalizer);
    evaluationSource.setPreProcessor(normalizer);
    DataSet first = trainingSource.next();
    normalizer.transform(first);
    return normalizer;
  }
}
