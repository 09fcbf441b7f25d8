package dev.plumbline.analysis.shape;

import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.stmt.ForEachStmt;
import dev.plumbline.engine.AnalysisKey;
import dev.plumbline.engine.FileContext;
import dev.plumbline.flow.CfgNode;
import dev.plumbline.flow.ControlFlowGraph;
import dev.plumbline.flow.FlowAnalysis;
import dev.plumbline.flow.FlowResult;
import dev.plumbline.flow.ForwardSolver;
import dev.plumbline.types.ExpressionTypes;

/**
 * Symbolic shape inference: the shape of every tensor at each point of each method, with each
 * size a constant, a named {@link Symbol} (a batch size read from {@code size(0)}, an
 * {@code int} parameter or field, a value from a call we do not model) or unknown, plus
 * {@code int} values, arrays of sizes, DJL {@code Shape}s and DL4J network configurations.
 *
 * <p>Approximation: a forward must-analysis per callable body over {@link ShapeState}. Library
 * semantics come from the API model ({@code Effect} CREATE, RESHAPE, PERMUTE, TRANSPOSE,
 * MATMUL, REDUCE, ELEMENTWISE, VECTOR_OP, CONCAT, SHAPE_QUERY, CHECK, network configuration
 * effects; each entry checked against the real jars) and the transfer functions of
 * {@link ShapeSemantics}, measured against the real libraries. Conditions teach sizes on the
 * path that continues ({@link ShapeChecks}); calls of the project's own small methods are
 * evaluated with the caller's argument values ({@link HelperCalls}). Errs towards unknown:
 * anything not modelled has no value, a size is only equal to another when both are the same
 * constant or symbol, and no facts are published for a graph whose solution did not converge.
 *
 * <p>It publishes {@link ShapeFacts} and never reports. As {@code ProvenanceAnalysis}, it
 * solves each graph silently, then evaluates each node once more on the converged state to
 * record facts.
 */
public final class ShapeAnalysis implements FlowAnalysis<ShapeState> {

  public static final AnalysisKey<ShapeFacts> KEY = AnalysisKey.of("shape", ShapeAnalysis::analyzeFile);

  final ShapeContext context;
  final ExpressionTypes types;
  final ControlFlowGraph graph;
  private final ShapeState entry;
  /** How many helper calls deep this evaluation is (0 for a method analyzed on its own). */
  final int depth;

  ShapeAnalysis(ShapeContext context, ExpressionTypes types, ControlFlowGraph graph, ShapeState entry, int depth) {
    this.context = context;
    this.types = types;
    this.graph = graph;
    this.entry = entry;
    this.depth = depth;
  }

  static ShapeFacts analyzeFile(FileContext file) {
    ShapeContext context = new ShapeContext(file);
    ShapeFacts facts = new ShapeFacts();
    for (ControlFlowGraph g : file.graphs()) {
      ShapeAnalysis analysis = new ShapeAnalysis(context, file.types(), g, ShapeState.EMPTY, 0);
      FlowResult<ShapeState> result = ForwardSolver.solve(g, analysis);
      if (!result.converged()) {
        continue;
      }
      for (CfgNode node : g.nodes()) {
        ShapeState before = result.before(node);
        if (before != null) {
          new ShapeEvaluator(analysis, facts).node(node, before);
        }
      }
    }
    return facts;
  }

  // ------------------------------------------------------------------ FlowAnalysis

  @Override
  public ShapeState entryState(ControlFlowGraph g) {
    return entry;
  }

  @Override
  public ShapeState join(ShapeState left, ShapeState right) {
    return left.join(right);
  }

  /** Drops every variable whose value changed at the loop head: see {@link ShapeState}. */
  @Override
  public ShapeState widen(ShapeState previous, ShapeState next) {
    return previous.widen(next);
  }

  @Override
  public ShapeState transfer(CfgNode node, ShapeState in) {
    return new ShapeEvaluator(this, null).node(node, in);
  }

  @Override
  public Branches<ShapeState> transferBranch(CfgNode node, ShapeState in) {
    ShapeState out = transfer(node, in);
    if (node.kind() == CfgNode.Kind.FOREACH_NEXT) {
      return new Branches<>(out, in);
    }
    if (node.ast() instanceof Expression condition && !(node.ast() instanceof ForEachStmt)) {
      ShapeChecks checks = new ShapeChecks(this);
      return new Branches<>(checks.learn(condition, out, true), checks.learn(condition, out, false));
    }
    return new Branches<>(out, out);
  }
}
