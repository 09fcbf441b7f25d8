package dev.plumbline.flow;

import com.github.javaparser.ast.Node;
import java.util.Collections;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The control-flow graph of one callable body (method, constructor, initializer or lambda).
 *
 * <p>Built by {@link CfgBuilder}. Nodes are numbered in source order. Loops are recorded with
 * their head so analyses can widen there and rules can ask which loop a node sits in.
 */
public final class ControlFlowGraph {

  private final Node callable;
  private final List<CfgNode> nodes;
  private final CfgNode entry;
  private final CfgNode exit;
  private final Map<Node, CfgNode> nodeByAst;
  private final Set<CfgNode> loopHeads;

  ControlFlowGraph(
      Node callable,
      List<CfgNode> nodes,
      CfgNode entry,
      CfgNode exit,
      Map<Node, CfgNode> nodeByAst,
      Set<CfgNode> loopHeads) {
    this.callable = callable;
    this.nodes = List.copyOf(nodes);
    this.entry = entry;
    this.exit = exit;
    this.nodeByAst = new IdentityHashMap<>(nodeByAst);
    this.loopHeads = Collections.unmodifiableSet(loopHeads);
  }

  /** The declaration or lambda whose body this graph describes. */
  public Node callable() {
    return callable;
  }

  public List<CfgNode> nodes() {
    return nodes;
  }

  public CfgNode entry() {
    return entry;
  }

  public CfgNode exit() {
    return exit;
  }

  /** Nodes that are targets of a back edge; the solver widens here. */
  public Set<CfgNode> loopHeads() {
    return loopHeads;
  }

  /** The node evaluating exactly this AST element, or null if the element has no node of its own. */
  public CfgNode nodeOf(Node ast) {
    return nodeByAst.get(ast);
  }

  /**
   * The node that evaluates {@code ast} or the nearest enclosing element that has one. Used to
   * find the state at an expression nested inside a statement.
   */
  public CfgNode enclosingNode(Node ast) {
    Node current = ast;
    while (current != null) {
      CfgNode node = nodeByAst.get(current);
      if (node != null) {
        return node;
      }
      if (current == callable) {
        return null;
      }
      current = current.getParentNode().orElse(null);
    }
    return null;
  }

  /** A compact text dump, one node per line, for golden tests of the builder. */
  public String dump() {
    StringBuilder out = new StringBuilder();
    for (CfgNode n : nodes) {
      out.append(n.id()).append(' ').append(n.kind());
      if (n.kind() != CfgNode.Kind.ENTRY && n.kind() != CfgNode.Kind.EXIT && n.ast() != null) {
        out.append(" L").append(n.ast().getBegin().map(p -> p.line).orElse(0));
        out.append(" ").append(AstText.abbreviate(n.ast()));
      }
      out.append(" ->");
      for (CfgNode.Edge e : n.successors()) {
        out.append(' ').append(e.target().id());
        if (e.kind() != CfgNode.Edge.Kind.NORMAL) {
          out.append(e.kind().name().charAt(0));
        }
      }
      if (loopHeads.contains(n)) {
        out.append(" [loop-head]");
      }
      out.append('\n');
    }
    return out.toString();
  }
}
