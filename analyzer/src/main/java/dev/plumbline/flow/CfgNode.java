package dev.plumbline.flow;

import com.github.javaparser.ast.Node;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

/**
 * One point of evaluation in a {@link ControlFlowGraph}.
 *
 * <p>A node evaluates one AST element: a whole simple statement (expression statement, local
 * declaration, assert), or the expression part of a compound statement (an {@code if} condition,
 * a {@code for} update, a returned value, a for-each binding). Expressions inside a node are
 * evaluated by the analysis itself in Java's left-to-right order; the graph only orders nodes.
 */
public final class CfgNode {

  /** What the node does with its {@link #ast()} element. */
  public enum Kind {
    /** Method entry: parameters are bound. {@code ast} is the callable declaration. */
    ENTRY,
    /** Normal and exceptional exit. {@code ast} is the callable declaration. */
    EXIT,
    /** Evaluates a statement or expression for its effects. */
    EVAL,
    /** Evaluates a boolean expression and branches on it: see {@link Edge.Kind#TRUE}. */
    CONDITION,
    /** Binds the next element of a for-each loop; {@code ast} is the {@code ForEachStmt}. */
    FOREACH_NEXT,
    /** Binds a caught exception; {@code ast} is the {@code CatchClause}. */
    CATCH,
    /** Join point with no evaluation (loop heads, finally entry). */
    JOIN
  }

  /** A directed edge; conditions have one {@code TRUE} and one {@code FALSE} edge. */
  public record Edge(CfgNode target, Kind kind) {
    public enum Kind { NORMAL, TRUE, FALSE, EXCEPTION }
  }

  private final int id;
  private final Kind kind;
  private final Node ast;
  private final List<Edge> successors = new ArrayList<>(2);
  private final List<CfgNode> predecessors = new ArrayList<>(2);

  CfgNode(int id, Kind kind, Node ast) {
    this.id = id;
    this.kind = kind;
    this.ast = ast;
  }

  /** Position in creation order, which follows source order; stable across runs. */
  public int id() {
    return id;
  }

  public Kind kind() {
    return kind;
  }

  public Node ast() {
    return ast;
  }

  public List<Edge> successors() {
    return Collections.unmodifiableList(successors);
  }

  public List<CfgNode> predecessors() {
    return Collections.unmodifiableList(predecessors);
  }

  void addEdge(CfgNode target, Edge.Kind edgeKind) {
    for (Edge e : successors) {
      if (e.target() == target && e.kind() == edgeKind) {
        return;
      }
    }
    successors.add(new Edge(target, edgeKind));
    target.predecessors.add(this);
  }

  @Override
  public String toString() {
    return id + ":" + kind;
  }
}
