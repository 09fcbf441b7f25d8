package dev.plumbline.analysis.scope;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.CallableDeclaration;
import com.github.javaparser.ast.body.Parameter;
import com.github.javaparser.ast.body.VariableDeclarator;
import com.github.javaparser.ast.expr.AssignExpr;
import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.expr.VariableDeclarationExpr;
import com.github.javaparser.ast.stmt.ForEachStmt;
import com.github.javaparser.ast.stmt.Statement;
import com.github.javaparser.ast.stmt.TryStmt;
import dev.plumbline.engine.AnalysisKey;
import dev.plumbline.engine.FileContext;
import dev.plumbline.flow.AstText;
import dev.plumbline.flow.CfgNode;
import dev.plumbline.flow.ControlFlowGraph;
import dev.plumbline.flow.FlowAnalysis;
import dev.plumbline.flow.FlowResult;
import dev.plumbline.flow.ForwardSolver;
import dev.plumbline.model.ApiMethod;
import dev.plumbline.model.Effect;
import dev.plumbline.model.TypeRole;
import dev.plumbline.parse.Subtrees;
import dev.plumbline.types.ExpressionTypes;
import dev.plumbline.types.ProjectIndex;
import dev.plumbline.types.Variable;
import java.util.ArrayList;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Scopes and graphs: which tensors may be attached to an autograd graph, which memory scope (DJL
 * manager, the manager of a batch, ND4J workspace) may own them, and where they are stored,
 * created, released and dropped, at each point of each method.
 *
 * <p>Approximation: a forward may-analysis per callable body, solved silently and then walked
 * once more with the converged states to record {@link ScopeFacts}; rules query those. Errs
 * towards silence: a value from code we do not see has an unknown graph, a scope we cannot see
 * opened has an unknown lifetime, and anything handed to such code may be kept or closed there.
 *
 * <p>Semantics, each measured on the real libraries in module {@code library-checks}: DJL
 * (PyTorch engine) records gradients only inside a {@code GradientCollector} (grad mode is on
 * there and off outside), so forward passes, losses and operations on attached tensors are
 * attached inside it, and results computed outside it are not; every DJL operation puts its
 * result in the manager of its receiver (first operand), and a forward pass in the manager of
 * its input; a batch from {@code Trainer.iterateDataset} owns a fresh sub-manager that only
 * {@code close()} releases. ND4J has no autograd for plain arrays; an ND4J array lives in the
 * workspace active where it is created (none inside {@code scopeOutOfWorkspaces()}), and
 * {@code detach()} copies it to the heap. SameDiff variables are graph nodes by nature. Project
 * methods are understood through {@link ScopeSummaries}.
 */
public final class ScopeAnalysis implements FlowAnalysis<ScopeState> {

  public static final AnalysisKey<ScopeFacts> KEY = AnalysisKey.of("scope", ScopeAnalysis::analyzeFile);

  /**
   * How a method is entered. Normally nothing is assumed; summaries of helpers analyze a method
   * as if called under gradient recording, with chosen values for its parameters.
   */
  record EntryContext(boolean underRecording, Map<Node, TensorValue> parameters) {
    static final EntryContext NORMAL = new EntryContext(false, Map.of());

    EntryContext {
      Map<Node, TensorValue> byIdentity = new IdentityHashMap<>(parameters);
      parameters = java.util.Collections.unmodifiableMap(byIdentity);
    }
  }

  final FileContext file;
  final ExpressionTypes types;
  final ControlFlowGraph graph;
  final EntryContext context;
  final ScopeSummaries summaries;
  final TypeTraits traits;
  private final Map<Node, Map<Scope.Kind, Scope>> scopes = new IdentityHashMap<>();
  private final Map<TryStmt, List<Scope>> resourceScopes = new IdentityHashMap<>();

  ScopeAnalysis(FileContext file, ControlFlowGraph graph, EntryContext context, ScopeSummaries summaries) {
    this.file = file;
    this.types = file.types();
    this.graph = graph;
    this.context = context;
    this.summaries = summaries;
    this.traits = file.analysis(TypeTraits.KEY);
  }

