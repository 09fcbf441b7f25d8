package dev.plumbline.analysis.shape;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.CallableDeclaration;
import com.github.javaparser.ast.body.MethodDeclaration;
import com.github.javaparser.ast.body.Parameter;
import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.expr.NameExpr;
import com.github.javaparser.ast.stmt.AssertStmt;
import com.github.javaparser.ast.stmt.IfStmt;
import com.github.javaparser.ast.stmt.ReturnStmt;
import com.github.javaparser.ast.stmt.ThrowStmt;
import dev.plumbline.flow.CfgNode;
import dev.plumbline.flow.ControlFlowGraph;
import dev.plumbline.flow.FlowResult;
import dev.plumbline.flow.ForwardSolver;
import dev.plumbline.model.Effect;
import dev.plumbline.parse.Subtrees;
import dev.plumbline.types.ExpressionTypes;
import dev.plumbline.types.ProjectIndex;
import dev.plumbline.types.Variable;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;

/**
 * Calls of the project's own methods: the callee is evaluated with the caller's argument values
 * bound to its parameters (context-sensitive, like inlining), and its returned value comes back
 * to the caller. So {@code INDArray flat = flatten(batch)} with {@code flatten} returning
 * {@code x.reshape(x.size(0), -1)} has the shape the reshape gives for {@code batch}'s shape.
 *
 * <p>Bounds: helpers up to {@value #MAX_DEPTH} calls deep, of at most {@value #MAX_NODES}
 * graph nodes, never recursive, only methods with a body (not overridable interface
 * declarations). Results are cached per callee and argument values for the file. What the
 * callee knew about its own locals is translated to the call: a size it read itself becomes
 * unknown, a tensor it made is made at the call, an unchecked reshape inside it is pending at
 * the call. A callee that inspects a parameter's shape and throws marks the caller's argument
 * checked.
 */
final class HelperCalls {
  static final int MAX_DEPTH = 2;
  static final int MAX_NODES = 300;

  /**
   * A callee evaluated with given argument values at a given depth. The depth belongs in the key:
   * at the deepest level the callee's own helper calls are not followed, so the same callee and
   * arguments give a less precise value there, and without the depth which graph ran first would
   * decide what later calls get from the cache.
   */
  record Key(Site callee, List<ShapeValue> arguments, int depth) {}

  /** Per callee: which parameters it checks. */
  record Summary(boolean[] checksParameter) {}

  private final ShapeEvaluator ev;
  private final ShapeContext context;

  HelperCalls(ShapeEvaluator ev) {
    this.ev = ev;
    this.context = ev.analysis.context;
  }

  ShapeValue call(MethodCallExpr call, ProjectIndex.ProjectMethod helper, List<ShapeValue> args) {
    if (!(helper.declaration() instanceof MethodDeclaration decl) || decl.getBody().isEmpty()) {
      return null;
    }
    ExpressionTypes calleeTypes = context.typesFor(decl);
    if (calleeTypes == null) {
      return null;
    }
    markCheckedArguments(call, decl, calleeTypes);
    if (ev.analysis.depth >= MAX_DEPTH || context.evaluating.contains(decl)) {
      return null;
    }
    ControlFlowGraph graph = context.graphOf(decl);
    if (graph.nodes().size() > MAX_NODES) {
      return null;
    }
    Key key = new Key(Site.of(decl), args, ev.analysis.depth + 1);
    ShapeValue result;
    if (context.helperResults.containsKey(key)) {
      result = context.helperResults.get(key);
    } else {
      result = evaluate(decl, calleeTypes, graph, args);
      context.helperResults.put(key, result);
    }
    return translate(result, decl, call);
  }

  private ShapeValue evaluate(MethodDeclaration decl, ExpressionTypes calleeTypes, ControlFlowGraph graph,
      List<ShapeValue> args) {
    ShapeState entry = ShapeState.EMPTY;
    for (int i = 0; i < decl.getParameters().size() && i < args.size(); i++) {
      Parameter p = decl.getParameter(i);
      if (p.isVarArgs()) {
        break;
      }
      ShapeValue a = args.get(i);
      if (a != null && !(a instanceof ShapeValue.Int n && !n.value().known())) {
        entry = entry.with(calleeTypes.symbols().variableOf(p), a);
      }
    }
    context.evaluating.push(decl);
    try {
      ShapeAnalysis callee = new ShapeAnalysis(context, calleeTypes, graph, entry, ev.analysis.depth + 1);
      FlowResult<ShapeState> solved = ForwardSolver.solve(graph, callee);
      if (!solved.converged()) {
        return null;
      }
      ShapeValue joined = null;
      boolean any = false;
      for (CfgNode node : graph.nodes()) {
        if (node.ast() instanceof ReturnStmt r && r.getExpression().isPresent() && solved.before(node) != null) {
          ShapeEvaluator e = new ShapeEvaluator(callee, null);
          e.state = solved.before(node);
          ShapeValue v = e.eval(r.getExpression().get());
          joined = any ? ShapeValue.join(joined, v) : v;
          any = true;
        }
      }
      return joined;
    } finally {
      context.evaluating.pop();
    }
  }

