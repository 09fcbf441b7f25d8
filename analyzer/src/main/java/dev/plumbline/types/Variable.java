package dev.plumbline.types;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.VariableDeclarator;
import java.util.Comparator;

/**
 * A local variable, parameter or field, identified by its declaration node.
 *
 * <p>Equality is identity: {@link SymbolTable} hands out one instance per declaration, so two
 * variables with the same name in sibling scopes stay distinct. (JavaParser's {@code Node.equals}
 * compares structure, which is why the declaration is not used as a key directly.)
 */
public final class Variable {
  public enum Kind { LOCAL, PARAMETER, FIELD }

  /** Source order of declarations, for deterministic dumps and messages. */
  public static final Comparator<Variable> BY_POSITION = Comparator
      .comparingInt((Variable v) -> v.line())
      .thenComparingInt(Variable::column)
      .thenComparing(Variable::name);

  private final String name;
  private final Kind kind;
  private final Node declaration;
  private final String declaredType;

  Variable(String name, Kind kind, Node declaration, String declaredType) {
    this.name = name;
    this.kind = kind;
    this.declaration = declaration;
    this.declaredType = declaredType;
  }

  public String name() {
    return name;
  }

  public Kind kind() {
    return kind;
  }

  /** A {@link VariableDeclarator} (locals and fields) or a {@code Parameter}. */
  public Node declaration() {
    return declaration;
  }

  /** Resolved type name as declared, or null for {@code var} and unresolvable types. */
  public String declaredType() {
    return declaredType;
  }

  public int line() {
    return declaration.getBegin().map(p -> p.line).orElse(0);
  }

  public int column() {
    return declaration.getBegin().map(p -> p.column).orElse(0);
  }

  public boolean isField() {
    return kind == Kind.FIELD;
  }

  @Override
  public String toString() {
    return kind == Kind.FIELD ? "this." + name : name;
  }
}
