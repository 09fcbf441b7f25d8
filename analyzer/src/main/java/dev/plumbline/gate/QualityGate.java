package dev.plumbline.gate;

import dev.plumbline.engine.ProjectAnalysis;
import dev.plumbline.engine.Rule;
import dev.plumbline.engine.ScanRequest;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.engine.Scanner;
import dev.plumbline.finding.Finding;
import dev.plumbline.model.ApiModel;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.stream.Collectors;

/**
 * A scan as CI runs it: configuration, the scan, then the post-scan stages in order (configured
 * severities, suppressions written in the code, the baseline) and the verdict against the fail
 * level. The command line and the Maven plugin both run scans through here, so the same options
 * mean the same thing in both.
 *
 * <p>Files named by the options are read before anything is scanned, so a bad configuration or
 * baseline fails fast with a {@link ConfigException}.
 */
public final class QualityGate {
  private final ApiModel model;
  private final List<Rule> allRules;
  private final List<ProjectAnalysis> projectAnalyses;
  private final Scanner.ScanListener listener;
  private final boolean audit;

  /**
   * What to scan and how.
   *
   * @param paths files and folders to scan
   * @param baseDirectory report names are relative to it; fingerprints include them
   * @param config configuration file, if any
   * @param baseline baseline file to filter against, if any
   * @param failOn fail level from the command line; overrides the configuration's
   * @param includes globs from the command line; replace the configuration's when given
   * @param excludes globs from the command line; added to the configuration's
   * @param jobs worker threads
   */
  public record Options(List<Path> paths, Path baseDirectory, Optional<Path> config,
      Optional<Path> baseline, Optional<FailLevel> failOn, List<String> includes,
      List<String> excludes, int jobs) {
    public Options {
      paths = List.copyOf(paths);
      includes = List.copyOf(includes);
      excludes = List.copyOf(excludes);
    }
  }

  /** The gate's decision. */
  public enum Verdict { PASS, FINDINGS_AT_FAIL_LEVEL, INCOMPLETE }

  /**
   * A finished gate run.
   *
   * @param result findings after every stage (suppressed ones included, baseline-known ones removed)
   * @param request the scan request as run, for tools that act on the same files (fix)
   * @param baseline how the scan compared with the baseline, when one was given
   */
  public record Outcome(ScanResult result, ScanRequest request, GateConfig config,
      FailLevel failLevel, Optional<BaselineSummary> baseline) {

    /** Unsuppressed findings at or above the fail level. */
    public List<Finding> failing() {
      return result.findings().stream()
          .filter(f -> !f.isSuppressed() && failLevel.fails(f.severity()))
          .toList();
    }

    /** Incomplete analysis outranks findings: the findings may not be all there are. */
    public Verdict verdict() {
      if (result.incomplete()) {
        return Verdict.INCOMPLETE;
      }
      return failing().isEmpty() ? Verdict.PASS : Verdict.FINDINGS_AT_FAIL_LEVEL;
    }
  }

  public QualityGate(ApiModel model, List<Rule> allRules, List<ProjectAnalysis> projectAnalyses,
      Scanner.ScanListener listener) {
    this(model, allRules, projectAnalyses, listener, false);
  }

  private QualityGate(ApiModel model, List<Rule> allRules, List<ProjectAnalysis> projectAnalyses,
      Scanner.ScanListener listener, boolean audit) {
    this.model = model;
    this.allRules = List.copyOf(allRules);
    this.projectAnalyses = List.copyOf(projectAnalyses);
    this.listener = listener;
    this.audit = audit;
  }

  /** The same gate, also collecting training entry points and test-set sizes (audit report). */
  public QualityGate withAudit() {
    return new QualityGate(model, allRules, projectAnalyses, listener, true);
  }

  public Set<String> ruleIds() {
    return allRules.stream().map(r -> r.descriptor().id())
        .collect(Collectors.toCollection(java.util.TreeSet::new));
  }

  public Outcome run(Options options) throws ConfigException {
    GateConfig config = options.config().isPresent()
        ? ConfigLoader.load(options.config().get(), display(options.config().get(), options.baseDirectory()), ruleIds())
        : GateConfig.EMPTY;
    Optional<Baseline> baseline = Optional.empty();
    if (options.baseline().isPresent()) {
      Path b = options.baseline().get();
      baseline = Optional.of(Baseline.load(b, display(b, options.baseDirectory())));
    }
    List<String> includes = options.includes().isEmpty() ? config.include() : options.includes();
    Set<String> excludes = new LinkedHashSet<>(config.exclude());
    excludes.addAll(options.excludes());
    ScanRequest request = new ScanRequest(options.paths(), options.baseDirectory(), includes,
        new ArrayList<>(excludes), options.jobs(), config.analysisSettings());
    Scanner scanner = new Scanner(model, config.enabledRules(allRules), projectAnalyses, listener)
        .withFileStage(Suppressions::mark);
    if (audit) {
      scanner = scanner.withAudit();
    }
    ScanResult result = scanner.scan(request);
    result = SeverityOverrides.apply(result, config);
    Optional<BaselineSummary> summary = Optional.empty();
    if (baseline.isPresent()) {
      Baseline.Outcome filtered = baseline.get().filter(result,
          display(options.baseline().get(), options.baseDirectory()));
      result = filtered.result();
      summary = Optional.of(filtered.summary());
    }
    FailLevel failLevel = options.failOn().or(config::failOn).orElse(FailLevel.DEFAULT);
    return new Outcome(result, request, config, failLevel, summary);
  }

  /** A path as messages show it: relative to the base directory when inside it. */
  public static String display(Path file, Path base) {
    Path abs = file.toAbsolutePath().normalize();
    Path b = base.toAbsolutePath().normalize();
    return abs.startsWith(b) ? b.relativize(abs).toString().replace('\\', '/') : abs.toString();
  }
}
