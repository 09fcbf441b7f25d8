package dev.plumbline.analysis.rowcount;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.CallableDeclaration;
import com.github.javaparser.ast.body.FieldDeclaration;
import com.github.javaparser.ast.body.MethodDeclaration;
import com.github.javaparser.ast.body.Parameter;
import com.github.javaparser.ast.body.VariableDeclarator;
import com.github.javaparser.ast.expr.ArrayCreationExpr;
import com.github.javaparser.ast.expr.ArrayInitializerExpr;
import com.github.javaparser.ast.expr.AssignExpr;
import com.github.javaparser.ast.expr.BinaryExpr;
import com.github.javaparser.ast.expr.CastExpr;
import com.github.javaparser.ast.expr.ConditionalExpr;
import com.github.javaparser.ast.expr.DoubleLiteralExpr;
import com.github.javaparser.ast.expr.EnclosedExpr;
import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.FieldAccessExpr;
import com.github.javaparser.ast.expr.IntegerLiteralExpr;
import com.github.javaparser.ast.expr.LambdaExpr;
import com.github.javaparser.ast.expr.LongLiteralExpr;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.expr.NameExpr;
import com.github.javaparser.ast.expr.ObjectCreationExpr;
import com.github.javaparser.ast.expr.UnaryExpr;
import com.github.javaparser.ast.expr.VariableDeclarationExpr;
import com.github.javaparser.ast.stmt.AssertStmt;
import com.github.javaparser.ast.stmt.ExplicitConstructorInvocationStmt;
import com.github.javaparser.ast.stmt.ExpressionStmt;
import com.github.javaparser.ast.stmt.ForEachStmt;
import com.github.javaparser.ast.stmt.ReturnStmt;
import com.github.javaparser.ast.stmt.ThrowStmt;
import com.github.javaparser.ast.stmt.YieldStmt;
import dev.plumbline.engine.AnalysisKey;
import dev.plumbline.engine.FileContext;
import dev.plumbline.flow.CfgNode;
import dev.plumbline.flow.ControlFlowGraph;
import dev.plumbline.flow.FlowAnalysis;
import dev.plumbline.flow.FlowResult;
import dev.plumbline.flow.ForwardSolver;
import dev.plumbline.model.ApiMethod;
import dev.plumbline.model.Effect;
import dev.plumbline.model.TypeRole;
import dev.plumbline.parse.NumberLiterals;
import dev.plumbline.parse.Subtrees;
import dev.plumbline.types.ExpressionTypes;
import dev.plumbline.types.ProjectIndex;
import dev.plumbline.types.Variable;
import java.util.ArrayList;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;

/**
 * Row counts: how many rows (examples) a data value holds, and the values of the integers that
 * size it, where the code fixes them without running: literal sizes, constant fields, arrays
 * created with a known first dimension, {@code Nd4j.create} of such arrays or of literal shapes,
 * data sets and iterators wrapping them, the parts of {@code splitTestAndTrain} with a literal
 * size or fraction (sized as the library does, {@link SplitSizes}), and project methods whose
 * summary says what they return ({@link RowCountSummaries}).
 *
 * <p>A forward must-analysis per callable body: a size is known at a point only when every path
 * gives the same one. Errs towards "unknown": fields are not tracked, a data value passed to or
 * called on code the model does not describe may have changed size and is forgotten, loop
 * variables are unknown, and facts are not published for a graph whose solution did not converge.
 */
public final class RowCountAnalysis implements FlowAnalysis<SizeState> {

  public static final AnalysisKey<RowCountFacts> KEY =
      AnalysisKey.of("row-count", RowCountAnalysis::analyzeFile);

  private static final Set<TypeRole> DATA_ROLES = Set.of(TypeRole.DATASET, TypeRole.DATA_ITERATOR,
      TypeRole.RECORD_SOURCE, TypeRole.TENSOR, TypeRole.SPLIT_HOLDER);
  private static final Set<String> INTEGRAL = Set.of("int", "long", "short", "byte");
  private static final int CONSTANT_DEPTH = 8;

  /** Sizes returned by project methods. */
  interface Summaries {
    Summaries NONE = m -> Optional.empty();