  static ScopeFacts analyzeFile(FileContext file) {
    ScopeSummaries summaries = Optional.ofNullable(file.projectFacts())
        .map(f -> f.get(ScopeSummaries.class)).orElse(ScopeSummaries.NONE);
    ScopeFacts facts = new ScopeFacts();
    for (ControlFlowGraph g : file.graphs()) {
      new ScopeAnalysis(file, g, EntryContext.NORMAL, summaries).run(facts);
    }
    TypeTraits traits = file.analysis(TypeTraits.KEY);
    for (Statement loop : Subtrees.findAll(file.source().unit(), Statement.class, Loops::isLoop)) {
      facts.loop(loop, traits(traits, summaries, loop));
    }
    return facts;
  }

  /** Solves silently, then records facts from the converged states; false if it gave up. */
  boolean run(ScopeFacts sink) {
    FlowResult<ScopeState> result = ForwardSolver.solve(graph, this);
    if (!result.converged()) {
      return false;
    }
    for (CfgNode node : graph.nodes()) {
      ScopeState before = result.before(node);
      if (before != null) {
        new ScopeEvaluator(this, sink).node(node, before);
      }
    }
    return true;
  }

  /** The converged state before each node, for dumps and tests; empty when not converged. */
  static Optional<FlowResult<ScopeState>> solve(FileContext file, ControlFlowGraph g) {
    ScopeSummaries summaries = Optional.ofNullable(file.projectFacts())
        .map(f -> f.get(ScopeSummaries.class)).orElse(ScopeSummaries.NONE);
    FlowResult<ScopeState> r = ForwardSolver.solve(g, new ScopeAnalysis(file, g, EntryContext.NORMAL, summaries));
    return r.converged() ? Optional.of(r) : Optional.empty();
  }

  /** What a method returns when entered in {@code context}; null when the solver gave up. */
  static List<TensorValue> returnedValues(FileContext file, ControlFlowGraph g, EntryContext context,
      ScopeSummaries summaries) {
    ScopeFacts sink = new ScopeFacts();
    if (!new ScopeAnalysis(file, g, context, summaries).run(sink)) {
      return null;
    }
    List<TensorValue> out = new ArrayList<>();
    for (ScopeFacts.Returned r : sink.returns()) {
      out.add(r.data());
    }
    return out;
  }

  // ------------------------------------------------------------------ FlowAnalysis

  @Override
  public ScopeState entryState(ControlFlowGraph g) {
    ScopeState s = ScopeState.EMPTY;
    if (g.callable() instanceof CallableDeclaration<?> c) {
      for (Parameter p : c.getParameters()) {
        // A method handed an open GradientCollector runs inside that recording.
        String type = types.typeOf(types.symbols().variableOf(p));
        if (types.project().hasRole(type, TypeRole.GRADIENT_SCOPE)) {
          s = s.opening(scopeAt(p, Scope.Kind.AUTOGRAD, false));
        }
      }
    }
    return s;
  }

  @Override
  public ScopeState join(ScopeState left, ScopeState right) {
    return left.join(right);
  }

  @Override
  public ScopeState transfer(CfgNode node, ScopeState in) {
    return new ScopeEvaluator(this, null).node(node, in);
  }

  @Override
  public Branches<ScopeState> transferBranch(CfgNode node, ScopeState in) {
    ScopeState out = transfer(node, in);
    if (node.kind() == CfgNode.Kind.FOREACH_NEXT) {
      return new Branches<>(out, in);
    }
    return new Branches<>(out, out);
  }

  // ------------------------------------------------------------------ scopes

  /** The canonical scope for a site; its closing try and label come from where the site sits. */
  Scope scopeAt(Node site, Scope.Kind kind, boolean opened) {
    return scopes.computeIfAbsent(site, s -> new java.util.EnumMap<>(Scope.Kind.class))
        .computeIfAbsent(kind, k -> new Scope(site, k, labelOf(site), opened, resourceTry(site)));
  }

