package dev.plumbline.analysis.provenance;

import com.github.javaparser.ast.Node;
import dev.plumbline.flow.ControlFlowGraph;
import java.util.Collections;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.SortedSet;
import java.util.concurrent.ConcurrentHashMap;

/**
 * Summaries of the project's own methods and fields, computed once per scan by
 * {@link ProvenanceSummarizer} and read by every file's provenance analysis, so that data passed
 * through a helper or kept in a field is still tracked.
 *
 * <p>Keys are declaration nodes (a method or constructor, a field's declarator), compared by
 * identity. Filled while the summarizer runs; read-only once the scan starts checking files,
 * except for the report-equal facts, which files take ({@link #takeReportOf}).
 */
public final class ProvenanceSummaries {

  /** What a method does with the rows of one parameter. */
  public enum Use { FIT, SPLIT, TRAIN, EVALUATE, SHUFFLE }

  /**
   * One use of parameter {@code index}. {@code description} names what uses it, e.g. the
   * preprocessor fitted; {@code learns} is for fits; {@code random} for splits; {@code seeding}
   * for shuffles; {@code evaluationKind} for evaluations.
   */
  public record ParamUse(int index, Use use, String description, boolean learns, boolean random,
      ProvenanceFacts.Seeding seeding, ProvenanceFacts.EvaluationKind evaluationKind) {}

  /**
   * The value a method returns. {@code roles} may contain {@link Role#ARGUMENT}: "the roles of
   * the arguments in {@code fromParams}". {@code ownData} when it returns rows it loaded itself;
   * {@code fields} are field declarators whose rows it returns.
   */
  public record ReturnSummary(DataValue.Kind kind, Set<Role> roles, Set<Role> guessed,
      SortedSet<Integer> fromParams, boolean ownData, Set<Node> fields, int parts,
      boolean timeOrdered) {}

  /**
   * What a method does with its parameters and returns. {@code settled} is false only while the
   * method's own call cycle is being solved: a call of it then yields nothing (the bottom of the
   * lattice) rather than unknown whole rows, so iteration climbs to the least fixed point.
   */
  public record MethodSummary(ReturnSummary returns, List<ParamUse> uses, boolean settled) {
    static final MethodSummary PENDING = new MethodSummary(null, List.of(), false);

    public MethodSummary {
      uses = List.copyOf(uses);
    }
  }

  /**
   * What a field may hold across the project. {@code origins} are the assignments that made it
   * train, validation or test rows (in the field's own file).
   */
  public record FieldSummary(Set<Role> roles, Set<Role> guessed, Set<Node> origins,
      Set<Node> timeOrdered) {
    @Override
    public boolean equals(Object o) {
      return o instanceof FieldSummary f && roles.equals(f.roles) && guessed.equals(f.guessed)
          && origins.size() == f.origins.size() && origins.containsAll(f.origins)
          && timeOrdered.size() == f.timeOrdered.size() && timeOrdered.containsAll(f.timeOrdered);
    }

    @Override
    public int hashCode() {
      return roles.hashCode() * 31 + guessed.hashCode();
    }
  }

  /**
   * One method's summary. The map of slots is filled before summarizing starts and never changes
   * shape afterwards, so that methods of independent components can be summarized on several
   * threads while others read finished summaries.
   */
  private static final class Slot {
    volatile MethodSummary summary;
  }

  private final Map<Node, Slot> methods = new IdentityHashMap<>();
  private final Map<Node, FieldSummary> fields = new IdentityHashMap<>();
  /**
   * Graphs whose report-mode facts are known already; see {@link #takeReportOf}. The one part
   * that changes once files are checked: each entry is taken by its file's analysis.
   */
  private volatile Map<ControlFlowGraph, ProvenanceFacts> reports = Map.of();

  public MethodSummary method(Node declaration) {
    Slot slot = methods.get(declaration);
    return slot == null ? null : slot.summary;
  }

  public FieldSummary field(Node declarator) {
    return fields.get(declarator);
  }

  /** Makes room for the summaries of these methods; call before summarizing, on one thread. */
  void prepare(List<? extends Node> declarations) {
    for (Node d : declarations) {
      methods.putIfAbsent(d, new Slot());
    }
  }

  /**
   * Records a method summary; returns whether it differs from the previous one. The method must
   * have been {@linkplain #prepare prepared}; only one thread writes a given method's summary.
   */
  boolean put(Node declaration, MethodSummary summary) {
    Slot slot = methods.get(declaration);
    if (slot == null) {
      throw new IllegalStateException("summary slot missing for " + declaration.getClass().getSimpleName());
    }
    MethodSummary old = slot.summary;
    slot.summary = summary;
    return !summary.equals(old);
  }

  /**
   * The facts a report-mode analysis of {@code graph} would give, when the summarizer's last
   * solution of it was that analysis in all but name: it read no parameter as its caller's rows
   * and every summary it read is final ({@link SummaryReads}). Null when not known, or already
   * taken: each is handed out once, so that it does not stay in memory until the scan ends (a
   * file's analysis is computed once per check; a second would only solve again).
   */
  ProvenanceFacts takeReportOf(ControlFlowGraph graph) {
    return reports.isEmpty() ? null : reports.remove(graph);
  }

  /** The facts {@link #takeReportOf} would hand out, without taking them (tests look). */
  ProvenanceFacts peekReportOf(ControlFlowGraph graph) {
    return reports.get(graph);
  }

  /** Keeps the summarizer's report-equal facts; call once summaries are final, on one thread. */
  void keepReports(Map<ControlFlowGraph, ProvenanceFacts> solved) {
    reports = new ConcurrentHashMap<>(solved);
  }

  boolean putField(Node declarator, FieldSummary summary) {
    FieldSummary old = fields.put(declarator, summary);
    return !summary.equals(old);
  }

  Map<Node, FieldSummary> fieldsView() {
    return Collections.unmodifiableMap(fields);
  }
}
