package dev.plumbline.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumbline.cli.Main;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The generated benchmark project: at least 200,000 lines, every file parses, the same seed gives
 * the same bytes, and the command line's output on it (and on the corpus) is byte-identical for
 * {@code --jobs 1} and {@code --jobs 4}.
 */
class GeneratedProjectTest {
  static final Path ROOT = Path.of("").toAbsolutePath().getParent();
  static final List<Path> CORPUS = List.of(ROOT.resolve("test-corpus/src/main/java"),
      ROOT.resolve("test-corpus/demo-project/src/main/java"));

  @TempDir
  static Path work;
  static Path project;
  static CorpusProjectGenerator.Result generated;

  @BeforeAll
  static void generate() {
    project = work.resolve("generated");
    generated = new CorpusProjectGenerator(CORPUS, 8).generate(project, 200_000);
  }

  record Run(int code, String out, String err) {}

  static Run scan(Path cwd, String... args) {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    ByteArrayOutputStream err = new ByteArrayOutputStream();
    int code = Main.run(args, new PrintStream(out, true, StandardCharsets.UTF_8),
        new PrintStream(err, true, StandardCharsets.UTF_8), cwd);
    return new Run(code, out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8));
  }

  @Test
  void hasTwoHundredThousandLinesThatAllParseWithFindings() {
    assertTrue(generated.lines() >= 200_000, () -> "lines: " + generated.lines());
    assertTrue(generated.files() > 500, () -> "files: " + generated.files());
    Run r = scan(project, "scan", ".", "--fail-on", "none");
    assertEquals(Main.EXIT_OK, r.code(), r.err() + r.out().lines().filter(l -> l.contains("[plumbline]"))
        .limit(5).toList());
    String summary = r.out().lines().reduce((a, b) -> b).orElse("");
    assertTrue(summary.contains("in " + generated.files() + " of " + generated.files() + " files"), summary);
    assertTrue(!summary.startsWith("0 findings"), summary);
  }

  @Test
  void jobsOneAndFourGiveByteIdenticalOutput() {
    for (String format : List.of("sarif", "text")) {
      Run one = scan(project, "scan", ".", "--jobs", "1", "--format", format);
      Run four = scan(project, "scan", ".", "--jobs", "4", "--format", format);
      assertEquals(one.code(), four.code());
      assertTrue(one.out().length() > 100_000, "a real report");
      assertTrue(one.out().equals(four.out()), "generated project, " + format + ": --jobs 1 and 4 differ");

      Run corpusOne = scan(ROOT, "scan", "test-corpus", "--jobs", "1", "--format", format);
      Run corpusFour = scan(ROOT, "scan", "test-corpus", "--jobs", "4", "--format", format);
      assertEquals(Main.EXIT_FINDINGS, corpusOne.code(), corpusOne.err());
      assertEquals(corpusOne.out(), corpusFour.out(), "test corpus, " + format);
    }
  }

  @Test
  void sameSeedGivesTheSameBytesAndAnotherSeedAnotherProject(@TempDir Path dir) throws IOException {
    new CorpusProjectGenerator(CORPUS, 3).generate(dir.resolve("a"), 20_000);
    new CorpusProjectGenerator(CORPUS, 3).generate(dir.resolve("b"), 20_000);
    new CorpusProjectGenerator(CORPUS, 4).generate(dir.resolve("c"), 20_000);
    Map<String, String> a = contents(dir.resolve("a"));
    assertEquals(a, contents(dir.resolve("b")));
    assertTrue(!a.equals(contents(dir.resolve("c"))));
  }

  private static Map<String, String> contents(Path root) throws IOException {
    Map<String, String> out = new TreeMap<>();
    try (Stream<Path> walk = Files.walk(root)) {
      for (Path p : walk.filter(Files::isRegularFile).toList()) {
        out.put(root.relativize(p).toString(), Files.readString(p));
      }
    }
    return out;
  }
}