  /**
   * The try-with-resources that declares {@code node} (a resource declarator, or its initializer)
   * and so closes it at the end of its block.
   */
  static TryStmt resourceTry(Node node) {
    Node declarator = node instanceof VariableDeclarator ? node : node.getParentNode().orElse(null);
    if (!(declarator instanceof VariableDeclarator d) || (node != d && d.getInitializer().orElse(null) != node)) {
      return null;
    }
    if (d.getParentNode().orElse(null) instanceof VariableDeclarationExpr vde
        && vde.getParentNode().orElse(null) instanceof TryStmt t
        && t.getResources().stream().anyMatch(r -> r == vde)) {
      return t;
    }
    return null;
  }

  private static String labelOf(Node site) {
    if (site instanceof VariableDeclarator d) {
      return d.getNameAsString();
    }
    if (site instanceof Parameter p) {
      return p.getNameAsString();
    }
    if (site instanceof ForEachStmt f) {
      return f.getVariable().getVariables().get(0).getNameAsString();
    }
    Node parent = site.getParentNode().orElse(null);
    if (parent instanceof VariableDeclarator d) {
      return d.getNameAsString();
    }
    if (parent instanceof AssignExpr a && a.getValue() == site) {
      return a.getTarget().toString();
    }
    return AstText.abbreviate(site);
  }

  /** Scopes declared by the resources of a try-with-resources, in order. */
  List<Scope> resourceScopes(TryStmt t) {
    return resourceScopes.computeIfAbsent(t, k -> {
      List<Scope> out = new ArrayList<>();
      for (Expression r : k.getResources()) {
        if (r instanceof VariableDeclarationExpr vde) {
          for (VariableDeclarator d : vde.getVariables()) {
            Scope s = resourceScope(d);
            if (s != null) {
              out.add(s);
            }
          }
        }
      }
      return out;
    });
  }

  /** The scope a resource declarator opens, from its initializer's effect or its type. */
  Scope resourceScope(VariableDeclarator d) {
    Optional<Expression> init = d.getInitializer();
    if (init.isPresent() && init.get() instanceof MethodCallExpr call) {
      Optional<ApiMethod> m = traits.apiMethod(call);
      if (m.isPresent() && (m.get().effect() == Effect.OPEN_GRADIENT_SCOPE
          || m.get().effect() == Effect.OPEN_MEMORY_SCOPE) && !"receiver".equals(m.get().attribute("activates"))) {
        return scopeAt(call, openedKind(m.get()), true);
      }
    }
    Scope.Kind kind = handleKind(types.typeOf(types.symbols().variableOf(d)));
    return kind == null ? null : scopeAt(d, kind, true);
  }

  /** Whether {@code at} lies in the block of a try-with-resources that opens gradient recording. */
  boolean lexicallyRecording(Node at) {
    return innermostResource(at, Scope.Kind.AUTOGRAD, Scope.Kind.AUTOGRAD) != null;
  }

  /** The innermost workspace (or out-of-workspaces) resource block around {@code at}, or null. */
  Scope lexicalWorkspace(Node at) {
    return innermostResource(at, Scope.Kind.WORKSPACE, Scope.Kind.NO_WORKSPACE);
  }

  private Scope innermostResource(Node at, Scope.Kind a, Scope.Kind b) {
    Node child = at;
    Node current = at.getParentNode().orElse(null);
    while (current != null && !Loops.isBoundary(current)) {
      if (current instanceof TryStmt t && child == t.getTryBlock()) {
        List<Scope> rs = resourceScopes(t);
        for (int i = rs.size() - 1; i >= 0; i--) {
          if (rs.get(i).kind() == a || rs.get(i).kind() == b) {
            return rs.get(i);
          }
        }
      }
      child = current;
      current = current.getParentNode().orElse(null);
    }
    return null;
  }

  // ------------------------------------------------------------------ types

  /** How a value of this static type is tracked, or null when it is not. */
  TensorValue.Kind trackedKind(String type) {
    return traits.trackedKind(type);
  }

