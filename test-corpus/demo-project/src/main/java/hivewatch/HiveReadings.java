package hivewatch;

import java.util.Random;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.factory.Nd4j;

/**
 * Sensor readings from an invented apiary: per hive and hour, brood temperature, humidity,
 * weight change and hum loudness, labelled calm or stressed. Generated here so the demo needs
 * no files.
 */
public final class HiveReadings {
  public static final int FEATURES = 4;
  public static final int CLASSES = 2;

  private HiveReadings() {}

  public static DataSet generate(int hours, long seed) {
    Random random = new Random(seed);
    double[][] x = new double[hours][FEATURES];
    double[][] y = new double[hours][CLASSES];
    for (int h = 0; h < hours; h++) {
      boolean stressed = random.nextDouble() < 0.3;
      x[h][0] = 34.5 + random.nextGaussian() * (stressed ? 1.8 : 0.4);
      x[h][1] = 60 + random.nextGaussian() * 8;
      x[h][2] = (stressed ? -40 : 15) + random.nextGaussian() * 20;
      x[h][3] = (stressed ? 62 : 48) + random.nextGaussian() * 5;
      y[h][stressed ? 1 : 0] = 1;
    }
    INDArray features = Nd4j.create(x);
    INDArray labels = Nd4j.create(y);
    return new DataSet(features, labels);
  }
}
