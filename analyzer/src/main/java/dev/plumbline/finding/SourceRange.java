package dev.plumbline.finding;

import com.github.javaparser.ast.Node;
import java.util.Comparator;

/** A 1-based, end-inclusive range of lines and columns, as SARIF regions and compilers count them. */
public record SourceRange(int startLine, int startColumn, int endLine, int endColumn)
    implements Comparable<SourceRange> {

  private static final Comparator<SourceRange> ORDER = Comparator
      .comparingInt(SourceRange::startLine)
      .thenComparingInt(SourceRange::startColumn)
      .thenComparingInt(SourceRange::endLine)
      .thenComparingInt(SourceRange::endColumn);

  public SourceRange {
    if (startLine < 1 || startColumn < 1) {
      throw new IllegalArgumentException("range starts before 1:1: " + startLine + ":" + startColumn);
    }
    if (endLine < startLine || (endLine == startLine && endColumn < startColumn)) {
      endLine = startLine;
      endColumn = startColumn;
    }
  }

  public static SourceRange of(Node node) {
    return node.getRange()
        .map(r -> new SourceRange(r.begin.line, r.begin.column, r.end.line, r.end.column))
        .orElse(new SourceRange(1, 1, 1, 1));
  }

  public SourceRange shiftLines(int delta) {
    return new SourceRange(startLine + delta, startColumn, endLine + delta, endColumn);
  }

  @Override
  public int compareTo(SourceRange o) {
    return ORDER.compare(this, o);
  }
}
