package dev.plumbline.finding;

import java.util.List;

/**
 * A machine-applicable repair: replacements of text in the finding's file. {@code safe} marks
 * fixes that keep the program's meaning apart from removing the defect; {@code plumbline fix}
 * applies only those. Rules build edits with {@code dev.plumbline.fix.SourceEdits} rather than
 * by hand, so positions, line terminators and indentation come out right.
 *
 * @param description what the fix does, as a message key and arguments
 * @param replacements non-overlapping changes, all applied or none
 * @param safe whether {@code plumbline fix} may apply it without review
 */
public record Edit(Message description, List<Replacement> replacements, boolean safe) {

  /**
   * Replace the text from {@code startLine:startColumn} up to, not including,
   * {@code endLine:endColumn} with {@code text}. Lines and columns are 1-based and count UTF-16
   * code units, as SARIF regions do; an empty span (start equals end) is an insertion, and a span
   * ending at column 1 of the next line takes the line terminator with it.
   */
  public record Replacement(int startLine, int startColumn, int endLine, int endColumn, String text) {
    public Replacement {
      if (startLine < 1 || startColumn < 1) {
        throw new IllegalArgumentException("replacement starts before 1:1: " + startLine + ":" + startColumn);
      }
      if (endLine < startLine || (endLine == startLine && endColumn < startColumn)) {
        throw new IllegalArgumentException("replacement ends before it starts: " + startLine + ":"
            + startColumn + "-" + endLine + ":" + endColumn);
      }
      if (text == null) {
        throw new IllegalArgumentException("replacement text is null");
      }
    }

    /** Replaces an end-inclusive range, as nodes report theirs. */
    public Replacement(SourceRange inclusive, String text) {
      this(inclusive.startLine(), inclusive.startColumn(), inclusive.endLine(),
          inclusive.endColumn() + 1, text);
    }

    /** Inserts {@code text} before the character at {@code line:column}. */
    public static Replacement insertion(int line, int column, String text) {
      return new Replacement(line, column, line, column, text);
    }

    public boolean isInsertion() {
      return startLine == endLine && startColumn == endColumn;
    }
  }

  public Edit {
    replacements = List.copyOf(replacements);
    if (replacements.isEmpty()) {
      throw new IllegalArgumentException("an edit needs at least one replacement");
    }
  }
}
