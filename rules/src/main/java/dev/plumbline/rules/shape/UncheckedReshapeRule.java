package dev.plumbline.rules.shape;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.VariableDeclarator;
import com.github.javaparser.ast.expr.AssignExpr;
import com.github.javaparser.ast.expr.MethodCallExpr;
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
 * A reshape whose sizes are computed or inferred ({@code -1}) in two or more places, or a permute
 * with computed axes, whose result
 * reaches a shape-sensitive use (a product, an element-wise operation with another tensor, a
 * join, a model's input) with no check of its shape in between. A wrong computed size does not
 * always fail: when the element count still matches, the data is silently laid out wrongly. A
 * single free size is fixed by the element count (a wrong one fails loudly), so it is not flagged.
 * Silent when the analysis proves the result exactly, when the input's or the result's shape is
 * checked first (a condition, a precondition, an assert, or a helper that checks and throws),
 * or when all sizes are constants.
 */
public final class UncheckedReshapeRule implements Rule {
  public static final String ID = "shape.unchecked-reshape";
  static final RuleDescriptor DESCRIPTOR = new RuleDescriptor(ID, Severity.WARNING, List.of("robustness", "shapes"));

  @Override
  public RuleDescriptor descriptor() {
    return DESCRIPTOR;
  }

  @Override
  public void check(FileContext file, FindingReporter reporter) {
    for (ShapeFacts.UncheckedReshape u : file.analysis(ShapeAnalysis.KEY).uncheckedReshapes()) {
      MethodCallExpr reshape = u.reshape();
      String use = u.use() instanceof MethodCallExpr m ? m.getNameAsString() : Snippets.of(u.use());
      String holder = holder(reshape);
      int axis = firstUnknownAxis(u.shape());
      reporter.at(this, Snippets.anchor(reshape))
          .message(u.helper() != null ? ID + ".helper" : u.permute() ? ID + ".permute" : ID, reshape.getNameAsString(),
              ShapeMismatchRule.arguments(reshape), u.shape().toString(), use, Snippets.line(u.use()))
          .related(Snippets.anchor(u.use()), "related.reshape-used", holder, u.shape().toString())
          .fix(ID + ".fix", holder, String.valueOf(axis))
          .involves("involved.shape", holder, u.shape().toString())
          .emit();
    }
  }

  /** The variable the reshaped tensor is stored in, or the call itself. */
  private static String holder(MethodCallExpr reshape) {
    Node parent = reshape.getParentNode().orElse(null);
    if (parent instanceof VariableDeclarator d) {
      return d.getNameAsString();
    }
    if (parent instanceof AssignExpr a) {
      return a.getTarget().toString();
    }
    return Snippets.of(reshape);
  }

  private static int firstUnknownAxis(TensorShape s) {
    if (!s.rankKnown()) {
      return 0;
    }
    for (int i = 0; i < s.rank(); i++) {
      if (!s.dim(i).known()) {
        return i;
      }
    }
    return Math.max(0, s.rank() - 1);
  }
}