  /** The callee's value as the caller sees it at {@code call}. */
  private ShapeValue translate(ShapeValue v, MethodDeclaration decl, MethodCallExpr call) {
    if (v == null) {
      return null;
    }
    Set<Symbol> inner = new HashSet<>();
    collectInnerSymbols(v, decl, inner);
    if (v instanceof ShapeValue.Tensor t) {
      ev.state = ev.state.forget(Site.of(call));
      Site origin = t.origin() == null || inside(t.origin().node(), decl) ? Site.of(call) : t.origin();
      // A reduction the helper took of the caller's tensor is, for the caller, taken at the call.
      ShapeValue.Reduction r = t.reducedFrom();
      if (r != null && inside(r.source().node(), decl)) {
        r = null;
      } else if (r != null && inside(r.call().node(), decl)) {
        r = new ShapeValue.Reduction(r.source(), r.sourceShape(), r.axes(), Site.of(call));
      }
      Set<Site> pending = new HashSet<>();
      for (Site s : t.uncheckedReshapes()) {
        pending.add(inside(s.node(), decl) ? Site.of(call) : s);
      }
      return new ShapeValue.Tensor(t.shape().forgetting(inner), t.framework(), origin, r, pending, false);
    }
    if (v instanceof ShapeValue.Int i) {
      if (i.value().known() && java.util.Collections.disjoint(i.value().symbols(), inner)) {
        return i;
      }
      return ev.unknownResult(call);
    }
    if (v instanceof ShapeValue.Tuple || v instanceof ShapeValue.TensorList || v instanceof NetworkValue
        || v instanceof NetworkValue.Layer) {
      return v.forgetting(inner, Site.of(call));
    }
    return null;
  }

  private static void collectInnerSymbols(ShapeValue v, Node decl, Set<Symbol> out) {
    List<Dim> dims = new ArrayList<>();
    if (v instanceof ShapeValue.Tensor t) {
      for (Symbol s : t.shape().symbols()) {
        if (s.site() != null && inside(s.site(), decl)) {
          out.add(s);
        }
      }
      return;
    }
    if (v instanceof ShapeValue.Int i) {
      dims.add(i.value());
    } else if (v instanceof ShapeValue.Tuple t && t.elements() != null) {
      dims.addAll(t.elements());
    } else if (v instanceof ShapeValue.TensorList l) {
      l.items().forEach(t -> collectInnerSymbols(t, decl, out));
    } else if (v instanceof NetworkValue n) {
      for (NetworkValue.Entry e : n.layers()) {
        if (e.layer() != null) {
          dims.add(e.layer().nIn());
          dims.add(e.layer().nOut());
        }
      }
    }
    for (Dim d : dims) {
      for (Symbol s : d.symbols()) {
        if (s.site() != null && inside(s.site(), decl)) {
          out.add(s);
        }
      }
    }
  }

  static boolean inside(Node node, Node ancestor) {
    Node c = node;
    while (c != null) {
      if (c == ancestor) {
        return true;
      }
      c = c.getParentNode().orElse(null);
    }
    return false;
  }

  // ------------------------------------------------------------------ checks inside helpers

  private void markCheckedArguments(MethodCallExpr call, MethodDeclaration decl, ExpressionTypes calleeTypes) {
    Summary summary = context.helperSummaries.computeIfAbsent(decl, d -> summarize(decl, calleeTypes));
    for (int i = 0; i < summary.checksParameter().length && i < call.getArguments().size(); i++) {
      if (!summary.checksParameter()[i]) {
        continue;
      }
      Expression arg = call.getArgument(i);
      Optional<Variable> v = ev.targetOf(arg);
      if (v.isPresent()) {
        ShapeValue.Tensor t = ev.tensorValueOf(v.get(), arg);
        if (t != null) {
          ev.state = ev.state.with(v.get(), t.asChecked());
        }
      }
    }
  }

  /**
   * Which parameters the helper validates: a shape query on the parameter in an {@code if}
   * whose branch throws, in a precondition call, or in an assert.
   */
  private static Summary summarize(MethodDeclaration decl, ExpressionTypes types) {
    boolean[] checks = new boolean[decl.getParameters().size()];
    List<Expression> conditions = new ArrayList<>();
    Subtrees.walk(decl, n -> {
      if (n instanceof IfStmt i && Subtrees.contains(i.getThenStmt(), ThrowStmt.class)) {
        conditions.add(i.getCondition());
      } else if (n instanceof AssertStmt a) {
        conditions.add(a.getCheck());
      } else if (n instanceof MethodCallExpr c && types.apiMethod(c).map(m -> m.effect() == Effect.CHECK).orElse(false)
          && !c.getArguments().isEmpty()) {
        conditions.add(c.getArgument(0));
      }
    });
    for (Expression condition : conditions) {
      Subtrees.walk(condition, n -> {
        if (n instanceof Expression x) {
          ShapeChecks.query(x, types).ifPresent(q -> {
            if (ShapeEvaluator.unwrap(q.subject()) instanceof NameExpr name) {
              for (int i = 0; i < checks.length; i++) {
                if (decl.getParameter(i).getNameAsString().equals(name.getNameAsString())) {
                  checks[i] = true;
                }
              }
            }
          });
        }
      });
    }
    return new Summary(checks);
  }
}
