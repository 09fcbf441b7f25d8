package dev.plumbline.analysis.shape;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

/** The shape analysis on small programs: inferred shapes, facts, and what it must not claim. */
class ShapeAnalysisTest {
  private static final String ND4J = "import org.nd4j.linalg.api.ndarray.INDArray;\n"
      + "import org.nd4j.linalg.factory.Nd4j;\n";

  /** A small golden dump: the inferred shape of each tensor expression, in source order. */
  @Test
  void shapesOfASmallProgram() {
    String dump = ShapeTestFiles.shapes(ND4J + """
        class T {
          INDArray m(INDArray x, int hidden) {
            long b = x.size(0);
            INDArray w = Nd4j.rand(16, hidden);
            INDArray y = x.reshape(b, -1);
            INDArray z = Nd4j.zeros(b, 16).mmul(w);
            INDArray s = z.sum(1);
            INDArray k = z.sum(true, 1);
            return z.add(Nd4j.ones(hidden)).transpose();
          }
        }
        """);
    assertEquals("""
        6: Nd4j.rand(16, hidden) = [16, hidden]
        7: x.reshape(b, -1) = [b, ?]
        8: Nd4j.zeros(b, 16).mmul(w) = [b, hidden]
        8: Nd4j.zeros(b, 16) = [b, 16]
        9: z.sum(1) = [b]
        10: z.sum(true, 1) = [b, 1]
        11: z.add(Nd4j.ones(hidden)).transpose() = [hidden, b]
        11: z.add(Nd4j.ones(hidden)) = [b, hidden]
        11: Nd4j.ones(hidden) = [hidden]""", dump);
  }

  /**
   * A size read inside a loop names a new value each iteration: what the previous iteration
   * knew about it must not be taken as equal to the current one (here it would claim a wrong
   * element count).
   */
  @Test
  void factsFromAnEarlierIterationAreForgotten() {
    ShapeFacts facts = ShapeTestFiles.facts(ND4J + """
        class T {
          void m(java.util.List<INDArray> batches) {
            INDArray previous = Nd4j.zeros(1, 4);
            for (INDArray batch : batches) {
              long n = batch.size(0);
              INDArray current = Nd4j.zeros(n, 4);
              previous.reshape(n, 8);
              previous = current;
            }
          }
        }
        """);
    assertTrue(facts.operations().stream().noneMatch(o -> o.outcome().fails()),
        () -> "claims: " + facts.operations().stream().filter(o -> o.outcome().fails()).toList());
  }

  @Test
  void loopsThatGrowShapesStillConverge() {
    ShapeFacts facts = ShapeTestFiles.facts(ND4J + """
        class T {
          INDArray m(int steps) {
            INDArray x = Nd4j.rand(2, 3);
            long width = 3;
            for (int i = 0; i < steps; i++) {
              width = width * 2;
              x = x.reshape(2 * 3 * 2, -1);
              x = Nd4j.concat(0, x, x);
            }
            return x.mmul(Nd4j.rand(width, 1));
          }
        }
        """);
    assertFalse(facts.operations().isEmpty());
    assertTrue(facts.operations().stream().noneMatch(o -> o.outcome().fails()));
  }

  @Test
  void recursiveHelpersAreNotFollowedForever() {
    ShapeFacts facts = ShapeTestFiles.facts(ND4J + """
        class T {
          INDArray grow(INDArray x, int n) {
            return n == 0 ? x : grow(Nd4j.concat(1, x, x), n - 1);
          }
          INDArray m() {
            return grow(Nd4j.rand(2, 2), 3).mmul(Nd4j.rand(5, 5));
          }
        }
        """);
    assertTrue(facts.operations().stream().noneMatch(o -> o.outcome().fails()));
  }

  @Test
  void helpersInAnotherFileAreEvaluatedWithTheCallersArguments() {
    ShapeFacts facts = ShapeTestFiles.facts("package p;\n" + ND4J + """
        class T {
          INDArray m(long b) {
            return Layers.flatten(Nd4j.zeros(b, 4, 4)).mmul(Nd4j.rand(8, 2));
          }
        }
        """, "package p;\n" + ND4J + """
        class Layers {
          static INDArray flatten(INDArray x) {
            return x.reshape(x.size(0), -1);
          }
        }
        """);
    List<ShapeFacts.Operation> failing = facts.operations().stream().filter(o -> o.outcome().fails()).toList();
    assertEquals(1, failing.size());
    assertEquals("[b, 16]", failing.get(0).shape(0).toString());
  }

  @Test
  void whatAHelperGivesDoesNotDependOnWhichMethodCalledItFirst() {
    // a() reaches g() two helpers deep, where g's own call of k() is not followed; b() calls g()
    // directly, so k() is followed and the product's mismatch is certain. Before the evaluation
    // depth was part of the helper cache's key, b() got a()'s less precise value when a() came
    // first in the file (methods are analyzed in source order, the helpers last here), and the
    // mismatch was not found.
    String helpers = """
          static INDArray k() { return Nd4j.zeros(2, 3); }
          static INDArray g() { return k(); }
          static INDArray h() { return g(); }
        """;
    String a = "  void a() { INDArray x = h(); }\n";
    String b = "  void b() { INDArray y = g(); INDArray z = y.mmul(Nd4j.rand(4, 5)); }\n";
    for (String body : List.of(a + b, b + a)) {
      ShapeFacts facts = ShapeTestFiles.facts(ND4J + "class T {\n" + body + helpers + "}\n");
      List<ShapeFacts.Operation> failing = facts.operations().stream().filter(o -> o.outcome().fails()).toList();
      assertEquals(1, failing.size(), body);
      assertEquals("[2, 3]", failing.get(0).shape(0).toString(), body);
    }
  }

  @Test
  void assertsInTestSourcesAreMarkedAsTestCode() {
    ShapeFacts facts = ShapeTestFiles.context("src/test/java/T.java", ND4J + """
        class T {
          public void m(INDArray x) {
            assert x.size(1) == 4;
          }
        }
        """).analysis(ShapeAnalysis.KEY);
    assertEquals(1, facts.assertions().size());
    assertTrue(facts.assertions().get(0).inTestCode());
    assertEquals(ShapeFacts.AssertSubject.SHAPE, facts.assertions().get(0).subject());
  }

  @Test
  void conditionsTeachShapesOnlyOnThePathThatContinues() {
    ShapeFacts facts = ShapeTestFiles.facts(ND4J + """
        class T {
          INDArray m(INDArray x, boolean strict) {
            if (x.rank() == 2 && x.size(1) == 5) {
              x.mmul(Nd4j.rand(4, 3));
            }
            return x.mmul(Nd4j.rand(4, 3));
          }
        }
        """);
    List<ShapeFacts.Operation> products = facts.operations().stream()
        .filter(o -> o.kind() == ShapeFacts.OpKind.PRODUCT).toList();
    assertTrue(products.get(0).outcome().fails(), "inside the if, x is [?, 5]");
    assertFalse(products.get(1).outcome().fails(), "after the merge nothing is known");
  }
}
