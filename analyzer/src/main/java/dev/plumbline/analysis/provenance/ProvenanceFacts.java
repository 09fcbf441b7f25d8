package dev.plumbline.analysis.provenance;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.VariableDeclarator;
import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.MethodCallExpr;
import dev.plumbline.flow.ControlFlowGraph;
import dev.plumbline.types.Variable;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Set;

/**
 * What the provenance analysis publishes for one file, for rules to query. Every fact names the
 * callable graph it was found in, so a rule can relate facts of the same method. A fact found
 * at a call of a project helper (through its summary) names the helper in {@code via}; its
 * {@code call} is then the helper call, in this file.
 */
public final class ProvenanceFacts {

  /**
   * A preprocessor fitted to data. {@code learns} is false for fixed-range scalers.
   * {@code preprocessor} is null when the fit happens inside a helper; {@code preprocessorName}
   * always says which preprocessor it is.
   */
  public record Fit(ControlFlowGraph graph, Expression call, Expression preprocessor,
      String preprocessorName, Expression argument, DataValue data, boolean learns, String via) {}

  /**
   * Rows of some lineages split into parts at {@code call}. {@code random} when the split draws
   * rows at random (rather than taking them in order).
   */
  public record Split(ControlFlowGraph graph, Expression call, Expression splitData, DataValue data,
      boolean random, String via) {}

  /** A statistic computed over data at {@code call} and used to rescale data at {@code use}. */
  public record StatisticUse(ControlFlowGraph graph, MethodCallExpr call, Expression over,
      DataValue data, Expression use) {}

  // ---- part bindings (used by fixes that need the variable holding a split part)

  /**
   * A local variable declared with rows of split parts only (no whole rows), e.g.
   * {@code DataSet train = split.getTrain();}. Recorded at the declaration, with the value the
   * initializer has on every path that reaches it.
   */
  public record PartBinding(ControlFlowGraph graph, VariableDeclarator declarator,
      Variable variable, DataValue value) {}

  private final List<PartBinding> partBindings;

  void add(PartBinding b) {
    partBindings.add(b);
  }

  public List<PartBinding> partBindings() {
    return Collections.unmodifiableList(partBindings);
  }

  // ---- fits, splits and statistics
  /**
   * Data given to a model: trained on, evaluated on or predicted from ({@code method.effect()}
   * says which), with the rows the argument may hold.
   */
  public record Use(ControlFlowGraph graph, MethodCallExpr call, dev.plumbline.model.ApiMethod method,
      Expression argument, DataValue data) {}
  /** A model trained on data at {@code call}; {@code model} names the model or trainer. */
  public record Train(ControlFlowGraph graph, Expression call, String model, Expression argument,
      DataValue data, String via) {}

  /** How an evaluation's result is obtained and what it is for. */
  public enum EvaluationKind {
    /** The call returns a score or an evaluation object. */
    SCORE,
    /** The score is read later from the model or trainer ({@code scoreVia=model}). */
    SCORE_ON_MODEL,
    /** An early-stopping score calculator built on the data: it picks when training stops. */
    EARLY_STOPPING
  }

  /**
   * A model evaluated on data at {@code call}. {@code model} is the model or trainer expression
   * when known (null through helpers and early-stopping calculators).
   */
  public record Evaluation(ControlFlowGraph graph, Expression call, Expression model,
      Expression argument, DataValue data, EvaluationKind kind, String via) {}

  /** How a shuffle is seeded. */
  public enum Seeding { SEEDED, CLOCK, BY_GENERATOR_ARGUMENT }

  /**
   * Rows shuffled in place at {@code call}. With {@link Seeding#BY_GENERATOR_ARGUMENT},
   * {@code generator} is the random generator argument.
   */
  public record Shuffle(ControlFlowGraph graph, Expression call, Expression target, DataValue data,
      Seeding seeding, Expression generator, String via) {}

  /** A field assigned at {@code at}; {@code value} is null when the value is not tracked. */
  public record FieldWrite(ControlFlowGraph graph, Node field, Node at, DataValue value) {}

  /** A value returned by the callable of {@code graph}; null when not tracked. */
  public record Returned(ControlFlowGraph graph, Node at, DataValue value) {}

  private final List<Fit> fits;
  private final List<Use> uses;
  private final List<Split> splits;
  private final List<StatisticUse> statisticUses;
  private final List<Train> trains;
  private final List<Evaluation> evaluations;
  private final List<Shuffle> shuffles;
  private final List<FieldWrite> fieldWrites;
  private final Set<Node> fieldSummariesRead;
  private final List<Returned> returns;

  public ProvenanceFacts() {
    partBindings = new ArrayList<>();
    fits = new ArrayList<>();
    uses = new ArrayList<>();
    splits = new ArrayList<>();
    statisticUses = new ArrayList<>();
    trains = new ArrayList<>();
    evaluations = new ArrayList<>();
    shuffles = new ArrayList<>();
    fieldWrites = new ArrayList<>();
    fieldSummariesRead = DataValue.identitySet(List.of());
    returns = new ArrayList<>();
  }

