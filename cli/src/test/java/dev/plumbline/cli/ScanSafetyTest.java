package dev.plumbline.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.FindingReporter;
import dev.plumbline.engine.Rule;
import dev.plumbline.engine.RuleDescriptor;
import dev.plumbline.finding.Severity;
import dev.plumbline.rules.BuiltInRules;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.atomic.AtomicReference;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Failures stay contained and the tool stays inside its lane, end to end through the command
 * line: a failing rule, link loops, dangling links, unreadable files and very deep nesting cost
 * only what they touch (exit code 3), and a scan writes nothing but the report it was asked for.
 */
class ScanSafetyTest {

  /** A rule with a bug that shows on one file only. */
  static final class PlantedFailure implements Rule {
    @Override
    public RuleDescriptor descriptor() {
      return new RuleDescriptor("test.planted-failure", Severity.ERROR, List.of());
    }

    @Override
    public void check(FileContext file, FindingReporter reporter) {
      if (file.uri().endsWith("Other.java")) {
        throw new IllegalStateException("planted failure");
      }
    }
  }

  static MainTest.Run run(Path cwd, List<Rule> rules, String... args) {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    ByteArrayOutputStream err = new ByteArrayOutputStream();
    int code = Main.run(args, new PrintStream(out, true, StandardCharsets.UTF_8),
        new PrintStream(err, true, StandardCharsets.UTF_8), cwd, rules);
    return new MainTest.Run(code, out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8));
  }

  @Test
  void failingRuleGivesExitThreeNamesRuleAndFileAndKeepsTheRest(@TempDir Path dir) throws IOException {
    Files.writeString(dir.resolve("Leaky.java"), MainTest.LEAKY);
    Files.writeString(dir.resolve("Other.java"), "class Other { void m() { int a = 1; } }");
    List<Rule> rules = new ArrayList<>(BuiltInRules.all());
    rules.add(new PlantedFailure());
    MainTest.Run r = run(dir, rules, "scan", ".");
    assertEquals(Main.EXIT_INCOMPLETE, r.code(), r.out() + r.err());
    assertTrue(r.out().startsWith("Leaky.java:9:5: error: "), "the other file's finding is reported: " + r.out());
    assertTrue(r.out().contains("Other.java:1:1: error: Rule test.planted-failure failed on Other.java and its "
        + "findings for that file are missing: IllegalStateException: planted failure [plumbline]"), r.out());
    assertTrue(r.out().contains("analysis incomplete"));

    MainTest.Run sarif = run(dir, rules, "scan", ".", "--format", "sarif");
    assertEquals(Main.EXIT_INCOMPLETE, sarif.code());
    assertTrue(sarif.out().contains("\"executionSuccessful\" : false"));
    assertTrue(sarif.out().contains("Rule test.planted-failure failed on Other.java"));
    assertTrue(sarif.out().contains("\"ruleId\" : \"leak.preprocessing-before-split\""));
  }

  @Test
  void linkLoopAndDanglingLinkAreReportedNotFatal(@TempDir Path dir) throws IOException {
    Path src = Files.createDirectories(dir.resolve("src"));
    Files.writeString(src.resolve("Leaky.java"), MainTest.LEAKY);
    Files.createSymbolicLink(src.resolve("again"), src);
    Files.createSymbolicLink(src.resolve("Gone.java"), dir.resolve("nowhere/Gone.java"));
    MainTest.Run r = MainTest.run(dir, "scan", "src");
    assertEquals(Main.EXIT_INCOMPLETE, r.code(), r.out() + r.err());
    assertTrue(r.out().startsWith("src/Leaky.java:9:5: error: "), r.out());
    assertTrue(r.out().contains("Symbolic link loop at src/again"), r.out());
    assertTrue(r.out().contains("Cannot read src/Gone.java"), r.out());
  }

  @Test
  void unreadableFileIsReportedNotFatal(@TempDir Path dir) throws IOException {
    Files.writeString(dir.resolve("Leaky.java"), MainTest.LEAKY);
    Path locked = dir.resolve("Locked.java");
    Files.writeString(locked, "class Locked {}");
    Files.setPosixFilePermissions(locked, PosixFilePermissions.fromString("---------"));
    assumeTrue(!Files.isReadable(locked), "permissions do not bind this user (root)");
    MainTest.Run r = MainTest.run(dir, "scan", ".");
    assertEquals(Main.EXIT_INCOMPLETE, r.code());
    assertTrue(r.out().contains("Cannot read Locked.java"), r.out());
    assertTrue(r.out().startsWith("Leaky.java:9:5: error: "));
  }

  /**
   * 20,000 nested parentheses and blocks, scanned from a thread whose stack is 256 KiB: the
   * scan runs on its own large-stack threads, so the caller cannot overflow.
   */
  @Test
  void deepNestingDoesNotOverflowTheCallersStack(@TempDir Path dir) throws Exception {
    Files.writeString(dir.resolve("Leaky.java"), MainTest.LEAKY);
    int depth = 20_000;
    Files.writeString(dir.resolve("Deep.java"), "class Deep {\n  int f(int a) {\n    "
        + "{".repeat(depth) + "a++;" + "}".repeat(depth) + "\n    return " + "(".repeat(depth) + "a"
        + ")".repeat(depth) + " + a" + " + a".repeat(depth) + ";\n  }\n}\n");
    AtomicReference<MainTest.Run> result = new AtomicReference<>();
    AtomicReference<Throwable> failure = new AtomicReference<>();
    Thread small = new Thread(null, () -> {
      try {
        result.set(MainTest.run(dir, "scan", "."));
      } catch (Throwable t) {
        failure.set(t);
      }
    }, "small-stack-caller", 256 * 1024);
    small.start();
    small.join();
    assertEquals(null, failure.get());
    MainTest.Run r = result.get();
    assertEquals(Main.EXIT_FINDINGS, r.code(), r.out() + r.err());
    assertTrue(r.out().contains("1 finding (1 errors, 0 warnings, 0 notes) in 2 of 2 files"), r.out());
  }

  /** Without --output nothing is written anywhere under the scanned or working folder. */
  @Test
  void scanWritesOnlyTheReportItIsAskedFor(@TempDir Path dir) throws IOException {
    Path src = Files.createDirectories(dir.resolve("src"));
    Files.writeString(src.resolve("Leaky.java"), MainTest.LEAKY);
    Files.writeString(src.resolve("Broken.java"), "class Broken { void m( { }");
    Map<String, String> before = snapshot(dir);
    assertEquals(Main.EXIT_INCOMPLETE, MainTest.run(dir, "scan", "src").code());
    assertEquals(Main.EXIT_INCOMPLETE, MainTest.run(dir, "scan", "src", "--format", "sarif").code());
    assertEquals(before, snapshot(dir), "a scan without --output wrote or changed files");

    assertEquals(Main.EXIT_INCOMPLETE, MainTest.run(dir, "scan", "src", "--output", "out/report.sarif",
        "--format", "sarif").code());
    Map<String, String> after = snapshot(dir);
    assertTrue(after.containsKey("out/report.sarif"));
    after.remove("out/report.sarif");
    after.remove("out");
    assertEquals(before, after, "only the named report was added");
  }

  /** Every path under {@code root} with its size and modification time. */
  static Map<String, String> snapshot(Path root) throws IOException {
    Map<String, String> out = new TreeMap<>();
    try (Stream<Path> walk = Files.walk(root)) {
      for (Path p : walk.toList()) {
        out.put(root.relativize(p).toString().replace('\\', '/'),
            Files.isDirectory(p) ? "dir" : Files.size(p) + "@" + Files.getLastModifiedTime(p).toMillis());
      }
    }
    return out;
  }
}
