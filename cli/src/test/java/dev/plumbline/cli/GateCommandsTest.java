package dev.plumbline.cli;

import static dev.plumbline.cli.MainTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The gate's commands end to end, in-process: baseline round trip, suppressions, configuration
 * errors and fixes. Every SARIF log produced here is also kept under {@code target/sarif/} so CI
 * can run the external SARIF check on it.
 */
class GateCommandsTest {
  static final Path SARIF_OUT = Path.of("target/sarif").toAbsolutePath();

  /** A training-data helper with one leak; {@code %s} is where more methods go. */
  static final String SENSORS = """
      package demo;
      import org.nd4j.linalg.dataset.DataSet;
      import org.nd4j.linalg.dataset.SplitTestAndTrain;
      import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;
      class Sensors {
        SplitTestAndTrain first(DataSet all) {
          NormalizerStandardize n = new NormalizerStandardize();
          n.fit(all);
          return all.splitTestAndTrain(0.8);
        }
      %s}
      """;

  static final String SECOND_METHOD = """
        SplitTestAndTrain second(DataSet rows) {
          NormalizerStandardize m = new NormalizerStandardize();
          m.fit(rows);
          return rows.splitTestAndTrain(0.7);
        }
      """;

  private static JsonNode keepSarif(Path dir, String file, String name) throws IOException {
    String text = Files.readString(dir.resolve(file), StandardCharsets.UTF_8);
    Files.createDirectories(SARIF_OUT);
    Files.writeString(SARIF_OUT.resolve(name), text, StandardCharsets.UTF_8);
    return new ObjectMapper().readTree(text);
  }

  @Test
  void baselineRoundTripReportsExactlyTheNewDefect(@TempDir Path dir) throws IOException {
    Files.writeString(dir.resolve("Sensors.java"), SENSORS.formatted(""));
    Files.writeString(dir.resolve("Leaky.java"), MainTest.LEAKY);
    assertEquals(1, run(dir, "scan", ".").code());
    MainTest.Run base = run(dir, "baseline", ".", "--output", "plumbline-baseline.json");
    assertEquals(0, base.code(), base.err());
    assertTrue(base.err().contains("(2 findings in 2 files)"), base.err());
    MainTest.Run quiet = run(dir, "scan", ".", "--baseline", "plumbline-baseline.json");
    assertEquals(0, quiet.code(), quiet.out());
    assertTrue(quiet.out().contains("0 findings (0 errors, 0 warnings, 0 notes), 2 known from plumbline-baseline.json"),
        quiet.out());

    // Ten blank lines at the top move every finding down; one new defect is added.
    Files.writeString(dir.resolve("Sensors.java"), "\n".repeat(10) + SENSORS.formatted(SECOND_METHOD));
    MainTest.Run r = run(dir, "scan", ".", "--baseline", "plumbline-baseline.json",
        "--format", "sarif", "--output", "roundtrip.sarif");
    assertEquals(1, r.code(), r.err());
    JsonNode run = keepSarif(dir, "roundtrip.sarif", "baseline-roundtrip.sarif").get("runs").get(0);
    JsonNode results = run.get("results");
    assertEquals(1, results.size(), results::toString);
    JsonNode where = results.get(0).get("locations").get(0).get("physicalLocation");
    assertEquals("Sensors.java", where.get("artifactLocation").get("uri").asText());
    assertEquals(10 + 13, where.get("region").get("startLine").asInt(), "the new defect, m.fit(rows)");
    assertEquals("new", results.get(0).get("baselineState").asText());
    assertEquals(2, run.get("properties").get("plumbline/baseline").get("known").asInt());
    assertEquals(0, run.get("properties").get("plumbline/baseline").get("stale").asInt());
  }

