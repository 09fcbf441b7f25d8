package dev.plumbline.flow;

import java.util.List;

/**
 * The solution of a forward analysis: the state before each node, indexed by node id.
 *
 * <p>An unreachable node has a null state. If the solver gave up (iteration budget exhausted),
 * {@link #converged()} is false and the states are not a fixed point: analyses must then publish
 * nothing for this graph rather than facts that might be wrong.
 */
public final class FlowResult<S> {
  private final ControlFlowGraph graph;
  private final List<S> before;
  private final boolean converged;

  FlowResult(ControlFlowGraph graph, List<S> before, boolean converged) {
    this.graph = graph;
    this.before = before;
    this.converged = converged;
  }

  public ControlFlowGraph graph() {
    return graph;
  }

  public boolean converged() {
    return converged;
  }

  /** State on entry to {@code node}; null when the node is unreachable. */
  public S before(CfgNode node) {
    return before.get(node.id());
  }
}
