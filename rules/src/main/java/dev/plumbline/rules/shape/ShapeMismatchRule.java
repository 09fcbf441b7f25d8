package dev.plumbline.rules.shape;

import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.expr.StringLiteralExpr;
import dev.plumbline.analysis.shape.Dim;
import dev.plumbline.analysis.shape.ShapeAnalysis;
import dev.plumbline.analysis.shape.ShapeError;
import dev.plumbline.analysis.shape.ShapeFacts;
import dev.plumbline.analysis.shape.TensorShape;
import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.FindingReporter;
import dev.plumbline.engine.Rule;
import dev.plumbline.engine.RuleDescriptor;
import dev.plumbline.finding.Severity;
import dev.plumbline.rules.Snippets;
import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;

/**
 * A tensor operation or network width that certainly fails at run time: the shape analysis
 * claims failure only when the sizes that make it fail are known (constants, or the same symbol
 * on both sides) and the library was measured to fail on them. The message states both shapes
 * and why they cannot combine.
 */
public final class ShapeMismatchRule implements Rule {
  public static final String ID = "shape.mismatch";
  static final RuleDescriptor DESCRIPTOR = new RuleDescriptor(ID, Severity.ERROR, List.of("correctness", "shapes"));

  @Override
  public RuleDescriptor descriptor() {
    return DESCRIPTOR;
  }

  @Override
  public void check(FileContext file, FindingReporter reporter) {
    ShapeFacts facts = file.analysis(ShapeAnalysis.KEY);
    for (ShapeFacts.Operation op : facts.operations()) {
      if (op.outcome().fails()) {
        operation(op, reporter);
      }
    }
    for (ShapeFacts.WidthMismatch w : facts.widthMismatches()) {
      width(w, reporter);
    }
  }

  private void operation(ShapeFacts.Operation op, FindingReporter reporter) {
    ShapeError e = op.outcome().error();
    String kind = e.kind().name().toLowerCase(Locale.ROOT).replace('_', '-');
    boolean binary = op.operands().size() > 1 && op.kind() != ShapeFacts.OpKind.RESHAPE;
    String second = binary ? op.operandText(1) : arguments(op.call());
    String secondShape = binary ? op.shape(1).toString() : "";
    String extra = e.shape() != null ? e.shape().toString()
        : op.shape(0).rankKnown() ? String.valueOf(op.shape(0).rank()) : "?";
    FindingReporter.Report.Builder b = reporter.at(this, Snippets.anchor(op.call()))
        .message(ID + "." + kind, op.call().getNameAsString(), op.operandText(0), op.shape(0).toString(),
            second, secondShape, dim(e.left()), dim(e.right()), String.valueOf(e.axis()), extra);
    for (int i = 0; i < op.operands().size() && i < 2; i++) {
      b.involves("involved.shape", op.operandText(i), op.shape(i).toString());
      if (op.origin(i) != null && op.origin(i) != op.call()) {
        b.related(Snippets.anchor(op.origin(i)), "related.shape-set-here", op.operandText(i), op.shape(i).toString());
      }
    }
    if (op.reduced() != null) {
      ShapeFacts.ReducedOperand r = op.reduced();
      b.related(Snippets.anchor(r.call()), "related.reduced-here", Snippets.of(r.call()), axes(r.axes()));
      b.fix(ID + ".fix.keep-dims", Snippets.of(r.call()), axes(r.axes()));
    } else {
      b.fix(ID + ".fix." + kind, op.operandText(0), second, op.call().getNameAsString());
    }
    b.emit();
  }

  private void width(ShapeFacts.WidthMismatch w, FindingReporter reporter) {
    String key = ID + "." + w.kind().name().toLowerCase(Locale.ROOT).replace('_', '-');
    FindingReporter.Report.Builder b = reporter.at(this, Snippets.anchor(w.at()));
    switch (w.kind()) {
      case LAYER_INPUT, LIST_LAYER_INPUT -> {
        boolean list = w.kind() == ShapeFacts.WidthKind.LIST_LAYER_INPUT;
        String name = list ? Snippets.line(Snippets.anchor(w.at())) : layerName(w.at());
        String from = w.related() == null ? "?"
            : list ? Snippets.line(Snippets.anchor(w.related())) : layerName(w.related());
        b.message(key, name, dim(w.actual()), from, dim(w.expected()))
            .fix(key + ".fix", name, from, dim(w.expected()));
        if (w.related() != null) {
          b.related(Snippets.anchor(w.related()), list ? "related.list-layer-width" : "related.layer-width", from,
              dim(w.expected()));
        }
      }
      default -> {
        MethodCallExpr call = (MethodCallExpr) w.at();
        int arg = w.kind() == ShapeFacts.WidthKind.LABELS ? 1 : 0;
        String data = arg < call.getArguments().size() ? Snippets.of(call.getArgument(arg)) : "?";
        b.involves("involved.shape", data, String.valueOf(w.shape()));
        b.message(key, call.getNameAsString(), data, String.valueOf(w.shape()), dim(w.expected()), dim(w.actual()))
            .fix(key + ".fix", data, dim(w.expected()), dim(w.actual()));
        if (w.related() != null) {
          b.related(Snippets.anchor(w.related()), w.kind() == ShapeFacts.WidthKind.LABELS ? "related.output-layer" : "related.first-layer",
              dim(w.expected()));
        }
      }
    }
    b.emit();
  }

  /** A layer's name in a graph: the first argument of {@code addLayer("name", ...)}. */
  private static String layerName(com.github.javaparser.ast.Node call) {
    if (call instanceof MethodCallExpr m && !m.getArguments().isEmpty()
        && m.getArgument(0) instanceof StringLiteralExpr s) {
      return s.asString();
    }
    return "?";
  }

  static String arguments(MethodCallExpr call) {
    return call.getArguments().stream().map(Expression::toString).collect(Collectors.joining(", ", "(", ")"));
  }

  static String dim(Dim d) {
    return d == null ? "?" : d.toString();
  }

  static String axes(List<Integer> axes) {
    return axes.stream().map(String::valueOf).collect(Collectors.joining(", "));
  }

  static String shape(TensorShape s) {
    return s == null ? "[...]" : s.toString();
  }
}
