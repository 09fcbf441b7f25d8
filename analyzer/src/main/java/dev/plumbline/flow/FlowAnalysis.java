package dev.plumbline.flow;

/**
 * A forward data-flow analysis over a {@link ControlFlowGraph}, solved by {@link ForwardSolver}.
 *
 * <p>Contract for the abstract state {@code S}:
 * <ul>
 *   <li>States are immutable values with {@code equals}; the solver never mutates one and an
 *       implementation must not either.
 *   <li>{@link #join} is the least upper bound (or a sound over-approximation of it): commutative,
 *       associative, idempotent, and it never mutates its inputs.
 *   <li>{@link #widen} returns a state at least as large as both arguments and guarantees that
 *       repeated widening at a loop head stabilizes in finitely many steps. Analyses over finite
 *       lattices may keep the default, which joins.
 * </ul>
 */
public interface FlowAnalysis<S> {

  /** State on entry to the callable (parameters bound, nothing else known). */
  S entryState(ControlFlowGraph graph);

  S join(S left, S right);

  default S widen(S previous, S next) {
    return join(previous, next);
  }

  /** Effect of evaluating a non-branching node. */
  S transfer(CfgNode node, S in);

  /**
   * Effect of a {@link CfgNode.Kind#CONDITION} or {@link CfgNode.Kind#FOREACH_NEXT} node: the
   * state when the condition holds (or an element is bound) and when it does not. The default
   * learns nothing from the outcome.
   */
  default Branches<S> transferBranch(CfgNode node, S in) {
    S out = transfer(node, in);
    return new Branches<>(out, out);
  }

  /** States after a branching node. */
  record Branches<S>(S whenTrue, S whenFalse) {}
}
