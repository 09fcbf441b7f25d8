package dev.plumbline.analysis.scope;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.Parameter;
import com.github.javaparser.ast.body.VariableDeclarator;
import com.github.javaparser.ast.expr.ArrayAccessExpr;
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
import com.github.javaparser.ast.stmt.CatchClause;
import com.github.javaparser.ast.stmt.ExplicitConstructorInvocationStmt;
import com.github.javaparser.ast.stmt.ExpressionStmt;
import com.github.javaparser.ast.stmt.ForEachStmt;
import com.github.javaparser.ast.stmt.ReturnStmt;
import com.github.javaparser.ast.stmt.Statement;
import com.github.javaparser.ast.stmt.ThrowStmt;
import com.github.javaparser.ast.stmt.TryStmt;
import com.github.javaparser.ast.stmt.YieldStmt;
import dev.plumbline.analysis.scope.ScopeFacts.DiscardKind;
import dev.plumbline.analysis.scope.ScopeFacts.StoreKind;
import dev.plumbline.analysis.scope.TensorValue.Kind;
import dev.plumbline.flow.CfgNode;
import dev.plumbline.model.ApiMethod;
import dev.plumbline.model.Effect;
import dev.plumbline.parse.Subtrees;
import dev.plumbline.types.ProjectIndex;
import dev.plumbline.types.Variable;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;

/**
 * Evaluates one node's expressions in Java's order, threading the store; records facts only in
 * the final pass over the converged solution (when {@code sink} is set).
 */
final class ScopeEvaluator {
  private final ScopeAnalysis a;
  private final ScopeFacts sink;
  private ScopeState state;

  ScopeEvaluator(ScopeAnalysis analysis, ScopeFacts sink) {
    this.a = analysis;
    this.sink = sink;
  }

  ScopeState node(CfgNode node, ScopeState in) {
    state = in;
    switch (node.kind()) {
      case ENTRY, EXIT, JOIN, CATCH -> {
        return in;
      }
      case FOREACH_NEXT -> {
        bindElement((ForEachStmt) node.ast());
        return state;
      }
      default -> {
        statement(node.ast());
        return state;
      }
    }
  }

