package dev.plumbline.flow;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.NodeList;
import com.github.javaparser.ast.body.CallableDeclaration;
import com.github.javaparser.ast.body.ConstructorDeclaration;
import com.github.javaparser.ast.body.InitializerDeclaration;
import com.github.javaparser.ast.body.MethodDeclaration;
import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.LambdaExpr;
import com.github.javaparser.ast.stmt.AssertStmt;
import com.github.javaparser.ast.stmt.BlockStmt;
import com.github.javaparser.ast.stmt.BreakStmt;
import com.github.javaparser.ast.stmt.CatchClause;
import com.github.javaparser.ast.stmt.ContinueStmt;
import com.github.javaparser.ast.stmt.DoStmt;
import com.github.javaparser.ast.stmt.EmptyStmt;
import com.github.javaparser.ast.stmt.ExplicitConstructorInvocationStmt;
import com.github.javaparser.ast.stmt.ExpressionStmt;
import com.github.javaparser.ast.stmt.ForEachStmt;
import com.github.javaparser.ast.stmt.ForStmt;
import com.github.javaparser.ast.stmt.IfStmt;
import com.github.javaparser.ast.stmt.LabeledStmt;
import com.github.javaparser.ast.stmt.LocalClassDeclarationStmt;
import com.github.javaparser.ast.stmt.LocalRecordDeclarationStmt;
import com.github.javaparser.ast.stmt.ReturnStmt;
import com.github.javaparser.ast.stmt.Statement;
import com.github.javaparser.ast.stmt.SwitchEntry;
import com.github.javaparser.ast.stmt.SwitchStmt;
import com.github.javaparser.ast.stmt.SynchronizedStmt;
import com.github.javaparser.ast.stmt.ThrowStmt;
import com.github.javaparser.ast.stmt.TryStmt;
import com.github.javaparser.ast.stmt.WhileStmt;
import com.github.javaparser.ast.stmt.YieldStmt;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.IdentityHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Builds a {@link ControlFlowGraph} from a JavaParser callable body.
 *
 * <p>Precision choices, all erring towards more paths (never fewer):
 * <ul>
 *   <li>Any node inside a {@code try} body may throw: it gets an exception edge to every handler
 *       of every enclosing {@code try}, carrying the state before the node.
 *   <li>A {@code finally} block is built once. Normal completion and every jump that leaves
 *       through it enter the same copy, and its end continues to all of their targets. States of
 *       different exits are therefore joined inside {@code finally}.
 *   <li>Lambda bodies and local or anonymous classes are not entered; they get graphs of their own.
 * </ul>
 * Semantics follow JLS chapter 14 (statements) for the order of evaluation and jump targets.
 */
public final class CfgBuilder {

  /** A dangling edge waiting for the next node. */
  private record Pending(CfgNode from, CfgNode.Edge.Kind kind) {}

  /** A statement that {@code break} or {@code continue} can target. */
  private static final class JumpScope {
    final Statement statement;
    final String label;
    final boolean isLoop;
    final boolean isSwitch;
    CfgNode continueTarget;
    final List<Pending> breaks = new ArrayList<>();
    final List<Pending> continues = new ArrayList<>();
    final int tryDepth;

    JumpScope(Statement statement, String label, boolean isLoop, boolean isSwitch, int tryDepth) {
      this.statement = statement;
      this.label = label;
      this.isLoop = isLoop;
      this.isSwitch = isSwitch;
      this.tryDepth = tryDepth;
    }
  }

  /** A jump that leaves a try-with-finally; replayed after the finally block. */
  private record PendingJump(Pending from, Statement jump) {}

  /** An enclosing {@code try}: its handlers and, with a finally, the jumps routed through it. */
  private static final class TryScope {
    final List<CfgNode> throwingNodes = new ArrayList<>();
    /** Nodes of the body and the handlers: an exception in either still runs finally. */
    final List<CfgNode> finallyThrowers = new ArrayList<>();
    final boolean hasFinally;
    final List<PendingJump> jumpsThroughFinally = new ArrayList<>();
    boolean inBody = true;

    TryScope(boolean hasFinally) {
      this.hasFinally = hasFinally;
    }
  }

