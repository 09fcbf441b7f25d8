package dev.plumbline.parse;

import com.github.javaparser.JavaParser;
import com.github.javaparser.ParseResult;
import com.github.javaparser.ParserConfiguration;
import com.github.javaparser.ast.body.BodyDeclaration;
import com.github.javaparser.ast.body.CallableDeclaration;
import com.github.javaparser.ast.body.TypeDeclaration;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Turns the code cells of a Java notebook into one Java compilation unit that the analyses read
 * like any source file, and records where each line came from.
 *
 * <p>Java notebook kernels accept imports, declarations and bare statements at the top level of
 * a cell. The unit keeps that meaning as far as a single class can: every import goes first;
 * methods and types declared in cells become members of a synthetic class; all statements of
 * all cells, in cell order, become the body of one synthetic method, so data flows from one cell
 * to the next as it does when the cells run top to bottom. A trailing expression without a
 * semicolon (a kernel displays its value) gets one. Line magics ({@code %...}) are blanked and
 * cells that start with a cell magic ({@code %%...}) are left out.
 *
 * <p>Each piece of code keeps its columns: its first line is padded to its column, later lines
 * are copied as they are. Known difference from a kernel: variables declared by statements are
 * locals of the synthetic method, so methods declared in cells cannot see them (their uses stay
 * unresolved, which the analyses treat as unknown).
 */
public final class NotebookSource {
  /** Name of the synthetic method that holds the statements of all cells. */
  public static final String CELLS_METHOD = "cells";

  /** The unit's text and the map back to the notebook. */
  public record Built(String text, NotebookLayout layout) {}

  private enum Kind { IMPORT, MEMBER, STATEMENT, STATEMENT_WITHOUT_SEMICOLON }

  private record Placed(String text, int reportedLine) {}

  private final JavaParser parser = new JavaParser(new ParserConfiguration()
      .setLanguageLevel(ParserConfiguration.LanguageLevel.JAVA_21));

  private NotebookSource() {}

  /** The synthetic class name for a notebook: unique per report name, a valid identifier. */
  public static String className(String uri) {
    return "Notebook_" + uri.replaceAll("[^A-Za-z0-9]", "_");
  }

  public static Built build(String uri, NotebookReader.Notebook notebook) {
    return new NotebookSource().assemble(uri, notebook);
  }

  private Built assemble(String uri, NotebookReader.Notebook notebook) {
    List<Placed> imports = new ArrayList<>();
    List<Placed> members = new ArrayList<>();
    List<Placed> statements = new ArrayList<>();
    Map<Integer, LineMap.CellPosition> cells = new HashMap<>();
    Map<Integer, String> shown = new HashMap<>();
    int lastFileLine = 1;
    for (NotebookReader.Cell cell : notebook.cells()) {
      if (!cell.isCode()) {
        continue;
      }
      List<NotebookReader.SourceLine> lines = cell.lines();
      for (int i = 0; i < lines.size(); i++) {
        int fileLine = lines.get(i).fileLine();
        cells.putIfAbsent(fileLine, new LineMap.CellPosition(cell.number(), i + 1));
        shown.putIfAbsent(fileLine, lines.get(i).text());
        lastFileLine = Math.max(lastFileLine, fileLine);
      }
      if (startsWithCellMagic(lines)) {
        continue;
      }
      List<String> code = new ArrayList<>();
      for (NotebookReader.SourceLine line : lines) {
        code.add(line.text().stripLeading().startsWith("%") ? "" : line.text());
      }
      String text = String.join("\n", code);
      int[] lineStarts = lineStarts(code);
      for (CellSegmenter.Piece piece : CellSegmenter.split(text)) {
        String pieceText = text.substring(piece.start(), piece.end());
        Kind kind = classify(pieceText);
        List<Placed> placed = place(text, lineStarts, lines, piece);
        if (kind == Kind.STATEMENT_WITHOUT_SEMICOLON) {
          Placed last = placed.remove(placed.size() - 1);
          placed.add(new Placed(last.text() + ";", last.reportedLine()));
        }
        switch (kind) {
          case IMPORT -> imports.addAll(placed);
          case MEMBER -> members.addAll(placed);
          default -> statements.addAll(placed);
        }
      }
    }
    List<Placed> unit = new ArrayList<>(imports);
    unit.add(new Placed("final class " + className(uri) + " {", 0));
    unit.addAll(members);
    unit.add(new Placed("void " + CELLS_METHOD + "() throws Exception {", 0));
    unit.addAll(statements);
    unit.add(new Placed("}", 0));
    unit.add(new Placed("}", 0));
    int[] reported = new int[unit.size()];
    StringBuilder sb = new StringBuilder();
    for (int i = 0; i < unit.size(); i++) {
      reported[i] = unit.get(i).reportedLine();
      sb.append(unit.get(i).text()).append('\n');
    }
    fillSyntheticLines(reported);
    List<String> reportedLines = new ArrayList<>();
    for (int line = 1; line <= lastFileLine; line++) {
      reportedLines.add(shown.getOrDefault(line, ""));
    }
    return new Built(sb.toString(), new NotebookLayout(reported, cells, reportedLines));
  }

