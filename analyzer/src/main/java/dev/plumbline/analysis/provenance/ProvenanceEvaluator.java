package dev.plumbline.analysis.provenance;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.VariableDeclarator;
import com.github.javaparser.ast.expr.ArrayAccessExpr;
import com.github.javaparser.ast.expr.ArrayCreationExpr;
import com.github.javaparser.ast.expr.ArrayInitializerExpr;
import com.github.javaparser.ast.expr.AssignExpr;
import com.github.javaparser.ast.expr.CastExpr;
import com.github.javaparser.ast.expr.ConditionalExpr;
import com.github.javaparser.ast.expr.EnclosedExpr;
import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.FieldAccessExpr;
import com.github.javaparser.ast.expr.LambdaExpr;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.expr.NameExpr;
import com.github.javaparser.ast.expr.ObjectCreationExpr;
import com.github.javaparser.ast.expr.ThisExpr;
import com.github.javaparser.ast.expr.VariableDeclarationExpr;
import com.github.javaparser.ast.stmt.AssertStmt;
import com.github.javaparser.ast.stmt.ExplicitConstructorInvocationStmt;
import com.github.javaparser.ast.stmt.ExpressionStmt;
import com.github.javaparser.ast.stmt.ForEachStmt;
import com.github.javaparser.ast.stmt.ReturnStmt;
import com.github.javaparser.ast.stmt.ThrowStmt;
import com.github.javaparser.ast.stmt.YieldStmt;
import dev.plumbline.flow.CfgNode;
import dev.plumbline.model.ApiMethod;
import dev.plumbline.model.Effect;
import dev.plumbline.parse.NumberLiterals;
import dev.plumbline.types.ProjectIndex;
import dev.plumbline.types.Variable;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;

/**
 * The transfer functions of {@link ProvenanceAnalysis}: evaluates one node's expressions in
 * Java's order, threading the store, and records facts when given a sink (only in the final pass
 * over the converged solution, so facts are never recorded from a state that is not a fixed
 * point).
 */
final class ProvenanceEvaluator {
  private final ProvenanceAnalysis a;
  private final ProvenanceFacts sink;
  private ProvenanceState state;

  ProvenanceEvaluator(ProvenanceAnalysis analysis, ProvenanceFacts sink) {
    this.a = analysis;
    this.sink = sink;
  }

  void startAt(ProvenanceState in) {
    state = in;
  }

  ProvenanceState node(CfgNode node, ProvenanceState in) {
    state = in;
    Node ast = node.ast();
    switch (node.kind()) {
      case ENTRY, EXIT, JOIN, CATCH -> {
        return in;
      }
      case FOREACH_NEXT -> {
        ForEachStmt f = (ForEachStmt) ast;
        DataValue iterable = valueOf(f.getIterable());
        for (VariableDeclarator d : f.getVariable().getVariables()) {
          Variable v = a.types.symbols().variableOf(d);
          state = state.with(v, iterable != null && iterable.kind() == DataValue.Kind.DATA
              ? iterable : null);
        }
        return state;
      }
      default -> {
        statementOrExpression(ast);
        return state;
      }
    }
  }

  private void statementOrExpression(Node ast) {
    if (ast instanceof ExpressionStmt es) {
      eval(es.getExpression());
    } else if (ast instanceof Expression e) {
      eval(e);
    } else if (ast instanceof ReturnStmt r) {
      if (r.getExpression().isPresent()) {
        DataValue v = eval(r.getExpression().get());
        if (sink != null) {
          sink.add(new ProvenanceFacts.Returned(a.graph, r, v));
        }
      }
    } else if (ast instanceof ThrowStmt t) {
      eval(t.getExpression());
    } else if (ast instanceof AssertStmt as) {
      eval(as.getCheck());
      as.getMessage().ifPresent(this::eval);
    } else if (ast instanceof YieldStmt y) {
      eval(y.getExpression());
    } else if (ast instanceof ExplicitConstructorInvocationStmt ec) {
      ec.getArguments().forEach(this::eval);
    }
  }

  /**
   * The value an expression has in the current store, evaluated silently and without changing
   * the store: used to re-read an iterable that its own node already evaluated and recorded.
   */
  private DataValue valueOf(Expression e) {
    ProvenanceEvaluator silent = new ProvenanceEvaluator(a, null);
    silent.state = state;
    return silent.eval(e);
  }

