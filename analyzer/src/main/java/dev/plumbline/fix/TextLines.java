package dev.plumbline.fix;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalInt;

/**
 * Line and column arithmetic over one text, with the line terminators JavaParser and javac
 * recognize ({@code \n}, {@code \r\n}, {@code \r}). Columns are 1-based and count UTF-16 code
 * units; a tab counts as one column, as in JavaParser's default configuration.
 */
public final class TextLines {
  private final String text;
  /** Offset where each line starts; one more entry than there are terminators. */
  private final int[] starts;

  public TextLines(String text) {
    this.text = text;
    List<Integer> s = new ArrayList<>();
    s.add(0);
    for (int i = 0; i < text.length(); i++) {
      char c = text.charAt(i);
      if (c == '\r' && i + 1 < text.length() && text.charAt(i + 1) == '\n') {
        i++;
        s.add(i + 1);
      } else if (c == '\n' || c == '\r') {
        s.add(i + 1);
      }
    }
    starts = s.stream().mapToInt(Integer::intValue).toArray();
  }

  public String text() {
    return text;
  }

  /** Number of lines; a text ending in a terminator has an empty last line. */
  public int count() {
    return starts.length;
  }

  /** The line's content without its terminator. */
  public String content(int line) {
    return text.substring(starts[line - 1], contentEnd(line));
  }

  /** The terminator that ends {@code line}, or "" for the last line. */
  public String terminator(int line) {
    int end = line < starts.length ? starts[line] : text.length();
    return text.substring(contentEnd(line), end);
  }

  /** The leading spaces and tabs of {@code line}. */
  public String indentation(int line) {
    String c = content(line);
    int i = 0;
    while (i < c.length() && (c.charAt(i) == ' ' || c.charAt(i) == '\t')) {
      i++;
    }
    return c.substring(0, i);
  }

  /** The usual terminator of this text: the first one found, else {@code \n}. */
  public String dominantTerminator() {
    for (int line = 1; line < starts.length; line++) {
      String t = terminator(line);
      if (!t.isEmpty()) {
        return t;
      }
    }
    return "\n";
  }

  /**
   * The offset of {@code line:column}, or empty when the position is outside the text. A column
   * may point at the line terminator or just past the line's last character.
   */
  public OptionalInt offset(int line, int column) {
    if (line < 1 || line > starts.length || column < 1) {
      return OptionalInt.empty();
    }
    int start = starts[line - 1];
    int limit = line < starts.length ? starts[line] : text.length();
    int offset = start + column - 1;
    return offset <= limit ? OptionalInt.of(offset) : OptionalInt.empty();
  }

  private int contentEnd(int line) {
    int end = line < starts.length ? starts[line] : text.length();
    while (end > starts[line - 1] && (text.charAt(end - 1) == '\n' || text.charAt(end - 1) == '\r')) {
      end--;
    }
    return end;
  }
}
