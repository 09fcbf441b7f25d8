package dev.plumbline.analysis.loops;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.VariableDeclarator;
import com.github.javaparser.ast.expr.AssignExpr;
import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.LambdaExpr;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.expr.NameExpr;
import com.github.javaparser.ast.expr.VariableDeclarationExpr;
import com.github.javaparser.ast.stmt.BreakStmt;
import com.github.javaparser.ast.stmt.DoStmt;
import com.github.javaparser.ast.stmt.ExpressionStmt;
import com.github.javaparser.ast.stmt.ForEachStmt;
import com.github.javaparser.ast.stmt.ForStmt;
import com.github.javaparser.ast.stmt.IfStmt;
import com.github.javaparser.ast.stmt.ReturnStmt;
import com.github.javaparser.ast.stmt.Statement;
import com.github.javaparser.ast.stmt.WhileStmt;
import dev.plumbline.analysis.provenance.ProvenanceAnalysis;
import dev.plumbline.analysis.provenance.ProvenanceFacts;
import dev.plumbline.engine.AnalysisKey;
import dev.plumbline.engine.FileContext;
import dev.plumbline.model.ApiMethod;
import dev.plumbline.parse.Subtrees;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.Set;

/**
 * Loop roles and steering: which loops try hyperparameter values (their values reach a network,
 * optimizer or data configuration), and for each evaluation of a model whether its score decides
 * something: a comparison against a running best whose branch keeps a model, epoch or setting
 * (model selection), a condition that stops training (early stopping), an early-stopping
 * configuration built on the data, or a comparison of settings inside a hyperparameter loop.
 *
 * <p>Approximation: syntactic and flow-insensitive within one body ({@link Influence}); the
 * evaluation and the decision must sit in a common loop for a selection to count, so a single
 * threshold check after training is not called tuning. Errs towards silence: a score that leaves
 * the method (returned, stored in a collection) is not followed, and printing or logging a score
 * is never a decision. Reads evaluations from {@link ProvenanceAnalysis}; publishes facts and
 * never reports.
 */
public final class LoopRoleAnalysis {

  public static final AnalysisKey<LoopRoleFacts> KEY =
      AnalysisKey.of("loop-roles", LoopRoleAnalysis::analyzeFile);

  private static final Set<String> OUTPUT_ONLY = Set.of("print", "println", "printf", "format",
      "info", "debug", "warn", "trace", "log", "append", "add", "put", "record");

  private final FileContext file;
  private final ConfigurationReach.Parameters reach;

  private LoopRoleAnalysis(FileContext file) {
    this.file = file;
    ConfigurationReach.Parameters r = file.projectFacts() == null ? null
        : file.projectFacts().get(ConfigurationReach.Parameters.class);
    this.reach = r;
  }

  static LoopRoleFacts analyzeFile(FileContext file) {
    LoopRoleFacts facts = new LoopRoleFacts();
    new LoopRoleAnalysis(file).run(facts);
    return facts;
  }

  private void run(LoopRoleFacts facts) {
    ProvenanceFacts provenance = file.analysis(ProvenanceAnalysis.KEY);
    List<LoopRoleFacts.HyperparameterLoop> loops = new ArrayList<>();
    for (Statement loop : Subtrees.findAll(file.source().unit(), Statement.class, LoopRoleAnalysis::isLoop)) {
      hyperparameterLoop(loop).ifPresent(l -> {
        loops.add(l);
        facts.add(l);
      });
    }
    for (ProvenanceFacts.Evaluation e : provenance.evaluations()) {
      if (e.kind() == ProvenanceFacts.EvaluationKind.EARLY_STOPPING) {
        facts.add(new LoopRoleFacts.SteeringUse(e, LoopRoleFacts.Steering.EARLY_STOPPING_CONFIGURATION,
            e.call(), null, null));
        continue;
      }
      Node body = e.graph().callable();
      LoopRoleFacts.HyperparameterLoop around = innermostAround(e.call(), loops);
      Optional<LoopRoleFacts.SteeringUse> decided = decision(e, body, around);
      if (decided.isPresent()) {
        facts.add(decided.get());
      } else if (around != null) {
        facts.add(new LoopRoleFacts.SteeringUse(e, LoopRoleFacts.Steering.HYPERPARAMETER_COMPARISON,
            around.configuration(), null, around));
      }
    }
  }

  private static boolean isLoop(Node n) {
    return n instanceof ForStmt || n instanceof ForEachStmt || n instanceof WhileStmt || n instanceof DoStmt;
  }

  /** A loop whose variable (or a value computed from it) reaches a configuration in its body. */
  private Optional<LoopRoleFacts.HyperparameterLoop> hyperparameterLoop(Statement loop) {
    List<VariableDeclarator> vars = new ArrayList<>();
    Statement body;
    if (loop instanceof ForEachStmt f) {
      vars.addAll(f.getVariable().getVariables());
      body = f.getBody();
    } else if (loop instanceof ForStmt f) {
      for (Expression init : f.getInitialization()) {
        if (init instanceof VariableDeclarationExpr vde) {
          vars.addAll(vde.getVariables());
        }
      }
      body = f.getBody();
    } else {
      return Optional.empty();
    }
    if (vars.isEmpty()) {
      return Optional.empty();
    }
    Influence influence = new Influence(file.types().symbols());
    for (VariableDeclarator d : vars) {
      influence.seed(file.types().symbols().variableOf(d));
    }
    influence.spreadThrough(body);
    List<Node> points = ConfigurationReach.configurationPoints(file.types(), body, influence, reach);
    if (points.isEmpty()) {
      return Optional.empty();
    }
    return Optional.of(new LoopRoleFacts.HyperparameterLoop(loop, vars.get(0).getNameAsString(),
        points.get(0)));
  }

