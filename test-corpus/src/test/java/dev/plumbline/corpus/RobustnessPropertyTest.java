package dev.plumbline.corpus;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumbline.engine.ScanRequest;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.engine.Scanner;
import dev.plumbline.finding.Finding;
import dev.plumbline.finding.Notification;
import dev.plumbline.model.ApiModel;
import dev.plumbline.rules.BuiltInRules;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Random;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.Tuple;
import net.jqwik.api.lifecycle.AfterContainer;
import net.jqwik.api.lifecycle.BeforeContainer;

/**
 * Damaged input never breaks a scan. Each try copies a few corpus files untouched, adds one to
 * three corpus files damaged in one to three ways (truncated, lines deleted or duplicated, random
 * bytes, very deep nesting, grown to 5 MB, invalid UTF-8, a byte-order mark, CRLF line ends, tab
 * indentation, emptied, or replaced by a dangling link), scans the folder, and checks that:
 * <ul>
 *   <li>no exception leaves {@link Scanner#scan};
 *   <li>every file that was not analyzed is named by a notification that marks the scan incomplete;
 *   <li>the untouched files get exactly the findings they get when scanned alone.
 * </ul>
 * Damaged copies move to packages of their own so that they cannot change what the untouched
 * files' classes mean to the project index.
 */
class RobustnessPropertyTest {
  /** Untouched corpus files (under the corpus source root); the first three have findings. */
  private static final List<String> UNTOUCHED = List.of(
      "corpus/leak/preprocessing/NormalizerBeforeSplit.java",
      "corpus/leak/preprocessing/FitOnEitherPart.java",
      "corpus/leak/preprocessing/StatisticsBeforeSplit.java",
      "corpus/leak/preprocessing/CleanFitOnTrainPart.java");

  enum Damage {
    TRUNCATE, DELETE_LINES, DUPLICATE_LINES, RANDOM_BYTES, DEEP_NESTING, FIVE_MEGABYTES,
    INVALID_UTF8, BYTE_ORDER_MARK, CRLF, TABS, EMPTY, DANGLING_LINK
  }

  /** One damage; {@code seed} drives its random choices. */
  record Mutation(Damage damage, long seed) {}

  /** A damaged copy of corpus file number {@code source}. */
  record DamagedFile(int source, List<Mutation> mutations) {}

  private static List<Path> corpusFiles;
  private static List<String> baseline;
  private static Scanner scanner;

  @BeforeContainer
  static void baseline() throws IOException {
    scanner = new Scanner(ApiModel.loadDefault(), BuiltInRules.all(), BuiltInRules.projectAnalyses(),
        Scanner.ScanListener.NONE);
    try (Stream<Path> walk = Files.walk(CorpusScan.SOURCES)) {
      corpusFiles = walk.filter(p -> p.toString().endsWith(".java")).sorted().toList();
    }
    Path dir = Files.createTempDirectory("plumbline-baseline");
    try {
      copyUntouched(dir);
      ScanResult alone = scan(dir);
      assertTrue(alone.notifications().isEmpty(), () -> "baseline: " + alone.notifications());
      baseline = describe(alone.findings());
      assertTrue(baseline.size() >= 3, "the untouched files must have findings to lose: " + baseline);
    } finally {
      delete(dir);
    }
  }

  @AfterContainer
  static void release() {
    scanner = null;
  }

  @Property(tries = 1000)
  void damagedFilesNeverBreakTheScan(@ForAll("damagedFiles") List<DamagedFile> damaged) throws IOException {
    Path dir = Files.createTempDirectory("plumbline-robust");
    try {
      copyUntouched(dir);
      List<String> damagedUris = new ArrayList<>();
      for (int i = 0; i < damaged.size(); i++) {
        damagedUris.add(writeDamaged(dir, i, damaged.get(i)));
      }
      ScanResult result = scan(dir); // any exception fails the try

      List<String> untouchedFindings = describe(result.findings().stream()
          .filter(f -> f.location().uri().startsWith("untouched/")).toList());
      assertEquals(baseline, untouchedFindings, "findings of the untouched files changed");

      List<Notification> incomplete = result.notifications().stream()
          .filter(Notification::incomplete).toList();
      int notAnalyzed = result.filesDiscovered() - result.filesAnalyzed();
      long named = damagedUris.stream()
          .filter(uri -> incomplete.stream().anyMatch(n -> names(n, uri))).count();
      assertTrue(named >= notAnalyzed,
          () -> notAnalyzed + " files not analyzed but only " + named + " named: " + result.notifications());
      for (int i = 0; i < damaged.size(); i++) {
        String uri = damagedUris.get(i);
        if (damaged.get(i).mutations().stream().anyMatch(m -> m.damage() == Damage.DANGLING_LINK)) {
          assertTrue(incomplete.stream().anyMatch(n -> names(n, uri)), () -> "link not reported: " + uri);
        }
      }
      assertEquals(notAnalyzed > 0 || named > 0, result.incomplete());
      assertFalse(incomplete.stream().anyMatch(n -> n.message().arguments().stream()
          .anyMatch(a -> a.contains("untouched/"))), () -> "an untouched file was reported: " + incomplete);
    } finally {
      delete(dir);
    }
  }

