package dev.plumbline.flow;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.stmt.DoStmt;
import com.github.javaparser.ast.stmt.ForEachStmt;
import com.github.javaparser.ast.stmt.ForStmt;
import com.github.javaparser.ast.stmt.IfStmt;
import com.github.javaparser.ast.stmt.SwitchStmt;
import com.github.javaparser.ast.stmt.TryStmt;
import com.github.javaparser.ast.stmt.WhileStmt;

/** Short one-line renderings of AST elements for dumps and messages. */
public final class AstText {
  private static final int MAX = 60;

  private AstText() {}

  public static String abbreviate(Node node) {
    String text;
    if (node instanceof ForEachStmt f) {
      text = "for (" + f.getVariable() + " : " + f.getIterable() + ")";
    } else if (node instanceof IfStmt || node instanceof WhileStmt || node instanceof ForStmt
        || node instanceof DoStmt || node instanceof SwitchStmt || node instanceof TryStmt) {
      text = node.getClass().getSimpleName();
    } else {
      text = node.toString();
    }
    text = text.replaceAll("\\s+", " ").trim();
    return text.length() <= MAX ? text : text.substring(0, MAX - 3) + "...";
  }
}
