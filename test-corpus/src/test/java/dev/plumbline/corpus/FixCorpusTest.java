package dev.plumbline.corpus;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumbline.discover.Discovery;
import dev.plumbline.discover.SourceFile;
import dev.plumbline.engine.ScanRequest;
import dev.plumbline.engine.Scanner;
import dev.plumbline.finding.Finding;
import dev.plumbline.fix.Fixer;
import dev.plumbline.gate.ConfigException;
import dev.plumbline.gate.QualityGate;
import dev.plumbline.model.ApiModel;
import dev.plumbline.rules.BuiltInRules;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import javax.tools.Diagnostic;
import javax.tools.DiagnosticCollector;
import javax.tools.JavaCompiler;
import javax.tools.JavaFileObject;
import javax.tools.StandardJavaFileManager;
import javax.tools.ToolProvider;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * {@code plumbline fix} on a copy of the golden corpus and the demo project: every fixed file
 * still compiles against the real ND4J/DL4J/DataVec/DJL jars (the test classpath), the fixed
 * findings are gone and nothing else changed, and files without safe fixes are byte-identical.
 * The diff the fixes make is kept as a golden file ({@code golden/fixes.diff}), refreshed with
 * {@code -Dplumbline.refreshGolden=true}. Compiling here is the test's check; the analyzer
 * itself never compiles scanned code.
 */
class FixCorpusTest {
  private static final Path COPY = CorpusScan.MODULE.resolve("target/fix-corpus");
  private static final Path GOLDEN = CorpusScan.MODULE.resolve("src/test/resources/golden/fixes.diff");
  private static final List<String> ROOTS = List.of("src/main/java", "demo-project/src/main/java");

  private static Fixer.Plan plan;
  private static List<Finding> before;
  private static List<Finding> after;

  @BeforeAll
  static void fixACopy() throws IOException, ConfigException {
    deleteTree(COPY);
    for (String root : ROOTS) {
      copyTree(CorpusScan.MODULE.resolve(root), COPY.resolve(root));
    }
    QualityGate.Outcome outcome = gate().run(options());
    before = outcome.result().findings();
    plan = Fixer.plan(outcome.result(), filesOf(outcome.request()));
    for (Fixer.FilePlan file : plan.files()) {
      Fixer.write(file);
    }
    after = gate().run(options()).result().findings();
  }

  private static QualityGate gate() {
    return new QualityGate(ApiModel.loadDefault(), BuiltInRules.all(), BuiltInRules.projectAnalyses(),
        Scanner.ScanListener.NONE);
  }

  private static QualityGate.Options options() {
    return new QualityGate.Options(ROOTS.stream().map(COPY::resolve).toList(), COPY, Optional.empty(),
        Optional.empty(), Optional.empty(), List.of(), List.of(), 2);
  }

  private static Map<String, SourceFile> filesOf(ScanRequest request) {
    Map<String, SourceFile> out = new TreeMap<>();
    new Discovery(new Discovery.Options(request.baseDirectory(), List.of(), List.of(), false))
        .discover(request.paths()).files().forEach(f -> out.put(f.uri(), f));
    return out;
  }

  private static Set<String> changedFiles() {
    return plan.files().stream().filter(Fixer.FilePlan::changes).map(f -> f.file().uri())
        .collect(Collectors.toCollection(TreeSet::new));
  }

  @Test
  void everyPlannedFixWasAppliedWithoutProblems() {
    for (Fixer.FilePlan file : plan.files()) {
      assertEquals(null, file.problem(), file.file().uri());
      assertTrue(file.overlapping().isEmpty(), file.file().uri());
    }
    assertTrue(changedFiles().size() >= 2, () -> "the corpus has a moved fit and an argument swap: " + changedFiles());
  }