  @Provide
  Arbitrary<List<DamagedFile>> damagedFiles() {
    Arbitrary<Damage> damage = Arbitraries.frequency(
        Tuple.of(10, Damage.TRUNCATE), Tuple.of(10, Damage.DELETE_LINES),
        Tuple.of(10, Damage.DUPLICATE_LINES), Tuple.of(10, Damage.RANDOM_BYTES),
        Tuple.of(6, Damage.DEEP_NESTING), Tuple.of(1, Damage.FIVE_MEGABYTES),
        Tuple.of(8, Damage.INVALID_UTF8), Tuple.of(8, Damage.BYTE_ORDER_MARK), Tuple.of(8, Damage.CRLF),
        Tuple.of(8, Damage.TABS), Tuple.of(3, Damage.EMPTY), Tuple.of(3, Damage.DANGLING_LINK));
    Arbitrary<Mutation> mutation = Combinators.combine(damage, Arbitraries.longs())
        .as(Mutation::new);
    Arbitrary<DamagedFile> file = Combinators.combine(
        Arbitraries.integers().between(0, 1_000),
        mutation.list().ofMinSize(1).ofMaxSize(3)).as(DamagedFile::new);
    return file.list().ofMinSize(1).ofMaxSize(3);
  }

  // ------------------------------------------------------------------ damage

  /** Writes the damaged copy and returns its report name. */
  private static String writeDamaged(Path dir, int index, DamagedFile spec) throws IOException {
    Path source = corpusFiles.get(spec.source() % corpusFiles.size());
    String text = Files.readString(source, StandardCharsets.UTF_8)
        .replaceFirst("package corpus\\.", "package damaged" + index + ".");
    byte[] bytes = text.getBytes(StandardCharsets.UTF_8);
    boolean link = false;
    for (Mutation m : spec.mutations()) {
      if (m.damage() == Damage.DANGLING_LINK) {
        link = true;
      } else {
        bytes = apply(m, bytes);
      }
    }
    String uri = "damaged/" + index + "/" + source.getFileName();
    Path target = dir.resolve(uri);
    Files.createDirectories(target.getParent());
    if (link) {
      Files.createSymbolicLink(target, dir.resolve("missing/" + source.getFileName()));
    } else {
      Files.write(target, bytes);
    }
    return uri;
  }

  static byte[] apply(Mutation m, byte[] in) {
    Random random = new Random(m.seed());
    String text = new String(in, StandardCharsets.UTF_8);
    List<String> lines = new ArrayList<>(List.of(text.split("\n", -1)));
    return switch (m.damage()) {
      case TRUNCATE -> java.util.Arrays.copyOf(in, in.length == 0 ? 0 : random.nextInt(in.length));
      case DELETE_LINES -> {
        for (int i = 0, n = 1 + random.nextInt(4); i < n && !lines.isEmpty(); i++) {
          lines.remove(random.nextInt(lines.size()));
        }
        yield utf8(String.join("\n", lines));
      }
      case DUPLICATE_LINES -> {
        for (int i = 0, n = 1 + random.nextInt(4); i < n && !lines.isEmpty(); i++) {
          int at = random.nextInt(lines.size());
          lines.add(at, lines.get(at));
        }
        yield utf8(String.join("\n", lines));
      }
      case RANDOM_BYTES -> {
        byte[] out = in.clone();
        for (int i = 0, n = 1 + random.nextInt(8); i < n && out.length > 0; i++) {
          out[random.nextInt(out.length)] = (byte) random.nextInt(256);
        }
        yield out;
      }
      case DEEP_NESTING -> utf8(text + deeplyNested(random));
      case FIVE_MEGABYTES -> utf8(text + fiveMegabyteComment(random));
      case INVALID_UTF8 -> {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        int at = in.length == 0 ? 0 : random.nextInt(in.length);
        out.write(in, 0, at);
        byte[][] bad = {{(byte) 0xFF}, {(byte) 0xC3, 0x28}, {(byte) 0xE2, (byte) 0x82}, {(byte) 0x80}};
        out.writeBytes(bad[random.nextInt(bad.length)]);
        out.write(in, at, in.length - at);
        yield out.toByteArray();
      }
      case BYTE_ORDER_MARK -> {
        byte[] out = new byte[in.length + 3];
        out[0] = (byte) 0xEF;
        out[1] = (byte) 0xBB;
        out[2] = (byte) 0xBF;
        System.arraycopy(in, 0, out, 3, in.length);
        yield out;
      }
      case CRLF -> utf8(text.replace("\r\n", "\n").replace("\n", "\r\n"));
      case TABS -> utf8(text.replace("    ", "\t").replace("  ", "\t"));
      case EMPTY -> new byte[0];
      case DANGLING_LINK -> in;
    };
  }

