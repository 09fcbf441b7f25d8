package dev.plumbline.flow;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.PriorityQueue;

/**
 * Worklist solver for {@link FlowAnalysis}: iterates to a fixed point, visiting nodes in id order
 * (which is source order, close to reverse post-order for structured code).
 *
 * <p>States are kept at node entry. An exception edge carries the state before its source node
 * (the exception may happen before any effect of that node). At loop heads the solver joins for
 * the first {@value #JOINS_BEFORE_WIDENING} visits and widens afterwards. A generous visit budget
 * stops pathological inputs; the result then says it did not converge.
 */
public final class ForwardSolver {
  static final int JOINS_BEFORE_WIDENING = 3;
  private static final int VISITS_PER_NODE = 64;

  private ForwardSolver() {}

  public static <S> FlowResult<S> solve(ControlFlowGraph graph, FlowAnalysis<S> analysis) {
    int n = graph.nodes().size();
    List<S> before = new ArrayList<>(Collections.nCopies(n, null));
    int[] visits = new int[n];
    boolean[] queued = new boolean[n];
    PriorityQueue<Integer> work = new PriorityQueue<>();
    CfgNode entry = graph.entry();
    before.set(entry.id(), analysis.entryState(graph));
    work.add(entry.id());
    queued[entry.id()] = true;
    long budget = (long) VISITS_PER_NODE * Math.max(n, 1);
    while (!work.isEmpty()) {
      if (budget-- <= 0) {
        return new FlowResult<>(graph, before, false);
      }
      int id = work.poll();
      queued[id] = false;
      CfgNode node = graph.nodes().get(id);
      S in = before.get(id);
      visits[id]++;
      S out = null;
      FlowAnalysis.Branches<S> branches = null;
      boolean branching =
          node.kind() == CfgNode.Kind.CONDITION || node.kind() == CfgNode.Kind.FOREACH_NEXT;
      if (branching) {
        branches = analysis.transferBranch(node, in);
      } else {
        out = analysis.transfer(node, in);
      }
      for (CfgNode.Edge edge : node.successors()) {
        S sent = switch (edge.kind()) {
          case EXCEPTION -> in;
          case TRUE -> branching ? branches.whenTrue() : out;
          case FALSE -> branching ? branches.whenFalse() : out;
          case NORMAL -> branching ? analysis.join(branches.whenTrue(), branches.whenFalse()) : out;
        };
        CfgNode target = edge.target();
        S old = before.get(target.id());
        S merged;
        if (old == null) {
          merged = sent;
        } else if (graph.loopHeads().contains(target) && visits[target.id()] >= JOINS_BEFORE_WIDENING) {
          merged = analysis.widen(old, analysis.join(old, sent));
        } else {
          merged = analysis.join(old, sent);
        }
        if (old == null || !old.equals(merged)) {
          before.set(target.id(), merged);
          if (!queued[target.id()]) {
            queued[target.id()] = true;
            work.add(target.id());
          }
        }
      }
    }
    return new FlowResult<>(graph, before, true);
  }
}
