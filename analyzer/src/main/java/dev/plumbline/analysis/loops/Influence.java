package dev.plumbline.analysis.loops;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.VariableDeclarator;
import com.github.javaparser.ast.expr.AssignExpr;
import com.github.javaparser.ast.expr.FieldAccessExpr;
import com.github.javaparser.ast.expr.LambdaExpr;
import com.github.javaparser.ast.expr.NameExpr;
import com.github.javaparser.ast.expr.ThisExpr;
import com.github.javaparser.ast.expr.UnaryExpr;
import dev.plumbline.parse.Subtrees;
import dev.plumbline.types.SymbolTable;
import dev.plumbline.types.Variable;
import java.util.Collections;
import java.util.IdentityHashMap;
import java.util.Optional;
import java.util.Set;

/**
 * Which variables of one body may carry a value computed from given seeds (expressions or
 * variables): the variables assigned or initialized from an expression that mentions a seed or
 * another such variable, to a fixed point.
 *
 * <p>Flow-insensitive and syntactic (a may-approximation): order and paths are ignored, and
 * values passed through calls count as carried when the call's arguments mention them. Used for
 * "does this loop's value reach a configuration" and "does this test score reach a decision".
 */
final class Influence {
  private final SymbolTable symbols;
  private final Set<Node> seeds = Collections.newSetFromMap(new IdentityHashMap<>());
  private final Set<Variable> carriers = Collections.newSetFromMap(new IdentityHashMap<>());

  Influence(SymbolTable symbols) {
    this.symbols = symbols;
  }

  Influence seed(Node expression) {
    seeds.add(expression);
    return this;
  }

  Influence seed(Variable v) {
    carriers.add(v);
    return this;
  }

  /** Spreads through the declarations and assignments of {@code body}; returns this. */
  Influence spreadThrough(Node body) {
    boolean changed = true;
    int rounds = 0;
    while (changed && rounds++ < 32) {
      changed = false;
      for (VariableDeclarator d : Subtrees.findAll(body, VariableDeclarator.class)) {
        if (d.getInitializer().isPresent() && mentions(d.getInitializer().get())) {
          changed |= carriers.add(symbols.variableOf(d));
        }
      }
      for (AssignExpr as : Subtrees.findAll(body, AssignExpr.class)) {
        if (mentions(as.getValue())) {
          Optional<Variable> target = target(as);
          if (target.isPresent()) {
            changed |= carriers.add(target.get());
          }
        }
      }
    }
    return this;
  }

  Set<Variable> carriers() {
    return Collections.unmodifiableSet(carriers);
  }

  boolean carries(Variable v) {
    return carriers.contains(v);
  }

  /** Whether the expression contains a seed or reads a carrier (not looking into lambdas). */
  boolean mentions(Node expression) {
    if (seeds.contains(expression)) {
      return true;
    }
    if (expression instanceof NameExpr n) {
      Optional<Variable> v = symbols.resolve(n);
      if (v.isPresent() && carriers.contains(v.get())) {
        return true;
      }
    }
    if (expression instanceof FieldAccessExpr fa && fa.getScope() instanceof ThisExpr) {
      Optional<Variable> v = symbols.field(fa, fa.getNameAsString());
      if (v.isPresent() && carriers.contains(v.get())) {
        return true;
      }
    }
    if (expression instanceof LambdaExpr) {
      return false;
    }
    for (Node child : expression.getChildNodes()) {
      if (mentions(child)) {
        return true;
      }
    }
    return false;
  }

  Optional<Variable> target(AssignExpr as) {
    if (as.getTarget() instanceof NameExpr n) {
      return symbols.resolve(n);
    }
    if (as.getTarget() instanceof FieldAccessExpr fa && fa.getScope() instanceof ThisExpr) {
      return symbols.field(fa, fa.getNameAsString());
    }
    return Optional.empty();
  }

  /** The variable an increment or decrement changes, if a plain name. */
  Optional<Variable> target(UnaryExpr u) {
    return u.getExpression() instanceof NameExpr n ? symbols.resolve(n) : Optional.empty();
  }
}
