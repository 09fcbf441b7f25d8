package dev.plumbline.gate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumbline.engine.MessageCatalog;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.finding.Finding;
import dev.plumbline.finding.Location;
import dev.plumbline.finding.Message;
import dev.plumbline.finding.Severity;
import dev.plumbline.finding.SourceRange;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;

class BaselineTest {
  private static final MessageCatalog NO_TEXTS = new MessageCatalog(List.of());

  private static Finding finding(String rule, int line, String fingerprint) {
    return new Finding(rule, Severity.ERROR, new Location("A.java", new SourceRange(line, 1, line, 5)),
        Message.of("m"), List.of(), Message.of("fix"), Optional.empty(), fingerprint, Optional.empty());
  }

  private static ScanResult result(Finding... findings) {
    return new ScanResult(List.of(findings), List.of(), List.of(), 1, 1, 10, Map.of());
  }

  @Test
  void writtenBaselineReadsBackTheSame() throws ConfigException {
    Baseline b = Baseline.of(result(finding("leak.x", 4, "00000000000000aa"),
        finding("leak.x", 2, "00000000000000bb").withSuppression("accepted")), NO_TEXTS);
    assertEquals(1, b.entries().size(), "suppressed findings need no baseline entry");
    Baseline read = Baseline.parse(b.render(), "b.json");
    assertEquals(b.entries(), read.entries());
    assertEquals(b.render(), read.render());
  }

  @Test
  void eachEntryAcceptsOneFindingAndStaleEntriesHideNothing() throws ConfigException {
    Baseline b = Baseline.of(result(finding("leak.x", 4, "00000000000000aa"),
        finding("leak.y", 9, "00000000000000cc")), NO_TEXTS);
    // Later: the first defect moved down, the second was fixed, and two new ones appeared: a
    // second instance of the first (same fingerprint text, next occurrence number) and one of
    // another rule that happens to share the fixed finding's fingerprint value.
    Baseline.Outcome o = b.filter(result(finding("leak.x", 14, "00000000000000aa"),
        finding("leak.x", 15, "00000000000000ab"), finding("leak.z", 9, "00000000000000cc")), "b.json");
    assertEquals(List.of(15, 9), o.result().findings().stream()
        .map(f -> f.location().range().startLine()).toList());
    assertEquals(new BaselineSummary("b.json", 1, 1), o.summary());
    Baseline.Outcome twice = b.filter(result(finding("leak.x", 4, "00000000000000aa"),
        finding("leak.x", 5, "00000000000000aa")), "b.json");
    assertEquals(1, twice.result().findings().size(), "one entry cannot accept two findings");
  }

  @Test
  void badFilesNameTheirLine() {
    String broken = assertThrows(ConfigException.class, () -> Baseline.parse("{", "b.json")).getMessage();
    assertTrue(broken.startsWith("b.json:1: not valid JSON: Unexpected end-of-input"), broken);
    assertEquals("b.json:1: format must be \"plumbline-baseline\"; got \"sarif\"",
        assertThrows(ConfigException.class, () -> Baseline.parse("{\"format\": \"sarif\"}", "b.json")).getMessage());
    assertEquals("b.json:4: fingerprint must be 16 lower-case hex digits; got \"xyz\"",
        assertThrows(ConfigException.class, () -> Baseline.parse(
            "{\"format\": \"plumbline-baseline\", \"version\": 1, \"entries\": [\n{\n\"rule\": \"leak.x\",\n"
                + "\"fingerprint\": \"xyz\"}]}", "b.json")).getMessage());
    assertEquals("b.json: not a plumbline baseline: format, version and entries are required",
        assertThrows(ConfigException.class, () -> Baseline.parse("{}", "b.json")).getMessage());
  }
}
