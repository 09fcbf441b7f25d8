package dev.plumbline.rules.leak;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.VariableDeclarator;
import com.github.javaparser.ast.expr.AssignExpr;
import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.LambdaExpr;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.expr.NameExpr;
import com.github.javaparser.ast.expr.ObjectCreationExpr;
import com.github.javaparser.ast.expr.VariableDeclarationExpr;
import com.github.javaparser.ast.stmt.BlockStmt;
import com.github.javaparser.ast.stmt.ExpressionStmt;
import com.github.javaparser.ast.stmt.Statement;
import dev.plumbline.analysis.provenance.ProvenanceFacts;
import dev.plumbline.analysis.provenance.Role;
import dev.plumbline.engine.FileContext;
import dev.plumbline.finding.Edit;
import dev.plumbline.finding.Message;
import dev.plumbline.fix.SourceEdits;
import dev.plumbline.parse.Subtrees;
import dev.plumbline.types.SymbolTable;
import dev.plumbline.types.Variable;
import java.util.EnumSet;
import java.util.List;
import java.util.Optional;

/**
 * The mechanical repair of a preprocessor fitted on rows that are split later: fit it on the
 * training part instead. Offered only where the repair is unambiguous and changes nothing else:
 *
 * <ul>
 *   <li>the fit is certain (whole rows on every path), a statement of its own, with one plain
 *       variable as its argument, and the data is split exactly once;
 *   <li>exactly one local variable of the method is declared with the training part of that
 *       data, is never reassigned, and has the same static type as the fitted argument (so the
 *       same overload of the fit method applies);
 *   <li>either that variable is already in scope at the fit (replace the argument), or the fit
 *       comes first in the same block (move the fit below the declaration). A move also needs
 *       the preprocessor to be a fresh object in a local variable of that block, used before
 *       the fit only as the receiver of calls whose results are dropped, and not used at all
 *       between the fit and its new place, so nothing can observe that it is fitted later.
 * </ul>
 */
final class FitOnTrainingPart {
  private FitOnTrainingPart() {}

  static Optional<Edit> plan(FileContext file, ProvenanceFacts facts, ProvenanceFacts.Fit fit,
      List<ProvenanceFacts.Split> splits) {
    // Only a fit written here: one made inside a helper (via) is fixed in the helper, not here.
    if (!(fit.call() instanceof MethodCallExpr call) || fit.via() != null) {
      return Optional.empty();
    }
    if (!fit.data().onlyWhole() || splits.size() != 1 || call.getArguments().size() != 1
        || call.getTypeArguments().isPresent()
        || !(fit.argument() instanceof NameExpr)
        || !(call.getParentNode().orElse(null) instanceof ExpressionStmt fitStatement)) {
      return Optional.empty();
    }
    List<ProvenanceFacts.PartBinding> training = facts.partBindings().stream()
        .filter(b -> b.graph() == fit.graph()
            && b.value().roles().equals(EnumSet.of(Role.TRAIN))
            && b.value().lineages().equals(fit.data().lineages()))
        .toList();
    if (training.size() != 1) {
      return Optional.empty();
    }
    ProvenanceFacts.PartBinding train = training.get(0);
    SymbolTable symbols = file.types().symbols();
    String argumentType = file.types().typeOf(fit.argument());
    if (argumentType == null || !argumentType.equals(file.types().typeOf(train.variable()))
        || reassigned(fit.graph().callable(), train.variable(), symbols)) {
      return Optional.empty();
    }
    Optional<ExpressionStmt> declaration = singleDeclarationStatement(train.declarator());
    if (declaration.isEmpty() || !(declaration.get().getParentNode().orElse(null) instanceof BlockStmt block)) {
      return Optional.empty();
    }
    String trainName = train.variable().name();
    int declIndex = block.getStatements().indexOf(declaration.get());
    Optional<Statement> fitTop = topStatementIn(block, fitStatement);
    if (fitTop.isPresent() && block.getStatements().indexOf(fitTop.get()) > declIndex) {
      return SourceEdits.in(file)
          .replace(fit.argument(), trainName)
          .build(Message.of(PreprocessingBeforeSplitRule.ID + ".edit.fit-on-train",
              fit.preprocessor().toString(), trainName, fit.argument().toString()), true);
    }
    if (fitTop.isPresent() && fitTop.get() == fitStatement
        && block.getStatements().indexOf(fitStatement) < declIndex
        && movable(block, fitStatement, declaration.get(), fit.preprocessor(), symbols)) {
      String moved = fit.preprocessor() + "." + call.getNameAsString() + "(" + trainName + ");";
      return SourceEdits.in(file)
          .removeStatement(fitStatement)
          .insertLineAfter(declaration.get(), moved)
          .build(Message.of(PreprocessingBeforeSplitRule.ID + ".edit.move-fit",
              fit.preprocessor().toString(), trainName, declaration.get().getBegin().map(p -> p.line).orElse(0)),
              true);
    }
    return Optional.empty();
  }

