package dev.plumbline.report;

import dev.plumbline.finding.SourceRange;
import dev.plumbline.fix.TextLines;
import java.util.Optional;

/** Source lines for excerpts, with tabs kept so the caret lines up in a terminal. */
final class Excerpts {
  private Excerpts() {}

  /**
   * Line {@code lineNumber} (from 1) of a text, as {@link String#lines()} would number it. The
   * text's line starts are found once ({@link TextLines}) and reused for each finding in it.
   */
  static Optional<String> line(TextLines lines, int lineNumber) {
    if (lineNumber < 1 || lineNumber > lines.count()) {
      return Optional.empty();
    }
    if (lineNumber == lines.count() && lines.offset(lineNumber, 1).orElse(0) == lines.text().length()) {
      return Optional.empty(); // a final line terminator does not start another line
    }
    return Optional.of(lines.content(lineNumber));
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