  DataValue eval(Expression e) {
    if (e instanceof EnclosedExpr en) {
      return eval(en.getInner());
    }
    if (e instanceof CastExpr c) {
      return eval(c.getExpression());
    }
    if (e instanceof NameExpr n) {
      return a.types.symbols().resolve(n).map(this::read).orElse(null);
    }
    if (e instanceof FieldAccessExpr fa) {
      if (fa.getScope() instanceof ThisExpr) {
        return a.types.symbols().field(fa, fa.getNameAsString()).map(this::read).orElse(null);
      }
      eval(fa.getScope());
      return null;
    }
    if (e instanceof VariableDeclarationExpr vde) {
      for (VariableDeclarator d : vde.getVariables()) {
        Variable v = a.types.symbols().variableOf(d);
        DataValue init = null;
        if (d.getInitializer().isPresent()) {
          Expression initializer = d.getInitializer().get();
          init = bindValue(d.getNameAsString(), initializer, eval(initializer), a.types.typeOf(v), d);
        }
        if (sink != null && init != null && init.kind() == DataValue.Kind.DATA
            && !init.roles().isEmpty() && !init.holds(Role.WHOLE)) {
          sink.add(new ProvenanceFacts.PartBinding(a.graph, d, v, init));
        }
        state = state.with(v, init);
      }
      return null;
    }
    if (e instanceof AssignExpr as) {
      DataValue value = eval(as.getValue());
      Optional<Variable> target = targetOf(as.getTarget());
      if (as.getOperator() != AssignExpr.Operator.ASSIGN) {
        value = null;
      } else if (target.isPresent()) {
        value = bindValue(target.get().name(), as.getValue(), value, a.types.typeOf(target.get()), as);
      }
      if (target.isPresent()) {
        write(target.get(), value, as);
      } else {
        eval(as.getTarget());
      }
      return value;
    }
    if (e instanceof ConditionalExpr c) {
      eval(c.getCondition());
      ProvenanceState before = state;
      DataValue t = eval(c.getThenExpr());
      ProvenanceState afterThen = state;
      state = before;
      DataValue f = eval(c.getElseExpr());
      state = state.join(afterThen);
      return t == null ? f : t.join(f);
    }
    if (e instanceof ArrayAccessExpr aa) {
      DataValue array = eval(aa.getName());
      eval(aa.getIndex());
      return element(array, aa);
    }
    if (e instanceof ArrayCreationExpr ac) {
      ac.getLevels().forEach(l -> l.getDimension().ifPresent(this::eval));
      return ac.getInitializer().map(this::eval).orElse(null);
    }
    if (e instanceof ArrayInitializerExpr ai) {
      List<DataValue> values = new ArrayList<>();
      for (Expression v : ai.getValues()) {
        values.add(eval(v));
      }
      return joinData(values);
    }
    if (e instanceof MethodCallExpr call) {
      return call(call);
    }
    if (e instanceof ObjectCreationExpr oce) {
      return construct(oce);
    }
    if (e instanceof LambdaExpr) {
      return null; // evaluated in its own graph
    }
    // Other expressions: evaluate children for their effects (assignments, calls) in order.
    for (Node child : e.getChildNodes()) {
      if (child instanceof Expression ce) {
        eval(ce);
      }
    }
    return null;
  }

  /**
   * The value a variable receives from {@code source}: a dataset builder with a known usage
   * becomes rows once it lands in a data-typed variable; rows loaded here from an unknown
   * source take a held-out role or time order from the variable's name (the weak heuristic).
   */
  DataValue bindValue(String name, Expression source, DataValue value, String type, Node site) {
    boolean data = a.isDataType(type);
    if (value == null) {
      if (!data) {
        return null;
      }
      value = DataValue.fresh(a.lineageAt(site, name));
      return named(value, List.of(name), site);
    }
    if (value.kind() == DataValue.Kind.PENDING) {
      if (!data) {
        return value;
      }
      return new DataValue(DataValue.Kind.DATA, value.roles(), value.guessed(),
          Set.of(a.lineageAt(site, name)), Set.of(), 0, value.origins(), value.timeOrdered());
    }
    if (value.onlyWhole() && value.lineages().size() == 1
        && value.lineages().iterator().next().site() == unwrap(source)) {
      return named(value, List.of(name), site);
    }
    if (value.onlyWhole() && a.file.settings().marksTestData(name)) {
      // The project's configuration says this name holds test rows; with no split evidence to
      // the contrary, take its word (still a name-based judgement, reported as such).
      return named(value, List.of(name), site);
    }
    return value;
  }

