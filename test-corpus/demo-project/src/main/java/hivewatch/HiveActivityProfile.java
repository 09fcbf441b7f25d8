package hivewatch;

import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/**
 * Daily activity profiles of an invented apiary: for each hive, the share of its day's hum
 * recorded in each hour. The hourly hum is synthesized here so the demo needs no files.
 */
public final class HiveActivityProfile {
  static final int HIVES = 24;
  static final int HOURS = 24;

  private HiveActivityProfile() {}

  /** Hives by hours; each row should sum to one. */
  public static INDArray hourlyShares() {
    double[][] hum = new double[HIVES][HOURS];
    for (int hive = 0; hive < HIVES; hive++) {
      for (int hour = 0; hour < HOURS; hour++) {
        hum[hive][hour] = 50 + 10 * Math.sin((hour + hive) * Math.PI / 12);
      }
    }
    INDArray loudness = Nd4j.create(hum);
    return loudness.div(loudness.sum(1)); // expect: shape.reduced-dim-broadcast
  }
}
