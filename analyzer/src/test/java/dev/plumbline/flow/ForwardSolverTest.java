package dev.plumbline.flow;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.github.javaparser.StaticJavaParser;
import com.github.javaparser.ast.body.MethodDeclaration;
import com.github.javaparser.ast.expr.AssignExpr;
import com.github.javaparser.ast.expr.VariableDeclarationExpr;
import java.util.Set;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;

/** The solver on a tiny may-analysis: which variables may have been assigned so far. */
class ForwardSolverTest {

  /** State: names assigned on some path. Join is union; the lattice is finite. */
  static final class AssignedNames implements FlowAnalysis<Set<String>> {
    @Override
    public Set<String> entryState(ControlFlowGraph g) {
      return Set.of();
    }

    @Override
    public Set<String> join(Set<String> a, Set<String> b) {
      Set<String> out = new TreeSet<>(a);
      out.addAll(b);
      return Set.copyOf(out);
    }

    @Override
    public Set<String> transfer(CfgNode node, Set<String> in) {
      Set<String> out = new TreeSet<>(in);
      if (node.ast() != null && node.kind() == CfgNode.Kind.EVAL) {
        node.ast().findAll(AssignExpr.class).forEach(a -> out.add(a.getTarget().toString()));
        node.ast().findAll(VariableDeclarationExpr.class)
            .forEach(v -> v.getVariables().forEach(d -> out.add(d.getNameAsString())));
      }
      return Set.copyOf(out);
    }
  }

  private static ControlFlowGraph graph(String method) {
    return CfgBuilder.of(StaticJavaParser.parse("class T {" + method + "}")
        .findFirst(MethodDeclaration.class).orElseThrow());
  }

  @Test
  void loopsReachAFixedPointAndBranchesJoin() {
    ControlFlowGraph g = graph("void m(boolean c){ int a = 0; while (c) { if (a > 1) { b = 1; } else { d = 2; } }"
        + " done(); }");
    FlowResult<Set<String>> r = ForwardSolver.solve(g, new AssignedNames());
    assertTrue(r.converged());
    CfgNode done = g.nodes().stream().filter(n -> n.ast() != null && n.ast().toString().startsWith("done"))
        .findFirst().orElseThrow();
    assertEquals(Set.of("a", "b", "d"), r.before(done));
  }

  @Test
  void codeAfterReturnIsUnreachable() {
    ControlFlowGraph g = graph("int m(){ return 1; }");
    FlowResult<Set<String>> r = ForwardSolver.solve(g, new AssignedNames());
    assertTrue(r.converged());
    assertFalse(r.before(g.exit()) == null);
    ControlFlowGraph g2 = graph("void m(){ while (true) { } }");
    assertNull(ForwardSolver.solve(g2, new AssignedNames()).before(g2.exit()));
  }

  @Test
  void catchSeesStateBeforeTheThrowingStatement() {
    ControlFlowGraph g = graph("void m(){ try { x = 1; y = 2; } catch (RuntimeException e) { h(); } }");
    FlowResult<Set<String>> r = ForwardSolver.solve(g, new AssignedNames());
    CfgNode handler = g.nodes().stream().filter(n -> n.kind() == CfgNode.Kind.CATCH).findFirst().orElseThrow();
    // Either statement may throw: before x = 1 nothing is assigned, before y = 2 only x.
    assertEquals(Set.of("x"), r.before(handler));
  }
}