  @Test
  void theFixedCorpusCompilesAgainstTheRealJars() throws IOException {
    JavaCompiler javac = ToolProvider.getSystemJavaCompiler();
    DiagnosticCollector<JavaFileObject> diagnostics = new DiagnosticCollector<>();
    Path classes = CorpusScan.MODULE.resolve("target/fix-corpus-classes");
    deleteTree(classes);
    Files.createDirectories(classes);
    List<Path> sources;
    try (Stream<Path> walk = Files.walk(COPY)) {
      sources = walk.filter(p -> p.toString().endsWith(".java")).sorted().toList();
    }
    try (StandardJavaFileManager files = javac.getStandardFileManager(diagnostics, null, StandardCharsets.UTF_8)) {
      boolean ok = javac.getTask(null, files, diagnostics,
          List.of("--release", "17", "-proc:none", "-classpath", System.getProperty("java.class.path"),
              "-d", classes.toString()),
          null, files.getJavaFileObjectsFromPaths(sources)).call();
      String errors = diagnostics.getDiagnostics().stream()
          .filter(d -> d.getKind() == Diagnostic.Kind.ERROR)
          .map(d -> d.getSource().getName() + ":" + d.getLineNumber() + ": " + d.getMessage(null))
          .collect(Collectors.joining("\n"));
      assertTrue(ok, () -> "fixed corpus does not compile:\n" + errors);
    }
    for (String uri : changedFiles()) {
      String className = uri.substring(uri.indexOf("/java/") + "/java/".length()).replace(".java", ".class");
      assertTrue(Files.isRegularFile(classes.resolve(className)), "compiled " + className);
    }
  }

  @Test
  void theFixedFindingsAreGoneAndNoOtherFindingChanged() {
    List<String> expected = new ArrayList<>();
    for (Finding f : before) {
      boolean fixed = plan.files().stream().anyMatch(p -> p.fixed().contains(f));
      if (!fixed) {
        expected.add(describe(f, changedFiles().contains(f.location().uri())));
      }
    }
    List<String> actual = after.stream().map(f -> describe(f, changedFiles().contains(f.location().uri()))).toList();
    assertEquals(expected, actual);
    assertEquals(before.size() - plan.files().stream().mapToInt(p -> p.fixed().size()).sum(), after.size());
  }

  /** Lines move in fixed files, so there a finding is identified by rule, message and file only. */
  private static String describe(Finding f, boolean inFixedFile) {
    return f.location().uri() + (inFixedFile ? "" : ":" + f.location().range().startLine()) + " "
        + f.ruleId() + " " + f.message() + " " + f.suppression().orElse("");
  }

  @Test
  void filesWithoutSafeFixesAreByteIdentical() throws IOException {
    Set<String> changed = changedFiles();
    int compared = 0;
    for (String root : ROOTS) {
      Path original = CorpusScan.MODULE.resolve(root);
      try (Stream<Path> walk = Files.walk(original)) {
        for (Path file : walk.filter(Files::isRegularFile).toList()) {
          String uri = root + "/" + original.relativize(file).toString().replace('\\', '/');
          if (!changed.contains(uri)) {
            assertArrayEquals(Files.readAllBytes(file), Files.readAllBytes(COPY.resolve(uri)), uri);
            compared++;
          }
        }
      }
    }
    assertTrue(compared > 10, "compared " + compared + " files");
  }

  @Test
  void theDiffMatchesTheGoldenFile() throws IOException {
    String diff = plan.files().stream().map(Fixer.FilePlan::diff).collect(Collectors.joining());
    if (Boolean.getBoolean("plumbline.refreshGolden")) {
      Files.writeString(GOLDEN, diff, StandardCharsets.UTF_8);
      return;
    }
    assertTrue(Files.exists(GOLDEN), "no golden diff yet: run with -Dplumbline.refreshGolden=true");
    assertEquals(Files.readString(GOLDEN, StandardCharsets.UTF_8), diff,
        "fix diff differs; review it and refresh with -Dplumbline.refreshGolden=true");
  }

  private static void copyTree(Path from, Path to) throws IOException {
    try (Stream<Path> walk = Files.walk(from)) {
      for (Path p : walk.toList()) {
        Path target = to.resolve(from.relativize(p).toString());
        if (Files.isDirectory(p)) {
          Files.createDirectories(target);
        } else {
          Files.copy(p, target);
        }
      }
    }
  }

  private static void deleteTree(Path root) throws IOException {
    if (!Files.exists(root)) {
      return;
    }
    try (Stream<Path> walk = Files.walk(root)) {
      walk.sorted(Comparator.reverseOrder()).forEach(p -> {
        try {
          Files.delete(p);
        } catch (IOException e) {
          throw new UncheckedIOException(e);
        }
      });
    }
  }
}
