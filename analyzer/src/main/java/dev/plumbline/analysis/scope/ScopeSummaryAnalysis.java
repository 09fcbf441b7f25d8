package dev.plumbline.analysis.scope;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.CallableDeclaration;
import com.github.javaparser.ast.body.MethodDeclaration;
import com.github.javaparser.ast.body.Parameter;
import com.github.javaparser.ast.expr.MethodCallExpr;
import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.ProjectAnalysis;
import dev.plumbline.engine.ProjectFacts;
import dev.plumbline.engine.Workers;
import dev.plumbline.flow.ControlFlowGraph;
import dev.plumbline.parse.Subtrees;
import dev.plumbline.types.ProjectIndex;
import java.util.ArrayList;
import java.util.Collections;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;

/**
 * Summarizes the project's own methods for the scope analysis ({@link HelperSummary}), so that a
 * helper that computes a loss and returns it, or opens gradient recording for a training step,
 * is understood at its call sites.
 *
 * <p>Each method that returns a tensor is analyzed in a few entry contexts: outside and inside
 * gradient recording with every tensor parameter detached, and once per tensor parameter with
 * that parameter attached (does its graph reach the result?). Whether a result is owned by a
 * parameter's manager is read from the returned value's scopes. Summaries that call other
 * helpers are recomputed (only those calling a helper whose summary changed, files in parallel)
 * until nothing changes, at most {@value #MAX_ROUNDS} rounds; a helper
 * still changing after that keeps its last summary (recursion through many helpers is rare and
 * the last round's facts are still sound for the rounds they saw). Deterministic: files and
 * methods are visited in their given order.
 */
public final class ScopeSummaryAnalysis implements ProjectAnalysis {
  static final int MAX_ROUNDS = 4;

  @Override
  public void compute(List<FileContext> files, ProjectIndex index, ProjectFacts out,
      Workers workers) {
    List<FileMethods> byFile = workers.map(files, FileMethods::of);
    ScopeSummaries current = ScopeSummaries.NONE;
    Set<CallableDeclaration<?>> changed = null; // null: the first round, summarize every method
    for (int round = 0; round < MAX_ROUNDS; round++) {
      ScopeSummaries known = current;
      Set<CallableDeclaration<?>> stale = changed;
      List<Map<CallableDeclaration<?>, HelperSummary>> parts =
          workers.map(byFile, f -> f.summarize(known, stale));
      Map<CallableDeclaration<?>, HelperSummary> next = new IdentityHashMap<>();
      parts.forEach(next::putAll);
      ScopeSummaries computed = new ScopeSummaries(next);
      changed = computed.differingFrom(current);
      current = computed;
      if (changed.isEmpty()) {
        break;
      }
    }
    out.put(ScopeSummaries.class, current);
  }

  /**
   * The methods of one file and the project methods each calls. A method's summary depends on
   * the summaries of project methods it calls and on nothing else that changes between rounds,
   * so a round recomputes only the methods that call one whose summary changed.
   */
  private record FileMethods(FileContext file, List<ControlFlowGraph> graphs,
      List<Set<CallableDeclaration<?>>> callees) {

    static FileMethods of(FileContext file) {
      List<ControlFlowGraph> graphs = new ArrayList<>();
      List<Set<CallableDeclaration<?>>> callees = new ArrayList<>();
      for (ControlFlowGraph g : file.graphs()) {
        if (g.callable() instanceof MethodDeclaration m) {
          graphs.add(g);
          Set<CallableDeclaration<?>> called = Collections.newSetFromMap(new IdentityHashMap<>());
          for (MethodCallExpr call : Subtrees.findAll(m, MethodCallExpr.class)) {
            file.types().projectMethod(call).ifPresent(pm -> called.add(pm.declaration()));
          }
          callees.add(called);
        }
      }
      return new FileMethods(file, graphs, callees);
    }

    /**
     * Summaries of this file's methods given {@code known}; a method calling nothing in
     * {@code stale} (null: everything is stale) keeps its summary in {@code known}.
     */
    Map<CallableDeclaration<?>, HelperSummary> summarize(ScopeSummaries known,
        Set<CallableDeclaration<?>> stale) {
      Map<CallableDeclaration<?>, HelperSummary> out = new IdentityHashMap<>();
      for (int i = 0; i < graphs.size(); i++) {
        ControlFlowGraph g = graphs.get(i);
        MethodDeclaration m = (MethodDeclaration) g.callable();
        HelperSummary s = stale == null || callsAny(callees.get(i), stale)
            ? ScopeSummaryAnalysis.summarize(file, g, m, known)
            : known.of(m);
        if (s != null) {
          out.put(m, s);
        }
      }
      return out;
    }

    private static boolean callsAny(Set<CallableDeclaration<?>> called,
        Set<CallableDeclaration<?>> stale) {
      for (CallableDeclaration<?> c : called) { // usually far fewer than the stale ones
        if (stale.contains(c)) {
          return true;
        }
      }
      return false;
    }
  }

