package dev.plumbline.report;

import dev.plumbline.finding.SourceRange;
import java.util.List;
import java.util.Optional;

/** Source lines for excerpts, with tabs kept so the caret lines up in a terminal. */
final class Excerpts {
  private Excerpts() {}

  static Optional<String> line(String text, int lineNumber) {
    List<String> lines = text.lines().toList();
    if (lineNumber < 1 || lineNumber > lines.size()) {
      return Optional.empty();
    }
    return Optional.of(lines.get(lineNumber - 1));
  }

  /** A caret under the start column and tildes to the end of the range on that line. */
  static String caret(String line, SourceRange range) {
    StringBuilder sb = new StringBuilder();
    int start = Math.max(1, range.startColumn());
    for (int i = 1; i < start && i <= line.length(); i++) {
      sb.append(line.charAt(i - 1) == '\t' ? '\t' : ' ');
    }
    sb.append('^');
    int end = range.endLine() == range.startLine() ? Math.min(range.endColumn(), line.length()) : line.length();
    for (int i = start + 1; i <= end; i++) {
      sb.append('~');
    }
    return sb.toString();
  }
}
