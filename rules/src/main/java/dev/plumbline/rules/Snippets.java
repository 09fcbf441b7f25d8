package dev.plumbline.rules;

import com.github.javaparser.ast.Node;
import dev.plumbline.parse.LineMap;
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

  /** The node's start line as reported (a notebook's file line), as a string argument. */
  public static String line(Node node) {
    LineMap lines = LineMap.of(node);
    return node.getBegin().map(p -> String.valueOf(lines.reportedLine(p.line))).orElse("?");
  }

  /** Data roles as report words, in the enum's order: {@code whole, test}. */
  public static String roles(java.util.Set<dev.plumbline.analysis.provenance.Role> roles) {
    return roles.stream().sorted().map(r -> r.name().toLowerCase(java.util.Locale.ROOT).replace('_', '-'))
        .collect(java.util.stream.Collectors.joining(", "));
  }
}
