package dev.plumbline.corpus;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumbline.engine.ScanResult;
import dev.plumbline.finding.Finding;
import dev.plumbline.parse.LineMap;
import dev.plumbline.parse.NotebookReader;
import dev.plumbline.parse.NotebookSource;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import javax.tools.JavaCompiler;
import javax.tools.JavaFileObject;
import javax.tools.SimpleJavaFileObject;
import javax.tools.ToolProvider;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The notebook fixture: a Java notebook whose third cell fits a scaler on all rows before the
 * split. The finding must sit in that cell, and the notebook's code, as the analyzer joins it,
 * must compile against the real jars (so the fixture is real training code, not a sketch).
 */
class NotebookFixtureTest {
  private static final Path FIXTURE = CorpusScan.NOTEBOOKS.resolve("HerbWateringLeak.ipynb");

  @Test
  void leakInTheThirdCellIsReportedInThatCell() throws Exception {
    ScanResult result = CorpusScan.scan(1, FIXTURE);
    assertTrue(result.notifications().isEmpty(), () -> result.notifications().toString());
    assertEquals(1, result.findings().size(), () -> result.findings().toString());
    Finding f = result.findings().get(0);
    assertEquals("leak.preprocessing-before-split", f.ruleId());
    assertEquals(new LineMap.CellPosition(3, 2), result.cellOf(f.location()).orElseThrow());
    String fileLine = Files.readAllLines(FIXTURE).get(f.location().range().startLine() - 1);
    assertTrue(fileLine.contains("scaler.fit(plants);"), "the reported line of the notebook file: " + fileLine);
    assertEquals(1, f.location().range().startColumn(), "column within the cell's code line");
    LineMap.CellPosition splitAt = result.cellOf(f.related().get(0).location()).orElseThrow();
    assertEquals(new LineMap.CellPosition(3, 4), splitAt, "the split is on the fourth line of cell 3");
  }

  @Test
  void joinedCellsCompileAgainstTheRealJars(@TempDir Path out) throws Exception {
    String json = Files.readString(FIXTURE, StandardCharsets.UTF_8);
    String uri = "notebooks/HerbWateringLeak.ipynb";
    NotebookSource.Built built = NotebookSource.build(uri, NotebookReader.read(json));
    String className = NotebookSource.className(uri);
    JavaCompiler javac = ToolProvider.getSystemJavaCompiler();
    assertNotNull(javac, "tests run on a JDK");
    JavaFileObject unit = new SimpleJavaFileObject(
        java.net.URI.create("string:///" + className + ".java"), JavaFileObject.Kind.SOURCE) {
      @Override
      public CharSequence getCharContent(boolean ignoreEncodingErrors) {
        return built.text();
      }
    };
    StringWriter diagnostics = new StringWriter();
    boolean ok = javac.getTask(diagnostics, null, null,
        List.of("-classpath", System.getProperty("java.class.path"), "-d", out.toString(),
            "-proc:none"), null, List.of(unit)).call();
    assertTrue(ok, () -> "notebook code does not compile:\n" + diagnostics + "\n" + built.text());
  }
}
