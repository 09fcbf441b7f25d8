package dev.plumbline.corpus;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import dev.plumbline.engine.Rule;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.finding.Finding;
import dev.plumbline.rules.BuiltInRules;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.stream.Collectors;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The golden tests: scan the corpus and the demo project, then compare findings with the marks
 * written next to the code ({@link Expectations}) and with the golden dump of rule ids,
 * message keys, arguments and line:col in {@code src/test/resources/golden/findings.txt}.
 * Run with {@code -Dplumbline.refreshGolden=true} to rewrite the dump after a reviewed change.
 */
class GoldenCorpusTest {
  private static final Path GOLDEN = CorpusScan.MODULE.resolve("src/test/resources/golden/findings.txt");

  /**
   * Least number of firing examples and of clean look-alikes per rule, from the issues that
   * introduced each rule. A rule missing here must have at least one of each.
   */
  private static final Map<String, Integer> MINIMUM_CASES = Map.ofEntries(
      // ---- provenance and loop roles (issue 3)
      Map.entry("leak.preprocessing-before-split", 8),
      Map.entry("leak.fit-on-test", 8),
      Map.entry("leak.test-in-tuning", 8),
      Map.entry("leak.temporal-shuffle", 8),
      Map.entry("repro.unseeded-randomness", 8),
      // ---- memory and tensor-result rules (issue 5)
      Map.entry("memory.graph-accumulation", 8),
      Map.entry("memory.scope-escape", 8),
      Map.entry("tensor.discarded-result", 8),
      // ---- shape rules (issue 4)
      Map.entry("shape.mismatch", 8),
      Map.entry("shape.implicit-broadcast", 8),
      Map.entry("shape.reduced-dim-broadcast", 8),
      Map.entry("shape.unchecked-reshape", 8),
      Map.entry("check.assert-validation", 8));

  private static ScanResult result;
  private static List<Expectations.Mark> marks;

  @BeforeAll
  static void scan() {
    result = CorpusScan.scan(2, CorpusScan.SOURCES, CorpusScan.DEMO, CorpusScan.NOTEBOOKS);
    marks = new ArrayList<>(Expectations.read(CorpusScan.MODULE, CorpusScan.SOURCES));
    marks.addAll(Expectations.read(CorpusScan.MODULE, CorpusScan.DEMO));
    marks.addAll(Expectations.read(CorpusScan.MODULE, CorpusScan.NOTEBOOKS));
  }

  @Test
  void corpusParsesCompletely() {
    assertTrue(result.notifications().isEmpty(), () -> "notifications: " + result.notifications());
    assertTrue(result.filesAnalyzed() > 0);
  }

  @Test
  void findingsMatchTheMarksNextToTheCode() {
    Map<String, Integer> expected = new TreeMap<>();
    Set<String> misses = new java.util.TreeSet<>();
    for (Expectations.Mark m : marks) {
      String key = m.uri() + ":" + m.line() + ": " + m.ruleId();
      if (m.kind() == Expectations.Kind.EXPECT) {
        expected.merge(key, 1, Integer::sum);
      } else if (m.kind() == Expectations.Kind.MISS) {
        misses.add(key);
      }
    }
    Map<String, Integer> actual = new TreeMap<>();
    for (Finding f : result.findings()) {
      if (!f.isSuppressed()) {
        actual.merge(f.location().uri() + ":" + f.location().range().startLine() + ": " + f.ruleId(),
            1, Integer::sum);
      }
    }
    List<String> missing = new ArrayList<>();
    List<String> unexpected = new ArrayList<>();
    for (String k : union(expected.keySet(), actual.keySet())) {
      int want = expected.getOrDefault(k, 0);
      int got = actual.getOrDefault(k, 0);
      if (got < want) {
        missing.add(k + (want > 1 ? " (x" + (want - got) + ")" : ""));
      } else if (got > want) {
        unexpected.add(k + (misses.contains(k) ? "  <- marked expect-miss: promote it to expect" : ""));
      }
    }
    if (!missing.isEmpty() || !unexpected.isEmpty()) {
      fail("golden corpus mismatch\nmissing findings:\n  " + String.join("\n  ", missing)
          + "\nunexpected findings:\n  " + String.join("\n  ", unexpected));
    }
  }

  @Test
  void everyRuleHasFiringAndCleanExamples() {
    List<String> problems = new ArrayList<>();
    for (Rule rule : BuiltInRules.all()) {
      String id = rule.descriptor().id();
      long firing = marks.stream().filter(m -> m.ruleId().equals(id) && m.kind() == Expectations.Kind.EXPECT).count();
      long clean = marks.stream().filter(m -> m.ruleId().equals(id) && m.kind() == Expectations.Kind.CLEAN).count();
      int minimum = MINIMUM_CASES.getOrDefault(id, 1);
      if (firing < minimum || clean < minimum) {
        problems.add(id + ": " + firing + " firing and " + clean + " clean examples, need " + minimum + " each");
      }
    }
    Set<String> known = BuiltInRules.all().stream().map(r -> r.descriptor().id()).collect(Collectors.toSet());
    for (Expectations.Mark m : marks) {
      if (!known.contains(m.ruleId())) {
        problems.add(m.uri() + ":" + m.line() + ": mark names unknown rule " + m.ruleId());
      }
    }
    assertTrue(problems.isEmpty(), () -> String.join("\n", problems));
  }

  @Test
  void goldenDumpOfKeysArgumentsAndPositions() throws IOException {
    String dump = result.findings().stream()
        .map(f -> f.location().display() + ": " + f.severity().label() + ": " + f.ruleId() + ": "
            + f.message().key() + f.message().arguments()
            + f.related().stream().map(r -> " | " + r.location().range().startLine() + ":"
                + r.location().range().startColumn() + " " + r.message().key())
                .collect(Collectors.joining())
            + f.suppression().map(j -> " | suppressed: " + j).orElse(""))
        .collect(Collectors.joining("\n", "", "\n"));
    if (Boolean.getBoolean("plumbline.refreshGolden")) {
      Files.createDirectories(GOLDEN.getParent());
      Files.writeString(GOLDEN, dump, StandardCharsets.UTF_8);
      return;
    }
    assertTrue(Files.exists(GOLDEN), "no golden dump yet: run with -Dplumbline.refreshGolden=true");
    assertEquals(Files.readString(GOLDEN, StandardCharsets.UTF_8), dump,
        "golden dump differs; review the change and refresh with -Dplumbline.refreshGolden=true");
  }

  private static Set<String> union(Set<String> a, Set<String> b) {
    Set<String> all = new java.util.TreeSet<>(a);
    all.addAll(b);
    return all;
  }
}
