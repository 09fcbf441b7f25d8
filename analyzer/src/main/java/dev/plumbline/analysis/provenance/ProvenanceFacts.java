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
 * callable graph it was found in, so a rule can relate facts of the same method.
 */
public final class ProvenanceFacts {

  /** A preprocessor fitted to data. {@code learns} is false for fixed-range scalers. */
  public record Fit(ControlFlowGraph graph, MethodCallExpr call, Expression preprocessor,
      Expression argument, DataValue data, boolean learns) {}

  /** Rows of some lineages split into parts at {@code call}. */
  public record Split(ControlFlowGraph graph, Expression call, Expression splitData, DataValue data) {}

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

  private final List<PartBinding> partBindings = new ArrayList<>();

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

  private final List<Fit> fits = new ArrayList<>();
  private final List<Use> uses = new ArrayList<>();
  private final List<Split> splits = new ArrayList<>();
  private final List<StatisticUse> statisticUses = new ArrayList<>();

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

  public List<Fit> fits() {
    return Collections.unmodifiableList(fits);
  }

  public List<Split> splits() {
    return Collections.unmodifiableList(splits);
  }

  public List<StatisticUse> statisticUses() {
    return Collections.unmodifiableList(statisticUses);
  }

  /** Splits in the same graph that split any of the given lineages, in source order. */
  public List<Split> splitsOf(ControlFlowGraph graph, Set<Lineage> lineages) {
    List<Split> out = new ArrayList<>();
    for (Split s : splits) {
      if (s.graph() == graph && s.data().lineages().stream().anyMatch(lineages::contains)) {
        out.add(s);
      }
    }
    return out;
  }

  static boolean sameNode(Node a, Node b) {
    return a == b;
  }
}
