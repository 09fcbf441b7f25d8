package dev.plumbline.bench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Collection;
import java.util.List;
import org.openjdk.jmh.infra.BenchmarkParams;
import org.openjdk.jmh.infra.IterationParams;
import org.openjdk.jmh.profile.InternalProfiler;
import org.openjdk.jmh.results.AggregationPolicy;
import org.openjdk.jmh.results.IterationResult;
import org.openjdk.jmh.results.Result;
import org.openjdk.jmh.results.ScalarResult;

/**
 * Reports the measuring JVM's peak resident set size, {@code VmHWM} in {@code /proc/self/status}
 * (Linux; see proc(5)): the most physical memory the process has held since it started, heap,
 * stacks, code and all. Each benchmark runs in a fresh JVM, so the value is the peak of that
 * operation on that input (warm-up iterations included).
 */
public final class PeakRssProfiler implements InternalProfiler {
  static final String LABEL = "peakRss";

  @Override
  public String getDescription() {
    return "peak resident set size of the benchmark JVM (VmHWM)";
  }

  @Override
  public void beforeIteration(BenchmarkParams benchmarkParams, IterationParams iterationParams) {}

  @Override
  public Collection<? extends Result> afterIteration(BenchmarkParams benchmarkParams,
      IterationParams iterationParams, IterationResult result) {
    return List.of(new ScalarResult(LABEL, peakKib() / 1024.0, "MiB", AggregationPolicy.MAX));
  }

  static long peakKib() {
    try {
      for (String line : Files.readAllLines(Path.of("/proc/self/status"))) {
        if (line.startsWith("VmHWM:")) {
          return Long.parseLong(line.replaceAll("[^0-9]", ""));
        }
      }
    } catch (IOException | NumberFormatException e) {
      return -1;
    }
    return -1;
  }
}