  private void statement(Node ast) {
    if (ast instanceof ExpressionStmt es) {
      discardedResult(es);
      eval(es.getExpression());
    } else if (ast instanceof Expression e) {
      TensorValue v = eval(e);
      if (v != null && e.getParentNode().orElse(null) instanceof TryStmt t
          && t.getResources().stream().anyMatch(r -> r == e)) {
        closedAtEndOf(t, v); // try (batch) { ... } closes an existing resource
      }
    } else if (ast instanceof ReturnStmt r) {
      if (r.getExpression().isPresent()) {
        TensorValue v = eval(r.getExpression().get());
        if (v != null) {
          if (sink != null) {
            sink.add(new ScopeFacts.Returned(a.graph, r, v));
          }
          keep(v);
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
      handOff(evalAll(ec.getArguments()));
    }
  }

  /** Binds a for-each element: a batch opens a scope per iteration; a tensor of a list is its element. */
  private void bindElement(ForEachStmt f) {
    TensorValue iterable = valueOf(f.getIterable());
    for (VariableDeclarator d : f.getVariable().getVariables()) {
      Variable v = a.types.symbols().variableOf(d);
      String type = a.types.typeOf(v);
      TensorValue value = null;
      if (a.handleKind(type) == Scope.Kind.BATCH) {
        Scope s = a.scopeAt(f, Scope.Kind.BATCH, true);
        if (sink != null) {
          List<Statement> loops = new ArrayList<>();
          loops.add(f);
          loops.addAll(Loops.enclosing(f));
          sink.add(new ScopeFacts.Opening(a.graph, s, loops));
        }
        value = TensorValue.handle(s);
      } else if (a.trackedKind(type) == Kind.TENSOR && iterable != null && iterable.kind() == Kind.TENSOR_LIST) {
        value = iterable.withKind(Kind.TENSOR);
      } else {
        value = a.entered(d, type);
      }
      state = state.with(v, value);
    }
  }

  /** The value of an expression in the current store, evaluated silently and without changing it. */
  private TensorValue valueOf(Expression e) {
    ScopeEvaluator silent = new ScopeEvaluator(a, null);
    silent.state = state;
    return silent.eval(e);
  }

  // ------------------------------------------------------------------ expressions

  TensorValue eval(Expression e) {
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
      declare(vde);
      return null;
    }
    if (e instanceof AssignExpr as) {
      return assign(as);
    }
    if (e instanceof ConditionalExpr c) {
      eval(c.getCondition());
      ScopeState before = state;
      TensorValue t = eval(c.getThenExpr());
      ScopeState afterThen = state;
      state = before;
      TensorValue f = eval(c.getElseExpr());
      state = state.join(afterThen);
      return t == null ? f : t.join(f);
    }
    if (e instanceof ArrayAccessExpr aa) {
      TensorValue array = eval(aa.getName());
      eval(aa.getIndex());
      return array != null && array.kind() == Kind.TENSOR_LIST ? array.withKind(Kind.TENSOR) : null;
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
    for (Node child : e.getChildNodes()) {
      if (child instanceof Expression ce) {
        eval(ce);
      }
    }
    return null;
  }

  private List<TensorValue> evalAll(List<Expression> es) {
    List<TensorValue> out = new ArrayList<>();
    for (Expression e : es) {
      out.add(eval(e));
    }
    return out;
  }

  private TensorValue read(Variable v) {
    Optional<TensorValue> known = state.get(v);
    if (known.isPresent()) {
      return known.get();
    }
    boolean external = v.isField()
        || v.declaration() instanceof Parameter p && !(p.getParentNode().orElse(null) instanceof CatchClause);
    return external ? a.external(v) : null;
  }

  private Variable variableOf(Expression e) {
    if (e instanceof EnclosedExpr en) {
      return variableOf(en.getInner());
    }
    if (e instanceof NameExpr n) {
      return a.types.symbols().resolve(n).orElse(null);
    }
    if (e instanceof FieldAccessExpr fa && fa.getScope() instanceof ThisExpr) {
      return a.types.symbols().field(fa, fa.getNameAsString()).orElse(null);
    }
    return null;
  }

  private void update(Expression target, TensorValue value) {
    Variable v = target == null ? null : variableOf(target);
    if (v != null) {
      state = state.with(v, value);
    }
  }

  private void declare(VariableDeclarationExpr vde) {
    for (VariableDeclarator d : vde.getVariables()) {
      Variable v = a.types.symbols().variableOf(d);
      TensorValue init = d.getInitializer().map(this::eval).orElse(null);
      String type = a.types.typeOf(v);
      TryStmt resourceOf = ScopeAnalysis.resourceTry(d);
      if (init == null && d.getInitializer().isPresent() && !d.getInitializer().get().isNullLiteralExpr()) {
        if (resourceOf != null && a.handleKind(type) != null) {
          Scope s = a.resourceScope(d);
          init = s == null ? null : TensorValue.handle(s);
          if (s != null && sink != null && s.ownsMemory()) {
            sink.add(new ScopeFacts.Opening(a.graph, s, Loops.enclosing(d)));
          }
        } else {
          init = a.entered(d, type);
          if (init != null && resourceOf == null && a.handleKind(type) == Scope.Kind.AUTOGRAD) {
            // A collector records from its creation (Engine.newGradientCollector and the like).
            for (Scope s : init.scopes()) {
              state = state.opening(s);
            }
          }
        }
      }
      if (resourceOf != null && init != null) {
        closedAtEndOf(resourceOf, init);
      }
      state = state.with(v, init);
    }
  }

  private TensorValue assign(AssignExpr as) {
    Expression target = as.getTarget();
    if (target instanceof ArrayAccessExpr aa) {
      TensorValue value = eval(as.getValue());
      eval(aa.getName());
      eval(aa.getIndex());
      Variable holder = variableOf(aa.getName());
      if (value != null && value.isTensor()) {
        if (holder == null) {
          keep(value);
        } else {
          collect(as, holder, as.getValue(), value);
        }
      }
      return value;
    }
    Variable holder = variableOf(target);
    TensorValue previous = holder == null ? null : read(holder);
    TensorValue value = eval(as.getValue());
    if (as.getOperator() != AssignExpr.Operator.ASSIGN) {
      value = null;
    }
    if (holder == null) {
      eval(target);
      if (value != null) {
        keep(value); // stored somewhere we do not follow
      }
      return value;
    }
    if (value != null && value.isTensor()) {
      if (holder.isField()) {
        store(as, StoreKind.FIELD, holder, as.getValue(), as.getValue(), value, null);
        keep(value);
      } else if (carriesOldValue(as.getValue(), holder)) {
        store(as, StoreKind.ACCUMULATE, holder, as.getValue(), addedOperand(as.getValue(), holder), value,
            previous);
      }
    }
    state = state.with(holder, value);
    return value;
  }

  /**
   * In {@code total = total.add(loss)}, the operand added to the holder ({@code loss}); in
   * {@code total = loss.add(total)}, the receiver. Null when the holder only reaches the result
   * through a call's arguments, as a recurrent state fed back into a forward pass does.
   */
  private Expression addedOperand(Expression rhs, Variable holder) {
    Expression e = rhs;
    while (true) {
      if (e instanceof EnclosedExpr en) {
        e = en.getInner();
      } else if (e instanceof CastExpr c) {
        e = c.getExpression();
      } else if (e instanceof MethodCallExpr c && c.getArguments().isEmpty() && c.getScope().isPresent()) {
        e = c.getScope().get();
      } else {
        break;
      }
    }
    if (!(e instanceof MethodCallExpr call) || call.getScope().isEmpty()) {
      return null;
    }
    Expression receiver = call.getScope().get();
    if (carriesOldValue(receiver, holder)) {
      for (Expression arg : call.getArguments()) {
        TensorValue v = valueOf(arg);
        if (v != null && v.isTensor()) {
          return arg;
        }
      }
      return null;
    }
    TensorValue r = valueOf(receiver);
    return r != null && r.isTensor() ? receiver : null;
  }

  /**
   * Whether the value of {@code e} is built from the current value of {@code v} without cutting
   * it loose on the way: some read of {@code v} in {@code e} reaches the result through no
   * detaching or scalar-taking call ({@code total.stopGradient().add(x)} starts afresh).
   */
  private boolean carriesOldValue(Expression e, Variable v) {
    List<Expression> reads = new ArrayList<>();
    for (NameExpr n : Subtrees.findAll(e, NameExpr.class)) {
      if (a.types.symbols().resolve(n).orElse(null) == v) {
        reads.add(n);
      }
    }
    for (FieldAccessExpr fa : Subtrees.findAll(e, FieldAccessExpr.class)) {
      if (fa.getScope() instanceof ThisExpr
          && a.types.symbols().field(fa, fa.getNameAsString()).orElse(null) == v) {
        reads.add(fa);
      }
    }
    for (Expression read : reads) {
      boolean cut = false;
      for (Node n = read; n != e && n != null && !cut; n = n.getParentNode().orElse(null)) {
        if (n.getParentNode().orElse(null) instanceof MethodCallExpr call && call.getScope().orElse(null) == n) {
          Effect effect = a.traits.apiMethod(call).map(ApiMethod::effect).orElse(null);
          cut = effect == Effect.DETACH || effect == Effect.TO_SCALAR || effect == Effect.LEAVE_MEMORY_SCOPE
              || effect == Effect.SHAPE_QUERY;
        }
      }
      if (!cut) {
        return true;
      }
    }
    return false;
  }

  private TensorValue construct(ObjectCreationExpr oce) {
    oce.getScope().ifPresent(this::eval);
    List<TensorValue> args = evalAll(oce.getArguments());
    String type = a.types.symbols().types().resolve(oce.getType());
    Kind k = a.trackedKind(type);
    if (k == Kind.TENSOR_LIST && oce.getAnonymousClassBody().isEmpty()) {
      TensorValue out = combine(args);
      return out == null
          ? TensorValue.tensor(Kind.TENSOR_LIST, Graph.DETACHED_ONLY, NodeSet.EMPTY, Set.of(), NodeSet.EMPTY)
          : out.withKind(Kind.TENSOR_LIST);
    }
    handOff(args);
    return k == null ? null : a.entered(oce, type);
  }

  // ------------------------------------------------------------------ calls

  private TensorValue call(MethodCallExpr call) {
    Expression scope = call.getScope().orElse(null);
    TensorValue receiver = scope == null ? null : eval(scope);
    List<TensorValue> args = evalAll(call.getArguments());
    Optional<ProjectIndex.ProjectMethod> pm = a.traits.projectMethod(call);
    if (pm.isPresent()) {
      return projectCall(call, pm.get(), args);
    }
    Optional<ApiMethod> api = a.traits.apiMethod(call);
    if (api.isEmpty()) {
      handOff(args);
      return a.entered(call, a.types.typeOf(call));
    }
    ApiMethod m = api.get();
    boolean sameDiff = a.isSameDiff(m.owner()) || a.isSameDiff(m.returns());
    boolean djl = m.owner().startsWith("ai.djl.");
    Kind resultKind = a.trackedKind(m.returns());
    switch (m.effect()) {
      case OPEN_GRADIENT_SCOPE, OPEN_MEMORY_SCOPE -> {
        if ("receiver".equals(m.attribute("activates"))) {
          if (receiver != null) {
            for (Scope s : receiver.scopes()) {
              state = s.kind() == Scope.Kind.WORKSPACE ? state.opening(s) : state;
            }
          }
          return receiver;
        }
        return open(call, ScopeAnalysis.openedKind(m));
      }
      case CLOSE -> {
        close(call, receiver);
        return "void".equals(m.returns()) ? null : receiver;
      }
      case CREATE -> {
        if (resultKind == null) {
          return null;
        }
        if (sameDiff) {
          return graphOperation(call);
        }
        Set<Scope> owner = djl
            ? receiver != null && receiver.kind() == Kind.SCOPE_HANDLE ? receiver.scopes() : Set.of()
            : workspaceAt(call);
        return allocate(call, TensorValue.tensor(resultKind, Graph.DETACHED_ONLY, NodeSet.EMPTY, owner,
            NodeSet.of(call)));
      }
      case FORWARD, PREDICT, LOSS -> {
        if (resultKind == null) {
          return null;
        }
        if (!djl) {
          // DL4J and SameDiff hand back outputs detached from their internal workspaces.
          return TensorValue.tensor(resultKind, Graph.DETACHED_ONLY, NodeSet.EMPTY, Set.of(), NodeSet.EMPTY);
        }
        boolean recording = recording(call);
        Set<Scope> owner = new HashSet<>();
        for (TensorValue arg : args) {
          if (arg != null && arg.isTensor()) {
            owner.addAll(arg.scopes());
            if (m.effect() != Effect.LOSS) {
              break; // a forward pass puts its output in its input's manager
            }
          }
        }
        return allocate(call, TensorValue.tensor(resultKind,
            recording ? Graph.ATTACHED_ONLY : Graph.DETACHED_ONLY,
            recording ? NodeSet.of(call) : NodeSet.EMPTY, owner, NodeSet.of(call)));
      }
      case BACKWARD -> {
        if (!call.getArguments().isEmpty()) {
          attachedByBackward(call.getArgument(0), call);
        }
        return null;
      }
      case DETACH -> {
        if (resultKind == null) {
          return null;
        }
        if (!djl) {
          return TensorValue.tensor(resultKind, Graph.DETACHED_ONLY, NodeSet.EMPTY, Set.of(), NodeSet.EMPTY);
        }
        return allocate(call, TensorValue.tensor(resultKind, Graph.DETACHED_ONLY, NodeSet.EMPTY,
            receiver != null ? receiver.scopes() : Set.of(), NodeSet.of(call)));
      }
      case COPY, ELEMENTWISE, VECTOR_OP, RESHAPE, PERMUTE, TRANSPOSE, MATMUL, REDUCE, CONCAT -> {
        if (resultKind == null || resultKind == Kind.SCOPE_HANDLE) {
          return null;
        }
        if (sameDiff) {
          return graphOperation(call);
        }
        if (TensorOps.inPlace(m)) {
          return inPlace(call, scope, receiver, args, djl);
        }
        return operation(call, resultKind, receiver, args, djl);
      }
      case LEAVE_MEMORY_SCOPE -> {
        return TensorValue.tensor(Kind.TENSOR, Graph.DETACHED_ONLY, NodeSet.EMPTY, Set.of(), NodeSet.EMPTY);
      }
      case MIGRATE -> {
        return allocate(call, TensorValue.tensor(Kind.TENSOR, Graph.DETACHED_ONLY, NodeSet.EMPTY,
            workspaceAt(call), NodeSet.of(call)));
      }
      case MOVE_TO_SCOPE -> {
        move(scope, receiver, args.isEmpty() ? null : args.get(0), m.flag("temporary"));
        return null;
      }
      case RELEASE_FROM_SCOPE -> {
        if (receiver != null && receiver.isTensor()) {
          release(receiver);
          update(scope, receiver.withScopes(Set.of()).withAllocations(NodeSet.EMPTY));
        }
        return null;
      }
      case SCOPE_OF -> {
        return receiver != null && !receiver.scopes().isEmpty()
            ? TensorValue.handle(receiver.scopes()) : a.entered(call, m.returns());
      }
      case STORE -> {
        storeInto(call, scope, receiver, args, call.getArguments(), m.intAttribute("valueArg", 0));
        return null;
      }
      case DERIVE -> {
        if (resultKind == null) {
          return null;
        }
        if (receiver != null && receiver.kind() == Kind.SCOPE_HANDLE) {
          // Data of a batch: owned by the batch's manager, created by the library.
          return TensorValue.tensor(resultKind, Graph.DETACHED_ONLY, NodeSet.EMPTY, receiver.scopes(),
              NodeSet.EMPTY);
        }
        return receiver != null && receiver.isTensor() ? receiver.withKind(resultKind)
            : a.entered(call, m.returns());
      }
      case TO_SCALAR, SHAPE_QUERY -> {
        return null;
      }
      default -> {
        return a.entered(call, m.returns());
      }
    }
  }

  /** Whether gradients are recorded where {@code at} is evaluated. */
  private boolean recording(Node at) {
    if (a.context.underRecording() || a.lexicallyRecording(at)) {
      return true;
    }
    for (Scope s : state.openScopes()) {
      if (s.kind() == Scope.Kind.AUTOGRAD) {
        return true;
      }
    }
    return false;
  }

  /** The ND4J workspace that owns arrays created at {@code at}: empty outside any (heap arrays). */
  private Set<Scope> workspaceAt(Node at) {
    Scope lexical = a.lexicalWorkspace(at);
    if (lexical != null) {
      return lexical.kind() == Scope.Kind.WORKSPACE ? Set.of(lexical) : Set.of();
    }
    Scope only = null;
    for (Scope s : state.openScopes()) {
      if (s.kind() == Scope.Kind.NO_WORKSPACE || s.kind() == Scope.Kind.WORKSPACE && only != null) {
        return Set.of(); // several candidates: we cannot tell which is innermost
      }
      if (s.kind() == Scope.Kind.WORKSPACE) {
        only = s;
      }
    }
    return only == null ? Set.of() : Set.of(only);
  }

  private TensorValue open(MethodCallExpr call, Scope.Kind kind) {
    Scope s = a.scopeAt(call, kind, true);
    if (s.closedBy() == null && kind != Scope.Kind.MANAGER) {
      state = state.opening(s);
    }
    if (sink != null && s.ownsMemory()) {
      sink.add(new ScopeFacts.Opening(a.graph, s, Loops.enclosing(call)));
    }
    return TensorValue.handle(s);
  }

  /** A try-with-resources closes {@code resource} when its block ends. */
  private void closedAtEndOf(TryStmt t, TensorValue resource) {
    if (resource.isTensor()) {
      release(resource);
    } else if (sink != null && resource.kind() == Kind.SCOPE_HANDLE) {
      for (Scope s : resource.scopes()) {
        sink.closed(s, t);
      }
    }
  }

  private void close(MethodCallExpr call, TensorValue receiver) {
    if (receiver == null) {
      return;
    }
    if (receiver.kind() == Kind.SCOPE_HANDLE) {
      for (Scope s : receiver.scopes()) {
        state = state.closing(s);
        if (sink != null) {
          sink.closed(s, call);
        }
      }
    } else if (receiver.isTensor()) {
      release(receiver);
    }
  }

  /** A new DJL or ND4J array from an operation on tensors. */
  private TensorValue operation(MethodCallExpr call, Kind kind, TensorValue receiver, List<TensorValue> args,
      boolean djl) {
    if (!djl) {
      return allocate(call, TensorValue.tensor(kind, Graph.DETACHED_ONLY, NodeSet.EMPTY, workspaceAt(call),
          NodeSet.of(call)));
    }
    Set<Graph> graph = Graph.DETACHED_ONLY;
    NodeSet origins = NodeSet.EMPTY;
    if (recording(call)) {
      TensorValue operands = receiver != null && receiver.isTensor() ? receiver
          : TensorValue.tensor(kind, Graph.UNKNOWN_ONLY, NodeSet.EMPTY, Set.of(), NodeSet.EMPTY);
      TensorValue fromArgs = combine(args);
      graph = fromArgs == null ? operands.graph() : Graph.either(operands.graph(), fromArgs.graph());
      origins = fromArgs == null ? operands.origins() : operands.origins().union(fromArgs.origins());
    }
    return allocate(call, TensorValue.tensor(kind, graph, graph.contains(Graph.ATTACHED) ? origins : NodeSet.EMPTY,
        receiver != null ? receiver.scopes() : Set.of(), NodeSet.of(call)));
  }

  /** {@code holder.addi(value)}: the receiver is rewritten; under recording it takes the argument's graph. */
  private TensorValue inPlace(MethodCallExpr call, Expression scope, TensorValue receiver, List<TensorValue> args,
      boolean djl) {
    TensorValue fromArgs = combine(args);
    if (!djl || fromArgs == null) {
      return receiver;
    }
    boolean recording = recording(call);
    if (!recording) {
      fromArgs = fromArgs.withGraph(Graph.DETACHED_ONLY, NodeSet.EMPTY);
    }
    TensorValue updated = receiver;
    if (receiver != null && receiver.isTensor() && recording) {
      updated = receiver.withGraph(Graph.either(receiver.graph(), fromArgs.graph()),
          receiver.origins().union(fromArgs.origins()));
      update(scope, updated);
    }
    Variable holder = scope == null ? null : variableOf(scope);
    Expression firstArg = call.getArguments().isEmpty() ? call : call.getArgument(0);
    if (holder != null) {
      store(call, StoreKind.IN_PLACE, holder, firstArg, firstArg, fromArgs, receiver);
    }
    return updated;
  }

  private void move(Expression scope, TensorValue receiver, TensorValue target, boolean temporary) {
    if (receiver == null || !receiver.isTensor() || target == null) {
      return;
    }
    if (sink != null && target.kind() == Kind.SCOPE_HANDLE) {
      sink.chosenForMovedArrays(target.scopes());
    }
    if (temporary) {
      Set<Scope> both = new HashSet<>(receiver.scopes());
      both.addAll(target.scopes());
      update(scope, receiver.withScopes(both));
    } else {
      release(receiver);
      update(scope, receiver.withScopes(target.scopes()));
    }
  }

  /** {@code backward(x)} succeeds only on an attached tensor: from here on, {@code x} is attached. */
  private void attachedByBackward(Expression arg, MethodCallExpr call) {
    Variable v = variableOf(arg);
    if (v == null) {
      return;
    }
    state.get(v).filter(TensorValue::isTensor).ifPresent(value -> state = state.with(v,
        value.withGraph(Graph.ATTACHED_ONLY, value.origins().isEmpty() ? NodeSet.of(call) : value.origins())));
  }

  private void storeInto(MethodCallExpr call, Expression scope, TensorValue container, List<TensorValue> args,
      List<Expression> argExprs, int valueArg) {
    if (valueArg >= args.size()) {
      return;
    }
    TensorValue value = args.get(valueArg);
    if (value == null || !value.isTensor()) {
      return;
    }
    if (container != null && container.kind() == Kind.TENSOR_LIST) {
      update(scope, container.join(value.withKind(Kind.TENSOR_LIST)).withKind(Kind.TENSOR_LIST));
    }
    Variable holder = scope == null ? null : variableOf(scope);
    if (holder == null) {
      keep(value);
      return;
    }
    collect(call, holder, argExprs.get(valueArg), value);
  }

  private void collect(Node at, Variable holder, Expression valueExpr, TensorValue value) {
    store(at, StoreKind.COLLECT, holder, valueExpr, valueExpr, value, null);
    Statement inner = Loops.innermost(at);
    if (inner == null || Loops.survives(holder, inner)) {
      keep(value);
    }
  }

  private TensorValue projectCall(MethodCallExpr call, ProjectIndex.ProjectMethod pm, List<TensorValue> args) {
    handOff(args);
    Kind kind = a.trackedKind(pm.returnType());
    if (kind == null) {
      return null;
    }
    HelperSummary s = a.summaries.of(pm.declaration());
    if (s == null || s.returns() == null) {
      return a.entered(call, pm.returnType());
    }
    Set<Graph> graph = recording(call) ? s.insideRecording() : s.outsideRecording();
    if (graph.isEmpty()) {
      graph = Graph.UNKNOWN_ONLY;
    }
    NodeSet origins = NodeSet.of(call);
    Set<Scope> owner = new HashSet<>();
    for (int i : s.graphFrom()) {
      TensorValue arg = i < args.size() ? args.get(i) : null;
      graph = Graph.either(graph, arg != null && arg.isTensor() ? arg.graph() : Graph.UNKNOWN_ONLY);
      if (arg != null) {
        origins = origins.union(arg.origins());
      }
    }
    for (int i : s.scopesFrom()) {
      if (i < args.size() && args.get(i) != null) {
        owner.addAll(args.get(i).scopes());
      }
    }
    return TensorValue.tensor(kind, graph, graph.contains(Graph.ATTACHED) ? origins : NodeSet.EMPTY, owner,
        NodeSet.EMPTY);
  }

  private TensorValue graphOperation(MethodCallExpr call) {
    if (sink != null) {
      sink.add(new ScopeFacts.GraphOperation(a.graph, call, Loops.enclosing(call)));
    }
    return TensorValue.tensor(Kind.TENSOR, Graph.ATTACHED_ONLY, NodeSet.of(call), Set.of(), NodeSet.EMPTY);
  }

  /** Tensors among {@code values}, combined as the operands of one operation; null if none. */
  private static TensorValue combine(List<TensorValue> values) {
    TensorValue out = null;
    for (TensorValue v : values) {
      if (v == null || !v.isTensor()) {
        continue;
      }
      if (out == null) {
        out = v;
      } else {
        Set<Scope> scopes = new HashSet<>(out.scopes());
        scopes.addAll(v.scopes());
        out = TensorValue.tensor(out.kind(), Graph.either(out.graph(), v.graph()),
            out.origins().union(v.origins()), scopes, out.allocations().union(v.allocations()));
      }
    }
    return out;
  }

  // ------------------------------------------------------------------ recording helpers

  private TensorValue allocate(MethodCallExpr call, TensorValue value) {
    if (sink != null && value.scopes().stream().anyMatch(Scope::ownsMemory)) {
      sink.add(new ScopeFacts.Allocation(a.graph, call, value, Loops.enclosing(call)));
    }
    return value;
  }

  private void store(Node at, StoreKind kind, Variable holder, Expression valueExpr, Expression operand,
      TensorValue value, TensorValue previous) {
    if (sink == null || value == null || !value.isTensor() || a.isSameDiff(a.types.typeOf(valueExpr))) {
      return; // SameDiff variables are graph nodes; growth is in the operations added, recorded apart
    }
    List<Statement> loops = new ArrayList<>();
    for (Statement loop : Loops.enclosing(at)) {
      if (Loops.survives(holder, loop) && !(kind == StoreKind.COLLECT && emptiedEachIteration(holder, loop))) {
        loops.add(loop);
      }
    }
    if (loops.isEmpty() && !holder.isField()) {
      return; // the holder is itself renewed every iteration
    }
    sink.add(new ScopeFacts.Store(a.graph, at, kind, holder, valueExpr, operand, value, previous,
        List.copyOf(loops)));
  }

  /** Whether each iteration of {@code loop} may empty or replace the container {@code holder}. */
  private boolean emptiedEachIteration(Variable holder, Statement loop) {
    for (MethodCallExpr call : Subtrees.findAll(loop, MethodCallExpr.class, c -> Loops.perIteration(loop, c))) {
      if (call.getScope().isPresent() && variableOf(call.getScope().get()) == holder
          && a.traits.apiMethod(call).map(m -> m.effect() == Effect.CLEAR).orElse(false)) {
        return true;
      }
    }
    for (AssignExpr as : Subtrees.findAll(loop, AssignExpr.class, x -> Loops.perIteration(loop, x))) {
      if (variableOf(as.getTarget()) == holder) {
        return true;
      }
    }
    return false;
  }

  private void keep(TensorValue v) {
    if (sink != null && v != null) {
      sink.kept(v.allocations());
    }
  }

  private void release(TensorValue v) {
    if (sink != null && v != null) {
      sink.released(v.allocations());
    }
  }

  /** Values passed to code we do not see: it may keep or close the arrays and scopes. */
  private void handOff(List<TensorValue> values) {
    for (TensorValue v : values) {
      if (v == null) {
        continue;
      }
      keep(v);
      if (sink != null && v.kind() == Kind.SCOPE_HANDLE) {
        sink.handedOff(v.scopes());
      }
    }
  }

  // ------------------------------------------------------------------ discarded results

  /** A copy operation used as a statement; the receiver is read from the state before it runs. */
  private void discardedResult(ExpressionStmt es) {
    if (sink == null || !(es.getExpression() instanceof MethodCallExpr call)) {
      return;
    }
    Optional<ApiMethod> api = a.traits.apiMethod(call);
    if (api.isEmpty() || !a.returnsTracked(api.get()) || a.isSameDiff(api.get().owner())) {
      return;
    }
    ApiMethod m = api.get();
    Expression receiver = call.getScope().orElse(null);
    DiscardKind kind = null;
    if (TensorOps.returnsCopy(m)) {
      kind = m.effect() == Effect.DETACH ? DiscardKind.DETACH
          : m.effect() == Effect.LEAVE_MEMORY_SCOPE ? DiscardKind.LEAVE_SCOPE : DiscardKind.COPY;
    } else if (TensorOps.inPlace(m) && receiver instanceof MethodCallExpr inner
        && a.traits.apiMethod(inner).filter(TensorOps::returnsCopy).filter(a::returnsTracked).isPresent()) {
      kind = DiscardKind.TEMPORARY;
    }
    if (kind != null) {
      sink.add(new ScopeFacts.DiscardedResult(a.graph, es, call, m, kind, receiver,
          receiver == null ? null : valueOf(receiver), kind == DiscardKind.COPY ? inPlaceVariant(call, m) : null));
    }
  }

  /** {@code addi} for {@code add}: the same operation writing into its receiver, if the model lists one. */
  private String inPlaceVariant(MethodCallExpr call, ApiMethod m) {
    String name = m.name() + "i";
    for (ApiMethod candidate : a.file.model().lookup(m.owner(), name, call.getArguments().size())) {
      if (TensorOps.inPlace(candidate) && candidate.effect() == m.effect()) {
        return name;
      }
    }
    return null;
  }
}