  private final Node callable;
  private final List<CfgNode> nodes = new ArrayList<>();
  private final Map<Node, CfgNode> nodeByAst = new IdentityHashMap<>();
  private final Set<CfgNode> loopHeads = new LinkedHashSet<>();
  private final Deque<JumpScope> jumpScopes = new ArrayDeque<>();
  private final Deque<TryScope> tryScopes = new ArrayDeque<>();
  private final List<Pending> toExit = new ArrayList<>();
  private List<Pending> open = new ArrayList<>();
  private String pendingLabel;

  private CfgBuilder(Node callable) {
    this.callable = callable;
  }

  /** Graph of a method or constructor body; an abstract method yields entry linked to exit. */
  public static ControlFlowGraph of(CallableDeclaration<?> declaration) {
    CfgBuilder b = new CfgBuilder(declaration);
    Optional<BlockStmt> body = Optional.empty();
    if (declaration instanceof MethodDeclaration m) {
      body = m.getBody();
    } else if (declaration instanceof ConstructorDeclaration c) {
      body = Optional.of(c.getBody());
    }
    return b.build(body.map(List::<Statement>of).orElse(List.of()), null);
  }

  public static ControlFlowGraph of(InitializerDeclaration initializer) {
    return new CfgBuilder(initializer).build(List.of(initializer.getBody()), null);
  }

  /** Graph of a lambda; an expression body becomes one node that evaluates the expression. */
  public static ControlFlowGraph of(LambdaExpr lambda) {
    CfgBuilder b = new CfgBuilder(lambda);
    Optional<Expression> expressionBody = lambda.getExpressionBody();
    if (expressionBody.isPresent()) {
      return b.build(List.of(), expressionBody.get());
    }
    return b.build(List.of(lambda.getBody()), null);
  }

  private ControlFlowGraph build(List<Statement> body, Expression expressionBody) {
    CfgNode entry = newNode(CfgNode.Kind.ENTRY, callable, false);
    open.add(new Pending(entry, CfgNode.Edge.Kind.NORMAL));
    for (Statement s : body) {
      statement(s);
    }
    if (expressionBody != null) {
      eval(expressionBody);
    }
    CfgNode realExit = newNode(CfgNode.Kind.EXIT, callable, false);
    toExit.addAll(open);
    for (Pending p : toExit) {
      p.from().addEdge(realExit, p.kind());
    }
    return new ControlFlowGraph(callable, nodes, entry, realExit, nodeByAst, loopHeads);
  }

  // ---------------------------------------------------------------- nodes and edges

  private CfgNode newNode(CfgNode.Kind kind, Node ast, boolean mayThrow) {
    CfgNode node = new CfgNode(nodes.size(), kind, ast);
    nodes.add(node);
    if (ast != null && kind != CfgNode.Kind.ENTRY && kind != CfgNode.Kind.EXIT) {
      nodeByAst.putIfAbsent(ast, node);
    }
    if (mayThrow) {
      for (TryScope t : tryScopes) {
        if (t.inBody) {
          t.throwingNodes.add(node);
        }
        if (t.hasFinally) {
          t.finallyThrowers.add(node);
        }
      }
    }
    return node;
  }

  /** Creates a node fed by all open edges; afterwards only the new node is open. */
  private CfgNode append(CfgNode.Kind kind, Node ast) {
    CfgNode node = newNode(kind, ast, kind == CfgNode.Kind.EVAL || kind == CfgNode.Kind.CONDITION);
    connectOpenTo(node);
    open = new ArrayList<>();
    open.add(new Pending(node, CfgNode.Edge.Kind.NORMAL));
    return node;
  }

  private void connectOpenTo(CfgNode node) {
    for (Pending p : open) {
      p.from().addEdge(node, p.kind());
    }
  }

  private void eval(Node ast) {
    append(CfgNode.Kind.EVAL, ast);
  }

  /** A condition node; returns its node with nothing left open: callers pick the branches. */
  private CfgNode condition(Expression e) {
    CfgNode c = append(CfgNode.Kind.CONDITION, e);
    open = new ArrayList<>();
    return c;
  }

  private CfgNode loopHead(Node loop) {
    CfgNode head = newNode(CfgNode.Kind.JOIN, null, false);
    connectOpenTo(head);
    open = new ArrayList<>(List.of(new Pending(head, CfgNode.Edge.Kind.NORMAL)));
    loopHeads.add(head);
    return head;
  }

  // ---------------------------------------------------------------- statements

