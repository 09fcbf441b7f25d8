package dev.plumbline.bench;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collection;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;
import java.util.stream.IntStream;
import java.util.stream.Stream;
import org.openjdk.jmh.results.BenchmarkResult;
import org.openjdk.jmh.results.IterationResult;
import org.openjdk.jmh.results.RunResult;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.options.ChainedOptionsBuilder;
import org.openjdk.jmh.runner.options.OptionsBuilder;
import org.openjdk.jmh.runner.options.VerboseMode;
import org.openjdk.jmh.annotations.Mode;
import java.util.concurrent.TimeUnit;

/**
 * Runs the benchmark: generates the inputs, times a bare parse against a full scan of each with
 * JMH (rounds in which every operation on every input runs in a fresh JVM, warm-up iterations
 * first; the median of all measured ones), and prints the three ratios with their targets.
 *
 * <pre>
 *   bench/run                  # the README command; builds, then runs this class
 *   bench/run --lines 50000    # smaller inputs, for a quick look
 * </pre>
 */
public final class BenchmarkMain {
  /** Targets from issue 8. */
  static final double MAX_SCAN_TO_PARSE = 1.5;
  static final double MAX_PEAK_RSS_MIB = 1024;
  static final double MAX_4X_TO_1X = 4.4;

  /**
   * Rounds of measurement by default: every operation on every input runs once a round, in a fresh
   * JVM. With the iterations below the 1x input gets 8 measured iterations of each operation, the
   * 4x input 4.
   */
  static final int DEFAULT_ROUNDS = 4;

  /**
   * One input and how many iterations each of its JVMs runs (warm-up, then measured); small inputs
   * need more to be stable.
   */
  record Input(String name, Path dir, int files, long lines, int warmups, int measurements) {}

  /**
   * The measurements of one input; {@code roundRatios} is scan/parse from each round's medians,
   * {@code roundScanMs} each round's median scan time; the means are of all measured iterations.
   */
  record Measured(Input input, double parseMs, double scanMs, double parseRssMib, double scanRssMib,
      ColdScan.Result cold, List<Double> roundRatios, List<Double> roundScanMs, double parseMeanMs,
      double scanMeanMs) {
    double ratio() {
      return scanMs / parseMs;
    }

    double linesPerSecond() {
      return input.lines() / (scanMs / 1000.0);
    }
  }

  private BenchmarkMain() {}

