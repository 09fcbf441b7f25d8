package dev.plumbline.parse;

import com.github.javaparser.ast.DataKey;
import com.github.javaparser.ast.Node;
import java.util.Optional;

/**
 * Maps a line of the analyzed text to a line of the reported file. Java sources map to
 * themselves; a notebook's joined cells map back to the notebook (see {@link NotebookLayout}).
 */
public interface LineMap {
  LineMap IDENTITY = line -> line;

  /** Attached to each parsed unit so code that holds only a node can report its lines. */
  DataKey<LineMap> KEY = new DataKey<>() {};

  /** The line map of the unit a node belongs to; identity for units parsed without one. */
  static LineMap of(Node node) {
    return node.findCompilationUnit()
        .filter(cu -> cu.containsData(KEY))
        .map(cu -> cu.getData(KEY))
        .orElse(IDENTITY);
  }

  int reportedLine(int analyzedLine);

  /** For notebooks: the cell and line within the cell shown at a reported line. */
  default Optional<CellPosition> cellOf(int reportedLine) {
    return Optional.empty();
  }

  /**
   * A line of a notebook cell.
   *
   * @param cell the cell's position among all cells, from 1, counted top to bottom
   * @param line the line within the cell, from 1
   */
  record CellPosition(int cell, int line) {}
}
