package dev.plumbline.flow;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.stmt.DoStmt;
import com.github.javaparser.ast.stmt.ForEachStmt;
import com.github.javaparser.ast.stmt.ForStmt;
import com.github.javaparser.ast.stmt.IfStmt;
import com.github.javaparser.ast.stmt.SwitchStmt;
import com.github.javaparser.ast.stmt.TryStmt;
import com.github.javaparser.ast.stmt.WhileStmt;
import com.github.javaparser.printer.configuration.DefaultConfigurationOption;
import com.github.javaparser.printer.configuration.DefaultPrinterConfiguration;
import java.util.regex.Pattern;

/** Short one-line renderings of AST elements for dumps and messages. */
public final class AstText {
  private static final int MAX = 60;
  private static final Pattern WHITESPACE = Pattern.compile("\\s+");

  private AstText() {}

  /**
   * The code of a node on one line, without comments: a trailing line comment is attached to the
   * next node by the parser and would otherwise end up inside message arguments.
   */
  public static String code(Node node) {
    DefaultPrinterConfiguration noComments = new DefaultPrinterConfiguration();
    noComments.removeOption(new DefaultConfigurationOption(DefaultPrinterConfiguration.ConfigOption.PRINT_COMMENTS));
    return WHITESPACE.matcher(node.toString(noComments)).replaceAll(" ").trim();
  }

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
    text = WHITESPACE.matcher(text).replaceAll(" ").trim();
    return text.length() <= MAX ? text : text.substring(0, MAX - 3) + "...";
  }
}