  /** Applies what names say to rows that just entered with nothing else known. */
  private DataValue named(DataValue fresh, List<String> names, Node site) {
    DataValue out = fresh;
    Optional<Role> role = DataNames.heldOutRole(names, a.file.settings());
    if (role.isPresent() && out.onlyWhole()) {
      out = out.withRoles(EnumSet.of(role.get()), EnumSet.of(role.get()), site);
    }
    if (!out.isTimeOrdered() && DataNames.saysTimeOrdered(names)) {
      out = out.withTimeOrder(site);
    }
    return out;
  }

  private static Node unwrap(Expression e) {
    Expression current = e;
    while (current instanceof EnclosedExpr || current instanceof CastExpr) {
      current = current instanceof EnclosedExpr en ? en.getInner() : ((CastExpr) current).getExpression();
    }
    return current;
  }

  private Optional<Variable> targetOf(Expression target) {
    if (target instanceof NameExpr n) {
      return a.types.symbols().resolve(n);
    }
    if (target instanceof FieldAccessExpr fa && fa.getScope() instanceof ThisExpr) {
      return a.types.symbols().field(fa, fa.getNameAsString());
    }
    return Optional.empty();
  }

  private void write(Variable v, DataValue value, Node at) {
    state = state.with(v, value);
    if (v.isField() && sink != null && a.graph != null) {
      sink.add(new ProvenanceFacts.FieldWrite(a.graph, v.declaration(), at, value));
    }
  }

  /** A variable's value; data entering from outside the method starts its own lineage. */
  private DataValue read(Variable v) {
    Optional<DataValue> known = state.get(v);
    if (known.isPresent()) {
      return known.get();
    }
    String type = a.types.typeOf(v);
    if (v.kind() == Variable.Kind.FIELD) {
      return fieldValue(v, type);
    }
    if (ProvenanceAnalysis.isCallableParameter(v)) {
      Lineage lineage = a.lineageAt(v.declaration(), v.name());
      if (a.mode == ProvenanceAnalysis.Mode.SUMMARY && (a.isDataType(type) || a.isCollectionType(type))) {
        a.readCallerRows = true;
        return DataValue.data(EnumSet.of(Role.ARGUMENT), Set.of(lineage));
      }
      if (a.isDataType(type)) {
        DataValue fresh = DataValue.fresh(lineage);
        // Only time order is read from a parameter's name: which rows a caller passes is the
        // caller's business, but a parameter called hourlyReadings is time-ordered whatever it is.
        return DataNames.saysTimeOrdered(List.of(v.name())) ? fresh.withTimeOrder(v.declaration()) : fresh;
      }
    }
    return null;
  }

  /**
   * A field read before this method assigns it: what the project-wide field summary says it may
   * hold, else what its name says, else whole rows. Its lineage is the field itself, shared by
   * every method of the class.
   */
  private DataValue fieldValue(Variable v, String type) {
    if (!a.isDataType(type) && !a.isCollectionType(type)) {
      return null;
    }
    Lineage lineage = a.lineageAt(v.declaration(), v.toString());
    ProvenanceSummaries.FieldSummary summary = a.fieldSummary(v.declaration());
    if (summary != null && !summary.roles().isEmpty()) {
      return new DataValue(DataValue.Kind.DATA, summary.roles(), summary.guessed(), Set.of(lineage),
          Set.of(), 0, sameFile(summary.origins()), sameFile(summary.timeOrdered()));
    }
    return named(DataValue.fresh(lineage), List.of(v.name()), v.declaration());
  }

  private Set<Node> sameFile(Set<Node> nodes) {
    Set<Node> out = DataValue.identitySet(List.of());
    for (Node n : nodes) {
      if (n.findCompilationUnit().orElse(null) == a.file.source().unit()) {
        out.add(n);
      }
    }
    return out;
  }

