package dev.plumbline.parse;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.github.javaparser.JavaParser;
import com.github.javaparser.ParseResult;
import com.github.javaparser.ParserConfiguration;
import com.github.javaparser.Problem;
import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.comments.Comment;
import com.github.javaparser.ast.validator.postprocessors.Java21PostProcessor;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * The reference is JavaParser itself: a parser configured for Java 21 must give the same tree and
 * the same problems (message, position, order) as a raw parse followed by {@link Java21Rules}.
 */
class Java21RulesTest {
  /**
   * Sources the grammar accepts and the Java 21 validation rejects, one or more per kind of check
   * (modifiers, reserved names, var, records, try, switch, class headers, assignments, receiver
   * parameters). Each must have problems according to JavaParser; that is asserted, so a snippet
   * that JavaParser starts to accept shows up.
   */
  /**
   * Sources the grammar accepts and the Java 21 validation rejects, one or more per kind of check
   * (modifiers, var, reserved and restricted names, class and interface headers, records, try,
   * assignments, switch expressions, constructor bodies, type arguments). Each must have problems
   * according to JavaParser; that is asserted, so a snippet that JavaParser starts to accept shows
   * up. The last one makes JavaParser's own validation throw, which it reports as a problem.
   */
  private static final List<String> REJECTED = List.of(
      "abstract final class A {}",
      "class A { private public int x; }",
      "class A { native strictfp void f(); }",
      "class A { abstract static void f(); }",
      "interface I { final void f(); }",
      "enum E { A; abstract final void f(); }",
      "class A { transient void f() {} }",
      "class A { synchronized class B {} }",
      "class A { default void f() {} }",
      "class A { void f() { public int x = 1; } }",
      "class A { void f() { static int x = 1; } }",
      "class A { void f() { var a; } }",
      "class A { var x = 1; }",
      "class A { void f() { var a = 1, b = 2; } }",
      "class A { void f() { var a[] = {1}; } }",
      "class A { void f() { var a = null; } }",
      "class A { void f() { var x = {1}; } }",
      "class A { void f() { for (var x = 1, y = 2;;) {} } }",
      "class A { void f() { for (var x : new int[0]) { var y; } } }",
      "class A { void f(var x) {} }",
      "class A { var f() { return 1; } }",
      "class record {}",
      "class A { void f() { int _ = 1; } }",
      "class A { void f() { int enum = 1; } }",
      "class A { void f() { assert = 1; } }",
      "class A extends B, C {}",
      "interface I implements J {}",
      "interface I { { } }",
      "class A { void f() { try {} } }",
      "record R(int x) { int y; }",
      "record R(int x) { static { } int y = 2; }",
      "class A { void f() { 1 = 2; } }",
      "class A { void f() { f() = 2; } }",
      "class A { int f() { return switch (1) { }; } }",
      "class A { A() { int x = 1; this(); } }",
      "class A { void f() { java.util.List<int> x; } }",
      "class A { void f() { Object o = new var(); } }");

  private static ParseResult<CompilationUnit> standard(String text) {
    return new JavaParser(new ParserConfiguration()
        .setLanguageLevel(ParserConfiguration.LanguageLevel.JAVA_21)
        .setCharacterEncoding(StandardCharsets.UTF_8)).parse(text);
  }

  private static List<String> problems(ParseResult<CompilationUnit> result) {
    List<String> out = new ArrayList<>();
    for (Problem p : result.getProblems()) {
      out.add(p.getVerboseMessage());
    }
    return out;
  }

  private static void assertSameOutcome(String text, String label) {
    ParseResult<CompilationUnit> expected = standard(text);
    ParseResult<CompilationUnit> actual = SourceParser.parseJava21(text);
    assertEquals(problems(expected), problems(actual), label);
    assertEquals(expected.isSuccessful(), actual.isSuccessful(), label);
    assertEquals(expected.getResult().isPresent(), actual.getResult().isPresent(), label);
    if (expected.getResult().isPresent()) {
      assertEquals(expected.getResult().get(), actual.getResult().get(), label);
      assertEquals(expected.getResult().get().toString(), actual.getResult().get().toString(), label);
      assertEquals(ranges(expected.getResult().get()), ranges(actual.getResult().get()), label);
    }
  }

  /** Every node's and comment's range, in pre-order: the tree's equality does not compare them. */
  private static List<String> ranges(CompilationUnit unit) {
    List<String> out = new ArrayList<>();
    unit.walk(Node.TreeTraversal.PREORDER,
        n -> out.add(n.getClass().getSimpleName() + " " + n.getRange().map(Object::toString).orElse("-")));
    for (Comment c : unit.getAllComments()) {
      out.add("comment " + c.getRange().map(Object::toString).orElse("-"));
    }
    return out;
  }

