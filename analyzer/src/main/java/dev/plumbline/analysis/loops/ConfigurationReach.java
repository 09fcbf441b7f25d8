package dev.plumbline.analysis.loops;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.CallableDeclaration;
import com.github.javaparser.ast.body.Parameter;
import com.github.javaparser.ast.body.TypeDeclaration;
import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.expr.ObjectCreationExpr;
import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.ProjectAnalysis;
import dev.plumbline.engine.ProjectFacts;
import dev.plumbline.engine.Workers;
import dev.plumbline.flow.ControlFlowGraph;
import dev.plumbline.model.ApiMethod;
import dev.plumbline.model.Effect;
import dev.plumbline.parse.Subtrees;
import dev.plumbline.types.ExpressionTypes;
import dev.plumbline.types.ProjectIndex;
import java.util.ArrayList;
import java.util.Collections;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;
import java.util.stream.IntStream;

/**
 * Which parameters of each project method reach a training configuration: an argument of a
 * configuration setter ({@code Effect.CONFIGURE}: learning rate, layer size, updater, batch size)
 * or of a project method whose parameter does. Lets a hyperparameter loop that calls
 * {@code buildNetwork(rate)} be recognized. Transitive through at most {@value #ROUNDS} levels of
 * helpers; deterministic (files in sorted order, methods in source order).
 */
public final class ConfigurationReach implements ProjectAnalysis {
  static final int ROUNDS = 4;

  /** Parameter indices reaching a configuration, by method declaration (identity). */
  public static final class Parameters {
    private final Map<Node, Set<Integer>> byMethod = new IdentityHashMap<>();

    public Set<Integer> of(Node declaration) {
      return byMethod.getOrDefault(declaration, Set.of());
    }
  }

  @Override
  public void compute(List<FileContext> files, ProjectIndex index, ProjectFacts out,
      Workers workers) {
    Parameters result = new Parameters();
    out.put(Parameters.class, result);
    List<FileContext> owners = new ArrayList<>();
    List<CallableDeclaration<?>> methods = new ArrayList<>();
    for (FileContext file : files) {
      for (ControlFlowGraph g : file.graphs()) {
        if (g.callable() instanceof CallableDeclaration<?> c
            && c.getParentNode().orElse(null) instanceof TypeDeclaration<?>) {
          owners.add(file);
          methods.add(c);
        }
      }
    }
    // What a method's parameters reach depends on what the project methods it calls reach, and
    // on nothing else that changes: a method whose callees changed nothing since it was last
    // looked at would get the same answer, so it is skipped. Exactly the same result, faster.
    // A method none of whose calls configures a library object, and whose project callees reach
    // nothing yet, reaches nothing: no parameter needs its influence spread (most methods).
    List<Set<Node>> callees = new ArrayList<>();
    List<Boolean> configuresLibrary = new ArrayList<>();
    List<Integer> indices = IntStream.range(0, methods.size()).boxed().toList();
    for (List<CallFacts> ofFile : workers.map(Workers.runsByFile(indices, owners::get), run -> run.stream()
        .map(i -> callFacts(owners.get(i), methods.get(i))).toList())) {
      for (CallFacts facts : ofFile) {
        callees.add(facts.projectCallees());
        configuresLibrary.add(facts.configuresLibrary());
      }
    }
    Map<Node, Integer> changedAt = new IdentityHashMap<>();
    int[] lookedAt = new int[methods.size()];
    int step = 0;
    for (int round = 0; round < ROUNDS; round++) {
      boolean changed = false;
      for (int i = 0; i < methods.size(); i++) {
        CallableDeclaration<?> m = methods.get(i);
        step++;
        if (round > 0 && !changedSince(callees.get(i), changedAt, lookedAt[i])) {
          continue;
        }
        lookedAt[i] = step;
        if (m.getParameters().isEmpty()
            || !configuresLibrary.get(i) && !reachesAnything(callees.get(i), result)) {
          continue;
        }
        Set<Integer> reach = new TreeSet<>(result.of(m));
        List<Parameter> params = m.getParameters();
        for (int p = 0; p < params.size(); p++) {
          if (!reach.contains(p) && reaches(owners.get(i), m, params.get(p), result)) {
            reach.add(p);
          }
        }
        if (!reach.equals(result.of(m))) {
          result.byMethod.put(m, Collections.unmodifiableSet(reach));
          changedAt.put(m, step);
          changed = true;
        }
      }
      if (!changed) {
        break;
      }
    }
  }

