package dev.plumbline.types;

import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.NodeList;
import com.github.javaparser.ast.body.BodyDeclaration;
import com.github.javaparser.ast.body.CallableDeclaration;
import com.github.javaparser.ast.body.FieldDeclaration;
import com.github.javaparser.ast.body.Parameter;
import com.github.javaparser.ast.body.RecordDeclaration;
import com.github.javaparser.ast.body.TypeDeclaration;
import com.github.javaparser.ast.body.VariableDeclarator;
import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.LambdaExpr;
import com.github.javaparser.ast.expr.NameExpr;
import com.github.javaparser.ast.expr.ObjectCreationExpr;
import com.github.javaparser.ast.expr.VariableDeclarationExpr;
import com.github.javaparser.ast.stmt.BlockStmt;
import com.github.javaparser.ast.stmt.CatchClause;
import com.github.javaparser.ast.stmt.ExpressionStmt;
import com.github.javaparser.ast.stmt.ForEachStmt;
import com.github.javaparser.ast.stmt.ForStmt;
import com.github.javaparser.ast.stmt.Statement;
import com.github.javaparser.ast.stmt.SwitchEntry;
import com.github.javaparser.ast.stmt.TryStmt;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Binds simple names to the local variable, parameter or field they denote, following Java's
 * scoping rules for blocks, {@code for}, for-each, {@code catch}, try resources, lambdas,
 * methods and class bodies (JLS 6.3). Fields are found in the enclosing class bodies of this
 * unit; inherited fields are unknown. Pattern variables are not bound (they stay unknown).
 *
 * <p>One instance per compilation unit; not thread-safe (a unit is analyzed by one thread).
 */
public final class SymbolTable {
  private final TypeResolver types;
  private final Map<Node, Variable> variables = new IdentityHashMap<>();
  private final Map<NameExpr, Optional<Variable>> resolved = new IdentityHashMap<>();

  public SymbolTable(CompilationUnit unit, TypeResolver types) {
    this.types = types;
  }

  public TypeResolver types() {
    return types;
  }

  /** The variable a name denotes, if it denotes a variable of this unit. */
  public Optional<Variable> resolve(NameExpr name) {
    Optional<Variable> cached = resolved.get(name);
    if (cached == null) {
      cached = Optional.ofNullable(lookup(name, name.getNameAsString()));
      resolved.put(name, cached);
    }
    return cached;
  }

  /** The variable declared by a declarator or parameter. */
  public Variable variableOf(VariableDeclarator declarator) {
    return variables.computeIfAbsent(declarator, d -> {
      boolean field = declarator.getParentNode().orElse(null) instanceof FieldDeclaration;
      String type = declarator.getType().isVarType() ? null : types.resolve(declarator.getType());
      return new Variable(declarator.getNameAsString(),
          field ? Variable.Kind.FIELD : Variable.Kind.LOCAL, declarator, type);
    });
  }

  public Variable variableOf(Parameter parameter) {
    return variables.computeIfAbsent(parameter, p -> {
      String type = parameter.getType().isUnknownType() || parameter.getType().isVarType()
          ? null : types.resolve(parameter.getType());
      if (type != null && parameter.isVarArgs()) {
        type = type + "[]";
      }
      return new Variable(parameter.getNameAsString(), Variable.Kind.PARAMETER, parameter, type);
    });
  }

  /** A field of the class enclosing {@code from} (or an outer class), by name. */
  public Optional<Variable> field(Node from, String name) {
    Node current = from;
    while (current != null) {
      if (current instanceof TypeDeclaration<?> type) {
        Variable v = fieldIn(type.getMembers(), name);
        if (v != null) {
          return Optional.of(v);
        }
        if (type instanceof RecordDeclaration record) {
          for (Parameter p : record.getParameters()) {
            if (p.getNameAsString().equals(name)) {
              return Optional.of(variableOf(p));
            }
          }
        }
      } else if (current instanceof ObjectCreationExpr oce && oce.getAnonymousClassBody().isPresent()) {
        Variable v = fieldIn(oce.getAnonymousClassBody().get(), name);
        if (v != null) {
          return Optional.of(v);
        }
      }
      current = current.getParentNode().orElse(null);
    }
    return Optional.empty();
  }

