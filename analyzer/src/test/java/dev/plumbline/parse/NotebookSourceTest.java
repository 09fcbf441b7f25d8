package dev.plumbline.parse;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.body.MethodDeclaration;
import com.github.javaparser.ast.expr.MethodCallExpr;
import dev.plumbline.discover.SourceFile;
import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;

/** Notebook cells become one unit whose positions map back to the notebook file and cell. */
class NotebookSourceTest {

  /** A notebook with the given code cells, written the way Jupyter writes them (indent 1). */
  static String notebook(String language, String... cells) {
    StringBuilder sb = new StringBuilder("{\n \"cells\": [\n");
    for (int c = 0; c < cells.length; c++) {
      String kind = cells[c].startsWith("#md ") ? "markdown" : "code";
      String text = kind.equals("markdown") ? cells[c].substring(4) : cells[c];
      sb.append("  {\n   \"cell_type\": \"").append(kind).append("\",\n   \"metadata\": {},\n");
      sb.append("   \"source\": [\n");
      String[] lines = text.split("\n", -1);
      for (int i = 0; i < lines.length; i++) {
        String line = lines[i] + (i < lines.length - 1 ? "\n" : "");
        sb.append("    \"").append(line.replace("\\", "\\\\").replace("\"", "\\\"").replace("\n", "\\n"))
            .append("\"").append(i < lines.length - 1 ? "," : "").append("\n");
      }
      sb.append("   ]\n  }").append(c < cells.length - 1 ? "," : "").append("\n");
    }
    sb.append(" ],\n \"metadata\": {\"kernelspec\": {\"language\": \"").append(language)
        .append("\", \"name\": \"k\"}},\n \"nbformat\": 4,\n \"nbformat_minor\": 5\n}\n");
    return sb.toString();
  }

  static SourceParser.Outcome parse(String json) {
    SourceFile file = new SourceFile(Path.of("nb/Try.ipynb"), "nb/Try.ipynb");
    return new SourceParser().parseNotebook(file, json, List.of());
  }

  @Test
  void readerKeepsTheFileLineOfEverySourceLine() throws IOException {
    String json = notebook("java", "int a = 1;\nint b = 2;", "#md Some words", "int c = 3;");
    NotebookReader.Notebook nb = NotebookReader.read(json);
    assertTrue(nb.isJava());
    assertEquals(3, nb.cells().size());
    List<String> jsonLines = json.lines().toList();
    for (NotebookReader.Cell cell : nb.cells()) {
      for (NotebookReader.SourceLine line : cell.lines()) {
        assertTrue(jsonLines.get(line.fileLine() - 1).contains(line.text()),
            line + " is on file line " + line.fileLine());
      }
    }
    assertEquals(3, nb.cells().get(2).number(), "markdown cells count in the numbering");
    assertFalse(nb.cells().get(1).isCode());
  }

  @Test
  void sourceGivenAsOneStringSharesItsLine() throws IOException {
    String json = "{\"cells\":[{\"cell_type\":\"code\",\"source\":\"int a = 1;\\nint b = 2;\\n\"}],"
        + "\"metadata\":{\"language_info\":{\"name\":\"Java\"}},\"nbformat\":4}";
    NotebookReader.Notebook nb = NotebookReader.read(json);
    assertTrue(nb.isJava(), "language_info.name is read when kernelspec has none");
    assertEquals(List.of("int a = 1;", "int b = 2;"),
        nb.cells().get(0).lines().stream().map(NotebookReader.SourceLine::text).toList());
    assertEquals(1, nb.cells().get(0).lines().get(1).fileLine());
  }

