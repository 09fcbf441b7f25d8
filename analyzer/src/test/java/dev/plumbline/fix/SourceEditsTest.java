package dev.plumbline.fix;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.github.javaparser.StaticJavaParser;
import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.stmt.ExpressionStmt;
import dev.plumbline.finding.Edit;
import dev.plumbline.finding.Message;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

/** Edits built from tree nodes land on the exact text, whatever the line terminators. */
class SourceEditsTest {
  private static final String CODE = """
      class A {
        void m() {
          int a = 1;
          int b = 2; // note
          int c = a + b;
        }
      }
      """;

  private static ExpressionStmt statement(CompilationUnit unit, int index) {
    return unit.findAll(ExpressionStmt.class).get(index);
  }

  private static String applied(String text, Optional<Edit> edit) {
    assertTrue(edit.isPresent(), "edit was built");
    return EditApplier.apply(text, List.of(edit.get())).text();
  }

  @Test
  void removeAStatementWithItsLineAndTrailingCommentThenReinsertItLower() {
    CompilationUnit unit = StaticJavaParser.parse(CODE);
    Optional<Edit> edit = SourceEdits.inText(CODE)
        .removeStatement(statement(unit, 1))
        .insertLineAfter(statement(unit, 2), "int b = 2;")
        .build(Message.of("test"), true);
    assertEquals(CODE.replace("    int b = 2; // note\n", "")
        .replace("    int c = a + b;\n", "    int c = a + b;\n    int b = 2;\n"), applied(CODE, edit));
  }

  @Test
  void windowsLineEndsAreKept() {
    String crlf = CODE.replace("\n", "\r\n");
    CompilationUnit unit = StaticJavaParser.parse(crlf);
    Optional<Edit> edit = SourceEdits.inText(crlf)
        .removeStatement(statement(unit, 0))
        .insertLineAfter(statement(unit, 2), "int a = 1;")
        .build(Message.of("test"), true);
    String out = applied(crlf, edit);
    assertEquals(crlf.replace("    int a = 1;\r\n", "")
        .replace("    int c = a + b;\r\n", "    int c = a + b;\r\n    int a = 1;\r\n"), out);
    assertTrue(!out.replace("\r\n", "").contains("\n"), "no bare line feed introduced");
  }

  @Test
  void aStatementSharingItsLineIsRemovedAloneAndInsertionAfterItIsRefused() {
    String shared = "class A { void m() { int a = 1; int b = 2; } }\n";
    CompilationUnit unit = StaticJavaParser.parse(shared);
    assertEquals("class A { void m() { int a = 1;  } }\n", applied(shared,
        SourceEdits.inText(shared).removeStatement(statement(unit, 1)).build(Message.of("t"), true)));
    assertTrue(SourceEdits.inText(shared).insertLineAfter(statement(unit, 0), "x();")
        .build(Message.of("t"), true).isEmpty(), "code follows on the line: no guess");
  }

  @Test
  void overlappingChangesGiveNoEdit() {
    CompilationUnit unit = StaticJavaParser.parse(CODE);
    assertTrue(SourceEdits.inText(CODE)
        .replace(statement(unit, 0), "int a = 3;")
        .removeStatement(statement(unit, 0))
        .build(Message.of("t"), true).isEmpty());
  }

  @Test
  void replaceAnExpressionKeepsEverythingElse() {
    CompilationUnit unit = StaticJavaParser.parse(CODE);
    var plus = statement(unit, 2).getExpression().asVariableDeclarationExpr().getVariable(0)
        .getInitializer().get();
    assertEquals(CODE.replace("a + b", "Math.addExact(a, b)"), applied(CODE,
        SourceEdits.inText(CODE).replace(plus, "Math.addExact(a, b)").build(Message.of("t"), true)));
  }
}
