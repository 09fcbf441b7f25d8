package corpus.leak.preprocessing;

import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;
import org.nd4j.linalg.factory.Nd4j;

/** Defect: a data set assembled from arrays is fitted whole, then split. */
class FitOnDataBuiltFromArrays {
  SplitTestAndTrain prepare(double[][] sensorRows, double[][] targets) {
    INDArray x = Nd4j.create(sensorRows);
    INDArray y = Nd4j.create(targets);
    DataSet assembled = new DataSet(x, y);
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(assembled); // expect: leak.preprocessing-before-split
    return assembled.splitTestAndTrain(0.8);
  }
}