  private void statement(Statement s) {
    String label = pendingLabel;
    pendingLabel = null;
    if (s instanceof BlockStmt b) {
      block(b, label);
    } else if (s instanceof ExpressionStmt || s instanceof ExplicitConstructorInvocationStmt
        || s instanceof AssertStmt) {
      eval(s);
    } else if (s instanceof IfStmt i) {
      ifStmt(i, label);
    } else if (s instanceof WhileStmt w) {
      whileStmt(w, label);
    } else if (s instanceof DoStmt d) {
      doStmt(d, label);
    } else if (s instanceof ForStmt f) {
      forStmt(f, label);
    } else if (s instanceof ForEachStmt f) {
      forEachStmt(f, label);
    } else if (s instanceof ReturnStmt r) {
      eval(r);
      jump(r);
    } else if (s instanceof ThrowStmt t) {
      eval(t);
      throwFrom(t);
    } else if (s instanceof BreakStmt || s instanceof ContinueStmt) {
      jump(s);
    } else if (s instanceof YieldStmt y) {
      // Only inside switch expressions, which are evaluated as part of an enclosing expression.
      eval(y);
    } else if (s instanceof LabeledStmt l) {
      pendingLabel = l.getLabel().asString();
      Statement inner = l.getStatement();
      if (isBreakableLoop(inner) || inner instanceof SwitchStmt) {
        statement(inner);
      } else {
        JumpScope scope = new JumpScope(l, pendingLabel, false, false, tryScopes.size());
        pendingLabel = null;
        jumpScopes.push(scope);
        statement(inner);
        jumpScopes.pop();
        open.addAll(scope.breaks);
      }
    } else if (s instanceof SwitchStmt sw) {
      switchStmt(sw, label);
    } else if (s instanceof TryStmt t) {
      tryStmt(t);
    } else if (s instanceof SynchronizedStmt sy) {
      eval(sy.getExpression());
      block(sy.getBody(), null);
    } else if (s instanceof EmptyStmt || s instanceof LocalClassDeclarationStmt
        || s instanceof LocalRecordDeclarationStmt) {
      // No evaluation here; local classes get graphs of their own.
    } else {
      // Unparsable or future statement kinds: evaluate as one opaque step.
      eval(s);
    }
  }

  private static boolean isBreakableLoop(Statement s) {
    return s instanceof WhileStmt || s instanceof DoStmt || s instanceof ForStmt
        || s instanceof ForEachStmt;
  }

  private void block(BlockStmt b, String label) {
    if (label != null) {
      JumpScope scope = new JumpScope(b, label, false, false, tryScopes.size());
      jumpScopes.push(scope);
      statements(b.getStatements());
      jumpScopes.pop();
      open.addAll(scope.breaks);
    } else {
      statements(b.getStatements());
    }
  }

  private void statements(NodeList<Statement> list) {
    for (Statement s : list) {
      statement(s);
    }
  }

  private void ifStmt(IfStmt i, String label) {
    CfgNode c = condition(i.getCondition());
    open.add(new Pending(c, CfgNode.Edge.Kind.TRUE));
    statement(i.getThenStmt());
    List<Pending> afterThen = open;
    open = new ArrayList<>(List.of(new Pending(c, CfgNode.Edge.Kind.FALSE)));
    i.getElseStmt().ifPresent(this::statement);
    open.addAll(afterThen);
  }

  private void whileStmt(WhileStmt w, String label) {
    CfgNode head = loopHead(w);
    JumpScope scope = new JumpScope(w, label, true, false, tryScopes.size());
    scope.continueTarget = head;
    CfgNode c = condition(w.getCondition());
    open.add(new Pending(c, CfgNode.Edge.Kind.TRUE));
    jumpScopes.push(scope);
    statement(w.getBody());
    jumpScopes.pop();
    closeLoop(head, scope);
    open = new ArrayList<>(scope.breaks);
    if (!isConstantTrue(w.getCondition())) {
      open.add(new Pending(c, CfgNode.Edge.Kind.FALSE));
    }
  }

  private void doStmt(DoStmt d, String label) {
    CfgNode head = loopHead(d);
    JumpScope scope = new JumpScope(d, label, true, false, tryScopes.size());
    jumpScopes.push(scope);
    statement(d.getBody());
    jumpScopes.pop();
    open.addAll(scope.continues);
    CfgNode c = condition(d.getCondition());
    c.addEdge(head, CfgNode.Edge.Kind.TRUE);
    open = new ArrayList<>(scope.breaks);
    if (!isConstantTrue(d.getCondition())) {
      open.add(new Pending(c, CfgNode.Edge.Kind.FALSE));
    }
  }

