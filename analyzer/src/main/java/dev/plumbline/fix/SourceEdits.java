package dev.plumbline.fix;

import com.github.javaparser.Position;
import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.stmt.Statement;
import dev.plumbline.engine.FileContext;
import dev.plumbline.finding.Edit;
import dev.plumbline.finding.Message;
import dev.plumbline.parse.LineMap;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Builds the {@link Edit} a rule attaches to a finding, from nodes of the file being checked:
 *
 * <pre>{@code
 * Optional<Edit> edit = SourceEdits.in(file)
 *     .removeStatement(fitStatement)
 *     .insertLineAfter(trainDeclaration, "normalizer.fit(train);")
 *     .build(Message.of("<rule id>.edit.<variant>", args...), true);
 * reporter.at(this, call).message(...).edit(edit.orElse(null)).emit();
 * }</pre>
 *
 * <p>Positions come from the tree; line terminators and indentation from the file's text. The
 * builder says nothing rather than something wrong: {@link #build} is empty when a node has no
 * position, the file's lines are mapped (a notebook), or two changes overlap.
 */
public final class SourceEdits {
  private final TextLines lines;
  private final boolean usable;
  private final List<Edit.Replacement> replacements = new ArrayList<>();
  private boolean failed;

  private SourceEdits(String text, boolean usable) {
    this.lines = new TextLines(text);
    this.usable = usable;
  }

  public static SourceEdits in(FileContext file) {
    return new SourceEdits(file.source().text(), file.source().lineMap() == LineMap.IDENTITY);
  }

  /** For tests and tools working on plain text whose tree was parsed from exactly {@code text}. */
  public static SourceEdits inText(String text) {
    return new SourceEdits(text, true);
  }

  /** Replaces the node's text. */
  public SourceEdits replace(Node node, String text) {
    Optional<Position> begin = node.getBegin();
    Optional<Position> end = node.getEnd();
    if (begin.isEmpty() || end.isEmpty()) {
      failed = true;
      return this;
    }
    return add(new Edit.Replacement(begin.get().line, begin.get().column, end.get().line,
        end.get().column + 1, text));
  }

  public SourceEdits insertBefore(Node node, String text) {
    Optional<Position> begin = node.getBegin();
    if (begin.isEmpty()) {
      failed = true;
      return this;
    }
    return add(Edit.Replacement.insertion(begin.get().line, begin.get().column, text));
  }

  public SourceEdits insertAfter(Node node, String text) {
    Optional<Position> end = node.getEnd();
    if (end.isEmpty()) {
      failed = true;
      return this;
    }
    return add(Edit.Replacement.insertion(end.get().line, end.get().column + 1, text));
  }

  /**
   * Removes a statement. When nothing but blanks and a trailing line comment share its lines,
   * the whole lines go, terminators included, so no blank line is left behind.
   */
  public SourceEdits removeStatement(Statement statement) {
    Optional<Position> begin = statement.getBegin();
    Optional<Position> end = statement.getEnd();
    if (begin.isEmpty() || end.isEmpty()) {
      failed = true;
      return this;
    }
    if (standsAlone(begin.get(), end.get())) {
      int last = end.get().line;
      if (last < lines.count()) {
        return add(new Edit.Replacement(begin.get().line, 1, last + 1, 1, ""));
      }
      return add(new Edit.Replacement(begin.get().line, 1, last, lines.content(last).length() + 1, ""));
    }
    return replace(statement, "");
  }

  /**
   * Inserts {@code code} as a new line after the last line of {@code statement}, indented like
   * the statement's first line and ended with the file's own terminator. Fails (empty build)
   * when other code follows the statement on its last line.
   */
  public SourceEdits insertLineAfter(Statement statement, String code) {
    Optional<Position> begin = statement.getBegin();
    Optional<Position> end = statement.getEnd();
    if (begin.isEmpty() || end.isEmpty() || !onlyCommentAfter(end.get())) {
      failed = true;
      return this;
    }
    int last = end.get().line;
    String indent = lines.indentation(begin.get().line);
    String terminator = lines.terminator(last);
    if (terminator.isEmpty()) {
      // The statement is on the file's last line: start a new line instead.
      return add(Edit.Replacement.insertion(last, lines.content(last).length() + 1,
          lines.dominantTerminator() + indent + code));
    }
    return add(Edit.Replacement.insertion(last + 1, 1, indent + code + terminator));
  }

  /** The edit, or empty when a position was unknown or changes overlap. */
  public Optional<Edit> build(Message description, boolean safe) {
    if (failed || !usable || replacements.isEmpty()) {
      return Optional.empty();
    }
    List<Edit.Replacement> sorted = new ArrayList<>(replacements);
    sorted.sort(EditApplier.BY_START);
    for (int i = 1; i < sorted.size(); i++) {
      if (EditApplier.overlap(sorted.get(i - 1), sorted.get(i))) {
        return Optional.empty();
      }
    }
    return Optional.of(new Edit(description, sorted, safe));
  }

  private SourceEdits add(Edit.Replacement r) {
    if (lines.offset(r.startLine(), r.startColumn()).isEmpty()
        || lines.offset(r.endLine(), r.endColumn()).isEmpty()) {
      failed = true;
    } else {
      replacements.add(r);
    }
    return this;
  }

  private boolean standsAlone(Position begin, Position end) {
    String before = lines.content(begin.line).substring(0, Math.min(begin.column - 1,
        lines.content(begin.line).length()));
    return before.isBlank() && onlyCommentAfter(end);
  }

  /** Whether only blanks, or blanks and a line comment, follow {@code end} on its line. */
  private boolean onlyCommentAfter(Position end) {
    String content = lines.content(end.line);
    String after = end.column < content.length() ? content.substring(end.column) : "";
    String rest = after.strip();
    return rest.isEmpty() || rest.startsWith("//");
  }
}
