package dev.plumbline.engine;

import java.nio.file.Path;
import java.util.List;

/**
 * What to scan and how. Immutable; validated by the caller (the command line checks paths and
 * numbers before building one).
 *
 * @param paths files or folders to scan
 * @param baseDirectory report names are relative to it (the SARIF {@code %SRCROOT%})
 * @param includes globs a file's report name must match (empty: all)
 * @param excludes globs that remove files
 * @param jobs worker threads for parsing and analysis, at least 1
 * @param settings configuration the analyses may consult
 */
public record ScanRequest(List<Path> paths, Path baseDirectory, List<String> includes,
    List<String> excludes, int jobs, AnalysisSettings settings) {

  public ScanRequest {
    paths = List.copyOf(paths);
    includes = List.copyOf(includes);
    excludes = List.copyOf(excludes);
    if (jobs < 1) {
      throw new IllegalArgumentException("jobs must be at least 1: " + jobs);
    }
    settings = settings == null ? AnalysisSettings.DEFAULTS : settings;
  }

  /** A request with default analysis settings. */
  public ScanRequest(List<Path> paths, Path baseDirectory, List<String> includes,
      List<String> excludes, int jobs) {
    this(paths, baseDirectory, includes, excludes, jobs, AnalysisSettings.DEFAULTS);
  }

  public static ScanRequest of(Path base, List<Path> paths) {
    return new ScanRequest(paths, base, List.of(), List.of(), Runtime.getRuntime().availableProcessors());
  }

  public ScanRequest withJobs(int n) {
    return new ScanRequest(paths, baseDirectory, includes, excludes, n, settings);
  }
}
