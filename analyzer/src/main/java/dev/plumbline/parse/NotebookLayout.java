package dev.plumbline.parse;

import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;

/**
 * Where the lines of a notebook's synthetic Java unit came from. Reported lines are lines of the
 * notebook file (the {@code .ipynb} JSON), so SARIF regions and compiler-style locations point
 * into the file a reader opens; columns stay columns of the code line, as written in the cell.
 * {@link #cellOf} gives the cell and the line within it for messages a person reads.
 *
 * <p>Immutable; holds no syntax tree, so reports may keep it after the analysis.
 */
public final class NotebookLayout implements LineMap {
  private final int[] reportedBySynthetic;
  private final Map<Integer, CellPosition> cellByReported;
  private final List<String> reportedLines;

  /**
   * @param reportedBySynthetic notebook file line of each synthetic line (index 0 is line 1)
   * @param cellByReported cell position of each notebook file line that holds code
   * @param reportedLines the code text shown at each notebook file line (index 0 is line 1),
   *     empty for lines that hold no code
   */
  NotebookLayout(int[] reportedBySynthetic, Map<Integer, CellPosition> cellByReported,
      List<String> reportedLines) {
    this.reportedBySynthetic = reportedBySynthetic.clone();
    this.cellByReported = new TreeMap<>(cellByReported);
    this.reportedLines = List.copyOf(reportedLines);
  }

  @Override
  public int reportedLine(int analyzedLine) {
    if (reportedBySynthetic.length == 0) {
      return 1;
    }
    int index = Math.min(Math.max(analyzedLine, 1), reportedBySynthetic.length) - 1;
    return reportedBySynthetic[index];
  }

  @Override
  public Optional<CellPosition> cellOf(int reportedLine) {
    return Optional.ofNullable(cellByReported.get(reportedLine));
  }

  /**
   * Text addressed by notebook file line: line k is the code shown at file line k, so excerpts
   * taken by reported line show code rather than JSON.
   */
  public String reportedText() {
    return String.join("\n", reportedLines) + "\n";
  }
}
