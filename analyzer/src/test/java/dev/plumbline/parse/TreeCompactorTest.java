package dev.plumbline.parse;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.github.javaparser.JavaParser;
import com.github.javaparser.ParserConfiguration;
import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.body.MethodDeclaration;
import com.github.javaparser.ast.comments.LineComment;
import com.github.javaparser.ast.expr.SimpleName;
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
}