    Optional<Count> returnedSize(CallableDeclaration<?> method);
  }

  private final ExpressionTypes types;
  private final ControlFlowGraph graph;
  private final Summaries summaries;

  private RowCountAnalysis(FileContext file, ControlFlowGraph graph, Summaries summaries) {
    this.types = file.types();
    this.graph = graph;
    this.summaries = summaries;
  }

  static RowCountFacts analyzeFile(FileContext file) {
    RowCountFacts facts = new RowCountFacts();
    RowCountSummaries.Published published = file.projectFacts().get(RowCountSummaries.Published.class);
    Summaries summaries = published == null ? Summaries.NONE : published::of;
    Map<Node, List<MethodCallExpr>> evaluationsByBody = new IdentityHashMap<>();
    for (MethodCallExpr call : Subtrees.findAll(file.source().unit(), MethodCallExpr.class)) {
      Optional<ApiMethod> m = file.types().apiMethod(call);
      if (m.isPresent() && m.get().effect() == Effect.EVALUATE) {
        Node body = ownBody(call);
        if (body != null) {
          evaluationsByBody.computeIfAbsent(body, b -> new ArrayList<>()).add(call);
        }
      }
    }
    for (ControlFlowGraph g : file.graphs()) {
      List<MethodCallExpr> targets = evaluationsByBody.get(g.callable());
      if (targets == null) {
        continue;
      }
      RowCountAnalysis analysis = new RowCountAnalysis(file, g, summaries);
      FlowResult<SizeState> result = ForwardSolver.solve(g, analysis);
      if (!result.converged()) {
        continue;
      }
      Set<MethodCallExpr> wanted = java.util.Collections.newSetFromMap(new IdentityHashMap<>());
      wanted.addAll(targets);
      for (CfgNode node : g.nodes()) {
        SizeState before = result.before(node);
        if (before != null) {
          new Evaluator(analysis, facts, wanted).node(node, before);
        }
      }
    }
    return facts;
  }

  /** The size every {@code return} of {@code method} gives, if they agree and it is known. */
  static Optional<Count> returnedSize(FileContext file, CallableDeclaration<?> method, Summaries summaries) {
    if (!(method instanceof MethodDeclaration md) || !returnsSizedValue(file, md)) {
      return Optional.empty();
    }
    ControlFlowGraph g = file.graphs().stream().filter(x -> x.callable() == method).findFirst().orElse(null);
    if (g == null) {
      return Optional.empty();
    }
    RowCountAnalysis analysis = new RowCountAnalysis(file, g, summaries);
    FlowResult<SizeState> result = ForwardSolver.solve(g, analysis);
    if (!result.converged()) {
      return Optional.empty();
    }
    Count common = null;
    for (CfgNode node : g.nodes()) {
      if (!(node.ast() instanceof ReturnStmt r) || r.getExpression().isEmpty() || result.before(node) == null) {
        continue;
      }
      Evaluator e = new Evaluator(analysis, null, Set.of());
      e.state = result.before(node);
      Size s = e.eval(r.getExpression().get());
      if (!(s instanceof Size.Rows rows) || (common != null && !common.equals(rows.count()))) {
        return Optional.empty();
      }
      common = rows.count();
    }
    return Optional.ofNullable(common);
  }

  private static boolean returnsSizedValue(FileContext file, MethodDeclaration m) {
    String type = file.types().symbols().types().resolve(m.getType());
    return type != null && (INTEGRAL.contains(type) || isData(file.project(), type) || type.endsWith("[]"));
  }

  /** The body a call is evaluated in: its nearest enclosing callable, lambda or initializer. */
  private static Node ownBody(Node node) {
    Node current = node.getParentNode().orElse(null);
    while (current != null) {
      if (current instanceof CallableDeclaration<?> || current instanceof LambdaExpr
          || current instanceof com.github.javaparser.ast.body.InitializerDeclaration) {
        return current;
      }
      current = current.getParentNode().orElse(null);
    }
    return null;
  }

  static boolean isData(ProjectIndex project, String type) {
    return project.hasAnyRole(type, DATA_ROLES);
  }

  // ------------------------------------------------------------------ FlowAnalysis