  private static HelperSummary summarize(FileContext file, ControlFlowGraph g, MethodDeclaration m,
      ScopeSummaries summaries) {
    boolean records = false;
    for (MethodCallExpr call : Subtrees.findAll(m, MethodCallExpr.class, c -> Loops.within(c, m))) {
      records |= ScopeAnalysis.recordsGradients(file.analysis(TypeTraits.KEY), summaries, call);
    }
    ScopeAnalysis probe = new ScopeAnalysis(file, g, ScopeAnalysis.EntryContext.NORMAL, summaries);
    TensorValue.Kind returns = probe.trackedKind(file.types().symbols().types().resolve(m.getType()));
    if (returns != TensorValue.Kind.TENSOR && returns != TensorValue.Kind.TENSOR_LIST) {
      return records ? HelperSummary.trainingStepOnly(true) : null;
    }
    Map<Node, TensorValue> detached = new IdentityHashMap<>();
    List<Parameter> params = m.getParameters();
    for (Parameter p : params) {
      TensorValue v = parameterValue(probe, p, Graph.DETACHED_ONLY);
      if (v != null) {
        detached.put(p, v);
      }
    }
    List<TensorValue> outside = ScopeAnalysis.returnedValues(file, g,
        new ScopeAnalysis.EntryContext(false, detached), summaries);
    List<TensorValue> inside = ScopeAnalysis.returnedValues(file, g,
        new ScopeAnalysis.EntryContext(true, detached), summaries);
    if (outside == null || inside == null) {
      return records ? HelperSummary.trainingStepOnly(true) : null;
    }
    Set<Graph> insideGraph = graphOf(inside);
    Set<Integer> graphFrom = new TreeSet<>();
    Set<Integer> scopesFrom = new TreeSet<>();
    for (int i = 0; i < params.size(); i++) {
      Parameter p = params.get(i);
      TensorValue base = detached.get(p);
      if (base == null) {
        continue;
      }
      for (TensorValue r : inside) {
        if (r != null && r.scopes().stream().anyMatch(s -> s.site() == p)) {
          scopesFrom.add(i);
        }
      }
      if (!base.isTensor() || insideGraph.equals(Graph.ATTACHED_ONLY)) {
        continue;
      }
      Map<Node, TensorValue> oneAttached = new IdentityHashMap<>(detached);
      oneAttached.put(p, base.withGraph(Graph.ATTACHED_ONLY, NodeSet.EMPTY));
      List<TensorValue> through = ScopeAnalysis.returnedValues(file, g,
          new ScopeAnalysis.EntryContext(true, oneAttached), summaries);
      if (through != null && graphOf(through).contains(Graph.ATTACHED) && !insideGraph.contains(Graph.ATTACHED)) {
        graphFrom.add(i);
      }
    }
    return new HelperSummary(returns, graphOf(outside), insideGraph, graphFrom, scopesFrom, records);
  }

  /** A parameter's value on entry, with the given graph status; its manager is the parameter's own. */
  private static TensorValue parameterValue(ScopeAnalysis probe, Parameter p, Set<Graph> graph) {
    TensorValue entered = probe.entered(p, probe.types.typeOf(probe.types.symbols().variableOf(p)));
    if (entered == null || !entered.isTensor()) {
      return entered;
    }
    return entered.withGraph(graph, NodeSet.EMPTY);
  }

  private static Set<Graph> graphOf(List<TensorValue> values) {
    Set<Graph> out = Set.of();
    for (TensorValue v : values) {
      if (v != null && v.isTensor()) {
        out = Graph.union(out, v.graph());
      }
    }
    return out;
  }
}