  /** An unmodifiable copy, as small as its facts allow (most lists of a method are empty). */
  private ProvenanceFacts(ProvenanceFacts from) {
    partBindings = List.copyOf(from.partBindings);
    fits = List.copyOf(from.fits);
    uses = List.copyOf(from.uses);
    splits = List.copyOf(from.splits);
    statisticUses = List.copyOf(from.statisticUses);
    trains = List.copyOf(from.trains);
    evaluations = List.copyOf(from.evaluations);
    shuffles = List.copyOf(from.shuffles);
    fieldWrites = List.copyOf(from.fieldWrites);
    // Identity, not Set.copyOf: nodes compare structurally.
    fieldSummariesRead = from.fieldSummariesRead.isEmpty() ? Set.of()
        : Collections.unmodifiableSet(DataValue.identitySet(from.fieldSummariesRead));
    returns = List.copyOf(from.returns);
  }

  /** No facts at all, unmodifiable: what most methods' frozen facts are. */
  private static final ProvenanceFacts NONE = new ProvenanceFacts(new ProvenanceFacts());

  /** These facts, kept for a while: an unmodifiable, compact copy. */
  ProvenanceFacts frozen() {
    boolean none = partBindings.isEmpty() && fits.isEmpty() && uses.isEmpty() && splits.isEmpty()
        && statisticUses.isEmpty() && trains.isEmpty() && evaluations.isEmpty()
        && shuffles.isEmpty() && fieldWrites.isEmpty() && fieldSummariesRead.isEmpty()
        && returns.isEmpty();
    return none ? NONE : new ProvenanceFacts(this);
  }

  void add(Fit f) {
    fits.add(f);
  }

  void add(Split s) {
    splits.add(s);
  }

  void add(Use u) {
    uses.add(u);
  }

  /** Training, evaluation and prediction calls whose data argument has a known provenance. */
  public List<Use> uses() {
    return Collections.unmodifiableList(uses);
  }

  void add(StatisticUse s) {
    statisticUses.add(s);
  }

  void add(Train t) {
    trains.add(t);
  }

  void add(Evaluation e) {
    evaluations.add(e);
  }

  void add(Shuffle s) {
    shuffles.add(s);
  }

  void add(FieldWrite w) {
    fieldWrites.add(w);
  }

  void add(Returned r) {
    returns.add(r);
  }

  public List<Fit> fits() {
    return Collections.unmodifiableList(fits);
  }

  public List<Split> splits() {
    return Collections.unmodifiableList(splits);
  }

  public List<StatisticUse> statisticUses() {
    return Collections.unmodifiableList(statisticUses);
  }

  public List<Train> trains() {
    return Collections.unmodifiableList(trains);
  }

  public List<Evaluation> evaluations() {
    return Collections.unmodifiableList(evaluations);
  }

  public List<Shuffle> shuffles() {
    return Collections.unmodifiableList(shuffles);
  }

  public List<FieldWrite> fieldWrites() {
    return Collections.unmodifiableList(fieldWrites);
  }

  void readFieldSummaries(Set<Node> declarators) {
    fieldSummariesRead.addAll(declarators);
  }

  /**
   * The field declarators whose project-wide summaries the analysis looked up: the only way
   * field summaries reach its results, so results stay the same while those summaries do.
   */
  public Set<Node> fieldSummariesRead() {
    return Collections.unmodifiableSet(fieldSummariesRead);
  }

  /** Appends every fact of {@code other} after this one's, as analyzing its graphs next would. */
  void addAll(ProvenanceFacts other) {
    partBindings.addAll(other.partBindings);
    fits.addAll(other.fits);
    uses.addAll(other.uses);
    splits.addAll(other.splits);
    statisticUses.addAll(other.statisticUses);
    trains.addAll(other.trains);
    evaluations.addAll(other.evaluations);
    shuffles.addAll(other.shuffles);
    fieldWrites.addAll(other.fieldWrites);
    fieldSummariesRead.addAll(other.fieldSummariesRead);
    returns.addAll(other.returns);
  }

  public List<Returned> returns() {
    return Collections.unmodifiableList(returns);
  }

  /**
   * Splits that split any of the given lineages, in source order: in the same graph, or, for a
   * lineage that is a field of this file, in any graph of the file (a field split in one method
   * and fitted in another holds the same rows).
   */
  public List<Split> splitsOf(ControlFlowGraph graph, Set<Lineage> lineages) {
    List<Split> out = new ArrayList<>();
    for (Split s : splits) {
      for (Lineage l : s.data().lineages()) {
        if (lineages.contains(l) && (s.graph() == graph || l.isField())) {
          out.add(s);
          break;
        }
      }
    }
    out.sort((x, y) -> DataValue.BY_POSITION.compare(x.call(), y.call()));
    return out;
  }

}