  @Test
  void aSecondInstanceInTheSameMethodIsNewAndAFixedOneIsStale(@TempDir Path dir) throws IOException {
    Files.writeString(dir.resolve("Sensors.java"), SENSORS.formatted(SECOND_METHOD));
    assertEquals(0, run(dir, "baseline", ".", "--output", "b.json").code());
    String twice = SENSORS.formatted(SECOND_METHOD)
        .replace("    m.fit(rows);\n", "    m.fit(rows);\n    m.fit(rows);\n")
        .replace("    n.fit(all);\n", "");
    Files.writeString(dir.resolve("Sensors.java"), twice);
    MainTest.Run r = run(dir, "scan", ".", "--baseline", "b.json");
    assertEquals(1, r.code(), r.out());
    assertTrue(r.out().startsWith("Sensors.java:13:5: error: "), r.out());
    assertTrue(r.out().contains("1 finding (1 errors, 0 warnings, 0 notes), 1 known from b.json "
        + "(1 entry no longer found)"), r.out());
  }

  @Test
  void suppressedFindingIsInSarifWithItsReasonAndDoesNotFailTheGate(@TempDir Path dir) throws IOException {
    Files.writeString(dir.resolve("Sensors.java"), SENSORS.formatted("").replace("    n.fit(all);\n",
        "    n.fit(all); // plumbline:accept leak.preprocessing-before-split because the split feeds a preview only\n"));
    MainTest.Run r = run(dir, "scan", ".", "--format", "sarif", "--output", "out.sarif");
    assertEquals(0, r.code(), r.err());
    JsonNode result = keepSarif(dir, "out.sarif", "suppressed.sarif").get("runs").get(0).get("results").get(0);
    assertEquals("leak.preprocessing-before-split", result.get("ruleId").asText());
    JsonNode suppression = result.get("suppressions").get(0);
    assertEquals("inSource", suppression.get("kind").asText());
    assertEquals("the split feeds a preview only", suppression.get("justification").asText());
    MainTest.Run text = run(dir, "scan", ".");
    assertTrue(text.out().contains("0 findings (0 errors, 0 warnings, 0 notes), 1 suppressed"), text.out());
  }

  @Test
  void unknownRuleInASuppressionIsReported(@TempDir Path dir) throws IOException {
    Files.writeString(dir.resolve("Sensors.java"), SENSORS.formatted("").replace("  SplitTestAndTrain first",
        "  @SuppressWarnings(\"plumbline:leak.preprocessing-before-splits\")\n  SplitTestAndTrain first"));
    MainTest.Run r = run(dir, "scan", ".");
    assertEquals(1, r.code());
    assertTrue(r.out().contains("Sensors.java:6:21: warning: 'leak.preprocessing-before-splits' is not a "
        + "plumbline rule, so this suppression suppresses nothing [suppression.invalid]"), r.out());
    assertTrue(r.out().contains("[leak.preprocessing-before-split]"), "the leak is still reported");
  }

  @Test
  void configurationDisablesRulesSetsSeveritiesAndFailLevel(@TempDir Path dir) throws IOException {
    Files.writeString(dir.resolve("Sensors.java"), SENSORS.formatted(""));
    Files.writeString(dir.resolve("off.yaml"), "rules:\n  leak.preprocessing-before-split: off\n");
    assertEquals(0, run(dir, "scan", ".", "--config", "off.yaml").code());
    Files.writeString(dir.resolve("note.yaml"), "rules:\n  leak.preprocessing-before-split:\n    severity: note\n");
    MainTest.Run note = run(dir, "scan", ".", "--config", "note.yaml");
    assertEquals(0, note.code());
    assertTrue(note.out().startsWith("Sensors.java:8:5: note: "), note.out());
    assertEquals(1, run(dir, "scan", ".", "--config", "note.yaml", "--fail-on", "note").code());
    Files.writeString(dir.resolve("strict.yaml"), "fail-on: note\nrules:\n  leak.preprocessing-before-split: note\n");
    assertEquals(1, run(dir, "scan", ".", "--config", "strict.yaml").code());
    Files.writeString(dir.resolve("skip.yaml"), "exclude: [\"Sensors.java\"]\n");
    assertEquals(0, run(dir, "scan", ".", "--config", "skip.yaml").code());
  }

