package dev.plumbline.analysis.randomness;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.CallableDeclaration;
import com.github.javaparser.ast.body.VariableDeclarator;
import com.github.javaparser.ast.expr.AssignExpr;
import com.github.javaparser.ast.expr.BooleanLiteralExpr;
import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.FieldAccessExpr;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.expr.NameExpr;
import com.github.javaparser.ast.expr.ObjectCreationExpr;
import com.github.javaparser.ast.expr.ThisExpr;
import com.github.javaparser.ast.stmt.ReturnStmt;
import dev.plumbline.analysis.provenance.ProvenanceAnalysis;
import dev.plumbline.analysis.provenance.ProvenanceFacts;
import dev.plumbline.engine.AnalysisKey;
import dev.plumbline.engine.FileContext;
import dev.plumbline.flow.AstText;
import dev.plumbline.model.ApiMethod;
import dev.plumbline.model.Effect;
import dev.plumbline.parse.Subtrees;
import dev.plumbline.types.Variable;
import java.util.Optional;
import java.util.Set;

/**
 * Random draws that make reported numbers change from run to run: shuffles seeded from the clock
 * ({@code DataSet.shuffle()}, {@code Collections.shuffle(list)}), shuffles and splits given a
 * {@code new Random()} that is never seeded, network configurations built without a seed
 * (DL4J's configuration builder defaults its seed to the current time), and DJL splits or
 * shuffled sampling when the project never seeds DJL's engine-wide generator.
 *
 * <p>Library defaults were read from the real jars' bytecode (nd4j-api and deeplearning4j-nn
 * 1.0.0-M2.1, DJL api 0.36.0) and are recorded in the API model. Approximation: a generator
 * counts as unseeded only when its creation is visible in the same body (or as a field
 * initializer of the same file) and no {@code setSeed} call or reassignment of it is seen there;
 * a generator or builder that leaves the method (argument, return, field) is not followed, so
 * the analysis errs towards silence.
 */
public final class RandomnessAnalysis {

  public static final AnalysisKey<RandomnessFacts> KEY =
      AnalysisKey.of("randomness", RandomnessAnalysis::analyzeFile);

  private static final Set<String> LEAVES_BUILDER = Set.of("list", "graphBuilder", "build");

  private final FileContext file;

  private RandomnessAnalysis(FileContext file) {
    this.file = file;
  }

  static RandomnessFacts analyzeFile(FileContext file) {
    RandomnessFacts facts = new RandomnessFacts();
    new RandomnessAnalysis(file).run(facts);
    return facts;
  }

  private void run(RandomnessFacts facts) {
    ProvenanceFacts provenance = file.analysis(ProvenanceAnalysis.KEY);
    ProjectSeeding.SeededScopes seeded = file.projectFacts() == null ? null
        : file.projectFacts().get(ProjectSeeding.SeededScopes.class);
    for (ProvenanceFacts.Shuffle s : provenance.shuffles()) {
      if (s.via() != null) {
        continue; // reported where the helper itself shuffles
      }
      String subject = AstText.code(s.target());
      if (s.seeding() == ProvenanceFacts.Seeding.CLOCK) {
        facts.add(new RandomnessFacts.Draw(s.call(), RandomnessFacts.Kind.CLOCK_SHUFFLE, s.call(),
            subject, s.via()));
      } else if (s.seeding() == ProvenanceFacts.Seeding.BY_GENERATOR_ARGUMENT && s.generator() != null) {
        unseededGenerator(s.generator()).ifPresent(g -> facts.add(new RandomnessFacts.Draw(s.call(),
            RandomnessFacts.Kind.UNSEEDED_GENERATOR, g, subject, s.via())));
      }
    }
    for (ProvenanceFacts.Split split : provenance.splits()) {
      if (!(split.call() instanceof MethodCallExpr call) || split.via() != null) {
        continue;
      }
      Optional<ApiMethod> m = file.types().apiMethod(call);
      if (m.isEmpty()) {
        continue;
      }
      String subject = AstText.code(split.splitData());
      if (m.get().attribute("randomArg") != null) {
        int i = m.get().intAttribute("randomArg", 0);
        if (i < call.getArguments().size()) {
          unseededGenerator(call.getArgument(i)).ifPresent(g -> facts.add(new RandomnessFacts.Draw(
              call, RandomnessFacts.Kind.UNSEEDED_GENERATOR, g, subject, null)));
        }
      }
      String scope = m.get().attribute("randomSource");
      if (scope != null && seeded != null && !seeded.seeded(scope)) {
        facts.add(new RandomnessFacts.Draw(call, RandomnessFacts.Kind.UNSEEDED_FRAMEWORK_GENERATOR,
            call, subject, null));
      }
    }
    for (MethodCallExpr call : Subtrees.findAll(file.source().unit(), MethodCallExpr.class)) {
      Optional<ApiMethod> m = file.types().apiMethod(call);
      if (m.isPresent() && m.get().attribute("shuffleArg") != null && seeded != null && !seeded.seeded("djl")) {
        int i = m.get().intAttribute("shuffleArg", 0);
        if (i < call.getArguments().size() && call.getArgument(i) instanceof BooleanLiteralExpr b
            && b.getValue() && !buildsTestSet(call)) {
          // Located at the method name: in a builder chain the call itself starts lines earlier.
          facts.add(new RandomnessFacts.Draw(call.getName(), RandomnessFacts.Kind.UNSEEDED_FRAMEWORK_GENERATOR,
              call.getName(), call.getNameAsString() + "(" + String.join(", ",
                  call.getArguments().stream().map(AstText::code).toList()) + ")", null));
        }
      }
    }
    for (ObjectCreationExpr oce : Subtrees.findAll(file.source().unit(), ObjectCreationExpr.class)) {
      Optional<ApiMethod> ctor = file.types().apiConstructor(oce);
      if (ctor.isPresent() && "clock".equals(ctor.get().attribute("seedDefault")) && !seededBuilder(oce)
          && !onlyBuildsIdleNetworks(chainEnd(oce))) {
        facts.add(new RandomnessFacts.Draw(oce, RandomnessFacts.Kind.CONFIGURATION_WITHOUT_SEED, oce,
            oce.getTypeAsString(), null));
      }
    }
  }

