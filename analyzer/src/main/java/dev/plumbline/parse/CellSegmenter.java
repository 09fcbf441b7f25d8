package dev.plumbline.parse;

import java.util.ArrayList;
import java.util.List;
import java.util.Set;

/**
 * Cuts the text of a notebook cell into top-level pieces: statements, declarations and imports,
 * as a Java notebook kernel (JShell underneath) reads them one after another. A piece ends at a
 * semicolon or a closing brace at nesting depth zero, unless the next word continues the same
 * construct ({@code else}, {@code catch}, {@code finally}, the {@code while} of a {@code do}, or
 * a following {@code ;}, {@code .}, {@code ,}, {@code )}). Comments, strings, character literals
 * and text blocks are skipped so their brackets and semicolons do not count.
 *
 * <p>Errs towards longer pieces: a piece that still holds two constructs fails to parse later
 * and is reported as a syntax problem of the notebook, never silently dropped.
 */
final class CellSegmenter {
  private static final Set<String> CONTINUING_WORDS = Set.of("else", "catch", "finally");

  /** A piece of the cell text: {@code [start, end)} offsets. */
  record Piece(int start, int end) {}

  private CellSegmenter() {}

  static List<Piece> split(String text) {
    List<Piece> out = new ArrayList<>();
    int n = text.length();
    int depth = 0;
    int start = 0;
    boolean significant = false;
    int i = 0;
    while (i < n) {
      int skipped = skipTrivia(text, i);
      if (skipped != i) {
        i = skipped;
        continue;
      }
      char c = text.charAt(i);
      if (c == '"' || c == '\'') {
        i = skipLiteral(text, i);
        significant = true;
        continue;
      }
      significant = true;
      if (c == '(' || c == '[' || c == '{') {
        depth++;
      } else if (c == ')' || c == ']' || c == '}') {
        depth = Math.max(0, depth - 1);
        if (c == '}' && depth == 0 && !continues(text, i + 1, start)) {
          out.add(new Piece(start, i + 1));
          start = i + 1;
          significant = false;
        }
      } else if (c == ';' && depth == 0) {
        out.add(new Piece(start, i + 1));
        start = i + 1;
        significant = false;
      }
      i++;
    }
    if (significant) {
      out.add(new Piece(start, n));
    }
    return out;
  }

  /** Whether the code after a closing brace at depth zero belongs to the same construct. */
  private static boolean continues(String text, int from, int pieceStart) {
    int i = from;
    while (i < text.length()) {
      int skipped = skipTrivia(text, i);
      if (skipped == i) {
        break;
      }
      i = skipped;
    }
    if (i >= text.length()) {
      return false;
    }
    char c = text.charAt(i);
    if (";.,)".indexOf(c) >= 0) {
      return true;
    }
    String word = wordAt(text, i);
    if (CONTINUING_WORDS.contains(word)) {
      return true;
    }
    return word.equals("while") && firstWord(text, pieceStart).equals("do");
  }

  private static String firstWord(String text, int from) {
    int i = from;
    while (i < text.length()) {
      int skipped = skipTrivia(text, i);
      if (skipped == i) {
        break;
      }
      i = skipped;
    }
    return i < text.length() ? wordAt(text, i) : "";
  }

  private static String wordAt(String text, int i) {
    int j = i;
    while (j < text.length() && Character.isJavaIdentifierPart(text.charAt(j))) {
      j++;
    }
    return text.substring(i, j);
  }

  /** Skips whitespace or one comment starting at {@code i}; returns {@code i} if there is none. */
  static int skipTrivia(String text, int i) {
    int n = text.length();
    if (i >= n) {
      return i;
    }
    char c = text.charAt(i);
    if (Character.isWhitespace(c)) {
      int j = i;
      while (j < n && Character.isWhitespace(text.charAt(j))) {
        j++;
      }
      return j;
    }
    if (c == '/' && i + 1 < n && text.charAt(i + 1) == '/') {
      int nl = text.indexOf('\n', i);
      return nl < 0 ? n : nl;
    }
    if (c == '/' && i + 1 < n && text.charAt(i + 1) == '*') {
      int close = text.indexOf("*/", i + 2);
      return close < 0 ? n : close + 2;
    }
    return i;
  }

  /** Skips a string, character literal or text block starting at {@code i}. */
  private static int skipLiteral(String text, int i) {
    int n = text.length();
    if (text.startsWith("\"\"\"", i)) {
      int j = i + 3;
      while (j < n) {
        if (text.charAt(j) == '\\') {
          j += 2;
        } else if (text.startsWith("\"\"\"", j)) {
          return j + 3;
        } else {
          j++;
        }
      }
      return n;
    }
    char quote = text.charAt(i);
    int j = i + 1;
    while (j < n && text.charAt(j) != quote && text.charAt(j) != '\n') {
      j += text.charAt(j) == '\\' ? 2 : 1;
    }
    return Math.min(n, j + 1);
  }
}