  public static void main(String[] args) throws RunnerException {
    Path root = Path.of("").toAbsolutePath();
    long lines = 200_000;
    int jobs = Runtime.getRuntime().availableProcessors();
    long seed = 8;
    boolean verbose = false;
    int rounds = DEFAULT_ROUNDS;
    for (int i = 0; i < args.length; i++) {
      switch (args[i]) {
        case "--root" -> root = Path.of(args[++i]).toAbsolutePath();
        case "--lines" -> lines = Long.parseLong(args[++i]);
        case "--jobs" -> jobs = Integer.parseInt(args[++i]);
        case "--seed" -> seed = Long.parseLong(args[++i]);
        case "--rounds" -> rounds = Integer.parseInt(args[++i]);
        case "--verbose" -> verbose = true;
        default -> {
          System.err.println("usage: bench/run [--lines N] [--jobs N] [--rounds N] [--seed S] [--verbose] [--root DIR]");
          System.exit(2);
        }
      }
    }
    Path work = root.resolve("bench/target/work");
    List<Path> corpus = List.of(root.resolve("test-corpus/src/main/java"),
        root.resolve("test-corpus/demo-project/src/main/java"));
    System.out.printf(Locale.ROOT, "plumbline benchmark: %d cores, %s, Java %s, %d jobs%n",
        Runtime.getRuntime().availableProcessors(), System.getProperty("os.arch"),
        System.getProperty("java.version"), jobs);

    List<Input> inputs = new ArrayList<>();
    Path corpusCopy = fresh(work.resolve("corpus"));
    for (int i = 0; i < corpus.size(); i++) {
      copyTree(corpus.get(i), corpusCopy.resolve("root" + i));
    }
    inputs.add(describe("test corpus", corpusCopy, 5, 5));
    CorpusProjectGenerator generator = new CorpusProjectGenerator(corpus, seed);
    Path one = fresh(work.resolve("generated-1x"));
    generator.generate(one, lines);
    // Two warm-ups: in a fresh JVM the first 1x iteration of either operation took 15 to 30%
    // longer than the later ones (measured 2026-12-04: scan 8.6 s, then 6.0 to 7.4 s).
    inputs.add(describe("generated 1x", one, 2, 2));
    Path four = fresh(work.resolve("generated-4x"));
    generator.generate(four, 4 * lines);
    inputs.add(describe("generated 4x", four, 1, 1));

    List<Measured> results = measure(inputs, rounds, jobs, verbose);
    String report = report(results, rounds, jobs);
    System.out.print(report);
    try {
      Files.writeString(work.resolve("results.txt"), report, StandardCharsets.UTF_8);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /**
   * Measures every operation on every input in rounds. A round runs each (input,
   * operation) pair once, in a fresh JVM, and the order rotates from round to round. Single
   * timings on a shared virtual machine move by 10 to 30% over minutes; measuring parse and scan,
   * or the 1x and the 4x scan, minutes apart let a slow spell fall on one side of a ratio only.
   * Interleaved, a slow spell falls on every side alike, and each median draws from every round.
   */
  private static List<Measured> measure(List<Input> inputs, int rounds, int jobs, boolean verbose) throws RunnerException {
    List<Leg> legs = new ArrayList<>();
    for (Input in : inputs) {
      legs.add(new Leg(in, "parse"));
      legs.add(new Leg(in, "scan"));
    }
    for (int round = 0; round < rounds; round++) {
      for (Leg leg : RoundOrder.of(legs, round)) {
        System.out.printf(Locale.ROOT, "round %d of %d: %s of %s%n", round + 1, rounds, leg.operation(),
            leg.input().name());
        leg.add(round, runFork(leg, jobs, verbose));
      }
    }
    List<Measured> results = new ArrayList<>();
    for (int i = 0; i < inputs.size(); i++) {
      Leg parse = legs.get(2 * i);
      Leg scan = legs.get(2 * i + 1);
      List<Double> roundRatios = new ArrayList<>();
      List<Double> roundScanMs = new ArrayList<>();
      for (int round = 0; round < rounds; round++) {
        double scanOfRound = median(scan.timesOfRound(round));
        roundScanMs.add(scanOfRound);
        roundRatios.add(scanOfRound / median(parse.timesOfRound(round)));
      }
      Input in = inputs.get(i);
      System.out.printf(Locale.ROOT, "cold scan of %s%n", in.name());
      results.add(new Measured(in, median(parse.allTimes()), median(scan.allTimes()), parse.peakRssMib(),
          scan.peakRssMib(), ColdScan.run(in.dir(), jobs), roundRatios, roundScanMs, mean(parse.allTimes()),
          mean(scan.allTimes())));
    }
    return results;
  }

  /** One JMH fork of one operation on one input: its measured iterations and peak RSS. */
  private static RunResult runFork(Leg leg, int jobs, boolean verbose) throws RunnerException {
    Input in = leg.input();
    ChainedOptionsBuilder options = new OptionsBuilder()
        .include(ScanBenchmark.class.getName() + "\\." + leg.operation() + "$")
        .param("input", in.dir().toString())
        .param("jobs", String.valueOf(jobs))
        .mode(Mode.SingleShotTime)
        .timeUnit(TimeUnit.MILLISECONDS)
        .warmupIterations(in.warmups())
        .measurementIterations(in.measurements())
        .forks(1)
        // Every iteration starts from a collected heap, as a command-line scan starts from an
        // empty one; otherwise each scan pays for the previous one's trees, left as garbage in
        // the old generation (a full collection every few iterations). Both operations alike.
        .shouldDoGC(true)
        .jvmArgs(Launcher.JVM_OPTIONS.toArray(String[]::new))
        .addProfiler(PeakRssProfiler.class)
        .shouldFailOnError(true)
        .verbosity(verbose ? VerboseMode.NORMAL : VerboseMode.SILENT);
    Collection<RunResult> results = new Runner(options.build()).run();
    if (results.size() != 1) {
      throw new IllegalStateException("expected one result for " + leg + ", got " + results.size());
    }
    return results.iterator().next();
  }

  /** An operation on an input, with what its forks measured, round by round. */
  static final class Leg {
    private final Input input;
    private final String operation;
    private final List<List<Double>> timesByRound = new ArrayList<>();
    private double peakRssMib;

    Leg(Input input, String operation) {
      this.input = input;
      this.operation = operation;
    }

    Input input() {
      return input;
    }

    String operation() {
      return operation;
    }

    void add(int round, RunResult fork) {
      List<Double> times = new ArrayList<>();
      for (BenchmarkResult b : fork.getBenchmarkResults()) {
        for (IterationResult iteration : b.getIterationResults()) {
          times.add(iteration.getPrimaryResult().getScore());
        }
      }
      while (timesByRound.size() <= round) {
        timesByRound.add(new ArrayList<>());
      }
      timesByRound.get(round).addAll(times);
      peakRssMib = Math.max(peakRssMib, fork.getSecondaryResults().get(PeakRssProfiler.LABEL).getScore());
    }

    List<Double> timesOfRound(int round) {
      return timesByRound.get(round);
    }

    List<Double> allTimes() {
      return timesByRound.stream().flatMap(List::stream).toList();
    }

    double peakRssMib() {
      return peakRssMib;
    }

    @Override
    public String toString() {
      return operation + " of " + input.name();
    }
  }

  static double mean(List<Double> values) {
    return values.stream().mapToDouble(Double::doubleValue).average().orElseThrow();
  }

  static double median(List<Double> values) {
    if (values.isEmpty()) {
      throw new IllegalArgumentException("no values");
    }
    double[] sorted = values.stream().mapToDouble(Double::doubleValue).sorted().toArray();
    int mid = sorted.length / 2;
    return sorted.length % 2 == 1 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
  }

  static String report(List<Measured> results, int rounds, int jobs) {
    StringBuilder out = new StringBuilder();
    out.append(String.format(Locale.ROOT, "%n%-13s %6s %8s %9s %9s %7s %10s %10s %11s %8s %10s%n", "input", "files",
        "lines", "parse ms", "scan ms", "ratio", "parse RSS", "scan RSS", "lines/s", "cold ms", "cold RSS"));
    for (Measured m : results) {
      out.append(String.format(Locale.ROOT,
          "%-13s %6d %8d %9.0f %9.0f %7.2f %6.0f MiB %6.0f MiB %11.0f %8d %6.0f MiB%n",
          m.input().name(), m.input().files(), m.input().lines(), m.parseMs(), m.scanMs(), m.ratio(),
          m.parseRssMib(), m.scanRssMib(), m.linesPerSecond(), m.cold().wallMs(), m.cold().peakRssMib()));
    }
    Measured one = results.get(1);
    Measured four = results.get(2);
    double scaling = four.scanMs() / one.scanMs();
    out.append(String.format(Locale.ROOT, "%nTimes are medians of single-shot runs with %d worker threads,"
        + " from %d interleaved rounds; RSS is the peak of the%nmeasuring JVMs (VmHWM), warm-ups included;"
        + " cold: one scan in a fresh JVM with the launcher's options, as a user runs it.%n", jobs, rounds));
    out.append(check("scan/parse time at 1x", one.ratio(), MAX_SCAN_TO_PARSE, "%.2f"));
    out.append(check("peak RSS of a cold scan at 1x (MiB)", one.cold().peakRssMib(), MAX_PEAK_RSS_MIB, "%.0f"));
    out.append(check("scan time 4x/1x", scaling, MAX_4X_TO_1X, "%.2f"));
    out.append(String.format(Locale.ROOT, "  (for reference: scan/parse at 4x %.2f, parse time 4x/1x %.2f,"
        + " corpus scan/parse %.2f, peak RSS of the benchmark's 1x scan JVM %.0f MiB)%n", four.ratio(),
        four.parseMs() / one.parseMs(), results.get(0).ratio(), one.scanRssMib()));
    // A median of short runs leaves out a slow spell of the machine that a long run cannot
    // escape, so with medians the 4x input is measured against a 1x time that saw less of the
    // machine's slow spells; means take each spell in proportion to its length on both sides.
    out.append(String.format(Locale.ROOT, "  (with means instead of medians: scan/parse at 1x %.2f, scan time 4x/1x %.2f,"
        + " parse time 4x/1x %.2f)%n", one.scanMeanMs() / one.parseMeanMs(), four.scanMeanMs() / one.scanMeanMs(),
        four.parseMeanMs() / one.parseMeanMs()));
    out.append(String.format(Locale.ROOT, "  (round by round: scan/parse at 1x %s; scan time 4x/1x %s)%n",
        joined(one.roundRatios()), joined(IntStream.range(0, four.roundScanMs().size())
            .mapToObj(r -> four.roundScanMs().get(r) / one.roundScanMs().get(r)).toList())));
    return out.toString();
  }

  private static String joined(List<Double> values) {
    return values.stream().map(v -> String.format(Locale.ROOT, "%.2f", v)).collect(Collectors.joining(", "));
  }

  private static String check(String what, double value, double max, String format) {
    return String.format(Locale.ROOT, "%-36s " + format + "  (target at most " + format + ")  %s%n",
        what, value, max, value <= max ? "met" : "MISSED");
  }

  private static Input describe(String name, Path dir, int warmups, int measurements) {
    int files = 0;
    long lines = 0;
    try (Stream<Path> walk = Files.walk(dir)) {
      for (Path p : walk.filter(f -> f.toString().endsWith(".java")).toList()) {
        files++;
        lines += Files.readString(p, StandardCharsets.UTF_8).lines().count();
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return new Input(name, dir, files, lines, warmups, measurements);
  }

  private static Path fresh(Path dir) {
    try {
      if (Files.exists(dir)) {
        try (Stream<Path> walk = Files.walk(dir)) {
          for (Path p : walk.sorted(Comparator.reverseOrder()).toList()) {
            Files.delete(p);
          }
        }
      }
      return Files.createDirectories(dir);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  private static void copyTree(Path from, Path to) {
    try (Stream<Path> walk = Files.walk(from)) {
      for (Path p : walk.filter(f -> f.toString().endsWith(".java")).toList()) {
        Path target = to.resolve(from.relativize(p).toString());
        Files.createDirectories(target.getParent());
        Files.copy(p, target);
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }
}
