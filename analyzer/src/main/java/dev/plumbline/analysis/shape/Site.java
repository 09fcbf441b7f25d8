package dev.plumbline.analysis.shape;

import com.github.javaparser.ast.Node;

/**
 * A place in the scanned code, compared by identity (JavaParser's {@code Node.equals} is
 * structural, so two identical calls on different lines would otherwise be one).
 */
public final class Site {
  private final Node node;

  private Site(Node node) {
    this.node = node;
  }

  public static Site of(Node node) {
    return node == null ? null : new Site(node);
  }

  public Node node() {
    return node;
  }

  public int line() {
    return node.getBegin().map(p -> p.line).orElse(0);
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof Site s && s.node == node;
  }

  @Override
  public int hashCode() {
    return System.identityHashCode(node);
  }

  @Override
  public String toString() {
    return "@" + line();
  }
}
