package dev.plumbline.analysis.provenance;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.CallableDeclaration;
import com.github.javaparser.ast.body.Parameter;
import com.github.javaparser.ast.body.VariableDeclarator;
import com.github.javaparser.ast.stmt.CatchClause;
import dev.plumbline.engine.AnalysisKey;
import dev.plumbline.engine.FileContext;
import dev.plumbline.flow.CfgNode;
import dev.plumbline.flow.ControlFlowGraph;
import dev.plumbline.flow.FlowAnalysis;
import dev.plumbline.flow.FlowResult;
import dev.plumbline.flow.ForwardSolver;
import dev.plumbline.model.TypeRole;
import dev.plumbline.types.ExpressionTypes;
import dev.plumbline.types.Variable;
import java.util.EnumSet;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Data provenance: which values hold all rows, training, validation or test rows, and of which
 * body of data (lineage), at each point of each method.
 *
 * <p>Approximation: a forward may-analysis per callable body ({@link ProvenanceState}, joined
 * pointwise). Roles come from evidence: a split call and the part taken from it, a DJL
 * {@code Dataset.Usage} given to a dataset builder, a project helper's summary, a field's
 * summary; and, weaker and marked as guessed, from names ({@link DataNames}). Data entering the
 * method (a parameter, a call we do not model, a constructor) starts a lineage holding
 * {@link Role#WHOLE} rows, which matters only if the same lineage is split. Errs towards
 * silence: an expression we cannot type or model has no value, and facts are not published for a
 * graph whose solution did not converge. Library semantics come from the API model
 * ({@code Effect} SPLIT, SPLIT_PART, DERIVE, WRAP, FIT_PREPROCESSOR, TRAIN, EVALUATE, SHUFFLE,
 * ...), each entry checked against the real jars.
 *
 * <p>Two modes share the transfer functions: {@link Mode#REPORT} for the facts rules read, and
 * {@link Mode#SUMMARY}, where parameters hold {@link Role#ARGUMENT} rows so that
 * {@link ProvenanceSummarizer} can say what a method does with its caller's data.
 */
public final class ProvenanceAnalysis implements FlowAnalysis<ProvenanceState> {

  public static final AnalysisKey<ProvenanceFacts> KEY =
      AnalysisKey.of("provenance", ProvenanceAnalysis::analyzeFile);

  /** Whether parameters are the caller's data (summaries) or data of their own (reports). */
  public enum Mode { REPORT, SUMMARY }

  private static final Set<TypeRole> DATA_ROLES = EnumSet.of(TypeRole.DATASET,
      TypeRole.DATA_ITERATOR, TypeRole.RECORD_SOURCE, TypeRole.TENSOR);
  private static final Set<String> COLLECTIONS = Set.of("java.util.Collection", "java.util.List",
      "java.util.ArrayList", "java.util.LinkedList", "java.util.Set", "java.util.Deque",
      "java.lang.Iterable");

  final FileContext file;
  final ExpressionTypes types;
  final ControlFlowGraph graph;
  final Mode mode;
  final ProvenanceSummaries summaries;
  private final Map<Node, Lineage> lineages = new IdentityHashMap<>();
  /** The project-wide summaries this analysis looked up. */
  final SummaryReads summariesRead = new SummaryReads();
  /**
   * Whether a callable parameter was read as the caller's rows ({@link Mode#SUMMARY} only): the
   * one place where the modes differ, so a solution that never did this is the report's too.
   */
  boolean readCallerRows;

  ProvenanceAnalysis(FileContext file, ControlFlowGraph graph, Mode mode) {
    this.file = file;
    this.types = file.types();
    this.graph = graph;
    this.mode = mode;
    ProvenanceSummaries s = file.projectFacts() == null ? null
        : file.projectFacts().get(ProvenanceSummaries.class);
    this.summaries = s == null ? new ProvenanceSummaries() : s;
  }

  /**
   * Each graph's facts in source order. A method the summarizer solved into the same facts as a
   * report would ({@link ProvenanceSummaries#takeReportOf}) is not solved again.
   */
  static ProvenanceFacts analyzeFile(FileContext file) {
    ProvenanceFacts facts = new ProvenanceFacts();
    ProvenanceSummaries summaries = file.projectFacts() == null ? null
        : file.projectFacts().get(ProvenanceSummaries.class);
    for (ControlFlowGraph g : file.graphs()) {
      ProvenanceFacts solved = summaries == null ? null : summaries.takeReportOf(g);
      if (solved != null) {
        facts.addAll(solved);
      } else {
        analyzeGraph(file, g, Mode.REPORT, facts);
      }
    }
    return facts;
  }

  /**
   * Solves one graph and records its facts into {@code facts}; returns the solved analysis, or
   * null (and records nothing) if the solution did not converge.
   */
  static ProvenanceAnalysis analyzeGraph(FileContext file, ControlFlowGraph g, Mode mode,
      ProvenanceFacts facts) {
    ProvenanceAnalysis analysis = new ProvenanceAnalysis(file, g, mode);
    FlowResult<ProvenanceState> result = ForwardSolver.solve(g, analysis);
    if (!result.converged()) {
      return null;
    }
    for (CfgNode node : g.nodes()) {
      ProvenanceState before = result.before(node);
      if (before != null) {
        new ProvenanceEvaluator(analysis, facts).node(node, before);
      }
    }
    facts.readFieldSummaries(analysis.summariesRead.fieldsRead());
    return analysis;
  }

  /** A field's project-wide summary, noting that this analysis depends on it. */
  ProvenanceSummaries.FieldSummary fieldSummary(Node declarator) {
    return summariesRead.field(declarator, summaries.field(declarator));
  }

  /** A project method's summary, noting that this analysis depends on it. */
  ProvenanceSummaries.MethodSummary methodSummary(Node declaration) {
    return summariesRead.method(declaration, summaries.method(declaration));
  }

  /** The value of a field's initializer, evaluated on its own (for field summaries). */
  static DataValue initializerValue(FileContext file, VariableDeclarator field) {
    if (field.getInitializer().isEmpty()) {
      return null;
    }
    ProvenanceAnalysis analysis = new ProvenanceAnalysis(file, null, Mode.SUMMARY);
    ProvenanceEvaluator e = new ProvenanceEvaluator(analysis, null);
    e.startAt(ProvenanceState.EMPTY);
    return e.bindValue(field.getNameAsString(), field.getInitializer().get(),
        e.eval(field.getInitializer().get()), analysis.types.typeOf(
            analysis.types.symbols().variableOf(field)), field);
  }

  // ------------------------------------------------------------------ FlowAnalysis

  @Override
  public ProvenanceState entryState(ControlFlowGraph g) {
    return ProvenanceState.EMPTY;
  }

  @Override
  public ProvenanceState join(ProvenanceState left, ProvenanceState right) {
    return left.join(right);
  }

  @Override
  public ProvenanceState transfer(CfgNode node, ProvenanceState in) {
    return new ProvenanceEvaluator(this, null).node(node, in);
  }

  @Override
  public Branches<ProvenanceState> transferBranch(CfgNode node, ProvenanceState in) {
    if (node.kind() == CfgNode.Kind.FOREACH_NEXT) {
      ProvenanceState bound = new ProvenanceEvaluator(this, null).node(node, in);
      return new Branches<>(bound, in);
    }
    ProvenanceState out = transfer(node, in);
    return new Branches<>(out, out);
  }

  // ------------------------------------------------------------------ helpers for the evaluator

  /** A lineage per entry site, canonical within this graph so that states compare equal. */
  Lineage lineageAt(Node site, String label) {
    return lineages.computeIfAbsent(site, s -> new Lineage(s, label));
  }

  /**
   * The lineage of rows that enter at {@code site}, labelled with the site's code. The label is
   * made only if a message names it, once per site.
   */
  Lineage lineageAt(Node site) {
    return lineages.computeIfAbsent(site, s -> new Lineage(s, ProvenanceAnalysis::shortText));
  }

  boolean isDataType(String type) {
    if (type == null) {
      return false;
    }
    String t = type.endsWith("[]") ? type.substring(0, type.length() - 2) : type;
    return types.project().hasAnyRole(t, DATA_ROLES);
  }

  boolean isCollectionType(String type) {
    return type != null && COLLECTIONS.contains(type);
  }

  /** Whether a variable is a parameter of a method or constructor (not a lambda or catch one). */
  static boolean isCallableParameter(Variable v) {
    return v.kind() == Variable.Kind.PARAMETER && v.declaration() instanceof Parameter p
        && p.getParentNode().orElse(null) instanceof CallableDeclaration<?>;
  }

  /** Index of a callable parameter in its declaration. */
  static Optional<Integer> parameterIndex(Node site) {
    if (site instanceof Parameter p && p.getParentNode().orElse(null) instanceof CallableDeclaration<?> c) {
      List<Parameter> params = c.getParameters();
      for (int i = 0; i < params.size(); i++) {
        if (params.get(i) == p) {
          return Optional.of(i);
        }
      }
    }
    return Optional.empty();
  }

  static String shortText(Node n) {
    String s = dev.plumbline.flow.AstText.code(n);
    return s.length() <= 40 ? s : s.substring(0, 37) + "...";
  }

  static boolean isCatchParameter(Node n) {
    return n.getParentNode().orElse(null) instanceof CatchClause;
  }
}
