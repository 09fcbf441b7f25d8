package dev.plumbline.parse;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.github.javaparser.JavaParser;
import com.github.javaparser.ParseResult;
import com.github.javaparser.ParserConfiguration;
import com.github.javaparser.Problem;
import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.comments.Comment;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.EmptyStackException;
import java.util.List;
import java.util.concurrent.atomic.AtomicReference;
import org.junit.jupiter.api.Test;

/** A thread's kept parsers give what fresh JavaParsers give, parse after parse. */
class ThreadParsersTest {
  private static final String VALID = """
      package p;
      /** A doc comment. */
      class A {
        // a line comment
        int f(int x) { var y = x + 1; /* a block comment */ return y * 2; }
        String g() { return "text"; }
      }
      """;
  private static final String BROKEN = "class B { void f() { int x = ; } ";
  private static final String REJECTED = "class C { void f() { var a; } }";

  @Test
  void reachesTheFieldsOfTheShippedJavaParser() {
    // Fails when a JavaParser upgrade renames the fields: parsing would silently take locks again.
    assertTrue(ThreadParsers.active());
    assertTrue(ThreadParsers.hasLockFreeStack(ThreadParsers.current(true)));
    assertTrue(ThreadParsers.hasLockFreeStack(ThreadParsers.current(false)));
  }

  @Test
  void parseAfterParseOnOneThreadGivesWhatFreshParsersGive() {
    for (String text : List.of(VALID, BROKEN, VALID, REJECTED, VALID, "", VALID.replace("var y", "int y"),
        VALID.replace("\n", "\r\n"), VALID.replace("\n", "\r"), VALID.replaceFirst("\n", "\r\n"),
        "class E {}", "class F {}\n", "class G {}\r", BROKEN + "\n}", BROKEN.replace(" ", "\n"))) {
      assertSameOutcome(text);
    }
  }

  @Test
  void theLineSeparatorIsJavaParsersOnCutAndMixedTexts() {
    // Cut at every point, with and without carriage returns: the root's line separator (which
    // CompilationUnit.toString prints with) is the one JavaParser's detection finds.
    List<String> texts = List.of(VALID, VALID.replace("\n", "\r\n"), VALID.replace("\n", "\r"));
    for (String full : texts) {
      for (int cut = 0; cut <= full.length(); cut += 3) {
        assertSameOutcome(full.substring(0, cut));
      }
    }
  }

  @Test
  void aParseThatThrowsLeavesTheThreadWithNewParsers() throws InterruptedException {
    // Deep enough nesting overflows a small stack inside JavaParser; that error reaches the caller
    // (SourceParser turns it into a notification) and the next parse on the thread is clean.
    String deep = "class D { int x = " + "(".repeat(20_000) + "1" + ")".repeat(20_000) + "; }";
    AtomicReference<Throwable> failure = new AtomicReference<>();
    Thread small = new Thread(null, () -> {
      try {
        JavaParser before = ThreadParsers.current(false);
        assertThrows(StackOverflowError.class, () -> ThreadParsers.parse(deep, false));
        JavaParser after = ThreadParsers.current(false);
        assertNotSame(before, after);
        assertSameOutcome(VALID.replace("var y", "int y"));
        assertSame(after, ThreadParsers.current(false));
      } catch (Throwable t) {
        failure.set(t);
      }
    }, "small-stack", 256 * 1024);
    small.start();
    small.join();
    if (failure.get() != null) {
      throw new AssertionError(failure.get());
    }
  }

  @Test
  void theLockFreeStackIsAStack() {
    ThreadParsers.ThreadConfinedStack<Integer> stack = new ThreadParsers.ThreadConfinedStack<>();
    assertTrue(stack.empty());
    assertThrows(EmptyStackException.class, stack::pop);
    assertThrows(EmptyStackException.class, stack::peek);
    for (int i = 0; i < 100; i++) {
      assertEquals(i, stack.push(i));
    }
    assertEquals(100, stack.size());
    assertEquals(99, stack.peek());
    for (int i = 99; i >= 0; i--) {
      assertEquals(i, stack.pop());
    }
    assertTrue(stack.isEmpty());
    stack.push(7);
    stack.clear();
    assertTrue(stack.empty());
    assertFalse(stack.equals(new ThreadParsers.ThreadConfinedStack<Integer>()));
  }

  private static void assertSameOutcome(String text) {
    boolean var = Java21Rules.mayNameVar(text);
    ParseResult<CompilationUnit> expected = new JavaParser(Java21Rules.configuration(var)
        .setCharacterEncoding(StandardCharsets.UTF_8)).parse(text);
    ParseResult<CompilationUnit> standard = new JavaParser(new ParserConfiguration()
        .setLanguageLevel(ParserConfiguration.LanguageLevel.JAVA_21)).parse(text);
    ParseResult<CompilationUnit> actual = ThreadParsers.parse(text, var);
    assertEquals(problems(standard), problems(actual), text);
    assertEquals(problems(expected), problems(actual), text);
    assertEquals(expected.getResult().isPresent(), actual.getResult().isPresent(), text);
    if (expected.getResult().isPresent()) {
      assertEquals(expected.getResult().get(), actual.getResult().get(), text);
      assertEquals(expected.getResult().get().toString(), actual.getResult().get().toString(), text);
      assertEquals(ranges(expected.getResult().get()), ranges(actual.getResult().get()), text);
      assertEquals(ranges(standard.getResult().get()), ranges(actual.getResult().get()), text);
      assertEquals(standard.getResult().get().getData(Node.LINE_SEPARATOR_KEY),
          actual.getResult().get().getData(Node.LINE_SEPARATOR_KEY), text);
      assertEquals(standard.getResult().get().toString(), actual.getResult().get().toString(), text);
    }
  }

  private static List<String> problems(ParseResult<CompilationUnit> result) {
    List<String> out = new ArrayList<>();
    for (Problem p : result.getProblems()) {
      out.add(p.getVerboseMessage());
    }
    return out;
  }

  private static List<String> ranges(CompilationUnit unit) {
    List<String> out = new ArrayList<>();
    unit.walk(Node.TreeTraversal.PREORDER,
        n -> out.add(n.getClass().getSimpleName() + " " + n.getRange().map(Object::toString).orElse("-")));
    for (Comment c : unit.getAllComments()) {
      out.add("comment " + c.getRange().map(Object::toString).orElse("-") + " " + c.getContent());
    }
    return out;
  }
}
