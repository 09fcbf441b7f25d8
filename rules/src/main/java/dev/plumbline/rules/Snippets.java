package dev.plumbline.rules;

import com.github.javaparser.ast.Node;
import dev.plumbline.flow.AstText;

/** Short renderings of code for message arguments. */
public final class Snippets {
  private static final int MAX = 48;

  private Snippets() {}

  /**
   * The code as written without comments, whitespace collapsed, shortened with an ellipsis past
   * {@value #MAX} chars.
   */
  public static String of(Node node) {
    if (node == null) {
      return "?";
    }
    String s = AstText.code(node);
    return s.length() <= MAX ? s : s.substring(0, MAX - 3) + "...";
  }

  /** The node's start line, as a string argument. */
  public static String line(Node node) {
    return node.getBegin().map(p -> String.valueOf(p.line)).orElse("?");
  }
}
