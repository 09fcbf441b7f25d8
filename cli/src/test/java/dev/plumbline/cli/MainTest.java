package dev.plumbline.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The command line, run in-process with captured streams. */
class MainTest {
  static final String LEAKY = """
      package demo;
      import org.nd4j.linalg.dataset.DataSet;
      import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
      import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;
      class Leaky {
        void prepare(DataSetIterator it) {
          DataSet all = it.next();
          NormalizerStandardize n = new NormalizerStandardize();
          n.fit(all);
          all.splitTestAndTrain(0.8);
        }
      }
      """;

  record Run(int code, String out, String err) {}

  static Run run(Path cwd, String... args) {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    ByteArrayOutputStream err = new ByteArrayOutputStream();
    int code = Main.run(args, new PrintStream(out, true, StandardCharsets.UTF_8),
        new PrintStream(err, true, StandardCharsets.UTF_8), cwd);
    return new Run(code, out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8));
  }

  @Test
  void unknownOptionIsUsageErrorOnOneLine(@TempDir Path dir) {
    Run r = run(dir, "scan", "--frobnicate", ".");
    assertEquals(2, r.code());
    assertTrue(r.err().startsWith("plumbline: Unknown option: '--frobnicate'"), r.err());
    assertEquals(1, r.err().strip().lines().count(), "one line: " + r.err());
    assertFalse(r.err().contains("\tat "), "no stack trace");
  }

  @Test
  void missingPathIsUsageError(@TempDir Path dir) {
    Run r = run(dir, "scan", "no/such/folder");
    assertEquals(2, r.code());
    assertEquals("plumbline: path not found: no/such/folder", r.err().strip());
  }

  @Test
  void badJobsAndFormatAreUsageErrors(@TempDir Path dir) {
    assertEquals(2, run(dir, "scan", "--jobs", "0", ".").code());
    assertEquals(2, run(dir, "scan", "--format", "pdf", ".").code());
    assertEquals(2, run(dir, "scan").code());
    assertEquals(2, run(dir, "frobnicate").code());
  }

  @Test
  void findingsGiveExitOneAndCompilerStyleText(@TempDir Path dir) throws IOException {
    Files.writeString(dir.resolve("Leaky.java"), LEAKY);
    Run r = run(dir, "scan", ".");
    assertEquals(1, r.code(), r.out() + r.err());
    assertTrue(r.out().startsWith("Leaky.java:9:5: error: "), r.out());
    assertTrue(r.out().contains("[leak.preprocessing-before-split]"));
    assertTrue(r.out().contains("    ^~~~~~~~~~"), "caret under the call");
    assertTrue(r.out().contains("  fix: "));
    assertEquals(0, run(dir, "scan", ".", "--fail-on", "none").code());
  }

  @Test
  void syntaxErrorAmongGoodFilesIsIncompleteButStillReports(@TempDir Path dir) throws IOException {
    Files.writeString(dir.resolve("Leaky.java"), LEAKY);
    Files.writeString(dir.resolve("Broken.java"), "class Broken { void m( { }");
    Run r = run(dir, "scan", ".", "--format", "sarif");
    assertEquals(3, r.code());
    assertTrue(r.out().contains("\"ruleId\" : \"leak.preprocessing-before-split\""), "good file still analyzed");
    assertTrue(r.out().contains("Broken.java does not parse"), "notification names the file");
    assertTrue(r.out().contains("\"executionSuccessful\" : false"));
  }

  @Test
  void outputFileIsWrittenAndStdoutStaysEmpty(@TempDir Path dir) throws IOException {
    Files.writeString(dir.resolve("Leaky.java"), LEAKY);
    Run r = run(dir, "scan", ".", "--format", "sarif", "--output", "reports/out.sarif");
    assertEquals(1, r.code());
    assertEquals("", r.out());
    assertTrue(Files.readString(dir.resolve("reports/out.sarif")).contains("\"version\" : \"2.1.0\""));
  }

  @Test
  void rulesAndExplain(@TempDir Path dir) {
    Run rules = run(dir, "rules");
    assertEquals(0, rules.code());
    assertTrue(rules.out().contains("leak.preprocessing-before-split"));
    Run explain = run(dir, "explain", "leak.preprocessing-before-split");
    assertEquals(0, explain.code());
    assertTrue(explain.out().contains("Why it matters:"));
    assertTrue(explain.out().contains("How to fix:"));
    assertTrue(explain.out().contains("Example:"));
    Run unknown = run(dir, "explain", "leak.nothing-like-this");
    assertEquals(2, unknown.code());
    assertTrue(unknown.err().contains("unknown rule"));
  }

  @Test
  void htmlReportIsOneSelfContainedPage(@TempDir Path dir) throws IOException {
    Files.writeString(dir.resolve("Leaky.java"), LEAKY);
    Run r = run(dir, "scan", ".", "--format", "html", "--output", "audit.html");
    assertEquals(1, r.code(), r.err());
    String html = Files.readString(dir.resolve("audit.html"));
    assertTrue(html.startsWith("<!DOCTYPE html>"));
    assertTrue(html.contains("id=\"limits\""), "limits stated");
    assertTrue(html.contains("leak.preprocessing-before-split"));
    for (String external : new String[] {"<link", "src=\"http", "href=\"http", "@import", "url("}) {
      assertFalse(html.contains(external), "fetches nothing: " + external);
    }
    assertTrue(html.contains("Content-Security-Policy"), "only its own inline blocks may run");
  }
}
