package dev.plumbline.flow;

import com.github.javaparser.StaticJavaParser;
import com.github.javaparser.ast.body.MethodDeclaration;

/** Prints the graph dump of each method in a snippet; used to write the expectations below. */
final class CfgDumpTool {
  private CfgDumpTool() {}

  static String dump(String classBody) {
    StringBuilder sb = new StringBuilder();
    for (MethodDeclaration m : StaticJavaParser.parse("class T {" + classBody + "}")
        .findAll(MethodDeclaration.class)) {
      sb.append(CfgBuilder.of(m).dump());
    }
    return sb.toString();
  }

  public static void main(String[] args) {
    System.out.println(dump(args[0]));
  }
}
