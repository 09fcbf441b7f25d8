package dev.plumbline.report;

import dev.plumbline.finding.SourceRange;
import java.util.Optional;

/** Source lines for excerpts, with tabs kept so the caret lines up in a terminal. */
final class Excerpts {
  private Excerpts() {}

  /**
   * Line {@code lineNumber} (from 1) of {@code text}, as {@link String#lines()} would number it,
   * without splitting the whole text: a report asks once per finding, and a file can have many.
   */
  static Optional<String> line(String text, int lineNumber) {
    if (lineNumber < 1) {
      return Optional.empty();
    }
    int start = 0;
    for (int current = 1; current < lineNumber; current++) {
      int terminator = endOfLine(text, start);
      if (terminator == text.length()) {
        return Optional.empty();
      }
      boolean crlf = text.charAt(terminator) == '\r' && terminator + 1 < text.length()
          && text.charAt(terminator + 1) == '\n';
      start = terminator + (crlf ? 2 : 1);
    }
    if (start >= text.length()) {
      return Optional.empty(); // a final line terminator does not start another line
    }
    return Optional.of(text.substring(start, endOfLine(text, start)));
  }

  private static int endOfLine(String text, int from) {
    int i = from;
    while (i < text.length() && text.charAt(i) != '\n' && text.charAt(i) != '\r') {
      i++;
    }
    return i;
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
