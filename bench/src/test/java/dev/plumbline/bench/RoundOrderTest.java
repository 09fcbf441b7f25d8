package dev.plumbline.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;

class RoundOrderTest {
  @Test
  void everyRoundHasEveryMeasurementOnce() {
    List<String> legs = List.of("a", "b", "c", "d", "e", "f");
    for (int round = 0; round < 10; round++) {
      List<String> order = RoundOrder.of(legs, round);
      assertEquals(Set.copyOf(legs), Set.copyOf(order));
      assertEquals(legs.size(), order.size());
    }
  }

  @Test
  void overAsManyRoundsAsMeasurementsEachTakesEveryPlace() {
    List<String> legs = List.of("parse", "scan", "parse 4x", "scan 4x");
    for (int place = 0; place < legs.size(); place++) {
      Set<String> seen = new HashSet<>();
      for (int round = 0; round < legs.size(); round++) {
        seen.add(RoundOrder.of(legs, round).get(place));
      }
      assertEquals(Set.copyOf(legs), seen, "place " + place);
    }
  }

  @Test
  void medianOfOddAndEvenCounts() {
    assertEquals(2.0, BenchmarkMain.median(List.of(3.0, 1.0, 2.0)));
    assertEquals(2.5, BenchmarkMain.median(List.of(4.0, 1.0, 3.0, 2.0)));
    assertEquals(4.0, BenchmarkMain.mean(List.of(1.0, 2.0, 9.0)));
  }
}