  /** A class whose only method nests one construct thousands of levels deep. */
  private static String deeplyNested(Random random) {
    int depth = 200 + random.nextInt(1_300);
    StringBuilder b = new StringBuilder("\nclass Deep {\n  Object deep(boolean c, int a) {\n");
    switch (random.nextInt(5)) {
      case 0 -> b.append("return ").append("(".repeat(depth)).append('a').append(")".repeat(depth)).append(";\n");
      case 1 -> b.append("{".repeat(depth)).append("a++;").append("}".repeat(depth)).append("return a;\n");
      case 2 -> b.append("if (c) ".repeat(depth)).append("a++;\nreturn a;\n");
      case 3 -> b.append("return a").append(" + a".repeat(depth * 2)).append(";\n");
      default -> b.append("return ").append("(java.util.function.Supplier<Object>) () -> ".repeat(depth / 10))
          .append("a;\n");
    }
    return b.append("  }\n}\n").toString();
  }

  /**
   * 5 MB more bytes, cheaply: a comment of random printable text (the lexer reads every byte).
   * The 5 MB of real code costs seconds per try, so {@link #fiveMegabytesOfCode} runs once.
   */
  private static String fiveMegabyteComment(Random random) {
    StringBuilder b = new StringBuilder("\n/*\n");
    while (b.length() < 5 * 1024 * 1024) {
      for (int i = 0; i < 100; i++) {
        char c = (char) (' ' + random.nextInt(95));
        b.append(c == '*' ? '+' : c);
      }
      b.append('\n');
    }
    return b.append("*/\n").toString();
  }

  /** One 5 MB file of code next to the untouched files: analyzed, and the rest unchanged. */
  @net.jqwik.api.Example
  void fiveMegabytesOfCode() throws IOException {
    Path dir = Files.createTempDirectory("plumbline-large");
    try {
      copyUntouched(dir);
      Path source = CorpusScan.SOURCES.resolve(UNTOUCHED.get(0));
      List<String> lines = List.of(Files.readString(source, StandardCharsets.UTF_8).split("\n"));
      String text = Files.readString(source, StandardCharsets.UTF_8)
          .replaceFirst("package corpus\\.", "package large.") + fiveMegabytes(lines);
      Files.createDirectories(dir.resolve("large"));
      Files.writeString(dir.resolve("large/Large.java"), text);
      assertTrue(Files.size(dir.resolve("large/Large.java")) > 5 * 1024 * 1024);
      ScanResult result = scan(dir);
      assertEquals(List.of(), result.notifications());
      assertEquals(UNTOUCHED.size() + 1, result.filesAnalyzed());
      assertEquals(baseline, describe(result.findings().stream()
          .filter(f -> f.location().uri().startsWith("untouched/")).toList()));
    } finally {
      delete(dir);
    }
  }

  /** Copies of the file's own lines inside a class of its own until the file passes 5 MB. */
  private static String fiveMegabytes(List<String> lines) {
    String body = lines.stream().filter(l -> l.startsWith("    ") && !l.contains("class "))
        .map(l -> "  // " + l.strip()).collect(Collectors.joining("\n"));
    StringBuilder b = new StringBuilder("\nclass Large {\n");
    int method = 0;
    while (b.length() < 5 * 1024 * 1024) {
      b.append("  int part").append(method++).append("(int a) {\n").append(body)
          .append("\n    int b = a * 2;\n    for (int i = 0; i < a; i++) {\n      b += i;\n    }\n    return b;\n  }\n");
    }
    return b.append("}\n").toString();
  }

  private static byte[] utf8(String s) {
    return s.getBytes(StandardCharsets.UTF_8);
  }

  // ------------------------------------------------------------------ helpers

  private static boolean names(Notification n, String uri) {
    return n.location().map(l -> l.uri().equals(uri)).orElse(false)
        || n.message().arguments().stream().anyMatch(a -> a.equals(uri) || a.endsWith("/" + uri));
  }

  private static ScanResult scan(Path dir) {
    return scanner.scan(new ScanRequest(List.of(dir), dir, List.of(), List.of(), 2));
  }

  private static List<String> describe(List<Finding> findings) {
    return findings.stream()
        .map(f -> f.location().display() + " " + f.ruleId() + " " + f.message().key()
            + f.message().arguments() + " " + f.fingerprint())
        .toList();
  }

  private static void copyUntouched(Path dir) throws IOException {
    for (String rel : UNTOUCHED) {
      Path target = dir.resolve("untouched").resolve(rel);
      Files.createDirectories(target.getParent());
      Files.copy(CorpusScan.SOURCES.resolve(rel), target);
    }
  }

  private static void delete(Path dir) {
    try (Stream<Path> walk = Files.walk(dir)) {
      for (Path p : walk.sorted(Comparator.reverseOrder()).toList()) {
        Files.deleteIfExists(p);
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }
}