  /** An element of an array: a part of a split made into an array, or any element of a data array. */
  private DataValue element(DataValue array, ArrayAccessExpr access) {
    if (array == null) {
      return null;
    }
    if (array.kind() == DataValue.Kind.DATA) {
      return array;
    }
    if (array.kind() != DataValue.Kind.PARTS) {
      return null;
    }
    List<Role> byIndex = partRoles(array);
    Node origin = array.sites().stream().min(DataValue.BY_POSITION).orElse(access);
    Expression index = access.getIndex();
    if (!index.isIntegerLiteralExpr()) {
      EnumSet<Role> any = EnumSet.noneOf(Role.class);
      byIndex.forEach(r -> any.add(heldOutOfTraining(array, r)));
      return new DataValue(DataValue.Kind.DATA, any, Set.of(), array.lineages(),
          Set.of(), 0, Set.of(origin), array.timeOrdered());
    }
    int i = NumberLiterals.value(index.asIntegerLiteralExpr()).intValue();
    Role role = heldOutOfTraining(array, i >= 0 && i < byIndex.size() ? byIndex.get(i) : Role.HELD_OUT);
    return new DataValue(DataValue.Kind.DATA, EnumSet.of(role), Set.of(), array.lineages(), Set.of(),
        0, Set.of(origin), array.timeOrdered());
  }

  /**
   * Rows held out of a split of training rows are validation rows, whatever the split method
   * calls its parts ({@code split.getTrain().splitTestAndTrain(0.9).getTest()} is the usual way
   * to carve a validation set out of the training part).
   */
  private static Role heldOutOfTraining(DataValue split, Role part) {
    boolean ofTraining = split.roles().equals(EnumSet.of(Role.TRAIN));
    return ofTraining && (part == Role.TEST || part == Role.HELD_OUT) ? Role.VALIDATION : part;
  }

  /** Whether a split draws its rows at random: always, or when given a shuffling argument. */
  private boolean drawsAtRandom(MethodCallExpr call, ApiMethod m) {
    if (m.flag("random")) {
      return true;
    }
    if (m.attribute("randomWhenArg") != null) {
      int i = m.intAttribute("randomWhenArg", 0);
      String type = i < call.getArguments().size() ? a.types.typeOf(call.getArgument(i)) : null;
      return type != null && a.file.model().typeAttribute(type, "shuffles").isPresent();
    }
    return false;
  }

  /**
   * Roles of the parts of a split into an array, in array order. With literal ratios the largest
   * part is the training part; of the others, two parts leave one held-out part of unsaid
   * purpose, three leave validation then test. Without ratios: training first, then (of three)
   * validation and test, as DJL's own examples order them (common practice).
   */
  private List<Role> partRoles(DataValue array) {
    int n = array.parts();
    List<Double> ratios = ratios(array);
    if (ratios != null) {
      n = ratios.size();
    }
    List<Role> out = new ArrayList<>();
    if (n <= 0) {
      out.add(Role.TRAIN);
      out.add(Role.HELD_OUT);
      return out;
    }
    int train = 0;
    if (ratios != null) {
      for (int i = 1; i < n; i++) {
        if (ratios.get(i) > ratios.get(train)) {
          train = i;
        }
      }
      for (int i = 0; i < n; i++) {
        if (i != train && ratios.get(i).equals(ratios.get(train))) {
          train = -1; // no unique largest part: say nothing about training
          break;
        }
      }
    }
    List<Role> heldOut = n == 3 ? List.of(Role.VALIDATION, Role.TEST) : List.of();
    int h = 0;
    for (int i = 0; i < n; i++) {
      if (i == train) {
        out.add(Role.TRAIN);
      } else if (train >= 0 && h < heldOut.size()) {
        out.add(heldOut.get(h++));
      } else {
        out.add(Role.HELD_OUT);
      }
    }
    return out;
  }

  private List<Double> ratios(DataValue array) {
    if (array.sites().size() != 1 || !(array.sites().iterator().next() instanceof MethodCallExpr call)) {
      return null;
    }
    Optional<ApiMethod> m = a.types.apiMethod(call);
    if (m.isEmpty() || m.get().attribute("ratiosFrom") == null) {
      return null;
    }
    int from = m.get().intAttribute("ratiosFrom", 0);
    List<Double> out = new ArrayList<>();
    for (int i = from; i < call.getArguments().size(); i++) {
      Expression arg = call.getArgument(i);
      if (arg.isIntegerLiteralExpr()) {
        out.add(NumberLiterals.value(arg.asIntegerLiteralExpr()).doubleValue());
      } else if (arg.isDoubleLiteralExpr()) {
        out.add(NumberLiterals.value(arg.asDoubleLiteralExpr()));
      } else {
        return null;
      }
    }
    return out.size() >= 2 ? out : null;
  }