  /** The kind of scope a handle of this type denotes, or null. */
  Scope.Kind handleKind(String type) {
    return traits.handleKind(type);
  }

  static Scope.Kind openedKind(ApiMethod m) {
    if (m.effect() == Effect.OPEN_GRADIENT_SCOPE) {
      return Scope.Kind.AUTOGRAD;
    }
    if ("none".equals(m.attribute("workspace"))) {
      return Scope.Kind.NO_WORKSPACE;
    }
    return m.owner().startsWith("ai.djl.") ? Scope.Kind.MANAGER : Scope.Kind.WORKSPACE;
  }

  /** Framework of the nearest listed library type: djl, nd4j, ... or null. */
  String framework(String type) {
    return traits.framework(type);
  }

  boolean isSameDiff(String type) {
    return traits.isSameDiff(type);
  }

  boolean returnsTracked(ApiMethod m) {
    TensorValue.Kind k = trackedKind(m.returns());
    return k == TensorValue.Kind.TENSOR || k == TensorValue.Kind.TENSOR_LIST;
  }

  /** The value of a tracked expression whose origin we do not see, entering at {@code site}. */
  TensorValue entered(Node site, String type) {
    TensorValue.Kind k = trackedKind(type);
    if (k == null) {
      return null;
    }
    if (k == TensorValue.Kind.SCOPE_HANDLE) {
      return TensorValue.handle(scopeAt(site, handleKind(type), false));
    }
    if (isSameDiff(type)) {
      return TensorValue.tensor(k, Graph.ATTACHED_ONLY, NodeSet.of(site), java.util.Set.of(), NodeSet.EMPTY);
    }
    java.util.Set<Scope> owner = "djl".equals(framework(type))
        ? java.util.Set.of(scopeAt(site, Scope.Kind.TENSOR_OWNER, false)) : java.util.Set.of();
    return TensorValue.tensor(k, Graph.UNKNOWN_ONLY, NodeSet.EMPTY, owner, NodeSet.EMPTY);
  }

  /** The value a parameter or field has on entry, or null when it is not tracked. */
  TensorValue external(Variable v) {
    TensorValue given = context.parameters().get(v.declaration());
    if (given != null) {
      return given;
    }
    return entered(v.declaration(), types.typeOf(v));
  }

  // ------------------------------------------------------------------ loop traits

  /** What each iteration of {@code loop} does: record gradients, run a SameDiff graph. */
  static ScopeFacts.LoopTraits traits(TypeTraits traits, ScopeSummaries summaries, Statement loop) {
    boolean records = false;
    boolean sameDiff = false;
    for (MethodCallExpr call : Subtrees.findAll(loop, MethodCallExpr.class, c -> Loops.perIteration(loop, c))) {
      records |= recordsGradients(traits, summaries, call);
      sameDiff |= runsSameDiff(traits, call);
    }
    return new ScopeFacts.LoopTraits(records, sameDiff);
  }

  /** A call that records gradients or runs a training step (DJL). */
  static boolean recordsGradients(TypeTraits traits, ScopeSummaries summaries, MethodCallExpr call) {
    Optional<ProjectIndex.ProjectMethod> pm = traits.projectMethod(call);
    if (pm.isPresent()) {
      HelperSummary s = summaries.of(pm.get().declaration());
      return s != null && s.recordsGradients();
    }
    Optional<ApiMethod> m = traits.apiMethod(call);
    if (m.isEmpty()) {
      return false;
    }
    Effect e = m.get().effect();
    return e == Effect.OPEN_GRADIENT_SCOPE || e == Effect.BACKWARD
        || e == Effect.TRAIN && m.get().owner().startsWith("ai.djl.");
  }

  private static boolean runsSameDiff(TypeTraits traits, MethodCallExpr call) {
    Optional<ApiMethod> m = traits.apiMethod(call);
    return m.isPresent() && (m.get().effect() == Effect.TRAIN || m.get().effect() == Effect.PREDICT)
        && traits.isSameDiff(m.get().owner());
  }
}