  private void forStmt(ForStmt f, String label) {
    for (Expression init : f.getInitialization()) {
      eval(init);
    }
    CfgNode head = loopHead(f);
    JumpScope scope = new JumpScope(f, label, true, false, tryScopes.size());
    CfgNode c = null;
    if (f.getCompare().isPresent()) {
      c = condition(f.getCompare().get());
      open.add(new Pending(c, CfgNode.Edge.Kind.TRUE));
    }
    jumpScopes.push(scope);
    statement(f.getBody());
    jumpScopes.pop();
    open.addAll(scope.continues);
    scope.continues.clear();
    for (Expression update : f.getUpdate()) {
      eval(update);
    }
    connectOpenTo(head);
    open = new ArrayList<>(scope.breaks);
    if (c != null && !isConstantTrue(f.getCompare().get())) {
      open.add(new Pending(c, CfgNode.Edge.Kind.FALSE));
    }
  }

  private void forEachStmt(ForEachStmt f, String label) {
    eval(f.getIterable());
    CfgNode head = loopHead(f);
    JumpScope scope = new JumpScope(f, label, true, false, tryScopes.size());
    scope.continueTarget = head;
    CfgNode next = newNode(CfgNode.Kind.FOREACH_NEXT, f, true);
    connectOpenTo(next);
    open = new ArrayList<>(List.of(new Pending(next, CfgNode.Edge.Kind.TRUE)));
    jumpScopes.push(scope);
    statement(f.getBody());
    jumpScopes.pop();
    closeLoop(head, scope);
    open = new ArrayList<>(scope.breaks);
    open.add(new Pending(next, CfgNode.Edge.Kind.FALSE));
  }

  private void closeLoop(CfgNode head, JumpScope scope) {
    connectOpenTo(head);
    for (Pending p : scope.continues) {
      p.from().addEdge(head, p.kind());
    }
  }

  private static boolean isConstantTrue(Expression e) {
    return e.isBooleanLiteralExpr() && e.asBooleanLiteralExpr().getValue();
  }

  private void switchStmt(SwitchStmt sw, String label) {
    CfgNode selector = append(CfgNode.Kind.EVAL, sw.getSelector());
    JumpScope scope = new JumpScope(sw, label, false, true, tryScopes.size());
    jumpScopes.push(scope);
    List<Pending> fallThrough = new ArrayList<>();
    boolean hasDefault = false;
    for (SwitchEntry entry : sw.getEntries()) {
      hasDefault |= entry.isDefault() || entry.getLabels().isEmpty();
      CfgNode caseNode = newNode(CfgNode.Kind.JOIN, entry, false);
      selector.addEdge(caseNode, CfgNode.Edge.Kind.NORMAL);
      boolean arrow = entry.getType() != SwitchEntry.Type.STATEMENT_GROUP;
      if (!arrow) {
        for (Pending p : fallThrough) {
          p.from().addEdge(caseNode, p.kind());
        }
      }
      open = new ArrayList<>(List.of(new Pending(caseNode, CfgNode.Edge.Kind.NORMAL)));
      statements(entry.getStatements());
      if (arrow) {
        scope.breaks.addAll(open);
        fallThrough = new ArrayList<>();
      } else {
        fallThrough = open;
      }
    }
    jumpScopes.pop();
    open = new ArrayList<>(scope.breaks);
    open.addAll(fallThrough);
    if (!hasDefault) {
      open.add(new Pending(selector, CfgNode.Edge.Kind.NORMAL));
    }
  }

