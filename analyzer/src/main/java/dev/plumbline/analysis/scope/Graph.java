package dev.plumbline.analysis.scope;

import java.util.EnumSet;
import java.util.Set;

/**
 * Whether a tensor may carry an autograd graph: the record of operations that produced it,
 * kept so gradients can flow back through them. A value holds a may-set of these: {ATTACHED}
 * is certain, {ATTACHED, DETACHED} means "on some paths".
 */
public enum Graph {
  /** Produced under gradient recording from a forward pass, a loss, or a SameDiff graph. */
  ATTACHED,
  /** Known to carry no graph: created outside recording, or detached explicitly. */
  DETACHED,
  /** Entered from code we do not see (a parameter, a field, an unmodeled call). */
  UNKNOWN;

  static final Set<Graph> ATTACHED_ONLY = Set.of(ATTACHED);
  static final Set<Graph> DETACHED_ONLY = Set.of(DETACHED);
  static final Set<Graph> UNKNOWN_ONLY = Set.of(UNKNOWN);

  /**
   * The graph status of an operation's result under gradient recording: attached when either
   * operand is, detached only when both are. Applied pointwise to may-sets.
   */
  static Set<Graph> either(Set<Graph> left, Set<Graph> right) {
    if (left.isEmpty()) {
      return right;
    }
    if (right.isEmpty()) {
      return left;
    }
    EnumSet<Graph> out = EnumSet.noneOf(Graph.class);
    for (Graph a : left) {
      for (Graph b : right) {
        out.add(a == ATTACHED || b == ATTACHED ? ATTACHED
            : a == DETACHED && b == DETACHED ? DETACHED : UNKNOWN);
      }
    }
    return Set.copyOf(out);
  }

  static Set<Graph> union(Set<Graph> left, Set<Graph> right) {
    if (left.containsAll(right)) {
      return left;
    }
    EnumSet<Graph> out = EnumSet.noneOf(Graph.class);
    out.addAll(left);
    out.addAll(right);
    return Set.copyOf(out);
  }
}