  // ------------------------------------------------------------------ calls

  private DataValue call(MethodCallExpr call) {
    DataValue receiver = call.getScope().map(this::eval).orElse(null);
    List<DataValue> args = new ArrayList<>();
    for (Expression arg : call.getArguments()) {
      args.add(eval(arg));
    }
    Optional<ProjectIndex.ProjectMethod> project = a.types.projectMethod(call);
    if (project.isPresent()) {
      return applySummary(call, project.get(), args);
    }
    Optional<ApiMethod> api = a.types.apiMethod(call);
    if (api.isEmpty()) {
      return unknownResult(call, receiver);
    }
    ApiMethod m = api.get();
    switch (m.effect()) {
      case SPLIT -> {
        if (receiver == null) {
          return null;
        }
        recordSplit(call, call.getScope().orElse(call), receiver, drawsAtRandom(call, m), null);
        return receiver.withKind(DataValue.Kind.SPLIT_HOLDER, Set.of(call), 0);
      }
      case SPLIT_ARRAY -> {
        if (receiver == null) {
          return null;
        }
        recordSplit(call, call.getScope().orElse(call), receiver, drawsAtRandom(call, m), null);
        int parts = m.isVarArgs() ? call.getArguments().size() - (m.params().size() - 1) : 0;
        return receiver.withKind(DataValue.Kind.PARTS, Set.of(call), parts > 1 ? parts : 0);
      }
      case SPLIT_PART -> {
        if (receiver == null || receiver.kind() != DataValue.Kind.SPLIT_HOLDER) {
          return null;
        }
        Role role = heldOutOfTraining(receiver, Role.valueOf(m.attribute("part").toUpperCase(Locale.ROOT)));
        Node origin = receiver.sites().stream().min(DataValue.BY_POSITION).orElse(call);
        return new DataValue(DataValue.Kind.DATA, EnumSet.of(role), Set.of(), receiver.lineages(),
            Set.of(), 0, Set.of(origin), receiver.timeOrdered());
      }
      case DERIVE, COPY -> {
        return receiver != null && receiver.kind() == DataValue.Kind.DATA ? receiver : null;
      }
      case WRAP -> {
        return joinData(args);
      }
      case STORE, READ_FROM -> {
        // STORE: a container keeps the argument (its rows join the container's); READ_FROM: a
        // reader reads the argument's rows from now on.
        int dataArg = m.effect() == Effect.STORE ? m.intAttribute("valueArg", 0) : m.intAttribute("dataArg", 0);
        DataValue added = dataArg < args.size() ? args.get(dataArg) : null;
        Optional<Variable> target = call.getScope().flatMap(this::targetOf);
        if (target.isPresent() && added != null && added.kind() == DataValue.Kind.DATA) {
          DataValue old = state.get(target.get()).orElse(null);
          DataValue now;
          if (m.effect() == Effect.STORE) {
            now = old == null ? added : old.join(added);
          } else {
            // A reader takes its rows from the split, but a sequence reader still reads them in
            // time order: keep the reader's own time-order evidence.
            now = added;
            if (old != null && old.isTimeOrdered() && !added.isTimeOrdered()) {
              now = added.withTimeOrder(old.firstTimeOrderEvidence().get());
            }
          }
          write(target.get(), now, call);
        }
        return null;
      }
      case FIT_PREPROCESSOR -> {
        int dataArg = m.intAttribute("dataArg", 0);
        if (sink != null && dataArg < args.size() && args.get(dataArg) != null && call.getScope().isPresent()) {
          boolean learns = !"false".equals(m.attribute("learns")) && learnsFromData(call);
          Expression pre = call.getScope().get();
          sink.add(new ProvenanceFacts.Fit(a.graph, call, pre, ProvenanceAnalysis.shortText(pre),
              call.getArgument(dataArg), args.get(dataArg), learns, null));
        }
        return null;
      }
      case TRAIN -> {
        recordUse(call, m, args);
        recordTrain(call, m, args);
        return null;
      }
      case PREDICT -> {
        recordUse(call, m, args);
        return unknownResult(call, receiver);
      }
      case EVALUATE -> {
        recordUse(call, m, args);
        ProvenanceFacts.EvaluationKind kind = "model".equals(m.attribute("scoreVia"))
            ? ProvenanceFacts.EvaluationKind.SCORE_ON_MODEL : ProvenanceFacts.EvaluationKind.SCORE;
        recordEvaluation(call, m, args, m.intAttribute("dataArg", 0), kind);
        return null;
      }
      case SHUFFLE -> {
        recordShuffle(call, m, receiver, args);
        return null;
      }
      case STATISTIC, REDUCE -> {
        if (!m.flag("statistic") && m.effect() == Effect.REDUCE) {
          return null;
        }
        if (receiver == null || receiver.kind() != DataValue.Kind.DATA) {
          return null;
        }
        return receiver.withKind(DataValue.Kind.STATISTIC, Set.of(call), 0);
      }
      case ELEMENTWISE, VECTOR_OP -> {
        for (DataValue arg : args) {
          recordStatisticUse(arg, call);
        }
        recordStatisticUse(receiver, call);
        return receiver != null && receiver.kind() == DataValue.Kind.DATA ? receiver : null;
      }
      default -> {
        return unknownResult(call, receiver);
      }
    }
  }