  private Variable fieldIn(NodeList<BodyDeclaration<?>> members, String name) {
    for (BodyDeclaration<?> member : members) {
      if (member instanceof FieldDeclaration f) {
        for (VariableDeclarator d : f.getVariables()) {
          if (d.getNameAsString().equals(name)) {
            return variableOf(d);
          }
        }
      }
    }
    return null;
  }

  private Variable lookup(Node use, String name) {
    Node child = use;
    Node current = use.getParentNode().orElse(null);
    while (current != null) {
      Variable found = declaredIn(current, child, name);
      if (found != null) {
        return found;
      }
      child = current;
      current = current.getParentNode().orElse(null);
    }
    return null;
  }

  /** A declaration of {@code name} in {@code scope} that is visible to its child {@code child}. */
  private Variable declaredIn(Node scope, Node child, String name) {
    if (scope instanceof BlockStmt block) {
      return declaredBefore(block.getStatements(), child, name);
    }
    if (scope instanceof SwitchEntry entry) {
      return declaredBefore(entry.getStatements(), child, name);
    }
    if (scope instanceof ForStmt f) {
      for (Expression init : f.getInitialization()) {
        Variable v = inDeclarationExpr(init, name);
        if (v != null && !isInside(child, init)) {
          return v;
        }
      }
      return null;
    }
    if (scope instanceof ForEachStmt f) {
      if (child == f.getBody()) {
        return inDeclarationExpr(f.getVariable(), name);
      }
      return null;
    }
    if (scope instanceof CatchClause c) {
      return c.getParameter().getNameAsString().equals(name) ? variableOf(c.getParameter()) : null;
    }
    if (scope instanceof TryStmt t) {
      for (Expression r : t.getResources()) {
        if (isInside(child, r)) {
          break;
        }
        Variable v = inDeclarationExpr(r, name);
        if (v != null) {
          return v;
        }
      }
      return null;
    }
    if (scope instanceof LambdaExpr lambda) {
      for (Parameter p : lambda.getParameters()) {
        if (p.getNameAsString().equals(name)) {
          return variableOf(p);
        }
      }
      return null;
    }
    if (scope instanceof CallableDeclaration<?> callable) {
      for (Parameter p : callable.getParameters()) {
        if (p.getNameAsString().equals(name)) {
          return variableOf(p);
        }
      }
      return null;
    }
    if (scope instanceof TypeDeclaration<?> || scope instanceof ObjectCreationExpr) {
      return field(scope, name).orElse(null);
    }
    return null;
  }

  private Variable declaredBefore(List<Statement> statements, Node child, String name) {
    Variable found = null;
    for (Statement s : statements) {
      if (s == child) {
        // A declarator's own initializer may see the variable (legal only on the left of =),
        // so declarations in the statement itself count when the use follows them.
        Variable own = s instanceof ExpressionStmt es ? inDeclarationExpr(es.getExpression(), name) : null;
        return own != null ? own : found;
      }
      if (s instanceof ExpressionStmt es) {
        Variable v = inDeclarationExpr(es.getExpression(), name);
        if (v != null) {
          found = v;
        }
      }
    }
    return found;
  }

  private Variable inDeclarationExpr(Expression e, String name) {
    if (e instanceof VariableDeclarationExpr vde) {
      for (VariableDeclarator d : vde.getVariables()) {
        if (d.getNameAsString().equals(name)) {
          return variableOf(d);
        }
      }
    }
    return null;
  }

  private static boolean isInside(Node node, Node ancestor) {
    Node current = node;
    while (current != null) {
      if (current == ancestor) {
        return true;
      }
      current = current.getParentNode().orElse(null);
    }
    return false;
  }
}