  @Test
  void configuredTestDataNamesMarkTestRows(@TempDir Path dir) throws IOException {
    // 'springCohort' says nothing about its purpose by itself; the configuration says it holds
    // the project's test rows, so fitting a normalizer on it is a (name-based) leak.
    Files.writeString(dir.resolve("Cohorts.java"), """
        package demo;
        import org.nd4j.linalg.dataset.DataSet;
        import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
        import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;
        class Cohorts {
          NormalizerStandardize prepare(DataSetIterator source) {
            DataSet springCohort = source.next();
            NormalizerStandardize n = new NormalizerStandardize();
            n.fit(springCohort);
            return n;
          }
        }
        """);
    MainTest.Run plain = run(dir, "scan", ".");
    assertEquals(0, plain.code(), plain.out());
    Files.writeString(dir.resolve("names.yaml"), "test-data-names: [springCohort]\n");
    MainTest.Run named = run(dir, "scan", ".", "--config", "names.yaml");
    assertEquals(1, named.code(), named.out());
    assertTrue(named.out().startsWith("Cohorts.java:9:5: warning: "), named.out());
    assertTrue(named.out().contains("[leak.fit-on-test]"), named.out());
  }

  @Test
  void badConfigurationOrBaselineIsExitTwoWithFileAndLine(@TempDir Path dir) throws IOException {
    Files.writeString(dir.resolve("Sensors.java"), SENSORS.formatted(""));
    Files.writeString(dir.resolve("bad.yaml"), "version: 1\nrules:\n  leak.preprocessing-before-split:\n    level: note\n");
    MainTest.Run r = run(dir, "scan", ".", "--config", "bad.yaml");
    assertEquals(2, r.code());
    assertEquals("plumbline: bad.yaml:4: unknown key 'level' in rules.leak.preprocessing-before-split "
        + "(known: enabled, severity)", r.err().strip());
    Files.writeString(dir.resolve("b.json"), "{\"format\": \"plumbline-baseline\",\n \"version\": 7}");
    MainTest.Run b = run(dir, "scan", ".", "--baseline", "b.json");
    assertEquals(2, b.code());
    assertEquals("plumbline: b.json:2: unsupported baseline version 7; this plumbline reads version 1",
        b.err().strip());
    assertEquals(2, run(dir, "scan", ".", "--config", "missing.yaml").code());
  }

  @Test
  void fixShowsTheDiffOnDryRunThenAppliesIt(@TempDir Path dir) throws IOException {
    String movable = """
        package demo;
        import org.nd4j.linalg.dataset.DataSet;
        import org.nd4j.linalg.dataset.SplitTestAndTrain;
        import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;
        class Movable {
          DataSet prepare(DataSet all) {
            NormalizerStandardize n = new NormalizerStandardize();
            n.fit(all);
            SplitTestAndTrain split = all.splitTestAndTrain(0.8);
            DataSet train = split.getTrain();
            n.transform(train);
            return train;
          }
        }
        """;
    Files.writeString(dir.resolve("Movable.java"), movable);
    Files.writeString(dir.resolve("Leaky.java"), MainTest.LEAKY);
    MainTest.Run dry = run(dir, "fix", ".", "--dry-run");
    assertEquals(0, dry.code(), dry.err());
    assertEquals("""
        --- a/Movable.java
        +++ b/Movable.java
        @@ -5,9 +5,9 @@
         class Movable {
           DataSet prepare(DataSet all) {
             NormalizerStandardize n = new NormalizerStandardize();
        -    n.fit(all);
             SplitTestAndTrain split = all.splitTestAndTrain(0.8);
             DataSet train = split.getTrain();
        +    n.fit(train);
             n.transform(train);
             return train;
           }
        """, dry.out());
    assertEquals(movable, Files.readString(dir.resolve("Movable.java")), "dry run changes nothing");
    MainTest.Run applied = run(dir, "fix", ".");
    assertEquals(0, applied.code(), applied.err());
    assertEquals("fixed Movable.java (1 finding)\n", applied.out());
    assertTrue(applied.err().contains("fixed 1 finding in 1 file"), applied.err());
    assertEquals(MainTest.LEAKY, Files.readString(dir.resolve("Leaky.java")), "no safe fix: untouched");
    MainTest.Run after = run(dir, "scan", ".");
    assertTrue(!after.out().contains("Movable.java"), after.out());
    assertEquals("", run(dir, "fix", ".", "--dry-run").out(), "nothing left to fix");
  }
}
