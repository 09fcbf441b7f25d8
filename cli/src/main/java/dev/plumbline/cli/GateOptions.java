package dev.plumbline.cli;

import dev.plumbline.gate.FailLevel;
import dev.plumbline.gate.QualityGate;
import java.nio.file.FileSystems;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** The options every scanning command shares: what to scan, configuration, globs, threads. */
final class GateOptions {
  @Parameters(paramLabel = "PATH", arity = "1..*", description = "Files or folders to scan.")
  List<String> paths = new ArrayList<>();

  @Option(names = "--config", paramLabel = "FILE",
      description = "Configuration file (YAML or JSON); see docs/configuration.md.")
  String config;

  @Option(names = "--jobs", paramLabel = "N", description = "Worker threads (default: number of cores).")
  Integer jobs;

  @Option(names = "--include", paramLabel = "GLOB",
      description = "Only scan files whose path matches (repeatable; replaces the configuration's).")
  List<String> includes = new ArrayList<>();

  @Option(names = "--exclude", paramLabel = "GLOB",
      description = "Skip files whose path matches (repeatable; added to the configuration's).")
  List<String> excludes = new ArrayList<>();

  /** Checks paths, numbers and globs up front and builds the gate's options. */
  QualityGate.Options validate(Path cwd, Optional<String> baseline, Optional<FailLevel> failOn) {
    List<Path> resolved = new ArrayList<>();
    for (String p : paths) {
      Path path = cwd.resolve(p).normalize();
      if (!Files.exists(path)) {
        throw new Main.UsageError("path not found: " + p);
      }
      resolved.add(path);
    }
    int n = jobs == null ? Runtime.getRuntime().availableProcessors() : jobs;
    if (n < 1 || n > 256) {
      throw new Main.UsageError("--jobs must be between 1 and 256, got " + n);
    }
    List<String> all = new ArrayList<>(includes);
    all.addAll(excludes);
    for (String glob : all) {
      try {
        FileSystems.getDefault().getPathMatcher("glob:" + glob);
      } catch (IllegalArgumentException e) {
        throw new Main.UsageError("bad glob '" + glob + "': " + e.getMessage());
      }
    }
    return new QualityGate.Options(resolved, cwd, existingFile(cwd, config, "--config"),
        existingFile(cwd, baseline.orElse(null), "--baseline"), failOn, includes, excludes, n);
  }

  private static Optional<Path> existingFile(Path cwd, String name, String option) {
    if (name == null) {
      return Optional.empty();
    }
    Path path = cwd.resolve(name).normalize();
    if (!Files.isRegularFile(path)) {
      throw new Main.UsageError(option + " file not found: " + name);
    }
    return Optional.of(path);
  }
}
