package dev.plumbline.librarychecks.shape;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import ai.djl.engine.Engine;
import ai.djl.ndarray.NDManager;
import dev.plumbline.analysis.shape.Dim;
import dev.plumbline.analysis.shape.Framework;
import dev.plumbline.analysis.shape.ShapeOutcome;
import dev.plumbline.analysis.shape.Symbol;
import dev.plumbline.analysis.shape.TensorShape;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Function;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The differential test of the shape analysis: every generated case runs on the real library
 * (ND4J with nd4j-native and OpenBLAS, DJL with the PyTorch engine, both on the CPU, offline) and
 * through the analysis' transfer functions ({@code ShapeSemantics}). Whatever the analysis
 * claims must hold: a claimed failure must throw, a claimed success must succeed with the
 * inferred shape, and an undecided case that succeeds must have the shape the analysis would
 * continue with. Unknown is allowed; wrong is not.
 *
 * <p>Each case is checked twice: with the concrete sizes, and with every size of 2 or more
 * replaced by a symbol (the same size by the same symbol), as the analysis sees a batch size it
 * cannot compute. The symbolic answer, with the sizes substituted back, must agree too.
 *
 * <p>The measured table is written to {@code docs/shape-semantics.md}; the test fails when the
 * committed table differs from the measurement. Refresh it with
 * {@code -Dplumbline.writeSemantics=true} after a reviewed change.
 */
class ShapeSemanticsDifferentialTest {
  static final Path DOC = Path.of("").toAbsolutePath().resolve("../docs/shape-semantics.md").normalize();

  record Measured(ShapeCase shapeCase, long[] shape, String error,
      ShapeOutcome concrete, ShapeOutcome symbolic, String disagreement) {}

  private static List<Measured> measured;

  @BeforeAll
  static void runEveryCase() {
    measured = new ArrayList<>();
    List<ShapeCase> cases = ShapeCaseTable.all();
    for (ShapeCase c : cases) {
      long[] shape = null;
      String error = null;
      try (NDManager manager = NDManager.newBaseManager()) {
        shape = c.real().run(manager, c.inputs());
      } catch (RuntimeException | Error e) {
        error = e.getClass().getSimpleName();
      }
      ShapeOutcome concrete = c.inferred().infer(concreteShapes(c.inputs()), Dim::of);
      Map<Long, Symbol> symbols = new HashMap<>();
      Function<Long, Dim> symbolic = v -> v >= 2 ? Dim.of(symbols.computeIfAbsent(v, k -> Symbol.named("s" + k)))
          : Dim.of(v);
      List<TensorShape> symbolicInputs = new ArrayList<>();
      for (long[] in : c.inputs()) {
        List<Dim> dims = new ArrayList<>();
        for (long d : in) {
          dims.add(symbolic.apply(d));
        }
        symbolicInputs.add(TensorShape.of(dims));
      }
      ShapeOutcome bySymbols = c.inferred().infer(symbolicInputs, symbolic);
      Map<Symbol, Long> values = new HashMap<>();
      symbols.forEach((v, s) -> values.put(s, v));
      String problem = disagreement(concrete, shape, Map.of());
      if (problem == null) {
        String p = disagreement(bySymbols, shape, values);
        problem = p == null ? null : "symbolic: " + p;
      }
      measured.add(new Measured(c, shape, error, concrete, bySymbols, problem));
    }
  }

  private static List<TensorShape> concreteShapes(List<long[]> inputs) {
    return inputs.stream().map(TensorShape::ofConstants).toList();
  }

  /** Null when the claim holds for the real outcome; otherwise what is wrong. */
  static String disagreement(ShapeOutcome claim, long[] real, Map<Symbol, Long> values) {
    switch (claim.status()) {
      case FAILS:
        return real == null ? null : "claimed failure (" + claim.error().kind() + ") but the library gave "
            + ShapeCaseTable.label(real);
      case SUCCEEDS:
        if (real == null) {
          return "claimed success " + claim.result() + " but the library threw";
        }
        return matches(claim.result(), real, values) ? null
            : "claimed " + claim.result() + " but the library gave " + ShapeCaseTable.label(real);
      default:
        return real == null || matches(claim.result(), real, values) ? null
            : "would continue with " + claim.result() + " but the library gave " + ShapeCaseTable.label(real);
    }
  }

