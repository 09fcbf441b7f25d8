package dev.plumbline.analysis.scope;

import java.util.Comparator;
import java.util.HashSet;
import java.util.Set;
import java.util.stream.Collectors;

/**
 * The abstract value of one expression the scope analysis tracks: a tensor, a list of tensors,
 * or a handle on a scope (manager, workspace, gradient collector, batch).
 *
 * <p>Join is set union on every component; two different kinds join to {@link Kind#MIXED},
 * which queries treat as "nothing known". Immutable.
 *
 * @param kind what the value is
 * @param graph may-set of graph status (empty for handles)
 * @param origins forward, loss or helper calls whose graph the value may carry
 * @param scopes memory scopes that may own the value; for a handle, the scope it denotes
 * @param allocations calls that created the arrays the value may reference, in this method
 */
public record TensorValue(Kind kind, Set<Graph> graph, NodeSet origins, Set<Scope> scopes,
    NodeSet allocations) {

  public enum Kind { TENSOR, TENSOR_LIST, SCOPE_HANDLE, MIXED }

  public TensorValue {
    graph = Set.copyOf(graph);
    scopes = Set.copyOf(scopes);
  }

  static TensorValue handle(Scope scope) {
    return new TensorValue(Kind.SCOPE_HANDLE, Set.of(), NodeSet.EMPTY, Set.of(scope), NodeSet.EMPTY);
  }

  static TensorValue handle(Set<Scope> scopes) {
    return new TensorValue(Kind.SCOPE_HANDLE, Set.of(), NodeSet.EMPTY, scopes, NodeSet.EMPTY);
  }

  static TensorValue tensor(Kind kind, Set<Graph> graph, NodeSet origins, Set<Scope> scopes,
      NodeSet allocations) {
    return new TensorValue(kind, graph, origins, scopes, allocations);
  }

  public boolean isTensor() {
    return kind == Kind.TENSOR || kind == Kind.TENSOR_LIST;
  }

  /** Every path gives an attached value. */
  public boolean certainlyAttached() {
    return isTensor() && graph.equals(Graph.ATTACHED_ONLY);
  }

  /** Some path gives an attached value. */
  public boolean mayBeAttached() {
    return isTensor() && graph.contains(Graph.ATTACHED);
  }

  TensorValue withKind(Kind k) {
    return k == kind ? this : new TensorValue(k, graph, origins, scopes, allocations);
  }

  TensorValue withGraph(Set<Graph> g, NodeSet o) {
    return new TensorValue(kind, g, o, scopes, allocations);
  }

  TensorValue withScopes(Set<Scope> s) {
    return new TensorValue(kind, graph, origins, s, allocations);
  }

  TensorValue withAllocations(NodeSet a) {
    return new TensorValue(kind, graph, origins, scopes, a);
  }

  public TensorValue join(TensorValue other) {
    if (other == null || other.equals(this)) {
      return this;
    }
    Set<Scope> s = new HashSet<>(scopes);
    s.addAll(other.scopes);
    return new TensorValue(kind == other.kind ? kind : Kind.MIXED, Graph.union(graph, other.graph),
        origins.union(other.origins), s, allocations.union(other.allocations));
  }

  /** Stable one-line rendering for dumps. */
  @Override
  public String toString() {
    String s = kind == Kind.SCOPE_HANDLE ? "handle" : kind.name().toLowerCase(java.util.Locale.ROOT);
    if (!graph.isEmpty()) {
      s += graph.stream().sorted().map(Graph::name).collect(Collectors.joining("|", "(", ")"));
    }
    if (!scopes.isEmpty()) {
      s += scopes.stream().sorted(Comparator.comparing(Scope::site, NodeSet.BY_POSITION))
          .map(sc -> sc.kind().name().toLowerCase(java.util.Locale.ROOT) + ":" + sc.label())
          .collect(Collectors.joining(",", " in{", "}"));
    }
    if (!allocations.isEmpty()) {
      s += " new" + allocations;
    }
    return s;
  }
}