  @Override
  public SizeState entryState(ControlFlowGraph g) {
    SizeState state = SizeState.EMPTY;
    if (g.callable() instanceof CallableDeclaration<?> c) {
      for (int i = 0; i < c.getParameters().size(); i++) {
        Parameter p = c.getParameters().get(i);
        Variable v = types.symbols().variableOf(p);
        String t = types.typeOf(v);
        if (!p.isVarArgs() && t != null && (INTEGRAL.contains(t) || isData(types.project(), t))) {
          state = state.with(v, new Size.Rows(Count.ofParameter(i)));
        }
      }
    }
    return state;
  }

  @Override
  public SizeState join(SizeState left, SizeState right) {
    return left.join(right);
  }

  @Override
  public SizeState transfer(CfgNode node, SizeState in) {
    return new Evaluator(this, null, Set.of()).node(node, in);
  }

  /** Evaluates one node's expressions in Java's order, threading the store. */
  static final class Evaluator {
    private final RowCountAnalysis a;
    private final RowCountFacts sink;
    private final Set<MethodCallExpr> wanted;
    SizeState state;

    Evaluator(RowCountAnalysis analysis, RowCountFacts sink, Set<MethodCallExpr> wanted) {
      this.a = analysis;
      this.sink = sink;
      this.wanted = wanted;
    }

    SizeState node(CfgNode node, SizeState in) {
      state = in;
      Node ast = node.ast();
      switch (node.kind()) {
        case ENTRY, EXIT, JOIN, CATCH -> {
          return in;
        }
        case FOREACH_NEXT -> {
          for (VariableDeclarator d : ((ForEachStmt) ast).getVariable().getVariables()) {
            state = state.with(a.types.symbols().variableOf(d), null);
          }
          return state;
        }
        default -> {
          if (ast instanceof ExpressionStmt es) {
            eval(es.getExpression());
          } else if (ast instanceof Expression e) {
            eval(e);
          } else if (ast instanceof ReturnStmt r) {
            r.getExpression().ifPresent(this::eval);
          } else if (ast instanceof ThrowStmt t) {
            eval(t.getExpression());
          } else if (ast instanceof AssertStmt as) {
            eval(as.getCheck());
          } else if (ast instanceof YieldStmt y) {
            eval(y.getExpression());
          } else if (ast instanceof ExplicitConstructorInvocationStmt ec) {
            ec.getArguments().forEach(this::eval);
          }
          return state;
        }
      }
    }