  private static boolean startsWithCellMagic(List<NotebookReader.SourceLine> lines) {
    for (NotebookReader.SourceLine l : lines) {
      String t = l.text().strip();
      if (!t.isEmpty()) {
        return t.startsWith("%%");
      }
    }
    return false;
  }

  /** Synthetic lines (class and method headers) report at the nearest code line after them. */
  private static void fillSyntheticLines(int[] reported) {
    int next = 0;
    for (int i = reported.length - 1; i >= 0; i--) {
      if (reported[i] == 0) {
        reported[i] = next;
      } else {
        next = reported[i];
      }
    }
    int previous = 1;
    for (int i = 0; i < reported.length; i++) {
      if (reported[i] == 0) {
        reported[i] = previous;
      } else {
        previous = reported[i];
      }
    }
  }

  private Kind classify(String piece) {
    String code = withoutLeadingTrivia(piece);
    if (code.startsWith("import") && code.length() > 6 && !Character.isJavaIdentifierPart(code.charAt(6))) {
      return Kind.IMPORT;
    }
    ParseResult<BodyDeclaration<?>> member = parser.parseBodyDeclaration(piece);
    boolean parsesAsMember = member.isSuccessful() && member.getResult().isPresent();
    if (parsesAsMember && (member.getResult().get() instanceof CallableDeclaration<?>
        || member.getResult().get() instanceof TypeDeclaration<?>)) {
      return Kind.MEMBER;
    }
    if (parser.parseStatement(piece).isSuccessful()) {
      return Kind.STATEMENT;
    }
    if (parsesAsMember) {
      return Kind.MEMBER; // e.g. a static field, which a statement cannot declare
    }
    String trimmed = piece.stripTrailing();
    if (!trimmed.endsWith(";") && !trimmed.endsWith("}") && parser.parseStatement(trimmed + ";").isSuccessful()) {
      return Kind.STATEMENT_WITHOUT_SEMICOLON;
    }
    return Kind.STATEMENT; // does not parse: the whole unit's parse reports it at its line
  }

  private static String withoutLeadingTrivia(String s) {
    int i = 0;
    while (i < s.length()) {
      int next = CellSegmenter.skipTrivia(s, i);
      if (next == i) {
        break;
      }
      i = next;
    }
    return s.substring(i);
  }

  private static int[] lineStarts(List<String> lines) {
    int[] starts = new int[lines.size() + 1];
    int offset = 0;
    for (int i = 0; i < lines.size(); i++) {
      starts[i] = offset;
      offset += lines.get(i).length() + 1;
    }
    starts[lines.size()] = offset;
    return starts;
  }

  private static int lineOf(int[] lineStarts, int offset) {
    int line = 0;
    while (line + 1 < lineStarts.length - 1 && lineStarts[line + 1] <= offset) {
      line++;
    }
    return line;
  }

  /** The lines of one piece, the first padded to its column, each with its notebook file line. */
  private static List<Placed> place(String text, int[] lineStarts, List<NotebookReader.SourceLine> lines,
      CellSegmenter.Piece piece) {
    List<Placed> out = new ArrayList<>();
    int first = lineOf(lineStarts, piece.start());
    int last = lineOf(lineStarts, Math.max(piece.start(), piece.end() - 1));
    for (int line = first; line <= last; line++) {
      int lineStart = lineStarts[line];
      int lineEnd = Math.min(text.length(), lineStarts[line + 1] - 1);
      int from = line == first ? piece.start() : lineStart;
      int to = line == last ? Math.min(piece.end(), lineEnd) : lineEnd;
      StringBuilder sb = new StringBuilder();
      for (int c = lineStart; c < from; c++) {
        sb.append(text.charAt(c) == '\t' ? '\t' : ' ');
      }
      sb.append(text, from, Math.max(from, to));
      out.add(new Placed(sb.toString(), lines.get(line).fileLine()));
    }
    return out;
  }
}
