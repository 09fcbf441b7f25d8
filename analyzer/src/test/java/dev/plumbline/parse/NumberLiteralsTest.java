package dev.plumbline.parse;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.github.javaparser.StaticJavaParser;
import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.expr.DoubleLiteralExpr;
import com.github.javaparser.ast.expr.IntegerLiteralExpr;
import com.github.javaparser.ast.expr.LongLiteralExpr;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/** The reference is JavaParser's own {@code asNumber} and {@code asDouble}. */
class NumberLiteralsTest {

  private static void assertSameAsJavaParser(CompilationUnit unit) {
    for (IntegerLiteralExpr i : unit.findAll(IntegerLiteralExpr.class)) {
      assertSame(() -> i.asNumber(), () -> NumberLiterals.value(i), i.toString());
    }
    for (LongLiteralExpr l : unit.findAll(LongLiteralExpr.class)) {
      assertSame(() -> l.asNumber(), () -> NumberLiterals.value(l), l.toString());
    }
    for (DoubleLiteralExpr d : unit.findAll(DoubleLiteralExpr.class)) {
      assertSame(() -> d.asDouble(), () -> NumberLiterals.value(d), d.toString());
    }
  }

  /** Same value and class, or both throw the same kind of exception. */
  private static void assertSame(java.util.concurrent.Callable<Object> expected,
      java.util.concurrent.Callable<Object> actual, String literal) {
    Object want;
    try {
      want = expected.call();
    } catch (Exception e) {
      assertThrows(e.getClass(), actual::call, literal);
      return;
    }
    Object got;
    try {
      got = actual.call();
    } catch (Exception e) {
      throw new AssertionError(literal + ": JavaParser reads " + want + ", here " + e);
    }
    assertEquals(want, got, literal);
    assertEquals(want.getClass(), got.getClass(), literal);
  }

  @Test
  void everyKindOfLiteralReadsAsJavaParserReadsIt() {
    assertSameAsJavaParser(StaticJavaParser.parse("""
        class A {
          int[] ints = {0, 7, 10, 123456789, 1234567890, 2147483647, 2_147_483_647, 1_000,
              0x1F, 0X7fffffff, 0xFFFFFFFF, 0b101, 0B1, 017, 00, 0_7, -2147483648, 2147483648, 99999999999};
          long[] longs = {0L, 7l, 123456789012345678L, 1234567890123456789L, 9223372036854775807L,
              -9223372036854775808L, 1_000L, 0x7FFFFFFFFFFFFFFFL, 0b1L, 017L, 00L, 9223372036854775808L};
          double[] doubles = {0.0, 1.5, 1e10, 1.5e-3, 2f, 3d, 1_000.5, .5, 5., 0x1.8p1, 1_0e1_0};
        }
        """));
  }

  @Test
  void randomDecimalLiteralsReadAsJavaParserReadsThem() {
    Random random = new Random(20261204);
    StringBuilder code = new StringBuilder("class A { Object[] o = {");
    for (int i = 0; i < 2000; i++) {
      long n = switch (i % 4) {
        case 0 -> random.nextInt(1000);
        case 1 -> random.nextInt(Integer.MAX_VALUE);
        case 2 -> Math.abs(random.nextLong() % 1_000_000_000_000L);
        default -> Math.abs(random.nextLong());
      };
      code.append(n <= Integer.MAX_VALUE && i % 2 == 0 ? Long.toString(n) : n + "L").append(", ");
    }
    code.append("0}; }");
    assertSameAsJavaParser(StaticJavaParser.parse(code.toString()));
  }

  @Test
  void theCorpusLiteralsReadAsJavaParserReadsThem() throws IOException {
    List<Path> files = new ArrayList<>();
    try (Stream<Path> walk = Files.walk(Path.of("../test-corpus/src/main/java"))) {
      walk.filter(p -> p.toString().endsWith(".java")).sorted().forEach(files::add);
    }
    assertTrue(files.size() > 50);
    for (Path f : files) {
      assertSameAsJavaParser(StaticJavaParser.parse(Files.readString(f, StandardCharsets.UTF_8)));
    }
  }
}