  /** {@code T name = ...;} as a statement of its own, declaring only this variable. */
  private static Optional<ExpressionStmt> singleDeclarationStatement(VariableDeclarator d) {
    if (d.getParentNode().orElse(null) instanceof VariableDeclarationExpr vde
        && vde.getVariables().size() == 1
        && vde.getParentNode().orElse(null) instanceof ExpressionStmt statement) {
      return Optional.of(statement);
    }
    return Optional.empty();
  }

  /** The statement of {@code block} that contains {@code node}, when no lambda or class lies between. */
  private static Optional<Statement> topStatementIn(BlockStmt block, Node node) {
    Node current = node;
    while (current != null) {
      Node parent = current.getParentNode().orElse(null);
      if (parent == block) {
        return Optional.of((Statement) current);
      }
      if (current instanceof LambdaExpr || current instanceof ObjectCreationExpr o && o.getAnonymousClassBody().isPresent()) {
        return Optional.empty();
      }
      current = parent;
    }
    return Optional.empty();
  }

  private static boolean reassigned(Node callable, Variable v, SymbolTable symbols) {
    return Subtrees.findAll(callable, AssignExpr.class).stream()
        .anyMatch(a -> a.getTarget() instanceof NameExpr n && symbols.resolve(n).orElse(null) == v);
  }

  /** The conditions for moving the fit from {@code fitStatement} to just after {@code target}. */
  private static boolean movable(BlockStmt block, ExpressionStmt fitStatement, ExpressionStmt target,
      Expression preprocessor, SymbolTable symbols) {
    if (!(preprocessor instanceof NameExpr name)) {
      return false;
    }
    Variable p = symbols.resolve(name).orElse(null);
    if (p == null || p.kind() != Variable.Kind.LOCAL
        || !(p.declaration() instanceof VariableDeclarator declarator)
        || !(declarator.getInitializer().orElse(null) instanceof ObjectCreationExpr creation)
        || creation.getAnonymousClassBody().isPresent()) {
      return false;
    }
    Optional<ExpressionStmt> declared = singleDeclarationStatement(declarator);
    List<Statement> statements = block.getStatements();
    int k = declared.map(statements::indexOf).orElse(-1);
    int i = statements.indexOf(fitStatement);
    int j = statements.indexOf(target);
    if (k < 0 || k >= i) {
      return false;
    }
    for (int s = k + 1; s < i; s++) {
      for (NameExpr use : uses(statements.get(s), p, symbols)) {
        if (!isDroppedReceiverCall(use, statements.get(s))) {
          return false;
        }
      }
    }
    for (int s = i + 1; s <= j; s++) {
      if (!uses(statements.get(s), p, symbols).isEmpty()) {
        return false;
      }
    }
    return true;
  }

  private static List<NameExpr> uses(Statement statement, Variable v, SymbolTable symbols) {
    return Subtrees.findAll(statement, NameExpr.class).stream()
        .filter(n -> symbols.resolve(n).orElse(null) == v)
        .toList();
  }

  /**
   * {@code p.m(...);} as a statement run in place (not inside a lambda or class body that could
   * run later): the call's result, possibly {@code p} itself, goes nowhere.
   */
  private static boolean isDroppedReceiverCall(NameExpr use, Statement top) {
    if (!(use.getParentNode().orElse(null) instanceof MethodCallExpr call)
        || call.getScope().orElse(null) != use
        || !(call.getParentNode().orElse(null) instanceof ExpressionStmt)) {
      return false;
    }
    for (Node n = call; n != null && n != top; n = n.getParentNode().orElse(null)) {
      if (n instanceof LambdaExpr || n instanceof com.github.javaparser.ast.body.TypeDeclaration<?>
          || n instanceof ObjectCreationExpr o && o.getAnonymousClassBody().isPresent()) {
        return false;
      }
    }
    return true;
  }
}