    Size eval(Expression e) {
      if (e instanceof EnclosedExpr en) {
        return eval(en.getInner());
      }
      if (e instanceof CastExpr c) {
        Size inner = eval(c.getExpression());
        return c.getType().isPrimitiveType() && !INTEGRAL.contains(c.getType().asString()) ? null : inner;
      }
      if (e instanceof IntegerLiteralExpr || e instanceof LongLiteralExpr) {
        return constant(e, 0).map(v -> (Size) new Size.Rows(Count.exact(v.longValue()))).orElse(null);
      }
      if (e instanceof NameExpr n) {
        Optional<Variable> v = a.types.symbols().resolve(n);
        if (v.isPresent() && !v.get().isField()) {
          return state.get(v.get());
        }
        return constant(e, 0).filter(Evaluator::isWhole).map(x -> (Size) new Size.Rows(Count.exact(x.longValue())))
            .orElse(null);
      }
      if (e instanceof FieldAccessExpr fa) {
        Optional<Number> c = constant(fa, 0);
        if (c.isPresent() && isWhole(c.get())) {
          return new Size.Rows(Count.exact(c.get().longValue()));
        }
        if (a.types.typeReference(fa.getScope()) == null) {
          eval(fa.getScope());
        }
        return null;
      }
      if (e instanceof UnaryExpr u) {
        return unary(u);
      }
      if (e instanceof BinaryExpr b) {
        Size l = eval(b.getLeft());
        Size r = eval(b.getRight());
        return arithmetic(b, l, r);
      }
      if (e instanceof VariableDeclarationExpr vde) {
        for (VariableDeclarator d : vde.getVariables()) {
          Size init = d.getInitializer().map(this::eval).orElse(null);
          state = state.with(a.types.symbols().variableOf(d), init);
        }
        return null;
      }
      if (e instanceof AssignExpr as) {
        Size value = eval(as.getValue());
        Optional<Variable> target = as.getTarget() instanceof NameExpr n
            ? a.types.symbols().resolve(n).filter(v -> !v.isField()) : Optional.empty();
        if (target.isPresent()) {
          state = state.with(target.get(), as.getOperator() == AssignExpr.Operator.ASSIGN ? value : null);
          return as.getOperator() == AssignExpr.Operator.ASSIGN ? value : null;
        }
        evalChildren(as.getTarget());
        return null;
      }
      if (e instanceof ConditionalExpr c) {
        eval(c.getCondition());
        SizeState before = state;
        Size t = eval(c.getThenExpr());
        SizeState afterThen = state;
        state = before;
        Size f = eval(c.getElseExpr());
        state = state.join(afterThen);
        return t != null && t.equals(f) ? t : null;
      }
      if (e instanceof ArrayCreationExpr ac) {
        Size first = null;
        for (int i = 0; i < ac.getLevels().size(); i++) {
          Optional<Expression> dim = ac.getLevels().get(i).getDimension();
          Size s = dim.map(this::eval).orElse(null);
          if (i == 0) {
            first = s;
          }
        }
        if (ac.getInitializer().isPresent()) {
          return eval(ac.getInitializer().get());
        }
        return first instanceof Size.Rows ? first : null;
      }
      if (e instanceof ArrayInitializerExpr ai) {
        ai.getValues().forEach(this::eval);
        return new Size.Rows(Count.exact(ai.getValues().size()));
      }
      if (e instanceof MethodCallExpr call) {
        return call(call);
      }
      if (e instanceof ObjectCreationExpr oce) {
        return construct(oce);
      }
      if (e instanceof LambdaExpr) {
        return null; // a separate body
      }
      evalChildren(e);
      return null;
    }

    private void evalChildren(Node n) {
      for (Node child : n.getChildNodes()) {
        if (child instanceof Expression ce) {
          eval(ce);
        }
      }
    }

    private Size unary(UnaryExpr u) {
      Size inner = eval(u.getExpression());
      switch (u.getOperator()) {
        case PLUS:
          return inner;
        case MINUS:
          return inner instanceof Size.Rows r && r.count().isExact()
              ? new Size.Rows(Count.exact(-r.count().constant())) : null;
        case PREFIX_INCREMENT, PREFIX_DECREMENT, POSTFIX_INCREMENT, POSTFIX_DECREMENT:
          if (u.getExpression() instanceof NameExpr n) {
            a.types.symbols().resolve(n).filter(v -> !v.isField()).ifPresent(v -> state = state.with(v, null));
          }
          return null;
        default:
          return null;
      }
    }

    private Size arithmetic(BinaryExpr b, Size l, Size r) {
      if (!(l instanceof Size.Rows lr) || !(r instanceof Size.Rows rr) || !lr.count().isExact()
          || !rr.count().isExact()) {
        return null;
      }
      long x = lr.count().constant();
      long y = rr.count().constant();
      long v;
      try {
        switch (b.getOperator()) {
          case PLUS -> v = Math.addExact(x, y);
          case MINUS -> v = Math.subtractExact(x, y);
          case MULTIPLY -> v = Math.multiplyExact(x, y);
          case DIVIDE -> {
            if (y == 0) {
              return null;
            }
            v = x / y;
          }
          case REMAINDER -> {
            if (y == 0) {
              return null;
            }
            v = x % y;
          }
          default -> {
            return null;
          }
        }
      } catch (ArithmeticException overflow) {
        return null;
      }
      boolean intTyped = "int".equals(a.types.typeOf(b));
      return intTyped && (v > Integer.MAX_VALUE || v < Integer.MIN_VALUE) ? null : new Size.Rows(Count.exact(v));
    }

