package dev.plumbline.analysis.shape;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.stmt.AssertStmt;
import dev.plumbline.flow.ControlFlowGraph;
import java.util.ArrayList;
import java.util.Collections;
import java.util.IdentityHashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * What the shape analysis publishes for one file, for rules to query: the inferred shape of
 * each tensor expression, each tensor operation with its operands' shapes and outcome, the
 * computed reshapes used without a check, network width conflicts, and Java assertions with what
 * they check. Every fact names the callable graph it was found in. Facts come from the final
 * pass over a converged solution, one per evaluation, in source order.
 */
public final class ShapeFacts {

  /** What kind of tensor operation an {@link Operation} is. */
  public enum OpKind { CREATE, RESHAPE, PERMUTE, TRANSPOSE, PRODUCT, REDUCE, ELEMENTWISE, VECTOR_OP, CONCAT, INDEX }

  /**
   * An operand of an element-wise operation that is a reduction, without kept dimensions, of
   * the other operand.
   *
   * @param operand index of the reduced operand (0 receiver, 1 argument)
   * @param call the reducing call
   * @param axes the reduced axes, normalized
   * @param sourceShape the shape of the tensor before the reduction
   * @param viaHelper whether {@code call} is a project helper that reduces inside
   */
  public record ReducedOperand(int operand, MethodCallExpr call, List<Integer> axes, TensorShape sourceShape,
      boolean viaHelper) {}

  /**
   * One tensor operation as evaluated on the converged state.
   *
   * @param graph the callable it is in
   * @param call the call
   * @param kind what it does
   * @param framework whose semantics apply
   * @param operands the receiver (if a tensor) then the tensor arguments, as written
   * @param shapes their inferred shapes, same order
   * @param outcome what the analysis knows about it
   * @param inPlace whether the receiver holds the result
   * @param reduced set when one operand is a reduction of the other without kept dimensions
   * @param origins where each operand tensor was made, in this file (null entries when unknown)
   */
  public record Operation(ControlFlowGraph graph, MethodCallExpr call, OpKind kind, Framework framework,
      List<Expression> operands, List<TensorShape> shapes, ShapeOutcome outcome, boolean inPlace,
      ReducedOperand reduced, List<Node> origins) {

    /** The operand's text as written, or "?" when there is none. */
    public String operandText(int i) {
      return i < operands.size() && operands.get(i) != null ? operands.get(i).toString() : "?";
    }

    public TensorShape shape(int i) {
      return i < shapes.size() ? shapes.get(i) : TensorShape.unknown();
    }

    public Node origin(int i) {
      return i < origins.size() ? origins.get(i) : null;
    }
  }

  /**
   * A reshape or permute with computed or inferred sizes (or a project helper that returns one)
   * whose result reaches a shape-sensitive use with no shape check in between.
   *
   * @param reshape the reshaping call, or the call of the helper that reshapes
   * @param helper the helper's name when the reshape happens inside it, else null
   * @param permute whether the call permutes axes rather than reshaping
   * @param use the first shape-sensitive use
   * @param shape the inferred shape of the reshaped tensor at the use
   */
  public record UncheckedReshape(ControlFlowGraph graph, MethodCallExpr reshape, String helper, boolean permute,
      Node use, TensorShape shape) {}

  /** A network width that certainly disagrees with what DL4J will find at run time. */
  public enum WidthKind {
    /** A graph layer's {@code nIn} differs from the {@code nOut} of the layer feeding it. */
    LAYER_INPUT,
    /** A list layer's {@code nIn} differs from the previous {@code nOut} while DL4J keeps written widths. */
    LIST_LAYER_INPUT,
    /** Features given to {@code fit}/{@code output} have a width other than the first layer's {@code nIn}. */
    FEATURES,
    /** Labels given to {@code fit} have a width other than the output layer's {@code nOut}. */
    LABELS
  }

  /**
   * @param at the call where DL4J fails (the {@code addLayer}/{@code layer} call, or {@code fit}/{@code output})
   * @param expected the width the network needs
   * @param actual the width it gets
   * @param related where the expected width is written (the other layer), or null
   * @param shape for FEATURES and LABELS, the inferred shape of the data
   */
  public record WidthMismatch(ControlFlowGraph graph, Node at, WidthKind kind, Dim expected, Dim actual,
      Node related, TensorShape shape) {}

  /** What a Java {@code assert} checks. */
  public enum AssertSubject {
    /** A tensor's shape, rank, size or length. */
    SHAPE,
    /** The contents of a tensor or data set. */
    DATA,
    /** An argument of a method callers can reach. */
    INPUT,
    /** Something else (an internal invariant). */
    OTHER
  }

  /**
   * @param statement the assertion
   * @param subject what it checks
   * @param about the checked tensor, data or parameter expression (null for OTHER)
   * @param shape the inferred shape of {@code about} when it is a tensor, else null
   * @param inTestCode whether the file is test code (a {@code src/test} folder)
   * @param alreadyHolds whether the analysis proves the condition at that point (a redundant assert)
   */
  public record Assertion(ControlFlowGraph graph, AssertStmt statement, AssertSubject subject, Expression about,
      TensorShape shape, boolean inTestCode, boolean alreadyHolds) {}

  private final Map<Expression, TensorShape> shapes = new IdentityHashMap<>();
  private final List<Operation> operations = new ArrayList<>();
  private final Map<MethodCallExpr, UncheckedReshape> uncheckedReshapes = new LinkedHashMap<>();
  private final List<WidthMismatch> widthMismatches = new ArrayList<>();
  private final List<Assertion> assertions = new ArrayList<>();

  void shape(Expression e, TensorShape s) {
    shapes.put(e, s);
  }

  void add(Operation o) {
    operations.add(o);
  }

  void add(UncheckedReshape u) {
    uncheckedReshapes.putIfAbsent(u.reshape(), u);
  }

  void add(WidthMismatch w) {
    widthMismatches.add(w);
  }

  void add(Assertion a) {
    assertions.add(a);
  }

  /** The inferred shape of a tensor expression where it is evaluated, or null if not a known tensor. */
  public TensorShape shapeOf(Expression e) {
    return shapes.get(e);
  }

  public List<Operation> operations() {
    return Collections.unmodifiableList(operations);
  }

  /** One fact per reshape, at its first unchecked shape-sensitive use. */
  public List<UncheckedReshape> uncheckedReshapes() {
    return List.copyOf(uncheckedReshapes.values());
  }

  public List<WidthMismatch> widthMismatches() {
    return Collections.unmodifiableList(widthMismatches);
  }

  public List<Assertion> assertions() {
    return Collections.unmodifiableList(assertions);
  }
}