  /** Data given to a model directly (train, evaluate, predict), for the audit's verdicts. */
  private void recordUse(MethodCallExpr call, ApiMethod m, List<DataValue> args) {
    int dataArg = m.intAttribute("dataArg", 0);
    if (sink != null && dataArg < args.size() && args.get(dataArg) != null) {
      sink.add(new ProvenanceFacts.Use(a.graph, call, m, call.getArgument(dataArg), args.get(dataArg)));
    }
  }

  private void recordTrain(MethodCallExpr call, ApiMethod m, List<DataValue> args) {
    int dataArg = m.intAttribute("dataArg", 0);
    if (sink != null && dataArg < args.size() && args.get(dataArg) != null) {
      sink.add(new ProvenanceFacts.Train(a.graph, call, ProvenanceAnalysis.shortText(modelOf(call, m)),
          call.getArgument(dataArg), args.get(dataArg), null));
    }
    if (m.attribute("validationArg") != null) {
      recordEvaluation(call, m, args, m.intAttribute("validationArg", 0),
          ProvenanceFacts.EvaluationKind.SCORE_ON_MODEL);
    }
  }

  private void recordEvaluation(Expression call, ApiMethod m, List<DataValue> args, int dataArg,
      ProvenanceFacts.EvaluationKind kind) {
    if (sink == null || dataArg >= args.size() || args.get(dataArg) == null) {
      return;
    }
    Expression argument = call instanceof MethodCallExpr mc ? mc.getArgument(dataArg)
        : ((ObjectCreationExpr) call).getArgument(dataArg);
    Expression model = call instanceof MethodCallExpr mc ? modelOf(mc, m) : null;
    sink.add(new ProvenanceFacts.Evaluation(a.graph, call, model, argument, args.get(dataArg), kind, null));
  }

  private static Expression modelOf(MethodCallExpr call, ApiMethod m) {
    if (m.attribute("modelArg") != null) {
      int i = m.intAttribute("modelArg", 0);
      if (i < call.getArguments().size()) {
        return call.getArgument(i);
      }
    }
    return call.getScope().orElse(call);
  }

  private void recordShuffle(MethodCallExpr call, ApiMethod m, DataValue receiver, List<DataValue> args) {
    Expression target;
    DataValue data;
    if (m.attribute("dataArg") != null) {
      int i = m.intAttribute("dataArg", 0);
      target = i < call.getArguments().size() ? call.getArgument(i) : null;
      data = i < args.size() ? args.get(i) : null;
    } else {
      target = call.getScope().orElse(null);
      data = receiver;
    }
    if (sink == null || target == null || data == null || data.kind() != DataValue.Kind.DATA) {
      return;
    }
    ProvenanceFacts.Seeding seeding;
    Expression generator = null;
    if (m.attribute("randomArg") != null) {
      seeding = ProvenanceFacts.Seeding.BY_GENERATOR_ARGUMENT;
      generator = call.getArgument(m.intAttribute("randomArg", 0));
    } else {
      seeding = m.flag("seeded") ? ProvenanceFacts.Seeding.SEEDED : ProvenanceFacts.Seeding.CLOCK;
    }
    sink.add(new ProvenanceFacts.Shuffle(a.graph, call, target, data, seeding, generator, null));
  }

