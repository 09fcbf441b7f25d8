package dev.plumbline.parse;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.github.javaparser.JavaParser;
import com.github.javaparser.ParserConfiguration;
import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.body.MethodDeclaration;
import com.github.javaparser.ast.comments.LineComment;
import com.github.javaparser.ast.expr.IntegerLiteralExpr;
import com.github.javaparser.ast.expr.Name;
import com.github.javaparser.ast.expr.SimpleName;
import com.github.javaparser.ast.expr.StringLiteralExpr;
import com.github.javaparser.ast.observer.AstObserverAdapter;
import dev.plumbline.discover.SourceFile;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/** Compacted trees keep every node and print the same; their empty lists refuse changes. */
class TreeCompactorTest {
  @Test
  void reachesTheFieldsOfTheShippedJavaParser() {
    // Fails when a JavaParser upgrade renames the fields: the trees would silently grow back.
    assertTrue(TreeCompactor.active());
  }

  @Test
  void compactedCorpusTreesPrintExactlyLikeFreshOnes() throws IOException {
    List<Path> files;
    try (Stream<Path> walk = Files.walk(Path.of("../test-corpus/src/main/java"))) {
      files = walk.filter(p -> p.toString().endsWith(".java")).sorted().toList();
    }
    assertTrue(files.size() > 20);
    for (Path file : files) {
      String text = Files.readString(file, StandardCharsets.UTF_8);
      CompilationUnit fresh = new JavaParser(new ParserConfiguration()
          .setLanguageLevel(ParserConfiguration.LanguageLevel.JAVA_21)).parse(text).getResult().orElseThrow();
      CompilationUnit compacted = new SourceParser().parseText(new SourceFile(file, file.toString()), text,
          LineMap.IDENTITY, List.of()).parsed().orElseThrow().unit();
      assertEquals(fresh.toString(), compacted.toString(), file.toString());
      assertEquals(fresh.findAll(com.github.javaparser.ast.Node.class).size(),
          compacted.findAll(com.github.javaparser.ast.Node.class).size(), file.toString());
      assertEquals(fresh.getAllComments().size(), compacted.getAllComments().size(), file.toString());
    }
  }

  @Test
  void aChangeToAnEmptiedListFailsLoudly() {
    CompilationUnit unit = new SourceParser().parseText(new SourceFile(Path.of("A.java"), "A.java"),
        "class A { void f() { int x = 1; } }", LineMap.IDENTITY, List.of()).parsed().orElseThrow().unit();
    MethodDeclaration method = unit.findFirst(MethodDeclaration.class).orElseThrow();
    SimpleName leaf = method.getName();
    assertTrue(leaf.getChildNodes().isEmpty());
    assertThrows(UnsupportedOperationException.class, () -> method.addOrphanComment(new LineComment("x")));
    assertThrows(UnsupportedOperationException.class, () -> leaf.register(new AstObserverAdapter() {}));
    assertThrows(UnsupportedOperationException.class, () -> method.getParameters().register(new AstObserverAdapter() {}));
    // The other nodes' lists are their own: nothing leaked into the shared one.
    assertTrue(TreeCompactor.FROZEN_EMPTY.isEmpty());
  }

  @Test
  void equalNamesAndLiteralsOfAllTreesOfAParserShareOneString() {
    SourceParser parser = new SourceParser();
    CompilationUnit a = parser.parseText(new SourceFile(Path.of("A.java"), "A.java"),
        "package p.q; class A { int count = 10; void f() { count = count + 10; String s = \"ten\"; } }",
        LineMap.IDENTITY, List.of()).parsed().orElseThrow().unit();
    CompilationUnit b = parser.parseText(new SourceFile(Path.of("B.java"), "B.java"),
        "package p.q; class B { long count = 10; String t = \"ten\"; }",
        LineMap.IDENTITY, List.of()).parsed().orElseThrow().unit();
    List<SimpleName> counts = Stream.of(a, b).flatMap(u -> u.findAll(SimpleName.class).stream())
        .filter(n -> n.getIdentifier().equals("count")).toList();
    assertEquals(4, counts.size());
    List<IntegerLiteralExpr> tens = Stream.of(a, b).flatMap(u -> u.findAll(IntegerLiteralExpr.class).stream()).toList();
    assertEquals(3, tens.size());
    List<StringLiteralExpr> words = Stream.of(a, b).flatMap(u -> u.findAll(StringLiteralExpr.class).stream()).toList();
    assertEquals(2, words.size());
    List<Name> packages = Stream.of(a, b).map(u -> u.getPackageDeclaration().orElseThrow().getName()).toList();
    for (SimpleName n : counts) {
      assertSame(counts.get(0).getIdentifier(), n.getIdentifier());
    }
    for (IntegerLiteralExpr n : tens) {
      assertSame(tens.get(0).getValue(), n.getValue());
    }
    assertSame(words.get(0).getValue(), words.get(1).getValue());
    assertSame(packages.get(0).getIdentifier(), packages.get(1).getIdentifier());
    assertSame(packages.get(0).getQualifier().orElseThrow().getIdentifier(),
        packages.get(1).getQualifier().orElseThrow().getIdentifier());
  }

  @Test
  void sharedStringsLeaveLongTextsAndOverflowAlone() {
    SharedStrings strings = new SharedStrings();
    String longText = "x".repeat(SharedStrings.MAX_LENGTH + 1);
    assertSame(longText, strings.shared(longText));
    assertNotSame(longText, strings.shared(new String(longText)));
    String first = new String("name");
    assertSame(first, strings.shared(first));
    assertSame(first, strings.shared(new String("name")));
    for (int i = 0; i < SharedStrings.LIMIT; i++) {
      strings.shared("n" + i);
    }
    String late = "late" + System.nanoTime();
    assertSame(late, strings.shared(late));
    assertNotSame(late, strings.shared(new String(late)), "a full table adds no more texts");
    assertSame(first, strings.shared(new String("name")), "texts already in it stay shared");
  }
}
