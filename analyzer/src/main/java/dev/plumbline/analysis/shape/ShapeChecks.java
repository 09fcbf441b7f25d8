package dev.plumbline.analysis.shape;

import com.github.javaparser.ast.body.CallableDeclaration;
import com.github.javaparser.ast.body.Parameter;
import com.github.javaparser.ast.expr.ArrayAccessExpr;
import com.github.javaparser.ast.expr.BinaryExpr;
import com.github.javaparser.ast.expr.EnclosedExpr;
import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.FieldAccessExpr;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.expr.NameExpr;
import com.github.javaparser.ast.expr.UnaryExpr;
import com.github.javaparser.ast.stmt.AssertStmt;
import dev.plumbline.model.ApiMethod;
import dev.plumbline.model.Effect;
import dev.plumbline.model.TypeRole;
import dev.plumbline.parse.NumberLiterals;
import dev.plumbline.parse.Subtrees;
import dev.plumbline.types.ExpressionTypes;
import dev.plumbline.types.Variable;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * What a condition says about shapes on each outcome: after
 * {@code if (!Arrays.equals(x.shape(), new long[] {b, 16})) throw ...} the path that continues
 * knows {@code x} is {@code [b, 16]}; after {@code Preconditions.checkArgument(x.size(1) == c)}
 * or {@code assert x.rank() == 2} the size or rank is known. Understood forms: {@code ==} and
 * {@code !=} between a shape query ({@code size(i)}, {@code shape()[i]}, {@code getShape().get(i)},
 * {@code rank()}, {@code rows()}, {@code columns()}, {@code shape().length}) and an {@code int}
 * value, {@code Arrays.equals} of {@code shape()} with an array of sizes, DJL
 * {@code getShape().equals(new Shape(...))}, combined with {@code !}, {@code &&} and {@code ||}.
 * Anything else teaches nothing. A tensor whose shape any condition inspects counts as checked.
 */
final class ShapeChecks {
  private final ShapeAnalysis analysis;
  private final ExpressionTypes types;

  ShapeChecks(ShapeAnalysis analysis) {
    this.analysis = analysis;
    this.types = analysis.types;
  }

  /** What a shape query reads: size {@code axis} of {@code subject}, its rank, or its whole shape. */
  record Query(Expression subject, Kind kind, int axis) {
    enum Kind { SIZE, RANK, SHAPE }
  }

  /** The shape query {@code e} is, if it is one. */
  static Optional<Query> query(Expression e, ExpressionTypes types) {
    Expression x = ShapeEvaluator.unwrap(e);
    if (x instanceof ArrayAccessExpr aa && ShapeEvaluator.unwrap(aa.getName()) instanceof MethodCallExpr call
        && "shape".equals(queryOf(call, types)) && aa.getIndex().isIntegerLiteralExpr() && call.getScope().isPresent()) {
      return Optional.of(new Query(call.getScope().get(), Query.Kind.SIZE,
          NumberLiterals.value(aa.getIndex().asIntegerLiteralExpr()).intValue()));
    }
    if (x instanceof FieldAccessExpr fa && fa.getNameAsString().equals("length")
        && ShapeEvaluator.unwrap(fa.getScope()) instanceof MethodCallExpr call && "shape".equals(queryOf(call, types))
        && call.getScope().isPresent()) {
      return Optional.of(new Query(call.getScope().get(), Query.Kind.RANK, -1));
    }
    if (!(x instanceof MethodCallExpr call) || call.getScope().isEmpty()) {
      return Optional.empty();
    }
    String q = queryOf(call, types);
    if (q == null) {
      return Optional.empty();
    }
    Expression scope = call.getScope().get();
    switch (q) {
      case "size":
        return literalArg(call).map(a -> new Query(scope, Query.Kind.SIZE, a));
      case "rows":
        return Optional.of(new Query(scope, Query.Kind.SIZE, 0));
      case "columns":
        return Optional.of(new Query(scope, Query.Kind.SIZE, 1));
      case "rank":
        return Optional.of(new Query(scope, Query.Kind.RANK, -1));
      case "shape":
        return Optional.of(new Query(scope, Query.Kind.SHAPE, -1));
      case "dim": {
        Expression inner = ShapeEvaluator.unwrap(scope);
        if (inner instanceof MethodCallExpr shapeCall && "shape".equals(queryOf(shapeCall, types))
            && shapeCall.getScope().isPresent()) {
          return literalArg(call).map(a -> new Query(shapeCall.getScope().get(), Query.Kind.SIZE, a));
        }
        return Optional.empty();
      }
      default:
        return Optional.empty();
    }
  }

