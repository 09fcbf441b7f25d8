package hivewatch;

import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;

/**
 * A threshold baseline on standardized hum loudness. Clean: its statistics come from the
 * training rows only and are reused on the test rows.
 */
public final class HiveBaseline {
  private HiveBaseline() {}

  public static double accuracy(DataSet readings) {
    SplitTestAndTrain split = readings.splitTestAndTrain(0.8);
    INDArray trainX = split.getTrain().getFeatures();
    INDArray testX = split.getTest().getFeatures();
    INDArray mean = trainX.mean(0); // clean: leak.preprocessing-before-split
    INDArray spread = trainX.std(0); // clean: leak.preprocessing-before-split
    INDArray scaled = testX.subRowVector(mean).divRowVector(spread);
    INDArray labels = split.getTest().getLabels();
    int correct = 0;
    for (int row = 0; row < scaled.rows(); row++) {
      boolean predictedStress = scaled.getDouble(row, 3) > 0.5;
      boolean stressed = labels.getDouble(row, 1) > 0.5;
      if (predictedStress == stressed) {
        correct++;
      }
    }
    return (double) correct / scaled.rows();
  }
}
