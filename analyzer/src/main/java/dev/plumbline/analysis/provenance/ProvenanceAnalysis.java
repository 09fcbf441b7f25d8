package dev.plumbline.analysis.provenance;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.CallableDeclaration;
import com.github.javaparser.ast.body.Parameter;
import com.github.javaparser.ast.body.VariableDeclarator;
import com.github.javaparser.ast.expr.ArrayAccessExpr;
import com.github.javaparser.ast.expr.AssignExpr;
import com.github.javaparser.ast.expr.CastExpr;
import com.github.javaparser.ast.expr.ConditionalExpr;
import com.github.javaparser.ast.expr.EnclosedExpr;
import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.FieldAccessExpr;
import com.github.javaparser.ast.expr.LambdaExpr;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.expr.NameExpr;
import com.github.javaparser.ast.expr.ObjectCreationExpr;
import com.github.javaparser.ast.expr.ThisExpr;
import com.github.javaparser.ast.expr.VariableDeclarationExpr;
import com.github.javaparser.ast.stmt.AssertStmt;
import com.github.javaparser.ast.stmt.CatchClause;
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
import dev.plumbline.model.TypeRole;
import dev.plumbline.types.ExpressionTypes;
import dev.plumbline.types.Variable;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Data provenance: which values hold all rows, training, validation or test rows, and of which
 * body of data (lineage), at each point of each method.
 *
 * <p>Approximation: a forward may-analysis per callable body. Roles come only from evidence (a
 * split call and the part taken from it); data entering the method (a parameter, a field, a call
 * we do not model, a constructor) starts a lineage holding {@link Role#WHOLE} rows, which matters
 * only if the same method splits that lineage. Errs towards silence: an expression we cannot
 * type or model has no value, and facts are not published for a graph whose solution did not
 * converge. Library semantics come from the API model ({@code Effect} SPLIT, SPLIT_PART, DERIVE,
 * WRAP, FIT_PREPROCESSOR, STATISTIC, ...), each entry checked against the real jars.
 */
public final class ProvenanceAnalysis implements FlowAnalysis<ProvenanceState> {

  public static final AnalysisKey<ProvenanceFacts> KEY =
      AnalysisKey.of("provenance", ProvenanceAnalysis::analyzeFile);

  private static final Set<TypeRole> DATA_ROLES = EnumSet.of(TypeRole.DATASET,
      TypeRole.DATA_ITERATOR, TypeRole.RECORD_SOURCE, TypeRole.TENSOR);

  private final FileContext file;
  private final ExpressionTypes types;
  private final ControlFlowGraph graph;
  private final Map<Node, Lineage> lineages;

  private ProvenanceAnalysis(FileContext file, ControlFlowGraph graph, Map<Node, Lineage> lineages) {
    this.file = file;
    this.types = file.types();
    this.graph = graph;
    this.lineages = lineages;
  }

  static ProvenanceFacts analyzeFile(FileContext file) {
    ProvenanceFacts facts = new ProvenanceFacts();
    for (ControlFlowGraph g : file.graphs()) {
      ProvenanceAnalysis analysis = new ProvenanceAnalysis(file, g, new IdentityHashMap<>());
      FlowResult<ProvenanceState> result = ForwardSolver.solve(g, analysis);
      if (!result.converged()) {
        continue;
      }
      for (CfgNode node : g.nodes()) {
        ProvenanceState before = result.before(node);
        if (before != null) {
          new Evaluator(analysis, facts).node(node, before);
        }
      }
    }
    return facts;
  }

  // ------------------------------------------------------------------ FlowAnalysis

  @Override
  public ProvenanceState entryState(ControlFlowGraph g) {
    return ProvenanceState.EMPTY;
  }

  @Override
  public ProvenanceState join(ProvenanceState left, ProvenanceState right) {
    return left.join(right);
  }

  @Override
  public ProvenanceState transfer(CfgNode node, ProvenanceState in) {
    return new Evaluator(this, null).node(node, in);
  }

  @Override
  public Branches<ProvenanceState> transferBranch(CfgNode node, ProvenanceState in) {
    if (node.kind() == CfgNode.Kind.FOREACH_NEXT) {
      ProvenanceState bound = new Evaluator(this, null).node(node, in);
      return new Branches<>(bound, in);
    }
    ProvenanceState out = transfer(node, in);
    return new Branches<>(out, out);
  }

  /** A lineage per entry site, canonical within this graph so that states compare equal. */
  Lineage lineageAt(Node site, String label) {
    return lineages.computeIfAbsent(site, s -> new Lineage(s, label));
  }

  boolean isDataType(String type) {
    if (type == null) {
      return false;
    }
    String t = type.endsWith("[]") ? type.substring(0, type.length() - 2) : type;
    for (TypeRole r : DATA_ROLES) {
      if (types.project().hasRole(t, r)) {
        return true;
      }
    }
    return false;
  }

  /**
   * Evaluates one node's expressions in Java's order, threading the store, and optionally
   * recording facts (only in the final pass over the converged solution).
   */
  static final class Evaluator {
    private final ProvenanceAnalysis a;
    private final ProvenanceFacts sink;
    private ProvenanceState state;

    Evaluator(ProvenanceAnalysis analysis, ProvenanceFacts sink) {
      this.a = analysis;
      this.sink = sink;
    }

    ProvenanceState node(CfgNode node, ProvenanceState in) {
      state = in;
      Node ast = node.ast();
      switch (node.kind()) {
        case ENTRY, EXIT, JOIN, CATCH -> {
          return in;
        }
        case FOREACH_NEXT -> {
          ForEachStmt f = (ForEachStmt) ast;
          DataValue iterable = valueOf(f.getIterable());
          for (VariableDeclarator d : f.getVariable().getVariables()) {
            Variable v = a.types.symbols().variableOf(d);
            state = state.with(v, iterable != null && iterable.kind() == DataValue.Kind.DATA
                ? iterable : null);
          }
          return state;
        }
        default -> {
          statementOrExpression(ast);
          return state;
        }
      }
    }

    private void statementOrExpression(Node ast) {
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
        as.getMessage().ifPresent(this::eval);
      } else if (ast instanceof YieldStmt y) {
        eval(y.getExpression());
      } else if (ast instanceof ExplicitConstructorInvocationStmt ec) {
        ec.getArguments().forEach(this::eval);
      }
    }

    /**
     * The value an expression has in the current store, evaluated silently and without changing
     * the store: used to re-read an iterable that its own node already evaluated and recorded.
     */
    private DataValue valueOf(Expression e) {
      Evaluator silent = new Evaluator(a, null);
      silent.state = state;
      return silent.eval(e);
    }

    DataValue eval(Expression e) {
      if (e instanceof EnclosedExpr en) {
        return eval(en.getInner());
      }
      if (e instanceof CastExpr c) {
        return eval(c.getExpression());
      }
      if (e instanceof NameExpr n) {
        return a.types.symbols().resolve(n).map(this::read).orElse(null);
      }
      if (e instanceof FieldAccessExpr fa) {
        if (fa.getScope() instanceof ThisExpr) {
          return a.types.symbols().field(fa, fa.getNameAsString()).map(this::read).orElse(null);
        }
        eval(fa.getScope());
        return null;
      }
      if (e instanceof VariableDeclarationExpr vde) {
        for (VariableDeclarator d : vde.getVariables()) {
          Variable v = a.types.symbols().variableOf(d);
          DataValue init = d.getInitializer().map(this::eval).orElse(null);
          if (init == null && d.getInitializer().isPresent() && a.isDataType(a.types.typeOf(v))) {
            init = DataValue.fresh(a.lineageAt(d, d.getNameAsString()));
          }
          if (sink != null && init != null && init.kind() == DataValue.Kind.DATA
              && !init.roles().isEmpty() && !init.holds(Role.WHOLE)) {
            sink.add(new ProvenanceFacts.PartBinding(a.graph, d, v, init));
          }
          state = state.with(v, init);
        }
        return null;
      }
      if (e instanceof AssignExpr as) {
        DataValue value = eval(as.getValue());
        Optional<Variable> target = targetOf(as.getTarget());
        if (as.getOperator() != AssignExpr.Operator.ASSIGN) {
          value = null;
        } else if (value == null && target.isPresent() && a.isDataType(a.types.typeOf(target.get()))) {
          value = DataValue.fresh(a.lineageAt(as, target.get().name()));
        }
        if (target.isPresent()) {
          state = state.with(target.get(), value);
        } else {
          eval(as.getTarget());
        }
        return value;
      }
      if (e instanceof ConditionalExpr c) {
        eval(c.getCondition());
        ProvenanceState before = state;
        DataValue t = eval(c.getThenExpr());
        ProvenanceState afterThen = state;
        state = before;
        DataValue f = eval(c.getElseExpr());
        state = state.join(afterThen);
        return t == null ? f : t.join(f);
      }
      if (e instanceof ArrayAccessExpr aa) {
        DataValue array = eval(aa.getName());
        eval(aa.getIndex());
        return part(array, aa);
      }
      if (e instanceof MethodCallExpr call) {
        return call(call);
      }
      if (e instanceof ObjectCreationExpr oce) {
        return construct(oce);
      }
      if (e instanceof LambdaExpr) {
        return null; // evaluated in its own graph
      }
      // Other expressions: evaluate children for their effects (assignments, calls) in order.
      for (Node child : e.getChildNodes()) {
        if (child instanceof Expression ce) {
          eval(ce);
        }
      }
      return null;
    }

    private Optional<Variable> targetOf(Expression target) {
      if (target instanceof NameExpr n) {
        return a.types.symbols().resolve(n);
      }
      if (target instanceof FieldAccessExpr fa && fa.getScope() instanceof ThisExpr) {
        return a.types.symbols().field(fa, fa.getNameAsString());
      }
      return Optional.empty();
    }

    /** A variable's value; data entering from outside the method starts its own lineage. */
    private DataValue read(Variable v) {
      Optional<DataValue> known = state.get(v);
      if (known.isPresent()) {
        return known.get();
      }
      boolean external = v.kind() == Variable.Kind.FIELD
          || (v.kind() == Variable.Kind.PARAMETER && v.declaration() instanceof Parameter p
              && p.getParentNode().orElse(null) instanceof CallableDeclaration<?>);
      if (external && a.isDataType(a.types.typeOf(v))) {
        return DataValue.fresh(a.lineageAt(v.declaration(), v.toString()));
      }
      return null;
    }

    /** {@code parts[i]} of a split into an array: train first, test last (DJL randomSplit order). */
    private DataValue part(DataValue array, ArrayAccessExpr access) {
      if (array == null || array.kind() != DataValue.Kind.PARTS) {
        return null;
      }
      Expression index = access.getIndex();
      if (!index.isIntegerLiteralExpr()) {
        return DataValue.data(EnumSet.of(Role.TRAIN, Role.HELD_OUT), array.lineages());
      }
      int i = index.asIntegerLiteralExpr().asNumber().intValue();
      Role role;
      if (i == 0) {
        role = Role.TRAIN;
      } else if (array.parts() == 3 && i == 1) {
        role = Role.VALIDATION;
      } else if (array.parts() == 3 && i == 2) {
        role = Role.TEST;
      } else {
        role = Role.HELD_OUT;
      }
      return DataValue.data(EnumSet.of(role), array.lineages());
    }

    private DataValue call(MethodCallExpr call) {
      DataValue receiver = call.getScope().map(this::eval).orElse(null);
      List<DataValue> args = new ArrayList<>();
      for (Expression arg : call.getArguments()) {
        args.add(eval(arg));
      }
      Optional<ApiMethod> api = a.types.apiMethod(call);
      if (api.isEmpty()) {
        return unknownResult(call);
      }
      ApiMethod m = api.get();
      switch (m.effect()) {
        case SPLIT -> {
          if (receiver == null) {
            return null;
          }
          recordSplit(call, call.getScope().orElse(call), receiver);
          return receiver.withKind(DataValue.Kind.SPLIT_HOLDER, Set.of(call), 0);
        }
        case SPLIT_ARRAY -> {
          if (receiver == null) {
            return null;
          }
          recordSplit(call, call.getScope().orElse(call), receiver);
          int parts = m.isVarArgs() && call.getArguments().size() > 1 ? call.getArguments().size() : 0;
          return receiver.withKind(DataValue.Kind.PARTS, Set.of(call), parts);
        }
        case SPLIT_PART -> {
          if (receiver == null || receiver.kind() != DataValue.Kind.SPLIT_HOLDER) {
            return null;
          }
          Role role = Role.valueOf(m.attribute("part").toUpperCase(java.util.Locale.ROOT));
          return DataValue.data(EnumSet.of(role), receiver.lineages());
        }
        case DERIVE, COPY -> {
          return receiver != null && receiver.kind() == DataValue.Kind.DATA ? receiver : null;
        }
        case WRAP -> {
          return joinData(args);
        }
        case FIT_PREPROCESSOR -> {
          int dataArg = m.intAttribute("dataArg", 0);
          if (sink != null && dataArg < args.size() && args.get(dataArg) != null && call.getScope().isPresent()) {
            boolean learns = !"false".equals(m.attribute("learns")) && learnsFromData(call);
            sink.add(new ProvenanceFacts.Fit(a.graph, call, call.getScope().get(),
                call.getArgument(dataArg), args.get(dataArg), learns));
          }
          return null;
        }
        case STATISTIC, REDUCE -> {
          if (!m.flag("statistic") && m.effect() == dev.plumbline.model.Effect.REDUCE) {
            return null;
          }
          if (receiver == null || receiver.kind() != DataValue.Kind.DATA) {
            return null;
          }
          return receiver.withKind(DataValue.Kind.STATISTIC, Set.of(call), 0);
        }
        case ELEMENTWISE, VECTOR_OP -> {
          for (int i = 0; i < args.size(); i++) {
            recordStatisticUse(args.get(i), call);
          }
          recordStatisticUse(receiver, call);
          return receiver != null && receiver.kind() == DataValue.Kind.DATA ? receiver : null;
        }
        case TRAIN, EVALUATE, PREDICT -> {
          int dataArg = m.intAttribute("dataArg", 0);
          if (sink != null && dataArg < args.size() && args.get(dataArg) != null) {
            sink.add(new ProvenanceFacts.Use(a.graph, call, m, call.getArgument(dataArg), args.get(dataArg)));
          }
          return unknownResult(call);
        }
        default -> {
          return unknownResult(call);
        }
      }
    }

    /** Whether the receiver's normalizer type learns statistics (type attribute {@code learns}). */
    private boolean learnsFromData(MethodCallExpr call) {
      String type = call.getScope().map(a.types::typeOf).orElse(null);
      if (type == null) {
        return true;
      }
      for (String t : a.types.project().selfAndSupertypes(type)) {
        Optional<String> learns = a.file.model().type(t).map(at -> at.attributes().get("learns"));
        if (learns.isPresent() && learns.get() != null) {
          return !"false".equals(learns.get());
        }
      }
      return true;
    }

    private void recordSplit(Expression call, Expression splitData, DataValue receiver) {
      if (sink != null && receiver.kind() == DataValue.Kind.DATA) {
        sink.add(new ProvenanceFacts.Split(a.graph, call, splitData, receiver));
      }
    }

    private void recordStatisticUse(DataValue v, MethodCallExpr use) {
      if (sink == null || v == null || v.kind() != DataValue.Kind.STATISTIC) {
        return;
      }
      for (Node site : v.sites()) {
        if (site instanceof MethodCallExpr statCall) {
          sink.add(new ProvenanceFacts.StatisticUse(a.graph, statCall,
              statCall.getScope().orElse(statCall), v, use));
        }
      }
    }

    private DataValue construct(ObjectCreationExpr oce) {
      oce.getScope().ifPresent(this::eval);
      List<DataValue> args = new ArrayList<>();
      for (Expression arg : oce.getArguments()) {
        args.add(eval(arg));
      }
      Optional<ApiMethod> ctor = a.types.apiConstructor(oce);
      if (ctor.isPresent() && ctor.get().effect() == dev.plumbline.model.Effect.WRAP) {
        DataValue wrapped = joinData(args);
        if (wrapped != null) {
          return wrapped;
        }
      }
      String type = a.types.symbols().types().resolve(oce.getType());
      return a.isDataType(type) ? DataValue.fresh(a.lineageAt(oce, oce.getTypeAsString())) : null;
    }

    private DataValue unknownResult(MethodCallExpr call) {
      String type = a.types.typeOf(call);
      return a.isDataType(type) ? DataValue.fresh(a.lineageAt(call, shortText(call))) : null;
    }

    private static DataValue joinData(List<DataValue> values) {
      DataValue out = null;
      for (DataValue v : values) {
        if (v != null && v.kind() == DataValue.Kind.DATA) {
          out = out == null ? v : out.join(v);
        }
      }
      return out;
    }
  }

  static String shortText(Node n) {
    String s = n.toString().replaceAll("\\s+", " ");
    return s.length() <= 40 ? s : s.substring(0, 37) + "...";
  }

  static boolean isCatchParameter(Node n) {
    return n.getParentNode().orElse(null) instanceof CatchClause;
  }
}
