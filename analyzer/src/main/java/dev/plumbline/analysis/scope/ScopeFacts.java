package dev.plumbline.analysis.scope;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.stmt.ExpressionStmt;
import com.github.javaparser.ast.stmt.ReturnStmt;
import com.github.javaparser.ast.stmt.Statement;
import dev.plumbline.flow.ControlFlowGraph;
import dev.plumbline.model.ApiMethod;
import dev.plumbline.types.Variable;
import java.util.ArrayList;
import java.util.Collections;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * What the scope analysis publishes for one file. Facts name the graph they were found in and
 * carry the loops around them, innermost first; the queries answer lifetime questions (is this
 * scope opened and closed within each iteration of that loop?) so rules stay declarative.
 */
public final class ScopeFacts {

  /** How a value reaches a holder that outlives the place it was computed. */
  public enum StoreKind {
    /** {@code total = total.add(loss)}: the holder's new value is built from its old one. */
    ACCUMULATE,
    /** {@code total.addi(loss)}: the holder is updated in place with the value. */
    IN_PLACE,
    /** {@code losses.add(loss)}, {@code history[i] = loss}: a container keeps the value. */
    COLLECT,
    /** {@code this.last = loss}: a field keeps the value beyond the method. */
    FIELD
  }

  /**
   * A tracked value stored into {@code holder}.
   *
   * @param data the value stored (for {@link StoreKind#IN_PLACE}, the operand written in)
   * @param operand what is added to the holder: for {@link StoreKind#ACCUMULATE} the other operand
   *     of the operation on the holder ({@code loss} in {@code total = total.add(loss)}), or null
   *     when the holder is fed back through a call instead (a recurrent state); otherwise the value
   * @param previous for {@link StoreKind#ACCUMULATE} and {@link StoreKind#IN_PLACE}: the holder's
   *     value just before, whose graph the new value carries on; null otherwise
   * @param loops enclosing loops across whose iterations the holder keeps its value, innermost first
   */
  public record Store(ControlFlowGraph graph, Node at, StoreKind kind, Variable holder,
      Expression value, Expression operand, TensorValue data, TensorValue previous, List<Statement> loops) {

    /** Whether the holder chains a graph from one iteration into the next through this store. */
    public boolean chainsGraph() {
      return previous != null && previous.mayBeAttached();
    }
  }

  /** An array created at {@code call}, owned by the value's scopes. */
  public record Allocation(ControlFlowGraph graph, Node call, TensorValue data, List<Statement> loops) {}

  /** A memory scope opened at its site, which lies in {@code loops}. */
  public record Opening(ControlFlowGraph graph, Scope scope, List<Statement> loops) {}

  /**
   * A copy operation used as a statement: its result, the only thing it produces, is dropped.
   *
   * @param inPlaceVariant name of the receiver type's in-place form of the same operation, or null
   */
  public record DiscardedResult(ControlFlowGraph graph, ExpressionStmt statement, MethodCallExpr call,
      ApiMethod method, DiscardKind kind, Expression receiver, TensorValue receiverData,
      String inPlaceVariant) {}

  public enum DiscardKind {
    /** An operation that returns a new tensor, e.g. {@code x.add(y);}. */
    COPY,
    /** A detaching copy, e.g. {@code state.stopGradient();}: the receiver stays attached. */
    DETACH,
    /** A copy out of a workspace, e.g. {@code out.detach();} in ND4J: the receiver stays inside. */
    LEAVE_SCOPE,
    /** An in-place operation on a fresh copy, e.g. {@code x.dup().addi(y);}: the copy is dropped. */
    TEMPORARY
  }

  /** An operation added to a SameDiff graph. */
  public record GraphOperation(ControlFlowGraph graph, MethodCallExpr call, List<Statement> loops) {}

  /** A value returned from a method. */
  public record Returned(ControlFlowGraph graph, ReturnStmt statement, TensorValue data) {}

  /** What a loop does on each iteration, as far as lifetimes care. */
  public record LoopTraits(boolean recordsGradients, boolean runsSameDiff) {
    static final LoopTraits NONE = new LoopTraits(false, false);
  }

