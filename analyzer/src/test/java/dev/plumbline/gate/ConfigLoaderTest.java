package dev.plumbline.gate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumbline.finding.Severity;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import org.junit.jupiter.api.Test;

class ConfigLoaderTest {
  private static final Set<String> RULES = Set.of("leak.fit-on-test", "shape.mismatch");

  private static GateConfig parse(String text) throws ConfigException {
    return ConfigLoader.parse(text, "plumbline.yaml", RULES);
  }

  private static String error(String text) {
    return assertThrows(ConfigException.class, () -> parse(text)).getMessage();
  }

  @Test
  void everySettingIsRead() throws ConfigException {
    GateConfig c = parse("""
        # team settings
        version: 1
        fail-on: error
        include: ["src/main/java/**"]
        exclude:
          - "**/generated/**"
        rules:
          leak.fit-on-test:
            severity: warning
          shape.mismatch: off
        test-data-names: [holdoutRows, finalExam]
        """);
    assertEquals(Optional.of(FailLevel.ERROR), c.failOn());
    assertEquals(List.of("src/main/java/**"), c.include());
    assertEquals(List.of("**/generated/**"), c.exclude());
    assertEquals(Optional.of(Severity.WARNING), c.severity("leak.fit-on-test"));
    assertTrue(c.enabled("leak.fit-on-test"));
    assertFalse(c.enabled("shape.mismatch"));
    assertTrue(c.analysisSettings().marksTestData("finalExam"));
    assertFalse(c.analysisSettings().marksTestData("trainRows"));
  }

  @Test
  void jsonIsAcceptedAndAnEmptyFileMeansDefaults() throws ConfigException {
    GateConfig c = parse("{\"fail-on\": \"none\", \"rules\": {\"shape.mismatch\": {\"enabled\": false}}}");
    assertEquals(Optional.of(FailLevel.NONE), c.failOn());
    assertFalse(c.enabled("shape.mismatch"));
    assertEquals(GateConfig.EMPTY, parse(""));
    assertEquals(GateConfig.EMPTY, parse("# nothing yet\n"));
  }

  @Test
  void errorsNameFileLineAndProblemOnOneLine() {
    assertEquals("plumbline.yaml:3: unknown key 'fail_on' in the configuration (known: version, fail-on, "
        + "include, exclude, rules, test-data-names)", error("version: 1\n\nfail_on: error\n"));
    assertEquals("plumbline.yaml:2: fail-on must be one of error, warning, note, none; got 'severe'",
        error("version: 1\nfail-on: severe\n"));
    assertEquals("plumbline.yaml:3: unknown rule 'leak.fit-on-tset' ('plumbline rules' lists them)",
        error("rules:\n  shape.mismatch: off\n  leak.fit-on-tset: off\n"));
    assertEquals("plumbline.yaml:3: unknown key 'severty' in rules.shape.mismatch (known: enabled, severity)",
        error("rules:\n  shape.mismatch:\n    severty: note\n"));
    assertEquals("plumbline.yaml:3: rules.shape.mismatch.severity must be error, warning or note; got 'high'",
        error("rules:\n  shape.mismatch:\n    severity: high\n"));
    assertEquals("plumbline.yaml:2: rules.shape.mismatch.enabled must be true or false; got 'yes'",
        error("rules:\n  shape.mismatch: {enabled: yes}\n"));
    assertEquals("plumbline.yaml:1: unsupported version '2'; this plumbline reads version 1", error("version: 2\n"));
    assertEquals("plumbline.yaml:1: include must be a list, e.g. [\"a\", \"b\"]", error("include: src/**\n"));
    assertTrue(error("exclude: [\"src/[a\"]\n").startsWith("plumbline.yaml:1: exclude: bad glob 'src/[a':"));
    assertEquals("plumbline.yaml:1: test-data-names: 'final-exam' is not a Java identifier",
        error("test-data-names: [final-exam]\n"));
    assertEquals("plumbline.yaml:2: key 'fail-on' appears twice (first at line 1)",
        error("fail-on: error\nfail-on: note\n"));
    assertEquals("plumbline.yaml:1: the configuration must be a mapping of version, fail-on, include, "
        + "exclude, rules, test-data-names", error("- a\n- b\n"));
  }

  @Test
  void yamlSyntaxErrorsNameTheirLine() {
    String message = error("version: 1\nrules:\n  shape.mismatch: [off\n");
    assertTrue(message.startsWith("plumbline.yaml:4: not valid YAML: "), message);
    assertFalse(message.contains("\n"));
  }
}
