package dev.plumbline.gate;

import static dev.plumbline.finding.Severity.ERROR;
import static dev.plumbline.finding.Severity.NOTE;
import static dev.plumbline.finding.Severity.WARNING;
import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class SeverityOverridesTest {
  @Test
  void configuredSeverityReplacesTheDefaultAndUnsureFindingsStayBelowIt() {
    assertEquals(WARNING, SeverityOverrides.shifted(WARNING, ERROR, ERROR));
    assertEquals(NOTE, SeverityOverrides.shifted(WARNING, ERROR, WARNING), "possible stays one step lower");
    assertEquals(NOTE, SeverityOverrides.shifted(NOTE, ERROR, WARNING), "never below note");
    assertEquals(ERROR, SeverityOverrides.shifted(ERROR, WARNING, WARNING));
    assertEquals(WARNING, SeverityOverrides.shifted(ERROR, WARNING, NOTE));
  }
}