    private Size call(MethodCallExpr call) {
      Expression scope = call.getScope().orElse(null);
      Size receiver = scope == null || a.types.typeReference(scope) != null ? null : eval(scope);
      List<Size> args = new ArrayList<>();
      for (Expression arg : call.getArguments()) {
        args.add(eval(arg));
      }
      Optional<ApiMethod> api = a.types.apiMethod(call);
      Size result;
      if (api.isPresent()) {
        result = apiResult(call, api.get(), receiver, args);
      } else {
        Optional<ProjectIndex.ProjectMethod> pm = a.types.projectMethod(call);
        result = pm.flatMap(m -> a.summaries.returnedSize(m.declaration()))
            .map(c -> substitute(c, args)).orElse(null);
        // Code the model does not describe may change the size of data it is given or called on.
        if (scope != null) {
          forgetData(scope);
        }
        call.getArguments().forEach(this::forgetData);
      }
      if (sink != null && wanted.contains(call) && api.isPresent()) {
        int dataArg = api.get().intAttribute("dataArg", 0);
        if (dataArg < args.size() && args.get(dataArg) instanceof Size.Rows rows && rows.count().isExact()
            && rows.count().constant() > 0) {
          sink.recordEvaluation(call, rows.count().constant());
        }
      }
      return result;
    }

    private Size apiResult(MethodCallExpr call, ApiMethod m, Size receiver, List<Size> args) {
      switch (m.effect()) {
        case CREATE -> {
          if ("data".equals(m.attribute("shape"))) {
            return args.isEmpty() ? null : rowsOnly(args.get(0));
          }
          if ("varargs".equals(m.attribute("shape")) && args.size() >= 2) {
            return rowsOnly(args.get(0));
          }
          return null;
        }
        case SPLIT -> {
          return split(call, m, receiver, args);
        }
        case SPLIT_PART -> {
          if (!(receiver instanceof Size.Parts parts)) {
            return null;
          }
          String part = m.attribute("part");
          return "train".equals(part) ? new Size.Rows(parts.train())
              : "test".equals(part) ? new Size.Rows(parts.test()) : null;
        }
        case COPY -> {
          return rowsOnly(receiver);
        }
        case DERIVE -> {
          return "same".equals(m.attribute("rows")) ? rowsOnly(receiver) : null;
        }
        case WRAP -> {
          return wrapped(m, call.getArguments(), args);
        }
        default -> {
          return null;
        }
      }
    }

    private Size split(MethodCallExpr call, ApiMethod m, Size receiver, List<Size> args) {
      if (!(receiver instanceof Size.Rows rows) || !rows.count().isExact() || args.isEmpty()) {
        return null;
      }
      Expression arg = call.getArgument(0);
      String argType = a.types.typeOf(arg);
      // Java picks splitTestAndTrain(int) for an integer argument and (double) for a fraction.
      Optional<SplitSizes.Parts> parts = Optional.empty();
      if (INTEGRAL.contains(argType) && args.get(0) instanceof Size.Rows n && n.count().isExact()) {
        parts = SplitSizes.byTrainCount(rows.count().constant(), n.count().constant());
      } else if ("double".equals(argType) || "float".equals(argType)) {
        OptionalDouble f = doubleConstant(arg);
        if (f.isPresent()) {
          parts = SplitSizes.byFraction(rows.count().constant(), f.getAsDouble());
        }
      }
      return parts.map(p -> (Size) new Size.Parts(Count.exact(p.train()), Count.exact(p.test()))).orElse(null);
    }

    private Size construct(ObjectCreationExpr oce) {
      oce.getScope().ifPresent(this::eval);
      List<Size> args = new ArrayList<>();
      for (Expression arg : oce.getArguments()) {
        args.add(eval(arg));
      }
      Optional<ApiMethod> ctor = a.types.apiConstructor(oce);
      if (ctor.isPresent()) {
        return ctor.get().effect() == Effect.WRAP ? wrapped(ctor.get(), oce.getArguments(), args) : null;
      }
      oce.getArguments().forEach(this::forgetData);
      return null;
    }

