package dev.plumbline.librarychecks.shape;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.github.javaparser.StaticJavaParser;
import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.body.MethodDeclaration;
import dev.plumbline.engine.ScanRequest;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.engine.Scanner;
import dev.plumbline.finding.Finding;
import dev.plumbline.model.ApiModel;
import dev.plumbline.rules.BuiltInRules;
import java.io.IOException;
import java.lang.reflect.InvocationTargetException;
import java.lang.reflect.Method;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;

/**
 * DL4J network widths, decided by running deeplearning4j-nn 1.0.0-M2.1: each scenario in
 * {@link NetworkWidthScenarios} is run, and the same source file is scanned by plumbline. Every
 * {@code shape.mismatch} plumbline reports inside a scenario must belong to one that DL4J
 * rejects (no false claim), and the scenarios named in {@link #DETECTED} must be reported (so
 * the test fails if the analysis stops seeing them).
 */
class NetworkWidthsTest {
  static final Path MODULE = Path.of("").toAbsolutePath();
  static final Path SOURCE = MODULE.resolve(
      "src/test/java/dev/plumbline/librarychecks/shape/NetworkWidthScenarios.java");

  /** Scenarios the analysis must report; all of them fail in DL4J. */
  static final List<String> DETECTED = List.of("listKeepingStaleNinFails", "graphWithStaleNinFails",
      "graphOfRecurrentLayersWithStaleNinFails", "featuresWiderThanFirstLayerFail",
      "labelsNarrowerThanOutputFailWithMse", "labelsNarrowerThanOutputFailWithCrossEntropy",
      "recurrentFeaturesOfWrongWidthFail", "recurrentLabelsOfWrongWidthFail");

  @Test
  void plumblineClaimsOnlyFailuresDl4jHasAndFindsTheKnownOnes() throws IOException {
    Map<String, String> outcome = new TreeMap<>();
    for (Method m : NetworkWidthScenarios.class.getDeclaredMethods()) {
      if (!java.lang.reflect.Modifier.isPublic(m.getModifiers())) {
        continue;
      }
      try {
        m.invoke(new NetworkWidthScenarios());
        outcome.put(m.getName(), "runs");
      } catch (InvocationTargetException e) {
        outcome.put(m.getName(), "fails: " + e.getCause().getClass().getSimpleName());
      } catch (ReflectiveOperationException e) {
        throw new AssertionError(e);
      }
    }
    Map<String, String> reported = reportedScenarios();
    List<String> problems = new ArrayList<>();
    reported.forEach((scenario, message) -> {
      if (!outcome.getOrDefault(scenario, "runs").startsWith("fails")) {
        problems.add("false claim in " + scenario + " (DL4J runs it): " + message);
      }
    });
    for (String s : DETECTED) {
      if (!outcome.get(s).startsWith("fails")) {
        problems.add(s + " was expected to fail in DL4J but " + outcome.get(s));
      }
      if (!reported.containsKey(s)) {
        problems.add(s + " fails in DL4J (" + outcome.get(s) + ") but plumbline does not report it");
      }
    }
    System.out.println("DL4J outcomes: " + outcome + "\nplumbline reports: " + reported.keySet());
    assertTrue(problems.isEmpty(), () -> String.join("\n", problems));
    assertEquals("runs", outcome.get("listWithStaleNinIsOverridden"),
        "a list() configuration overrides a stale nIn in DL4J 1.0.0-M2.1");
  }

  /** Scenario name to the first shape.mismatch message key plumbline reports inside it. */
  private static Map<String, String> reportedScenarios() throws IOException {
    Scanner scanner = new Scanner(ApiModel.loadDefault(), BuiltInRules.all(), BuiltInRules.projectAnalyses(),
        Scanner.ScanListener.NONE);
    ScanResult result = scanner.scan(new ScanRequest(List.of(SOURCE), MODULE, List.of(), List.of(), 1));
    assertTrue(result.notifications().isEmpty(), () -> "scan problems: " + result.notifications());
    CompilationUnit unit = StaticJavaParser.parse(SOURCE);
    Map<String, String> out = new TreeMap<>();
    for (Finding f : result.findings()) {
      if (!f.ruleId().equals("shape.mismatch")) {
        continue;
      }
      int line = f.location().range().startLine();
      for (MethodDeclaration m : unit.findAll(MethodDeclaration.class)) {
        if (m.getBegin().get().line <= line && line <= m.getEnd().get().line) {
          out.putIfAbsent(m.getNameAsString(), f.message().key());
        }
      }
    }
    return out;
  }
}