  /**
   * Whether a configuration builder gets a seed, or may get one where we cannot see: a seed call
   * in its chain before the chain leaves the builder ({@code list()}, {@code build()}); or, when
   * the builder is kept in a local variable, a seed call on that variable in the same body; a
   * builder that escapes, or whose chain goes through a call the model does not know before it
   * leaves the builder, counts as seeded (unknown).
   */
  private boolean seededBuilder(ObjectCreationExpr creation) {
    Expression current = creation;
    while (current.getParentNode().orElse(null) instanceof MethodCallExpr parent
        && parent.getScope().orElse(null) == current) {
      Optional<ApiMethod> m = file.types().apiMethod(parent);
      if (m.isPresent() && m.get().effect() == Effect.SEED) {
        return true;
      }
      if (LEAVES_BUILDER.contains(parent.getNameAsString())) {
        return false;
      }
      if (m.isEmpty()) {
        return true; // see chainSeeds
      }
      current = parent;
    }
    Node holder = current.getParentNode().orElse(null);
    Optional<Variable> kept = Optional.empty();
    if (holder instanceof VariableDeclarator d && d.getInitializer().orElse(null) == current) {
      kept = Optional.of(file.types().symbols().variableOf(d));
    }
    if (kept.isEmpty() || kept.get().isField()) {
      return true; // stored elsewhere, passed on or returned: the seed may be set where we cannot see
    }
    Variable builder = kept.get();
    Node body = creation.findAncestor(CallableDeclaration.class).map(n -> (Node) n).orElse(null);
    if (body == null) {
      return true;
    }
    for (NameExpr use : Subtrees.findAll(body, NameExpr.class)) {
      if (!file.types().symbols().resolve(use).filter(v -> v == builder).isPresent()) {
        continue;
      }
      Node parent = use.getParentNode().orElse(null);
      if (parent instanceof MethodCallExpr call && call.getScope().orElse(null) == use) {
        if (chainSeeds(call)) {
          return true;
        }
      } else if (!(parent instanceof AssignExpr)) {
        return true; // passed to a call, returned or copied: it may be seeded elsewhere
      }
    }
    return false;
  }

  /**
   * Whether the builder chain around {@code call} selects the test split
   * ({@code optUsage(Dataset.Usage.TEST)}). Such a set is read for evaluation, where a full pass
   * sums over every row whatever their order, so a shuffled order changes no reported number.
   */
  private static boolean buildsTestSet(MethodCallExpr call) {
    Expression current = call;
    while (current instanceof MethodCallExpr c) {
      if (selectsTestUsage(c)) {
        return true;
      }
      current = c.getScope().orElse(null);
    }
    Expression outer = call;
    while (outer.getParentNode().orElse(null) instanceof MethodCallExpr parent
        && parent.getScope().orElse(null) == outer) {
      if (selectsTestUsage(parent)) {
        return true;
      }
      outer = parent;
    }
    return false;
  }

  private static boolean selectsTestUsage(MethodCallExpr c) {
    if (!c.getNameAsString().equals("optUsage") || c.getArguments().size() != 1) {
      return false;
    }
    Expression usage = c.getArgument(0);
    return usage instanceof FieldAccessExpr f && f.getNameAsString().equals("TEST")
            && f.getScope().toString().endsWith("Usage")
        || usage instanceof NameExpr n && n.getNameAsString().equals("TEST");
  }

  /** The outermost call of the builder chain that starts at {@code start}. */
  private static Expression chainEnd(Expression start) {
    Expression current = start;
    while (current.getParentNode().orElse(null) instanceof MethodCallExpr parent
        && parent.getScope().orElse(null) == current) {
      current = parent;
    }
    return current;
  }

