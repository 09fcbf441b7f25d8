package dev.plumbline.rules.shape;

import dev.plumbline.analysis.shape.Dim;
import dev.plumbline.analysis.shape.Framework;
import dev.plumbline.analysis.shape.ShapeAnalysis;
import dev.plumbline.analysis.shape.ShapeFacts;
import dev.plumbline.analysis.shape.TensorShape;
import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.FindingReporter;
import dev.plumbline.engine.Rule;
import dev.plumbline.engine.RuleDescriptor;
import dev.plumbline.finding.Severity;
import dev.plumbline.rules.Snippets;
import java.util.ArrayList;
import java.util.List;

/**
 * A reduction taken without keeping its dimensions and combined element-wise with the tensor
 * it reduced, along an axis other than the leading ones: broadcasting aligns shapes from the
 * last axis, so the reduced values meet the wrong axis ({@code x.div(x.sum(1))} divides row i's
 * entries by the totals of columns, not by row i's total). When the sizes make it run (the square
 * case) the result is silently wrong: an error. When the analysis cannot tell whether it runs,
 * the code is still wrong either way unless the sizes happen to be 1: a warning. A reduction over
 * leading axes ({@code x.sub(x.mean(0))}) lines up correctly and stays silent; a certain failure
 * is left to {@code shape.mismatch}, whose fix then says to keep the dimensions.
 */
public final class ReducedDimBroadcastRule implements Rule {
  public static final String ID = "shape.reduced-dim-broadcast";
  static final RuleDescriptor DESCRIPTOR = new RuleDescriptor(ID, Severity.ERROR, List.of("correctness", "shapes"));

  @Override
  public RuleDescriptor descriptor() {
    return DESCRIPTOR;
  }

  @Override
  public void check(FileContext file, FindingReporter reporter) {
    for (ShapeFacts.Operation op : file.analysis(ShapeAnalysis.KEY).operations()) {
      ShapeFacts.ReducedOperand r = op.reduced();
      if (op.kind() != ShapeFacts.OpKind.ELEMENTWISE || r == null || op.outcome().fails() || leading(r.axes())) {
        continue;
      }
      int source = 1 - r.operand();
      TensorShape reduced = op.shape(r.operand());
      if (reduced.rankKnown() && reduced.dims().stream().allMatch(d -> d.is(1))) {
        continue; // a single total broadcasts like a scalar: correct
      }
      boolean certain = op.outcome().succeeds();
      String reduceName = r.call().getNameAsString();
      String kept = keptShape(r.sourceShape(), r.axes()).toString();
      reporter.at(this, Snippets.anchor(op.call()))
          .message(certain ? ID : ID + ".possible", op.call().getNameAsString(), op.operandText(source),
              op.shape(source).toString(), Snippets.of(r.call()), reduced.toString(),
              ShapeMismatchRule.axes(r.axes()), reduceName)
          .related(Snippets.anchor(r.call()), "related.reduced-here", Snippets.of(r.call()), ShapeMismatchRule.axes(r.axes()))
          .fix(ID + (r.viaHelper() ? ".fix.helper" : op.framework() == Framework.DJL ? ".fix.djl" : ".fix.nd4j"),
              op.operandText(source), reduceName, ShapeMismatchRule.axes(r.axes()), kept, op.call().getNameAsString())
          .involves("involved.shape", op.operandText(source), op.shape(source).toString())
          .involves("involved.shape", Snippets.of(r.call()), reduced.toString())
          .severity(certain ? Severity.ERROR : Severity.WARNING)
          .emit();
    }
  }

  /** Whether the axes are 0..k-1: then the remaining axes still line up from the end. */
  static boolean leading(List<Integer> axes) {
    for (int i = 0; i < axes.size(); i++) {
      if (axes.get(i) != i) {
        return false;
      }
    }
    return true;
  }

  /** The shape the reduction has when it keeps its dimensions. */
  static TensorShape keptShape(TensorShape source, List<Integer> axes) {
    if (!source.rankKnown()) {
      return TensorShape.unknown();
    }
    List<Dim> out = new ArrayList<>(source.dims());
    for (int a : axes) {
      if (a >= 0 && a < out.size()) {
        out.set(a, Dim.of(1));
      }
    }
    return TensorShape.of(out);
  }
}
