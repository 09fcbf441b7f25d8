package dev.plumbline.bench;

import dev.plumbline.cli.Main;
import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.TimeUnit;

/**
 * One scan in a fresh JVM started with the launcher's options, as a user's {@code plumbline scan}
 * runs: no warm-up, nothing else in the process. Its peak resident set is the memory a scan
 * needs; the benchmark JVMs' own peak also holds the garbage of their earlier iterations, which
 * the parallel collector leaves in the old generation until it is full.
 *
 * <p>{@link #main} is the child: it scans, then prints one line, {@code cold-scan <exit code>
 * <wall ms> <peak RSS KiB>}. {@link #run} starts it and reads that line.
 */
final class ColdScan {
  /** The child's answer. */
  record Result(long wallMs, double peakRssMib) {}

  private ColdScan() {}

  public static void main(String[] args) {
    Path input = Path.of(args[0]);
    PrintStream discard = new PrintStream(OutputStream.nullOutputStream(), false, StandardCharsets.UTF_8);
    long start = System.nanoTime();
    int code = Main.run(new String[] {"scan", input.toString(), "--jobs", args[1], "--fail-on", "none"},
        discard, discard, input);
    long wallMs = (System.nanoTime() - start) / 1_000_000;
    System.out.printf(Locale.ROOT, "cold-scan %d %d %d%n", code, wallMs, PeakRssProfiler.peakKib());
  }

  /** Runs one cold scan of {@code input} in a child JVM. */
  static Result run(Path input, int jobs) {
    String java = ProcessHandle.current().info().command().orElse("java");
    String classPath = System.getProperty("java.class.path");
    List<String> command = new ArrayList<>(List.of(java));
    command.addAll(Launcher.JVM_OPTIONS);
    command.addAll(List.of("-cp", classPath, ColdScan.class.getName(), input.toString(),
        String.valueOf(jobs)));
    try {
      Process p = new ProcessBuilder(command).redirectErrorStream(true).start();
      String output = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
      if (!p.waitFor(30, TimeUnit.MINUTES)) {
        p.destroyForcibly();
        throw new IllegalStateException("cold scan of " + input + " did not finish");
      }
      for (String line : output.lines().toList()) {
        String[] f = line.split(" ");
        if (f.length == 4 && f[0].equals("cold-scan")) {
          if (!f[1].equals(String.valueOf(Main.EXIT_OK))) {
            throw new IllegalStateException("cold scan of " + input + " exited with " + f[1]);
          }
          return new Result(Long.parseLong(f[2]), Long.parseLong(f[3]) / 1024.0);
        }
      }
      throw new IllegalStateException("cold scan of " + input + " printed no result:\n" + output);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException("interrupted", e);
    }
  }
}
