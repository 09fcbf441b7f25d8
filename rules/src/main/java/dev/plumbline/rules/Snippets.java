package dev.plumbline.rules;

import com.github.javaparser.ast.Node;

/** Short renderings of code for message arguments. */
public final class Snippets {
  private static final int MAX = 48;

  private Snippets() {}

  /** The code as written, whitespace collapsed, shortened with an ellipsis past {@value #MAX} chars. */
  public static String of(Node node) {
    if (node == null) {
      return "?";
    }
    String s = node.toString().replaceAll("\\s+", " ").trim();
    return s.length() <= MAX ? s : s.substring(0, MAX - 3) + "...";
  }

  /**
   * Where to anchor a finding on a call: the call itself, or, for a call at the end of a chain
   * that starts on an earlier line (a builder chain), its method name, so the finding points at
   * the line of the harmful call rather than the start of the chain.
   */
  public static Node anchor(Node node) {
    if (node instanceof com.github.javaparser.ast.expr.MethodCallExpr call) {
      int start = call.getBegin().map(p -> p.line).orElse(0);
      int name = call.getName().getBegin().map(p -> p.line).orElse(start);
      return name != start ? call.getName() : call;
    }
    return node;
  }

  /** The node's start line, as a string argument. */
  public static String line(Node node) {
    return node.getBegin().map(p -> String.valueOf(p.line)).orElse("?");
  }
}
