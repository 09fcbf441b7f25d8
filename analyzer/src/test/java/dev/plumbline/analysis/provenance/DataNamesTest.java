package dev.plumbline.analysis.provenance;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

/** The named heuristic reads whole words only, and says nothing when names disagree. */
class DataNamesTest {

  @Test
  void splitsCamelCaseSnakeCaseAndPaths() {
    assertEquals(List.of("test", "iterator"), DataNames.words("testIterator"));
    assertEquals(List.of("data", "holdout", "csv"), DataNames.words("data/holdout.csv"));
    assertEquals(List.of("val", "batches"), DataNames.words("VAL_batches"));
  }

  @Test
  void heldOutRolesFromWholeWords() {
    assertEquals(Optional.of(Role.TEST), DataNames.heldOutRole(List.of("testRows")));
    assertEquals(Optional.of(Role.TEST), DataNames.heldOutRole(List.of("readings/holdout")));
    assertEquals(Optional.of(Role.VALIDATION), DataNames.heldOutRole(List.of("validationBatches")));
    assertEquals(Optional.empty(), DataNames.heldOutRole(List.of("latest", "contest")));
    assertEquals(Optional.empty(), DataNames.heldOutRole(List.of("attestation")));
  }

  @Test
  void disagreeingNamesSayNothing() {
    assertEquals(Optional.empty(), DataNames.heldOutRole(List.of("trainTestSplit")));
    assertEquals(Optional.empty(), DataNames.heldOutRole(List.of("testDir", "validationDir")));
    assertEquals(Optional.empty(), DataNames.heldOutRole(List.of("trainingRows")));
  }

  @Test
  void timeWords() {
    assertTrue(DataNames.saysTimeOrdered(List.of("hourlyReadings")));
    assertTrue(DataNames.saysTimeOrdered(List.of("sensor-timeseries")));
    assertFalse(DataNames.saysTimeOrdered(List.of("runtimeMetrics")));
    assertFalse(DataNames.saysTimeOrdered(List.of("photos", "update")));
  }
}