  private static Optional<Integer> literalArg(MethodCallExpr call) {
    if (call.getArguments().size() == 1 && call.getArgument(0).isIntegerLiteralExpr()) {
      return Optional.of(NumberLiterals.value(call.getArgument(0).asIntegerLiteralExpr()).intValue());
    }
    return Optional.empty();
  }

  static String queryOf(MethodCallExpr call, ExpressionTypes types) {
    return types.apiMethod(call).filter(m -> m.effect() == Effect.SHAPE_QUERY).map(m -> m.attribute("query"))
        .orElse(null);
  }

  // ------------------------------------------------------------------ learning

  ShapeState learn(Expression condition, ShapeState s, boolean outcome) {
    Expression c = condition;
    if (c instanceof EnclosedExpr en) {
      return learn(en.getInner(), s, outcome);
    }
    if (c instanceof UnaryExpr u && u.getOperator() == UnaryExpr.Operator.LOGICAL_COMPLEMENT) {
      return learn(u.getExpression(), s, !outcome);
    }
    if (c instanceof BinaryExpr b) {
      switch (b.getOperator()) {
        case AND:
          return outcome ? learn(b.getRight(), learn(b.getLeft(), s, true), true) : s;
        case OR:
          return outcome ? s : learn(b.getRight(), learn(b.getLeft(), s, false), false);
        case EQUALS:
        case NOT_EQUALS:
          if ((b.getOperator() == BinaryExpr.Operator.EQUALS) == outcome) {
            return equate(b.getLeft(), b.getRight(), s);
          }
          return s;
        default:
          return s;
      }
    }
    if (c instanceof MethodCallExpr call && outcome) {
      return shapesEqual(call, s);
    }
    return s;
  }

  /** {@code query == value}: the queried size or rank becomes the value. */
  private ShapeState equate(Expression left, Expression right, ShapeState s) {
    Optional<Query> q = query(left, types);
    Expression other = right;
    if (q.isEmpty()) {
      q = query(right, types);
      other = left;
    }
    if (q.isEmpty()) {
      return s;
    }
    ShapeValue value = silent(s).eval(other);
    if (!(value instanceof ShapeValue.Int i) || !i.value().known()) {
      return s;
    }
    Query query = q.get();
    Dim size = i.value();
    return refine(query, s, shape -> switch (query.kind()) {
      case SIZE -> shape.withDim(query.axis(), size);
      case RANK -> size.isConstant() ? shape.withRank((int) size.constant().getAsLong()) : shape;
      default -> shape;
    });
  }

  /** {@code Arrays.equals(x.shape(), sizes)} and DJL {@code x.getShape().equals(new Shape(...))}. */
  private ShapeState shapesEqual(MethodCallExpr call, ShapeState s) {
    Optional<ApiMethod> m = types.apiMethod(call);
    if (m.isEmpty()) {
      return s;
    }
    List<Expression> sides = new ArrayList<>();
    if (m.get().effect() == Effect.EQUALS && call.getArguments().size() == 2) {
      sides.addAll(call.getArguments());
    } else if (m.get().effect() == Effect.SHAPE_QUERY && "equals".equals(m.get().attribute("query"))
        && call.getScope().isPresent() && call.getArguments().size() == 1) {
      sides.add(call.getScope().get());
      sides.add(call.getArgument(0));
    } else {
      return s;
    }
    for (int i = 0; i < 2; i++) {
      Optional<Query> q = query(sides.get(i), types);
      if (q.isPresent() && q.get().kind() == Query.Kind.SHAPE) {
        ShapeValue other = silent(s).eval(sides.get(1 - i));
        if (other instanceof ShapeValue.Tuple t && t.elements() != null) {
          return refine(q.get(), s, shape -> TensorShape.of(t.elements()));
        }
      }
    }
    return s;
  }

  private ShapeState refine(Query q, ShapeState s, java.util.function.UnaryOperator<TensorShape> change) {
    ShapeEvaluator ev = silent(s);
    Optional<Variable> v = ev.targetOf(q.subject());
    if (v.isEmpty()) {
      return s;
    }
    ShapeValue.Tensor t = ev.tensorValueOf(v.get(), q.subject());
    if (t == null) {
      return s;
    }
    return ev.state.with(v.get(), t.withShape(change.apply(t.shape())));
  }

  private ShapeEvaluator silent(ShapeState s) {
    ShapeEvaluator ev = new ShapeEvaluator(analysis, null);
    ev.state = s;
    return ev;
  }

