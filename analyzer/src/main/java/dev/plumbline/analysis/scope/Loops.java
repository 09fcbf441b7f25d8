package dev.plumbline.analysis.scope;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.BodyDeclaration;
import com.github.javaparser.ast.expr.LambdaExpr;
import com.github.javaparser.ast.expr.ObjectCreationExpr;
import com.github.javaparser.ast.stmt.DoStmt;
import com.github.javaparser.ast.stmt.ForEachStmt;
import com.github.javaparser.ast.stmt.ForStmt;
import com.github.javaparser.ast.stmt.Statement;
import com.github.javaparser.ast.stmt.WhileStmt;
import dev.plumbline.types.Variable;
import java.util.ArrayList;
import java.util.List;

/**
 * Loops as the source writes them, and what lives for one iteration of a loop versus across
 * iterations. Lexical: a lambda or a local class body is a boundary (its code may run at any
 * time), so a loop outside one does not enclose code inside it.
 */
public final class Loops {
  private Loops() {}

  public static boolean isLoop(Node n) {
    return n instanceof ForStmt || n instanceof ForEachStmt || n instanceof WhileStmt
        || n instanceof DoStmt;
  }

  /** Loops whose every iteration evaluates {@code node}, innermost first. */
  public static List<Statement> enclosing(Node node) {
    List<Statement> out = new ArrayList<>();
    Node current = node.getParentNode().orElse(null);
    while (current != null && !isBoundary(current)) {
      if (isLoop(current) && perIteration((Statement) current, node)) {
        out.add((Statement) current);
      }
      current = current.getParentNode().orElse(null);
    }
    return out;
  }

  /** The innermost loop whose iterations evaluate {@code node}, or null. */
  public static Statement innermost(Node node) {
    List<Statement> loops = enclosing(node);
    return loops.isEmpty() ? null : loops.get(0);
  }

  /**
   * Whether {@code node} is evaluated (or declared) afresh in each iteration of {@code loop}: it
   * is inside the loop but not in a {@code for} initializer or a for-each iterable, which run
   * once. The loop statement itself counts for a for-each, whose element is bound per iteration.
   */
  public static boolean perIteration(Statement loop, Node node) {
    if (node == loop) {
      return loop instanceof ForEachStmt;
    }
    Node child = node;
    Node current = node.getParentNode().orElse(null);
    while (current != null) {
      if (current == loop) {
        if (loop instanceof ForStmt f) {
          Node direct = child;
          return f.getInitialization().stream().noneMatch(init -> init == direct);
        }
        if (loop instanceof ForEachStmt f) {
          return child != f.getIterable();
        }
        return true;
      }
      if (isBoundary(current)) {
        return false;
      }
      child = current;
      current = current.getParentNode().orElse(null);
    }
    return false;
  }

  /** Whether a variable keeps its value from one iteration of {@code loop} to the next. */
  public static boolean survives(Variable v, Statement loop) {
    return v.isField() || !perIteration(loop, v.declaration());
  }

  /** Whether {@code node} lies inside {@code ancestor} without crossing a lambda or class body. */
  public static boolean within(Node node, Node ancestor) {
    Node current = node;
    while (current != null) {
      if (current == ancestor) {
        return true;
      }
      if (current != node && isBoundary(current)) {
        return false;
      }
      current = current.getParentNode().orElse(null);
    }
    return false;
  }

  static boolean isBoundary(Node n) {
    return n instanceof LambdaExpr || n instanceof BodyDeclaration<?>
        || n instanceof ObjectCreationExpr oce && oce.getAnonymousClassBody().isPresent();
  }
}