    /** Rows of a wrapper: its data arguments must all have the same known size. */
    private Size wrapped(ApiMethod m, List<Expression> argExprs, List<Size> args) {
      List<Integer> dataArgs = new ArrayList<>();
      String listed = m.attribute("dataArgs");
      if (listed != null) {
        for (String s : listed.split(",")) {
          dataArgs.add(Integer.parseInt(s.trim()));
        }
      } else {
        for (int i = 0; i < argExprs.size(); i++) {
          String t = a.types.typeOf(argExprs.get(i));
          if (isData(a.types.project(), t) || (t != null && t.startsWith("java.util."))) {
            dataArgs.add(i);
          }
        }
      }
      Size common = null;
      for (int i : dataArgs) {
        Size s = i < args.size() ? rowsOnly(args.get(i)) : null;
        if (s == null || (common != null && !common.equals(s))) {
          return null;
        }
        common = s;
      }
      return common;
    }

    private static Size rowsOnly(Size s) {
      return s instanceof Size.Rows ? s : null;
    }

    private static Size substitute(Count c, List<Size> args) {
      if (c.isExact()) {
        return new Size.Rows(c);
      }
      return c.parameter() < args.size() ? rowsOnly(args.get(c.parameter())) : null;
    }

    /** Forgets the size of a data variable handed to code whose effect on it is unknown. */
    private void forgetData(Expression e) {
      if (e instanceof NameExpr n) {
        a.types.symbols().resolve(n).filter(v -> !v.isField()).ifPresent(v -> {
          String t = a.types.typeOf(v);
          if (t == null || !(INTEGRAL.contains(t) || t.endsWith("[]"))) {
            state = state.with(v, null);
          }
        });
      }
    }

    // ---------------------------------------------------------------- constants

    private static boolean isWhole(Number n) {
      return n instanceof Long || n instanceof Integer;
    }

    private OptionalDouble doubleConstant(Expression e) {
      Optional<Number> n = constant(e, 0);
      return n.isPresent() ? OptionalDouble.of(n.get().doubleValue()) : OptionalDouble.empty();
    }

    /**
     * The value of a compile-time constant expression built from literals, {@code static final}
     * fields of this unit or of project types with constant initializers, and arithmetic.
     */
    Optional<Number> constant(Expression e, int depth) {
      if (depth > CONSTANT_DEPTH) {
        return Optional.empty();
      }
      if (e instanceof EnclosedExpr en) {
        return constant(en.getInner(), depth + 1);
      }
      if (e instanceof IntegerLiteralExpr i) {
        try {
          return Optional.of(NumberLiterals.value(i).longValue());
        } catch (NumberFormatException bad) {
          return Optional.empty();
        }
      }
      if (e instanceof LongLiteralExpr l) {
        try {
          return Optional.of(NumberLiterals.value(l).longValue());
        } catch (NumberFormatException bad) {
          return Optional.empty();
        }
      }
      if (e instanceof DoubleLiteralExpr d) {
        return Optional.of(NumberLiterals.value(d));
      }
      if (e instanceof UnaryExpr u && u.getOperator() == UnaryExpr.Operator.MINUS) {
        return constant(u.getExpression(), depth + 1)
            .map(n -> n instanceof Double x ? (Number) (-x) : (Number) (-n.longValue()));
      }
      if (e instanceof NameExpr n) {
        Optional<Variable> v = a.types.symbols().resolve(n);
        return v.filter(Variable::isField).flatMap(f -> constantField(f.declaration(), depth));
      }
      if (e instanceof FieldAccessExpr fa) {
        String owner = a.types.typeReference(fa.getScope());
        if (owner == null) {
          return Optional.empty();
        }
        return a.types.project().type(owner)
            .flatMap(t -> t.declaration().getFieldByName(fa.getNameAsString()))
            .flatMap(f -> f.getVariables().stream()
                .filter(d -> d.getNameAsString().equals(fa.getNameAsString())).findFirst())
            .flatMap(d -> constantField(d, depth));
      }
      return Optional.empty();
    }

    private Optional<Number> constantField(Node declarator, int depth) {
      if (!(declarator instanceof VariableDeclarator d)
          || !(d.getParentNode().orElse(null) instanceof FieldDeclaration f)
          || !f.isStatic() || !f.isFinal() || d.getInitializer().isEmpty()) {
        return Optional.empty();
      }
      return constant(d.getInitializer().get(), depth + 1);
    }
  }
}