  private final List<Store> stores = new ArrayList<>();
  private final List<Allocation> allocations = new ArrayList<>();
  private final List<Opening> openings = new ArrayList<>();
  private final List<DiscardedResult> discarded = new ArrayList<>();
  private final List<GraphOperation> graphOperations = new ArrayList<>();
  private final List<Returned> returns = new ArrayList<>();
  private final Map<Scope, List<Node>> closes = new java.util.HashMap<>();
  private final Set<Node> released = Collections.newSetFromMap(new IdentityHashMap<>());
  private final Set<Node> kept = Collections.newSetFromMap(new IdentityHashMap<>());
  private final Set<Scope> handedOff = new java.util.HashSet<>();
  private final Set<Scope> chosenForMovedArrays = new java.util.HashSet<>();
  private final Map<Node, LoopTraits> loops = new IdentityHashMap<>();

  // ------------------------------------------------------------------ recording (analysis only)

  void add(Store s) {
    stores.add(s);
  }

  void add(Allocation a) {
    allocations.add(a);
  }

  void add(Opening o) {
    openings.add(o);
  }

  void add(DiscardedResult d) {
    discarded.add(d);
  }

  void add(GraphOperation g) {
    graphOperations.add(g);
  }

  void add(Returned r) {
    returns.add(r);
  }

  void closed(Scope s, Node at) {
    closes.computeIfAbsent(s, k -> new ArrayList<>()).add(at);
  }

  void released(NodeSet sites) {
    released.addAll(sites.sorted());
  }

  void kept(NodeSet sites) {
    kept.addAll(sites.sorted());
  }

  void handedOff(Set<Scope> scopes) {
    handedOff.addAll(scopes);
  }

  void chosenForMovedArrays(Set<Scope> scopes) {
    chosenForMovedArrays.addAll(scopes);
  }

  void loop(Statement loop, LoopTraits traits) {
    loops.put(loop, traits);
  }

  // ------------------------------------------------------------------ queries

  public List<Store> stores() {
    return Collections.unmodifiableList(stores);
  }

  public List<Allocation> allocations() {
    return Collections.unmodifiableList(allocations);
  }

  public List<Opening> openings() {
    return Collections.unmodifiableList(openings);
  }

  public List<DiscardedResult> discardedResults() {
    return Collections.unmodifiableList(discarded);
  }

  public List<GraphOperation> graphOperations() {
    return Collections.unmodifiableList(graphOperations);
  }

  public List<Returned> returns() {
    return Collections.unmodifiableList(returns);
  }

  /** Whether the array created at {@code allocation} is closed, moved or detached on some path. */
  public boolean released(Node allocation) {
    return released.contains(allocation);
  }

  /**
   * Whether the array created at {@code allocation} is deliberately kept (stored beyond the loop,
   * returned) or handed to code we do not see, which may keep or close it.
   */
  public boolean kept(Node allocation) {
    return kept.contains(allocation);
  }

  /** Whether a scope handle is passed to code we do not see, which may close it. */
  public boolean handedOff(Scope s) {
    return handedOff.contains(s);
  }

  /**
   * Whether the method moves arrays into this scope on purpose ({@code attach},
   * {@code tempAttach}) while the scope itself comes from the caller: results computed from those
   * arrays then land where the caller chose, and the caller decides when they are released.
   */
  public boolean chosenByCaller(Scope s) {
    return !s.opened() && chosenForMovedArrays.contains(s);
  }

  /** Whether the scope is opened anew in each iteration of {@code loop}. */
  public boolean opensWithin(Scope s, Statement loop) {
    return Loops.perIteration(loop, s.site());
  }

  /** Whether some path closes the scope within each iteration of {@code loop}. */
  public boolean closesWithin(Scope s, Statement loop) {
    if (s.closedBy() != null && Loops.perIteration(loop, s.closedBy())) {
      return true;
    }
    for (Node at : closes.getOrDefault(s, List.of())) {
      if (Loops.perIteration(loop, at)) {
        return true;
      }
    }
    return false;
  }

  /** Whether some path closes the scope anywhere in the method (or a try-with-resources does). */
  public boolean closedAnywhere(Scope s) {
    return s.closedBy() != null || closes.containsKey(s);
  }

  /** Whether each iteration of the loop opens and closes the scope: it does not outlive one iteration. */
  public boolean livesOneIteration(Scope s, Statement loop) {
    return opensWithin(s, loop) && closesWithin(s, loop);
  }

  public LoopTraits traits(Statement loop) {
    return loops.getOrDefault(loop, LoopTraits.NONE);
  }
}