  @Test
  void segmenterKeepsCompoundStatementsTogetherAndIgnoresLiterals() {
    String cell = """
        int a = 1; if (a > 0) { a++; } else { a--; }
        do { a++; } while (a < 3);
        String s = "; } {"; char c = '}';
        /* ; } */ String t = \"\"\"
          ; }
          \"\"\";
        double twice(double v) { return 2 * v; }
        Runnable r = () -> { a(); };
        a""";
    List<String> pieces = CellSegmenter.split(cell).stream()
        .map(p -> cell.substring(p.start(), p.end()).strip())
        .collect(Collectors.toList());
    assertEquals(List.of(
        "int a = 1;",
        "if (a > 0) { a++; } else { a--; }",
        "do { a++; } while (a < 3);",
        "String s = \"; } {\";",
        "char c = '}';",
        "/* ; } */ String t = \"\"\"\n  ; }\n  \"\"\";",
        "double twice(double v) { return 2 * v; }",
        "Runnable r = () -> { a(); };",
        "a"), pieces);
  }

  @Test
  void cellsBecomeImportsMembersAndOneMethodOfStatementsInOrder() {
    String json = notebook("java",
        "%maven org.example:thing:1.0\nimport java.util.List;\nint n = 3;",
        "double twice(double v) {\n  return 2 * v;\n}\nint m = n + 1;",
        "%%bash\necho not java",
        "twice(m)");
    SourceParser.Outcome out = parse(json);
    assertTrue(out.notifications().isEmpty(), () -> out.notifications().toString());
    CompilationUnit unit = out.parsed().orElseThrow().unit();
    assertEquals(1, unit.getImports().size());
    MethodDeclaration cells = unit.findAll(MethodDeclaration.class).stream()
        .filter(m -> m.getNameAsString().equals(NotebookSource.CELLS_METHOD)).findFirst().orElseThrow();
    assertEquals(List.of("int n = 3;", "int m = n + 1;", "twice(m);"),
        cells.getBody().orElseThrow().getStatements().stream().map(Object::toString).toList());
    assertTrue(unit.findAll(MethodDeclaration.class).stream().anyMatch(m -> m.getNameAsString().equals("twice")));
  }

  @Test
  void positionsMapBackToNotebookLineCellAndColumn() {
    String json = notebook("java", "int a = 1;", "int b = 2;", "int c = 3;\n   Math.max(a,\n      c);");
    SourceParser.Outcome out = parse(json);
    ParsedSource parsed = out.parsed().orElseThrow();
    MethodCallExpr call = parsed.unit().findFirst(MethodCallExpr.class).orElseThrow();
    int reported = parsed.lineMap().reportedLine(call.getBegin().orElseThrow().line);
    List<String> jsonLines = json.lines().toList();
    assertTrue(jsonLines.get(reported - 1).contains("Math.max(a,"), jsonLines.get(reported - 1));
    assertEquals(4, call.getBegin().orElseThrow().column, "column within the code line is kept");
    assertEquals(new LineMap.CellPosition(3, 2), parsed.lineMap().cellOf(reported).orElseThrow());
    int end = parsed.lineMap().reportedLine(call.getEnd().orElseThrow().line);
    assertEquals(new LineMap.CellPosition(3, 3), parsed.lineMap().cellOf(end).orElseThrow());
    NotebookLayout layout = (NotebookLayout) parsed.lineMap();
    assertEquals("   Math.max(a,", layout.reportedText().lines().toList().get(reported - 1));
    assertEquals(LineMap.of(call), parsed.lineMap(), "the unit carries its line map");
  }

  @Test
  void syntaxErrorIsReportedAtTheNotebookLine() {
    String json = notebook("java", "int a = 1;", "int b = ;");
    SourceParser.Outcome out = parse(json);
    assertTrue(out.parsed().isEmpty());
    int line = out.notifications().get(0).location().orElseThrow().range().startLine();
    assertTrue(json.lines().toList().get(line - 1).contains("int b = ;"));
  }

  @Test
  void otherLanguagesAreSkippedWithANoteAndBadJsonIsAProblem() {
    SourceParser.Outcome python = parse(notebook("python", "print(1)"));
    assertTrue(python.parsed().isEmpty());
    assertEquals("notification.notebook-not-java", python.notifications().get(0).message().key());
    assertFalse(python.notifications().get(0).incomplete(), "not an analysis failure");
    SourceParser.Outcome broken = parse("{\"cells\": [");
    assertEquals("notification.notebook-unreadable", broken.notifications().get(0).message().key());
    assertTrue(broken.notifications().get(0).incomplete());
  }
}