  /** Whether the receiver's normalizer type learns statistics (type attribute {@code learns}). */
  private boolean learnsFromData(MethodCallExpr call) {
    String type = call.getScope().map(a.types::typeOf).orElse(null);
    if (type == null) {
      return true;
    }
    for (String t : a.types.project().selfAndSupertypes(type)) {
      Optional<String> learns = a.file.model().type(t).map(at -> at.attributes().get("learns"));
      if (learns.isPresent() && learns.get() != null) {
        return !"false".equals(learns.get());
      }
    }
    return true;
  }

  private void recordSplit(Expression call, Expression splitData, DataValue receiver, boolean random,
      String via) {
    if (sink != null && receiver.kind() == DataValue.Kind.DATA) {
      sink.add(new ProvenanceFacts.Split(a.graph, call, splitData, receiver, random, via));
    }
  }

  private void recordStatisticUse(DataValue v, MethodCallExpr use) {
    if (sink == null || v == null || v.kind() != DataValue.Kind.STATISTIC) {
      return;
    }
    for (Node site : v.sites().stream().sorted(DataValue.BY_POSITION).toList()) {
      if (site instanceof MethodCallExpr statCall) {
        sink.add(new ProvenanceFacts.StatisticUse(a.graph, statCall,
            statCall.getScope().orElse(statCall), v, use));
      }
    }
  }

  // ------------------------------------------------------------------ project helpers

  /**
   * A call of a project method: its summary's uses of each argument become facts at this call,
   * and its returned value is rebuilt from the arguments. Without a summary (a recursive cycle
   * not yet solved) the result is unknown.
   */
  private DataValue applySummary(MethodCallExpr call, ProjectIndex.ProjectMethod method,
      List<DataValue> args) {
    ProvenanceSummaries.MethodSummary s = a.methodSummary(method.declaration());
    if (s == null) {
      return unknownResult(call, null);
    }
    if (!s.settled()) {
      // A call into the cycle being solved: no rows known yet (bottom), which joins away.
      return DataValue.data(Set.of(), Set.of());
    }
    String via = method.name();
    for (ProvenanceSummaries.ParamUse use : s.uses()) {
      if (use.index() >= args.size() || method.isVarArgs() && use.index() >= method.arity() - 1) {
        continue;
      }
      DataValue v = args.get(use.index());
      if (v == null || v.kind() != DataValue.Kind.DATA || sink == null) {
        continue;
      }
      Expression argument = call.getArgument(use.index());
      switch (use.use()) {
        case FIT -> sink.add(new ProvenanceFacts.Fit(a.graph, call, null, use.description(), argument,
            v, use.learns(), via));
        case SPLIT -> sink.add(new ProvenanceFacts.Split(a.graph, call, argument, v, use.random(), via));
        case TRAIN -> sink.add(new ProvenanceFacts.Train(a.graph, call, use.description(), argument, v, via));
        case EVALUATE -> sink.add(new ProvenanceFacts.Evaluation(a.graph, call, null, argument, v,
            use.evaluationKind(), via));
        case SHUFFLE -> sink.add(new ProvenanceFacts.Shuffle(a.graph, call, argument, v, use.seeding(),
            null, via));
        default -> throw new IllegalStateException("unknown use " + use.use());
      }
    }
    ProvenanceSummaries.ReturnSummary r = s.returns();
    if (r == null) {
      return unknownResult(call, null);
    }
    EnumSet<Role> roles = EnumSet.noneOf(Role.class);
    roles.addAll(r.roles());
    roles.remove(Role.ARGUMENT);
    Set<Role> guessed = EnumSet.noneOf(Role.class);
    guessed.addAll(r.guessed());
    Set<Lineage> lineages = new HashSet<>();
    Set<Node> timeOrdered = DataValue.identitySet(List.of());
    Set<Node> origins = DataValue.identitySet(List.of());
    boolean changedRoles = !roles.isEmpty();
    for (int i : r.fromParams()) {
      DataValue v = i < args.size() ? args.get(i) : null;
      if (v == null || v.kind() != DataValue.Kind.DATA) {
        continue;
      }
      lineages.addAll(v.lineages());
      timeOrdered.addAll(v.timeOrdered());
      if (r.roles().contains(Role.ARGUMENT)) {
        origins.addAll(v.origins());
        for (Role role : v.roles()) {
          if (roles.add(role) && v.guessed().contains(role)) {
            guessed.add(role);
          }
        }
      }
    }
    if (r.ownData()) {
      lineages.add(a.lineageAt(call));
    }
    for (Node field : r.fields()) {
      if (field instanceof VariableDeclarator d) {
        lineages.add(a.lineageAt(field, "this." + d.getNameAsString()));
      }
    }
    if (r.timeOrdered()) {
      timeOrdered.add(call);
    }
    if (roles.isEmpty() || lineages.isEmpty()) {
      return unknownResult(call, null);
    }
    if (changedRoles) {
      origins.add(call);
    }
    return new DataValue(r.kind(), roles, guessed, lineages, Set.of(call), r.parts(), origins,
        timeOrdered);
  }