  private void tryStmt(TryStmt t) {
    TryScope scope = new TryScope(t.getFinallyBlock().isPresent());
    tryScopes.push(scope);
    for (Expression resource : t.getResources()) {
      eval(resource);
    }
    block(t.getTryBlock(), null);
    scope.inBody = false;
    List<Pending> normal = new ArrayList<>(open);
    // Handlers: each may be entered from any node of the body, with the state before that node.
    for (CatchClause clause : t.getCatchClauses()) {
      CfgNode handler = newNode(CfgNode.Kind.CATCH, clause, false);
      for (CfgNode thrower : scope.throwingNodes) {
        thrower.addEdge(handler, CfgNode.Edge.Kind.EXCEPTION);
      }
      open = new ArrayList<>(List.of(new Pending(handler, CfgNode.Edge.Kind.NORMAL)));
      block(clause.getBody(), null);
      normal.addAll(open);
    }
    tryScopes.pop();
    if (t.getFinallyBlock().isEmpty()) {
      open = normal;
      return;
    }
    CfgNode finallyEntry = newNode(CfgNode.Kind.JOIN, t.getFinallyBlock().get(), false);
    for (Pending p : normal) {
      p.from().addEdge(finallyEntry, p.kind());
    }
    for (CfgNode thrower : scope.finallyThrowers) {
      thrower.addEdge(finallyEntry, CfgNode.Edge.Kind.EXCEPTION);
    }
    for (PendingJump j : scope.jumpsThroughFinally) {
      j.from().from().addEdge(finallyEntry, j.from().kind());
    }
    open = new ArrayList<>(List.of(new Pending(finallyEntry, CfgNode.Edge.Kind.NORMAL)));
    block(t.getFinallyBlock().get(), null);
    List<Pending> afterFinally = new ArrayList<>(open);
    // Replay each distinct jump from the end of finally; it may leave through outer finally too.
    Set<Statement> replayed = java.util.Collections.newSetFromMap(new IdentityHashMap<>());
    for (PendingJump j : scope.jumpsThroughFinally) {
      if (replayed.add(j.jump())) {
        open = new ArrayList<>(afterFinally);
        if (j.jump() instanceof ThrowStmt ts) {
          throwFrom(ts);
        } else {
          jump(j.jump());
        }
      }
    }
    // Uncaught exceptions continue after finally towards outer handlers or the exit.
    if (!scope.finallyThrowers.isEmpty()) {
      for (TryScope outer : tryScopes) {
        if (outer.inBody) {
          for (Pending p : afterFinally) {
            outer.throwingNodes.add(p.from());
          }
        }
      }
      toExit.addAll(afterFinally);
    }
    open = afterFinally;
  }

  // ---------------------------------------------------------------- jumps

  /** Routes a return, break or continue; open edges end here. */
  private void jump(Statement s) {
    int targetTryDepth = 0;
    JumpScope target = null;
    if (s instanceof BreakStmt b) {
      target = findScope(b.getLabel().map(l -> l.asString()).orElse(null), false);
    } else if (s instanceof ContinueStmt c) {
      target = findScope(c.getLabel().map(l -> l.asString()).orElse(null), true);
    }
    if (target != null) {
      targetTryDepth = target.tryDepth;
    } else if (!(s instanceof ReturnStmt)) {
      open = new ArrayList<>();
      return; // malformed jump: nothing to target
    }
    TryScope innermostFinally = innermostFinallyAbove(targetTryDepth);
    if (innermostFinally != null) {
      for (Pending p : open) {
        innermostFinally.jumpsThroughFinally.add(new PendingJump(p, s));
      }
    } else if (s instanceof ReturnStmt) {
      toExit.addAll(open);
    } else if (s instanceof BreakStmt) {
      target.breaks.addAll(open);
    } else {
      if (target.continueTarget != null) {
        for (Pending p : open) {
          p.from().addEdge(target.continueTarget, p.kind());
        }
      } else {
        target.continues.addAll(open);
      }
    }
    open = new ArrayList<>();
  }

  /** A throw leaves to handlers (already wired by exception edges) or, outside any try, the exit. */
  private void throwFrom(ThrowStmt t) {
    TryScope innermostFinally = innermostFinallyAbove(0);
    boolean handled = tryScopes.stream().anyMatch(ts -> ts.inBody);
    if (innermostFinally != null && !handled) {
      for (Pending p : open) {
        innermostFinally.jumpsThroughFinally.add(new PendingJump(p, t));
      }
    } else if (!handled) {
      toExit.addAll(open);
    }
    open = new ArrayList<>();
  }

  /** The innermost try with a finally whose body or handlers we are in, above a depth. */
  private TryScope innermostFinallyAbove(int depth) {
    int level = tryScopes.size();
    for (TryScope t : tryScopes) {
      if (level <= depth) {
        return null;
      }
      if (t.hasFinally) {
        return t;
      }
      level--;
    }
    return null;
  }

  private JumpScope findScope(String label, boolean forContinue) {
    for (JumpScope scope : jumpScopes) {
      if (label != null) {
        if (label.equals(scope.label)) {
          return scope;
        }
      } else if (scope.isLoop || (!forContinue && scope.isSwitch)) {
        return scope;
      }
    }
    return null;
  }
}