  /** Every tensor variable whose shape the condition inspects counts as checked from here on. */
  ShapeState markChecked(Expression condition, ShapeState s) {
    ShapeState out = s;
    for (Expression subject : inspected(condition)) {
      ShapeEvaluator ev = silent(out);
      Optional<Variable> v = ev.targetOf(subject);
      if (v.isPresent()) {
        ShapeValue.Tensor t = ev.tensorValueOf(v.get(), subject);
        if (t != null) {
          out = ev.state.with(v.get(), t.asChecked());
        }
      }
    }
    return out;
  }

  /** Subjects of the shape queries inside {@code e}, in source order. */
  List<Expression> inspected(Expression e) {
    List<Expression> out = new ArrayList<>();
    Subtrees.walk(e, n -> {
      if (n instanceof Expression x) {
        query(x, types).ifPresent(q -> out.add(q.subject()));
      }
    });
    return out;
  }

  // ------------------------------------------------------------------ assertions

  /** Whether the analysis already proves the condition (so the assert adds nothing). */
  boolean alreadyHolds(Expression condition, ShapeState s) {
    Expression c = ShapeEvaluator.unwrap(condition);
    if (c instanceof BinaryExpr b && b.getOperator() == BinaryExpr.Operator.AND) {
      return alreadyHolds(b.getLeft(), s) && alreadyHolds(b.getRight(), s);
    }
    if (c instanceof BinaryExpr b && b.getOperator() == BinaryExpr.Operator.EQUALS
        && (query(b.getLeft(), types).isPresent() || query(b.getRight(), types).isPresent())) {
      ShapeEvaluator ev = silent(s);
      ShapeValue l = ev.eval(b.getLeft());
      ShapeValue r = ev.eval(b.getRight());
      return l instanceof ShapeValue.Int li && r instanceof ShapeValue.Int ri && li.value().equalTo(ri.value()).isTrue();
    }
    return false;
  }

  /** Records what an assert checks: a shape, data, a caller's input, or an internal invariant. */
  void describeAssertion(AssertStmt as, ShapeState s, boolean holds, ShapeFacts sink) {
    Expression check = as.getCheck();
    List<Expression> shapes = inspected(check);
    ShapeFacts.AssertSubject subject = ShapeFacts.AssertSubject.OTHER;
    Expression about = null;
    if (!shapes.isEmpty()) {
      subject = ShapeFacts.AssertSubject.SHAPE;
      about = shapes.get(0);
    } else {
      about = dataIn(check);
      if (about != null) {
        subject = ShapeFacts.AssertSubject.DATA;
      } else {
        about = inputIn(check);
        if (about != null) {
          subject = ShapeFacts.AssertSubject.INPUT;
        }
      }
    }
    TensorShape shape = null;
    if (about != null) {
      ShapeValue v = silent(s).eval(about);
      if (v instanceof ShapeValue.Tensor t) {
        shape = t.shape();
      }
    }
    sink.add(new ShapeFacts.Assertion(analysis.graph, as, subject, about, shape, analysis.context.inTestCode, holds));
  }

  /**
   * A tensor or data set whose contents the condition reads (it is the receiver or an argument of
   * a call), if any; a bare null test is not a data check.
   */
  private Expression dataIn(Expression check) {
    List<Expression> found = new ArrayList<>();
    Subtrees.walk(check, n -> {
      boolean read = n.getParentNode().orElse(null) instanceof MethodCallExpr;
      if (found.isEmpty() && read && (n instanceof NameExpr || n instanceof FieldAccessExpr) && n instanceof Expression x) {
        String type = types.typeOf(x);
        if (type != null && (types.project().hasRole(type, TypeRole.TENSOR)
            || types.project().hasRole(type, TypeRole.DATASET))) {
          found.add(x);
        }
      }
    });
    return found.isEmpty() ? null : found.get(0);
  }

  /** A parameter of a non-private method or constructor that the condition reads, if any. */
  private Expression inputIn(Expression check) {
    List<Expression> found = new ArrayList<>();
    Subtrees.walk(check, n -> {
      if (found.isEmpty() && n instanceof NameExpr name) {
        types.symbols().resolve(name).ifPresent(v -> {
          if (v.declaration() instanceof Parameter p
              && p.getParentNode().orElse(null) instanceof CallableDeclaration<?> c && !c.isPrivate()) {
            found.add(name);
          }
        });
      }
    });
    return found.isEmpty() ? null : found.get(0);
  }
}