  // ------------------------------------------------------------------ sources

  /**
   * A call the model does not describe: a dataset builder given a {@code Usage} stays a pending
   * source of those rows along its builder chain; a call returning data starts a lineage, named
   * by the words in the call.
   */
  private DataValue unknownResult(MethodCallExpr call, DataValue receiver) {
    DataValue pending = receiver != null && receiver.kind() == DataValue.Kind.PENDING ? receiver : null;
    for (Expression arg : call.getArguments()) {
      Optional<Role> usage = usageRole(arg);
      if (usage.isPresent()) {
        pending = new DataValue(DataValue.Kind.PENDING, EnumSet.of(usage.get()), Set.of(), Set.of(),
            Set.of(), 0, Set.of(arg), pending == null ? Set.of() : pending.timeOrdered());
      }
    }
    String type = a.types.typeOf(call);
    if (pending != null) {
      if (!a.isDataType(type)) {
        return pending;
      }
      return new DataValue(DataValue.Kind.DATA, pending.roles(), Set.of(),
          Set.of(a.lineageAt(call)), Set.of(), 0,
          pending.origins(), pending.timeOrdered());
    }
    if (!a.isDataType(type)) {
      return null;
    }
    return named(DataValue.fresh(a.lineageAt(call)),
        DataNames.namesIn(call), call);
  }

  /** The role a DJL {@code Dataset.Usage} constant says, e.g. {@code Dataset.Usage.TEST}. */
  private Optional<Role> usageRole(Expression arg) {
    if (!(arg instanceof FieldAccessExpr fa)) {
      return Optional.empty();
    }
    String type = a.types.typeReference(fa.getScope());
    if (type == null || a.file.model().typeAttribute(type, "usageOfData").isEmpty()) {
      return Optional.empty();
    }
    return switch (fa.getNameAsString()) {
      case "TEST" -> Optional.of(Role.TEST);
      case "VALIDATION" -> Optional.of(Role.VALIDATION);
      case "TRAIN" -> Optional.of(Role.TRAIN);
      default -> Optional.empty();
    };
  }

  private DataValue construct(ObjectCreationExpr oce) {
    oce.getScope().ifPresent(this::eval);
    List<DataValue> args = new ArrayList<>();
    for (Expression arg : oce.getArguments()) {
      args.add(eval(arg));
    }
    Optional<ApiMethod> ctor = a.types.apiConstructor(oce);
    String type = a.types.symbols().types().resolve(oce.getType());
    boolean sequence = type != null && a.file.model().typeAttribute(type, "ordered").isPresent();
    if (ctor.isPresent() && ctor.get().effect() == Effect.WRAP) {
      DataValue wrapped = joinData(args);
      if (wrapped != null) {
        return sequence && !wrapped.isTimeOrdered() ? wrapped.withTimeOrder(oce) : wrapped;
      }
    }
    if (ctor.isPresent() && ctor.get().effect() == Effect.EARLY_STOPPING) {
      recordEvaluation(oce, ctor.get(), args, ctor.get().intAttribute("dataArg", 0),
          ProvenanceFacts.EvaluationKind.EARLY_STOPPING);
      return null;
    }
    if (!a.isDataType(type)) {
      return null;
    }
    DataValue fresh = named(DataValue.fresh(a.lineageAt(oce, oce.getTypeAsString())),
        DataNames.namesIn(oce), oce);
    return sequence && !fresh.isTimeOrdered() ? fresh.withTimeOrder(oce) : fresh;
  }

  private static DataValue joinData(List<DataValue> values) {
    DataValue out = null;
    for (DataValue v : values) {
      if (v != null && v.kind() == DataValue.Kind.DATA) {
        out = out == null ? v : out.join(v);
      }
    }
    return out;
  }
}