  /**
   * Whether the configuration {@code value} holds provably reaches no number: it is only given
   * to network constructors ({@code Effect.BUILD}), directly or through a local variable, and
   * each network is only used through calls the model marks {@code inert} (they neither train the
   * network nor read anything computed from its weights, as {@code init()}). Any other use (a
   * return, a field, a call we do not model, a lambda) may lead to reported numbers.
   */
  private boolean onlyBuildsIdleNetworks(Expression value) {
    Node parent = value.getParentNode().orElse(null);
    if (parent instanceof ObjectCreationExpr network && network.getArguments().contains(value)) {
      Optional<ApiMethod> ctor = file.types().apiConstructor(network);
      return ctor.isPresent() && ctor.get().effect() == Effect.BUILD
          && network.getArguments().indexOf(value) == ctor.get().intAttribute("configArg", -1)
          && onlyInertUses(network);
    }
    return everyLocalUse(parent, value, this::onlyBuildsIdleNetworks);
  }

  /** Whether the network made by {@code network} is only used through inert calls. */
  private boolean onlyInertUses(Expression network) {
    Node parent = network.getParentNode().orElse(null);
    if (parent instanceof MethodCallExpr call && call.getScope().orElse(null) == network) {
      return file.types().apiMethod(call).map(m -> "true".equals(m.attribute("inert"))).orElse(false)
          && call.getParentNode().orElse(null) instanceof com.github.javaparser.ast.stmt.ExpressionStmt;
    }
    return everyLocalUse(parent, network, this::onlyInertUses);
  }

  /**
   * When {@code value} initializes a local variable, whether {@code test} holds for every read of
   * that variable in the method, lambdas included (and the variable is never reassigned); false
   * otherwise.
   */
  private boolean everyLocalUse(Node parent, Expression value, java.util.function.Predicate<Expression> test) {
    if (!(parent instanceof VariableDeclarator d) || d.getInitializer().orElse(null) != value) {
      return false;
    }
    Variable v = file.types().symbols().variableOf(d);
    Node body = d.findAncestor(CallableDeclaration.class).map(n -> (Node) n).orElse(null);
    if (v.isField() || body == null) {
      return false;
    }
    for (NameExpr use : Subtrees.findAll(body, NameExpr.class)) {
      if (!file.types().symbols().resolve(use).filter(x -> x == v).isPresent()) {
        continue;
      }
      if (use.getParentNode().orElse(null) instanceof AssignExpr as && as.getTarget() == use || !test.test(use)) {
        return false;
      }
    }
    return true;
  }

  private boolean chainSeeds(MethodCallExpr first) {
    Expression current = first;
    while (current instanceof MethodCallExpr call) {
      Optional<ApiMethod> m = file.types().apiMethod(call);
      if (m.isPresent() && m.get().effect() == Effect.SEED) {
        return true;
      }
      if (LEAVES_BUILDER.contains(call.getNameAsString())) {
        return false;
      }
      if (m.isEmpty()) {
        // A setter the model does not list (optimizationAlgo, miniBatch, an older version's
        // iterations): its result's type is unknown, so a seed call after it cannot be told from
        // any other call, and absence of evidence is no finding.
        return true;
      }
      Node parent = call.getParentNode().orElse(null);
      current = parent instanceof MethodCallExpr p && p.getScope().orElse(null) == call ? p : null;
    }
    return false;
  }

  /**
   * Where an unseeded generator given as {@code generator} is created: {@code new Random()} in
   * place, or in the initializer of a local variable or field that is never reassigned or seeded
   * in the body (for a field: in the file).
   */
  private Optional<Node> unseededGenerator(Expression generator) {
    if (generator instanceof ObjectCreationExpr oce) {
      return unseededCreation(oce) ? Optional.of(oce) : Optional.empty();
    }
    Optional<Variable> v = Optional.empty();
    if (generator instanceof NameExpr n) {
      v = file.types().symbols().resolve(n);
    } else if (generator instanceof FieldAccessExpr fa && fa.getScope() instanceof ThisExpr) {
      v = file.types().symbols().field(fa, fa.getNameAsString());
    }
    if (v.isEmpty() || !(v.get().declaration() instanceof VariableDeclarator d)
        || !(d.getInitializer().orElse(null) instanceof ObjectCreationExpr init)
        || !unseededCreation(init)) {
      return Optional.empty();
    }
    Node scope = v.get().isField() ? file.source().unit()
        : generator.findAncestor(CallableDeclaration.class).map(n -> (Node) n).orElse(null);
    if (scope == null) {
      return Optional.empty();
    }
    Variable variable = v.get();
    for (NameExpr use : Subtrees.findAll(scope, NameExpr.class)) {
      if (!file.types().symbols().resolve(use).filter(x -> x == variable).isPresent()) {
        continue;
      }
      Node parent = use.getParentNode().orElse(null);
      if (parent instanceof AssignExpr as && as.getTarget() == use
          || parent instanceof MethodCallExpr call && call.getScope().orElse(null) == use
              && file.types().apiMethod(call).map(m -> m.effect() == Effect.SEED).orElse(true)
          || parent instanceof ReturnStmt) {
        return Optional.empty();
      }
    }
    return Optional.of(init);
  }

  private boolean unseededCreation(ObjectCreationExpr oce) {
    return file.types().apiConstructor(oce).map(m -> "false".equals(m.attribute("seeded"))).orElse(false);
  }
}
