package dev.plumbline.analysis.scope;

import com.github.javaparser.ast.Node;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Comparator;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Set;

/**
 * An immutable set of AST nodes compared by identity (JavaParser's {@code Node.equals} is
 * structural, so two identical calls on different lines would otherwise be one element).
 * Iteration for output is in source order, so messages and dumps are deterministic.
 */
public final class NodeSet {
  static final NodeSet EMPTY = new NodeSet(Set.of());

  static final Comparator<Node> BY_POSITION = Comparator
      .comparingInt((Node n) -> n.getBegin().map(p -> p.line).orElse(0))
      .thenComparingInt(n -> n.getBegin().map(p -> p.column).orElse(0))
      .thenComparingInt(n -> n.getEnd().map(p -> p.line).orElse(0))
      .thenComparingInt(n -> n.getEnd().map(p -> p.column).orElse(0));

  private final Set<Node> nodes;

  private NodeSet(Set<Node> nodes) {
    this.nodes = nodes;
  }

  static NodeSet of(Node node) {
    Set<Node> s = Collections.newSetFromMap(new IdentityHashMap<>());
    s.add(node);
    return new NodeSet(Collections.unmodifiableSet(s));
  }

  NodeSet union(NodeSet other) {
    if (other.nodes.isEmpty() || nodes.containsAll(other.nodes)) {
      return this;
    }
    if (nodes.isEmpty()) {
      return other;
    }
    Set<Node> s = Collections.newSetFromMap(new IdentityHashMap<>());
    s.addAll(nodes);
    s.addAll(other.nodes);
    return new NodeSet(Collections.unmodifiableSet(s));
  }

  public boolean contains(Node n) {
    return nodes.contains(n);
  }

  public boolean isEmpty() {
    return nodes.isEmpty();
  }

  public int size() {
    return nodes.size();
  }

  /** The nodes in source order. */
  public List<Node> sorted() {
    List<Node> out = new ArrayList<>(nodes);
    out.sort(BY_POSITION);
    return out;
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof NodeSet other && other.nodes.size() == nodes.size()
        && nodes.containsAll(other.nodes);
  }

  @Override
  public int hashCode() {
    int h = 0;
    for (Node n : nodes) {
      h += System.identityHashCode(n);
    }
    return h;
  }

  @Override
  public String toString() {
    StringBuilder sb = new StringBuilder("[");
    for (Node n : sorted()) {
      if (sb.length() > 1) {
        sb.append(", ");
      }
      sb.append(n.getBegin().map(p -> p.line + ":" + p.column).orElse("?"));
    }
    return sb.append(']').toString();
  }
}
