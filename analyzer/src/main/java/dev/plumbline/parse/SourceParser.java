package dev.plumbline.parse;

import com.github.javaparser.ParseResult;
import com.github.javaparser.Problem;
import com.github.javaparser.TokenRange;
import com.github.javaparser.ast.CompilationUnit;
import dev.plumbline.discover.SourceFile;
import dev.plumbline.finding.Location;
import dev.plumbline.finding.Message;
import dev.plumbline.finding.Notification;
import dev.plumbline.finding.Severity;
import dev.plumbline.finding.SourceRange;
import java.io.IOException;
import java.nio.file.Files;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Reads and parses one file. Never throws for bad input: an unreadable, oversized or
 * unparsable file yields notifications and no tree, and the scan goes on with other files.
 *
 * <p>A file with any syntax problem is not analyzed at all: JavaParser recovers from some
 * errors, but facts drawn from a guessed tree would not meet the precision bar.
 */
public final class SourceParser {
  /** Larger files are skipped: no hand-written training code comes near this. */
  public static final long MAX_FILE_BYTES = 16L * 1024 * 1024;

  /** Names and literal texts shared by the trees this parser makes (see {@link TreeCompactor}). */
  private final SharedStrings strings = new SharedStrings();

  /** The outcome for one file: a tree (maybe with warnings) or only notifications. */
  public record Outcome(Optional<ParsedSource> parsed, List<Notification> notifications) {}

  /**
   * Parses as JavaParser does at the Java 21 language level, with the same tree and problems, but
   * with that level's validation run by {@link Java21Rules}, on this thread's own parser
   * ({@link ThreadParsers}: JavaParser instances are not thread-safe).
   */
  static ParseResult<CompilationUnit> parseJava21(String text) {
    return ThreadParsers.parse(text, Java21Rules.mayNameVar(text));
  }

  public Outcome parse(SourceFile file) {
    List<Notification> notes = new ArrayList<>();
    byte[] bytes;
    try {
      long size = Files.size(file.path());
      if (size > MAX_FILE_BYTES) {
        notes.add(fileNote(file, Severity.WARNING, "notification.file-too-large", true,
            file.uri(), String.valueOf(size), String.valueOf(MAX_FILE_BYTES)));
        return new Outcome(Optional.empty(), notes);
      }
      bytes = Files.readAllBytes(file.path());
    } catch (IOException | SecurityException e) {
      notes.add(fileNote(file, Severity.ERROR, "notification.unreadable-file", true,
          file.uri(), String.valueOf(e.getMessage())));
      return new Outcome(Optional.empty(), notes);
    }
    SourceText decoded = SourceText.decode(bytes);
    if (decoded.hadInvalidBytes()) {
      notes.add(fileNote(file, Severity.WARNING, "notification.invalid-utf8", false, file.uri()));
    }
    if (file.isNotebook()) {
      return parseNotebook(file, decoded.text(), notes);
    }
    return parseText(file, decoded.text(), LineMap.IDENTITY, notes);
  }

  /**
   * A Java notebook becomes one synthetic unit whose lines map back to the notebook file (see
   * {@link NotebookSource}). A notebook of another language is skipped with a note; a file that
   * is not a notebook at all is a problem of the run.
   */
  public Outcome parseNotebook(SourceFile file, String json, List<Notification> notes) {
    List<Notification> out = new ArrayList<>(notes);
    NotebookReader.Notebook notebook;
    try {
      notebook = NotebookReader.read(json);
    } catch (IOException | RuntimeException e) {
      out.add(fileNote(file, Severity.ERROR, "notification.notebook-unreadable", true, file.uri(),
          firstLine(String.valueOf(e.getMessage()))));
      return new Outcome(Optional.empty(), out);
    }
    if (notebook.formatMajor() < 4) {
      out.add(fileNote(file, Severity.WARNING, "notification.notebook-old-format", true, file.uri(),
          String.valueOf(notebook.formatMajor())));
      return new Outcome(Optional.empty(), out);
    }
    if (!notebook.isJava()) {
      out.add(fileNote(file, Severity.NOTE, "notification.notebook-not-java", false, file.uri(),
          notebook.language().isEmpty() ? "unknown" : notebook.language()));
      return new Outcome(Optional.empty(), out);
    }
    NotebookSource.Built built = NotebookSource.build(file.uri(), notebook);
    return parseText(file, built.text(), built.layout(), out);
  }

  /** Parses text already in memory (tests, notebooks). */
  public Outcome parseText(SourceFile file, String text, LineMap lines, List<Notification> notes) {
    List<Notification> out = new ArrayList<>(notes);
    ParseResult<CompilationUnit> result;
    try {
      result = parseJava21(text);
    } catch (StackOverflowError | RuntimeException e) {
      out.add(fileNote(file, Severity.ERROR, "notification.parse-crash", true, file.uri(),
          e.getClass().getSimpleName()));
      return new Outcome(Optional.empty(), out);
    }
    if (!result.isSuccessful() || result.getResult().isEmpty()) {
      Problem first = result.getProblems().isEmpty() ? null : result.getProblems().get(0);
      SourceRange range = first == null ? new SourceRange(1, 1, 1, 1) : first.getLocation()
          .flatMap(TokenRange::toRange)
          .map(r -> new SourceRange(lines.reportedLine(r.begin.line), Math.max(1, r.begin.column),
              lines.reportedLine(r.begin.line), Math.max(1, r.begin.column)))
          .orElse(new SourceRange(1, 1, 1, 1));
      String detail = first == null ? "unknown syntax error" : firstLine(first.getMessage());
      out.add(new Notification(Severity.ERROR,
          Message.of("notification.syntax-error", file.uri(), detail),
          Optional.of(new Location(file.uri(), range)), true));
      return new Outcome(Optional.empty(), out);
    }
    CompilationUnit unit = result.getResult().get();
    dropTokens(unit);
    unit.setData(LineMap.KEY, lines);
    return new Outcome(Optional.of(new ParsedSource(file, text, unit, lines)), out);
  }

  /**
   * Keeps each node's range and lets go of its tokens. JavaParser links every token of the file
   * (whitespace included) into one list that any node's token range keeps alive; nothing here
   * reads tokens, and they are most of a tree's memory, which matters because all trees of a
   * project stay in memory until the scan ends (the project index refers to declarations). The
   * ranges kept are {@link Subtrees.IndexedRange}s, for fast subtree queries. For the same reason
   * the tree's empty lists and equal names are shared ({@link TreeCompactor}).
   */
  private void dropTokens(CompilationUnit unit) {
    Subtrees.Layout layout = unit.containsData(Subtrees.Layout.KEY) ? unit.getData(Subtrees.Layout.KEY) : null;
    if (layout == null || !layout.isOf(unit)) {
      layout = Subtrees.Layout.of(unit);
    }
    unit.removeData(Subtrees.Layout.KEY);
    Subtrees.install(layout, node -> TreeCompactor.compact(node, strings));
  }

  private static String firstLine(String s) {
    int nl = s.indexOf('\n');
    String line = nl < 0 ? s : s.substring(0, nl);
    return line.length() > 200 ? line.substring(0, 197) + "..." : line;
  }

  private static Notification fileNote(SourceFile file, Severity level, String key,
      boolean incomplete, String... args) {
    return new Notification(level, Message.of(key, (Object[]) args),
        Optional.of(new Location(file.uri(), new SourceRange(1, 1, 1, 1))), incomplete);
  }
}