  /** The project methods a method calls, and whether it calls a library configuration point. */
  private record CallFacts(Set<Node> projectCallees, boolean configuresLibrary) {}

  private static CallFacts callFacts(FileContext file, CallableDeclaration<?> m) {
    Set<Node> callees = Collections.newSetFromMap(new IdentityHashMap<>());
    boolean configures = false;
    ExpressionTypes types = file.types();
    for (Node n : Subtrees.findAll(m, Node.class, x -> x instanceof MethodCallExpr || x instanceof ObjectCreationExpr)) {
      if (n instanceof MethodCallExpr call) {
        Optional<ProjectIndex.ProjectMethod> pm = types.projectMethod(call);
        if (pm.isPresent()) {
          callees.add(pm.get().declaration());
          continue;
        }
        if (!configures) {
          configures = isConfigurationPoint(types.apiMethod(call));
        }
      } else if (!configures) {
        configures = isConfigurationPoint(types.apiConstructor((ObjectCreationExpr) n));
      }
    }
    return new CallFacts(callees, configures);
  }

  private static boolean isConfigurationPoint(Optional<ApiMethod> api) {
    return api.isPresent()
        && (api.get().effect() == Effect.CONFIGURE || api.get().attribute("batchArg") != null);
  }

  private static boolean reachesAnything(Set<Node> callees, Parameters known) {
    for (Node c : callees) {
      if (!known.of(c).isEmpty()) {
        return true;
      }
    }
    return false;
  }

  /**
   * Whether one of {@code callees} changed its reach at or after step {@code since} (at: the
   * method itself, when recursive, changed when it was last looked at).
   */
  private static boolean changedSince(Set<Node> callees, Map<Node, Integer> changedAt, int since) {
    for (Node c : callees) {
      Integer at = changedAt.get(c);
      if (at != null && at >= since) {
        return true;
      }
    }
    return false;
  }

  private static boolean reaches(FileContext file, CallableDeclaration<?> m, Parameter p,
      Parameters known) {
    Influence influence = new Influence(file.types().symbols())
        .seed(file.types().symbols().variableOf(p))
        .spreadThrough(m);
    return !configurationPoints(file.types(), m, influence, known).isEmpty();
  }

  /**
   * Calls and constructions in {@code body} where a value the influence carries becomes part of
   * a training configuration, in source order.
   */
  static List<Node> configurationPoints(ExpressionTypes types, Node body, Influence influence,
      Parameters known) {
    List<Node> out = new ArrayList<>();
    for (Node n : Subtrees.findAll(body, Node.class, x -> x instanceof MethodCallExpr || x instanceof ObjectCreationExpr)) {
      List<Expression> args;
      Optional<ApiMethod> api;
      if (n instanceof MethodCallExpr call) {
        args = call.getArguments();
        Optional<ProjectIndex.ProjectMethod> pm = types.projectMethod(call);
        if (pm.isPresent() && known != null) {
          for (int i : known.of(pm.get().declaration())) {
            if (i < args.size() && influence.mentions(args.get(i))) {
              out.add(n);
              break;
            }
          }
          continue;
        }
        api = types.apiMethod(call);
      } else {
        ObjectCreationExpr oce = (ObjectCreationExpr) n;
        args = oce.getArguments();
        api = types.apiConstructor(oce);
      }
      if (api.isEmpty()) {
        continue;
      }
      ApiMethod m = api.get();
      if (m.effect() == Effect.CONFIGURE) {
        if (args.stream().anyMatch(influence::mentions)) {
          out.add(n);
        }
      } else if (m.attribute("batchArg") != null) {
        int b = m.intAttribute("batchArg", 0);
        if (b < args.size() && influence.mentions(args.get(b))) {
          out.add(n);
        }
      }
    }
    return out;
  }
}