  private static boolean matches(TensorShape inferred, long[] real, Map<Symbol, Long> values) {
    if (inferred.rankKnown() && inferred.rank() != real.length) {
      return false;
    }
    for (int i = 0; i < real.length; i++) {
      Long v = inferred.dim(i).evaluate(values);
      if (v != null && v != real[i]) {
        return false;
      }
    }
    return true;
  }

  @Test
  void theAnalysisIsNeverWrongAboutTheRealLibraries() {
    List<String> wrong = new ArrayList<>();
    for (Measured m : measured) {
      if (m.disagreement() != null) {
        wrong.add(m.shapeCase().describe() + ": " + m.disagreement());
      }
    }
    assertTrue(wrong.isEmpty(), () -> wrong.size() + " of " + measured.size() + " cases disagree:\n"
        + String.join("\n", wrong));
  }

  @Test
  void theTableIsLargeAndTheAnalysisDecidesMostOfIt() {
    long decided = measured.stream().filter(m -> m.concrete().status() != ShapeOutcome.Status.UNDECIDED).count();
    long symbolicDecided = measured.stream()
        .filter(m -> m.symbolic().status() != ShapeOutcome.Status.UNDECIDED).count();
    long errors = measured.stream().filter(m -> m.shape() == null).count();
    System.out.printf("shape cases: %d (%d raise an error in the library); decided statically: %d concrete, %d"
        + " symbolic%n", measured.size(), errors, decided, symbolicDecided);
    assertTrue(measured.size() >= 300, "at least 300 generated cases");
    for (Framework fw : Framework.values()) {
      assertTrue(measured.stream().anyMatch(m -> m.shapeCase().framework() == fw && m.shape() == null));
      assertTrue(measured.stream().anyMatch(m -> m.shapeCase().framework() == fw && m.shape() != null));
    }
    assertTrue(decided * 10 >= measured.size() * 8, "the analysis decides at least 80% of the concrete cases");
  }

  @Test
  void theCheckCanFail() {
    // A wrong claim must be caught: a claimed success with the wrong shape, a claimed failure of a
    // working call, and a continuation shape that contradicts the real result.
    long[] real = {3, 4};
    assertTrue(disagreement(ShapeOutcome.succeeds(TensorShape.ofConstants(4, 3)), real, Map.of()) != null);
    assertTrue(disagreement(ShapeOutcome.fails(dev.plumbline.analysis.shape.ShapeError.of(
        dev.plumbline.analysis.shape.ShapeError.Kind.BROADCAST)), real, Map.of()) != null);
    assertTrue(disagreement(ShapeOutcome.undecided(TensorShape.ofConstants(3, 4, 1)), real, Map.of()) != null);
    Symbol b = Symbol.named("b");
    assertTrue(disagreement(ShapeOutcome.succeeds(TensorShape.of(Dim.of(b), Dim.of(4))), real, Map.of(b, 5L)) != null);
    assertTrue(disagreement(ShapeOutcome.succeeds(TensorShape.of(Dim.of(b), Dim.of(4))), real, Map.of(b, 3L)) == null);
  }

  @Test
  void theDocumentedTableIsTheMeasuredOne() throws IOException {
    String doc = SemanticsDoc.render(measured, versions());
    if (Boolean.getBoolean("plumbline.writeSemantics")) {
      Files.createDirectories(DOC.getParent());
      Files.writeString(DOC, doc, StandardCharsets.UTF_8);
      return;
    }
    assertTrue(Files.exists(DOC), "no " + DOC + " yet: run with -Dplumbline.writeSemantics=true");
    assertEquals(Files.readString(DOC, StandardCharsets.UTF_8), doc,
        "docs/shape-semantics.md differs from the measurement; review and refresh with"
            + " -Dplumbline.writeSemantics=true");
  }

  private static Map<String, String> versions() {
    Map<String, String> v = new java.util.LinkedHashMap<>();
    v.put("ND4J (nd4j-native, CPU, OpenBLAS)", System.getProperty("plumbline.dl4j.version", "?"));
    v.put("DJL", System.getProperty("plumbline.djl.version", "?"));
    v.put("PyTorch engine native library", Engine.getEngine("PyTorch").getVersion());
    return v;
  }
}
