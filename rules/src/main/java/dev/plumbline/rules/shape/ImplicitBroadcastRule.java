package dev.plumbline.rules.shape;

import dev.plumbline.analysis.shape.Dim;
import dev.plumbline.analysis.shape.ShapeAnalysis;
import dev.plumbline.analysis.shape.ShapeFacts;
import dev.plumbline.analysis.shape.TensorShape;
import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.FindingReporter;
import dev.plumbline.engine.Rule;
import dev.plumbline.engine.RuleDescriptor;
import dev.plumbline.finding.Severity;
import dev.plumbline.rules.Snippets;
import java.util.List;

/**
 * An element-wise operation whose broadcast expands <em>both</em> operands: a {@code [n]}
 * against an {@code [n, 1]}, a column against a row. The result is an outer combination, larger
 * than either input, which code meant element by element computes silently. A lower-rank operand
 * that only gains leading axes (a bias row added to a batch) is the intended use of broadcasting
 * and stays silent. An expansion counts when an operand's size is the constant 1 where the result's
 * is not known to be 1 (a batch size could in principle be 1; the finding says what happens
 * otherwise).
 */
public final class ImplicitBroadcastRule implements Rule {
  public static final String ID = "shape.implicit-broadcast";
  static final RuleDescriptor DESCRIPTOR = new RuleDescriptor(ID, Severity.WARNING, List.of("correctness", "shapes"));

  @Override
  public RuleDescriptor descriptor() {
    return DESCRIPTOR;
  }

  @Override
  public void check(FileContext file, FindingReporter reporter) {
    for (ShapeFacts.Operation op : file.analysis(ShapeAnalysis.KEY).operations()) {
      if (op.kind() != ShapeFacts.OpKind.ELEMENTWISE || op.inPlace() || op.outcome().fails() || op.reduced() != null) {
        continue;
      }
      TensorShape a = op.shape(0);
      TensorShape b = op.shape(1);
      TensorShape result = op.outcome().result();
      if (!a.rankKnown() || !b.rankKnown() || !result.rankKnown() || !expanded(a, result) || !expanded(b, result)) {
        continue;
      }
      reporter.at(this, Snippets.anchor(op.call()))
          .message(ID, op.call().getNameAsString(), op.operandText(0), a.toString(), op.operandText(1), b.toString(),
              result.toString())
          .fix(ID + ".fix", op.operandText(0), op.operandText(1), a.toString(), b.toString())
          .involves("involved.shape", op.operandText(0), a.toString())
          .involves("involved.shape", op.operandText(1), b.toString())
          .emit();
    }
  }

  /** Whether broadcasting grows the operand: it gains axes, or a size 1 becomes larger. */
  static boolean expanded(TensorShape operand, TensorShape result) {
    if (operand.rank() < result.rank()) {
      return true;
    }
    for (int i = 0; i < operand.rank(); i++) {
      Dim d = operand.dim(i);
      Dim r = result.dim(i);
      if (d.is(1) && !r.isOne().isTrue() && r.known()) {
        return true;
      }
    }
    return false;
  }
}