  @Test
  void theValidationsTreeWalksAreFused() {
    // Fails when a JavaParser upgrade renames the fields read: each check would walk again.
    assertTrue(Java21Rules.fusedChecks() >= 15, "fused checks: " + Java21Rules.fusedChecks());
  }

  @Test
  void theVarPostProcessingIsSkippedOnlyWhereNoNameIsVar() {
    // Skipped where mayNameVar is false; either way the outcome must be JavaParser's.
    List<String> snippets = List.of(
        "class A { void f() { var x = 1; } }",
        "class A { void f() { var\tx = 1; for (var y : new int[0]) {} } }",
        "class A { void f() { java.util.List<var> l; } }",
        "class A { int variance; int avar; int var1; int $var; int _var; void f() { variance = avar; } }",
        "class A { void f() { long x = 1Lvar; } }",
        "class A { void f() { double d = 1e5var; } }",
        "class A { void f() { \\u0076ar x = 1; } }",
        "class var {}",
        "class A { Object o = a.var; }",
        "class A { String s = \"var\"; /* var */ }");
    for (String text : snippets) {
      assertSameOutcome(text, text);
    }
    assertTrue(Java21Rules.mayNameVar("var x"));
    assertTrue(Java21Rules.mayNameVar("a.var;"));
    assertTrue(Java21Rules.mayNameVar("1Lvar"), "a number, then the name var");
    assertTrue(Java21Rules.mayNameVar("x = var"));
    assertFalse(Java21Rules.mayNameVar("int variance, avar, var1, $var, _var, x1var;"));
    assertFalse(Java21Rules.mayNameVar("\\u0076ar x"));
    assertFalse(Java21Rules.mayNameVar("varvarvarvar"));
  }

  @Test
  void everyRejectedSnippetGetsJavaParsersProblems() {
    for (String text : REJECTED) {
      assertFalse(standard(text).getProblems().isEmpty(), "JavaParser accepts: " + text);
      assertSameOutcome(text, text);
    }
  }

  @Test
  void theFusedWalkFindsAProblemExactlyWhenJavaParsersValidationDoes() {
    // Checked on the walk itself: with the standard validator as the fallback, a fused check that
    // missed a problem would otherwise only show as a missing problem above.
    for (String text : REJECTED) {
      ParseResult<CompilationUnit> raw = new JavaParser(new ParserConfiguration()
          .setLanguageLevel(ParserConfiguration.LanguageLevel.RAW)).parse(text);
      if (raw.getProblems().isEmpty()) {
        try {
          new Java21PostProcessor().postProcess(raw, new ParserConfiguration());
        } catch (RuntimeException e) {
          continue; // the post-processing itself fails: a problem before any check runs
        }
        assertTrue(Java21Rules.hasProblem(raw.getResult().orElseThrow()), "fused walk misses: " + text);
      }
    }
  }

  @Test
  void theRepositorysJavaFilesParseAlikeBothWays() throws IOException {
    List<Path> files = new ArrayList<>();
    for (String root : List.of("../test-corpus", "src", "../rules/src", "../cli/src")) {
      try (Stream<Path> walk = Files.walk(Path.of(root))) {
        walk.filter(p -> p.toString().endsWith(".java")).sorted().forEach(files::add);
      }
    }
    assertTrue(files.size() > 200, "files: " + files.size());
    int accepted = 0;
    for (Path file : files) {
      String text = Files.readString(file, StandardCharsets.UTF_8);
      assertSameOutcome(text, file.toString());
      if (standard(text).isSuccessful()) {
        accepted++;
      }
    }
    assertTrue(accepted > 200);
  }

  @Test
  void brokenAndMutatedFilesParseAlikeBothWays() throws IOException {
    // Deleted, duplicated and cut lines of corpus files: syntax errors, recovered trees and the
    // occasional tree only the validation rejects.
    List<Path> files;
    try (Stream<Path> walk = Files.walk(Path.of("../test-corpus/src/main/java"))) {
      files = walk.filter(p -> p.toString().endsWith(".java")).sorted().limit(12).toList();
    }
    for (Path file : files) {
      List<String> lines = Files.readAllLines(file, StandardCharsets.UTF_8);
      for (int i = 0; i < lines.size(); i += 3) {
        List<String> deleted = new ArrayList<>(lines);
        deleted.remove(i);
        assertSameOutcome(String.join("\n", deleted), file + " without line " + (i + 1));
        List<String> doubled = new ArrayList<>(lines);
        doubled.add(i, lines.get(i));
        assertSameOutcome(String.join("\n", doubled), file + " with line " + (i + 1) + " twice");
      }
      assertSameOutcome(String.join("\n", lines.subList(0, lines.size() / 2)), file + " cut");
    }
  }
}