  private static LoopRoleFacts.HyperparameterLoop innermostAround(Node n,
      List<LoopRoleFacts.HyperparameterLoop> loops) {
    LoopRoleFacts.HyperparameterLoop best = null;
    for (LoopRoleFacts.HyperparameterLoop l : loops) {
      if (isInside(n, l.loop()) && (best == null || isInside(l.loop(), best.loop()))) {
        best = l;
      }
    }
    return best;
  }

  /**
   * The first decision in source order that the evaluation's score reaches: an {@code if} inside
   * a loop that also holds the evaluation, or such a loop's own condition.
   */
  private Optional<LoopRoleFacts.SteeringUse> decision(ProvenanceFacts.Evaluation e, Node body,
      LoopRoleFacts.HyperparameterLoop around) {
    Influence score = new Influence(file.types().symbols());
    boolean seeded = false;
    if (e.kind() == ProvenanceFacts.EvaluationKind.SCORE) {
      score.seed(e.call());
      seeded = true;
    } else if (e.model() instanceof NameExpr model) {
      for (MethodCallExpr read : Subtrees.findAll(body, MethodCallExpr.class)) {
        Optional<ApiMethod> m = file.types().apiMethod(read);
        if (m.isPresent() && "validation".equals(m.get().attribute("score")) && rootedAt(read, model)) {
          score.seed(read);
          seeded = true;
        }
      }
    }
    if (!seeded) {
      return Optional.empty();
    }
    score.spreadThrough(body);
    for (Statement s : Subtrees.findAll(body, Statement.class)) {
      if (s.findAncestor(LambdaExpr.class).filter(l -> isInside(l, body) && l != body).isPresent()) {
        continue;
      }
      Statement loop = commonLoop(s, e.call(), body);
      if (loop == null) {
        continue;
      }
      if (s instanceof IfStmt i && score.mentions(i.getCondition())) {
        if (containsExit(i.getThenStmt()) || i.getElseStmt().map(LoopRoleAnalysis::containsExit).orElse(false)) {
          return Optional.of(new LoopRoleFacts.SteeringUse(e, LoopRoleFacts.Steering.EARLY_STOP,
              i.getCondition(), null, around));
        }
        Optional<Node> kept = kept(i.getThenStmt(), score);
        if (kept.isPresent()) {
          return Optional.of(new LoopRoleFacts.SteeringUse(e, LoopRoleFacts.Steering.MODEL_SELECTION,
              i.getCondition(), kept.get(), around));
        }
      } else if (isLoop(s) && s == loop && loopCondition(s).map(score::mentions).orElse(false)) {
        return Optional.of(new LoopRoleFacts.SteeringUse(e, LoopRoleFacts.Steering.EARLY_STOP,
            loopCondition(s).get(), null, around));
      }
    }
    return Optional.empty();
  }

  /** A loop that contains both nodes (or whose condition is {@code s} itself), inside the body. */
  private static Statement commonLoop(Statement s, Node evaluation, Node body) {
    Node current = s;
    while (current != null && current != body) {
      if (current instanceof Statement st && isLoop(st) && isInside(evaluation, st)) {
        return st;
      }
      current = current.getParentNode().orElse(null);
    }
    return null;
  }

  private static Optional<Expression> loopCondition(Statement loop) {
    if (loop instanceof WhileStmt w) {
      return Optional.of(w.getCondition());
    }
    if (loop instanceof DoStmt d) {
      return Optional.of(d.getCondition());
    }
    if (loop instanceof ForStmt f) {
      return f.getCompare();
    }
    return Optional.empty();
  }

  private static boolean containsExit(Statement s) {
    return Subtrees.contains(s, BreakStmt.class) || Subtrees.contains(s, ReturnStmt.class);
  }

  /**
   * What a branch keeps besides the score itself: an assignment of something that is not the
   * score (a model, an epoch number, a setting), or a call that is not output (saving a model).
   */
  private Optional<Node> kept(Statement branch, Influence score) {
    for (AssignExpr as : Subtrees.findAll(branch, AssignExpr.class)) {
      if (!score.mentions(as.getValue())) {
        return Optional.of(as);
      }
    }
    for (VariableDeclarator d : Subtrees.findAll(branch, VariableDeclarator.class)) {
      if (d.getInitializer().isPresent() && !score.mentions(d.getInitializer().get())) {
        return Optional.of(d);
      }
    }
    for (ExpressionStmt es : Subtrees.findAll(branch, ExpressionStmt.class)) {
      if (es.getExpression() instanceof MethodCallExpr call && !OUTPUT_ONLY.contains(call.getNameAsString())) {
        return Optional.of(call);
      }
    }
    return Optional.empty();
  }

  private static boolean rootedAt(MethodCallExpr call, NameExpr model) {
    Expression current = call;
    while (current instanceof MethodCallExpr mc && mc.getScope().isPresent()) {
      current = mc.getScope().get();
    }
    return current instanceof NameExpr n && n.getNameAsString().equals(model.getNameAsString());
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
