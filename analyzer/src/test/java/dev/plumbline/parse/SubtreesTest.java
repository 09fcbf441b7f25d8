package dev.plumbline.parse;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.MethodDeclaration;
import com.github.javaparser.ast.comments.Comment;
import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.expr.NameExpr;
import com.github.javaparser.ast.expr.SimpleName;
import com.github.javaparser.ast.stmt.BlockStmt;
import com.github.javaparser.ast.stmt.Statement;
import dev.plumbline.discover.SourceFile;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * The pre-order layout answers every subtree query exactly as JavaParser's own walk does (same
 * nodes, same order), for every node of every file tried, and is really used (not the fallback).
 */
class SubtreesTest {
  private static final List<Class<? extends Node>> TYPES = List.of(Node.class, Expression.class,
      MethodCallExpr.class, NameExpr.class, Statement.class, BlockStmt.class, Comment.class,
      SimpleName.class);

  /** Comments in odd places, nested and anonymous types, lambdas, switch forms, records. */
  private static final String TRICKY = """
      package demo.layout;

      import java.util.List; // trailing comment on an import

      /** Javadoc of the type. */
      @SuppressWarnings("unused")
      public class Outer<T extends Comparable<T>> {
        // orphan comment at the start of the body

        private final List<T> items = List.of(); /* after a field */

        enum Mode { A, /* inside */ B { int x() { return 1; } } }

        record Pair(int left, int right) {
          Pair { if (left > right) throw new IllegalArgumentException(); }
        }

        /** Javadoc of a method. */
        int run(int n) {
          int total = 0; // counts
          var unused = total; // a var type: JavaParser's post-processing replaces a node after the parse
          label:
          for (int i = 0; i < n; i++) {
            switch (i % 3) {
              case 0 -> total += i;
              case 1 -> { continue label; }
              default -> total -= helper(() -> i * 2, new Object() { int y = 3; }.y);
            }
            // comment before a statement
            Runnable r = () -> { /* empty body comment */ };
            r.run();
          }
          int k = switch (n) { case 1: yield 2; default: yield 3; };
          return total + k;
        }

        private int helper(java.util.function.IntSupplier s, int y) {
          return s.getAsInt() + y /* in an expression */;
        }
      }
      """;

  @Test
  void answersLikeJavaParserOnTrickySource() {
    CompilationUnit unit = parse("Outer.java", TRICKY);
    assertLayoutMatches(unit);
  }

  @Test
  void answersLikeJavaParserOnEveryCorpusFile() throws IOException {
    Path corpus = Path.of("../test-corpus/src/main/java");
    assertTrue(Files.isDirectory(corpus), "the test corpus is the real code to check against");
    List<Path> files;
    try (Stream<Path> walk = Files.walk(corpus)) {
      files = walk.filter(p -> p.toString().endsWith(".java")).sorted().toList();
    }
    assertTrue(files.size() > 20, "expected the corpus files, found " + files.size());
    for (Path file : files) {
      assertLayoutMatches(parse(file.toString(), Files.readString(file, StandardCharsets.UTF_8)));
    }
  }

  @Test
  void aCopyIsNotAnsweredFromTheOriginalsLayout() {
    CompilationUnit unit = parse("Outer.java", TRICKY);
    MethodDeclaration original = unit.findFirst(MethodDeclaration.class,
        m -> m.getNameAsString().equals("run")).orElseThrow();
    MethodDeclaration copy = original.clone();
    // A node that takes over another's range object (layout included) must not be answered
    // from that layout, which describes the other node's subtree.
    copy.setRange(original.getRange().orElseThrow());
    List<MethodCallExpr> calls = Subtrees.findAll(copy, MethodCallExpr.class);
    assertFalse(calls.isEmpty());
    assertSameNodes(copy.findAll(MethodCallExpr.class), calls);
    assertTrue(calls.stream().allMatch(c -> c.findAncestor(MethodDeclaration.class).orElseThrow() == copy));
  }

  private static CompilationUnit parse(String name, String text) {
    SourceFile file = new SourceFile(Path.of(name), name);
    SourceParser.Outcome outcome = new SourceParser().parseText(file, text, LineMap.IDENTITY, List.of());
    return outcome.parsed().orElseThrow(() -> new AssertionError(name + ": " + outcome.notifications()))
        .unit();
  }

  private static void assertLayoutMatches(CompilationUnit unit) {
    assertFalse(unit.containsData(Subtrees.Layout.KEY), "the parse's layout is not left in the tree's data");
    List<Node> all = new ArrayList<>();
    unit.walk(all::add);
    List<Node> walked = new ArrayList<>();
    Subtrees.walk(unit, walked::add);
    assertSameNodes(all, walked);
    for (Comment comment : unit.getAllComments()) {
      assertTrue(comment.getTokenRange().isEmpty(), "a comment's tokens are dropped");
      assertTrue(comment.getRange().isPresent(), "a comment keeps its range");
    }
    for (Node root : all) {
      if (root.getRange().isPresent()) {
        assertTrue(root.getRange().get() instanceof Subtrees.IndexedRange,
            () -> "not laid out: " + root.getClass().getSimpleName() + " at " + root.getRange());
      }
      assertTrue(root.getTokenRange().isEmpty(), "tokens are dropped");
      for (Class<? extends Node> type : TYPES) {
        assertSameNodes(root.findAll(type), Subtrees.findAll(root, type));
        assertSameNodes(root.findAll(type, n -> n.getChildNodes().size() % 2 == 0),
            Subtrees.findAll(root, type, n -> n.getChildNodes().size() % 2 == 0));
        assertEquals(root.findFirst(type).isPresent(), Subtrees.contains(root, type));
        root.findFirst(type).ifPresent(n -> assertSame(n, Subtrees.findFirst(root, type).orElseThrow()));
      }
    }
  }

  private static void assertSameNodes(List<? extends Node> expected, List<? extends Node> actual) {
    assertEquals(expected.size(), actual.size(), "number of nodes");
    for (int i = 0; i < expected.size(); i++) {
      assertSame(expected.get(i), actual.get(i), "node " + i);
    }
  }
}
