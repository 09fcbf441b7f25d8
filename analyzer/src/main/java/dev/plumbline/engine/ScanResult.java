package dev.plumbline.engine;

import dev.plumbline.analysis.entrypoints.TrainingEntryPoint;
import dev.plumbline.finding.Finding;
import dev.plumbline.finding.Notification;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import dev.plumbline.parse.LineMap;
import dev.plumbline.parse.NotebookLayout;

/**
 * The outcome of a scan, sorted and ready to report.
 *
 * @param findings all findings, suppressed ones included, in {@link Finding#ORDER}
 * @param notifications problems of the run itself, sorted
 * @param rules the rules that ran, in id order
 * @param filesDiscovered files chosen for scanning
 * @param filesAnalyzed files that parsed and were analyzed
 * @param linesAnalyzed source lines of the analyzed files
 * @param sources text of each file that has a finding, by report name, for excerpts; for a
 *     notebook, the code shown at each line of the notebook file (see {@link NotebookLayout})
 * @param notebooks where the lines of each analyzed notebook came from, by report name
 * @param entryPoints training entry points and their evaluations, for the audit report; empty
 *     unless the scan was asked for them ({@link Scanner#withAudit()})
 */
public record ScanResult(
    List<Finding> findings,
    List<Notification> notifications,
    List<RuleDescriptor> rules,
    int filesDiscovered,
    int filesAnalyzed,
    long linesAnalyzed,
    Map<String, String> sources,
    Map<String, NotebookLayout> notebooks,
    List<TrainingEntryPoint> entryPoints) {

  public ScanResult {
    findings = List.copyOf(findings);
    notifications = List.copyOf(notifications);
    rules = List.copyOf(rules);
    sources = Map.copyOf(sources);
    notebooks = Map.copyOf(notebooks);
    entryPoints = List.copyOf(entryPoints);
  }

  /** A result with no notebooks. */
  public ScanResult(List<Finding> findings, List<Notification> notifications,
      List<RuleDescriptor> rules, int filesDiscovered, int filesAnalyzed, long linesAnalyzed,
      Map<String, String> sources) {
    this(findings, notifications, rules, filesDiscovered, filesAnalyzed, linesAnalyzed, sources,
        Map.of(), List.of());
  }

  /** For a location in a notebook: the cell and the line within it. */
  public Optional<LineMap.CellPosition> cellOf(dev.plumbline.finding.Location location) {
    NotebookLayout layout = notebooks.get(location.uri());
    return layout == null ? Optional.empty() : layout.cellOf(location.range().startLine());
  }

  /** Whether some input could not be analyzed (exit code 3). */
  public boolean incomplete() {
    return notifications.stream().anyMatch(Notification::incomplete);
  }

  public Optional<String> source(String uri) {
    return Optional.ofNullable(sources.get(uri));
  }

  public ScanResult withFindings(List<Finding> replaced) {
    return new ScanResult(replaced, notifications, rules, filesDiscovered, filesAnalyzed,
        linesAnalyzed, sources, notebooks, entryPoints);
  }
}
