package dev.plumbline.bench;

import java.util.ArrayList;
import java.util.List;

/**
 * The order of the measurements within a round: the list rotated by the round's number, so that
 * over as many rounds as there are measurements each one takes every place once, and a machine
 * that slows down or speeds up within a round does not always favour the same one.
 */
final class RoundOrder {
  private RoundOrder() {}

  static <T> List<T> of(List<T> measurements, int round) {
    int n = measurements.size();
    List<T> order = new ArrayList<>(n);
    for (int i = 0; i < n; i++) {
      order.add(measurements.get(Math.floorMod(i + round, n)));
    }
    return order;
  }
}
