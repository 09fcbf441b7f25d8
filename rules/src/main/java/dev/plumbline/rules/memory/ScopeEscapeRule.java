package dev.plumbline.rules.memory;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.stmt.ForEachStmt;
import com.github.javaparser.ast.stmt.Statement;
import dev.plumbline.analysis.scope.Scope;
import dev.plumbline.analysis.scope.ScopeAnalysis;
import dev.plumbline.analysis.scope.ScopeFacts;
import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.FindingReporter;
import dev.plumbline.engine.Rule;
import dev.plumbline.engine.RuleDescriptor;
import dev.plumbline.finding.Severity;
import dev.plumbline.rules.Snippets;
import java.util.Collections;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Arrays created on every iteration of a loop under a memory scope that outlives the loop, and
 * never released: they stay allocated until the scope closes, so memory grows with the number
 * of iterations. Two shapes: an allocation in a manager or workspace opened outside the loop
 * (reported once per loop and scope, at the first such allocation), and a scope opened on every
 * iteration (a batch, a sub-manager) that nothing closes. An allocation that is closed, moved,
 * kept on purpose, or handed to code we do not see is not reported; neither is one whose owner
 * may be released within the iteration on some path, nor one whose owner is renewed by an
 * enclosing loop (the arrays of the time steps of one batch are released with the batch, and
 * the graph needs them until then), nor one owned by a manager the caller passed in and into
 * which the method moves arrays on purpose (the caller then decides when they are released).
 */
public final class ScopeEscapeRule implements Rule {
  public static final String ID = "memory.scope-escape";
  static final RuleDescriptor DESCRIPTOR =
      new RuleDescriptor(ID, Severity.WARNING, List.of("memory", "performance"));

  @Override
  public RuleDescriptor descriptor() {
    return DESCRIPTOR;
  }

  @Override
  public void check(FileContext file, FindingReporter reporter) {
    ScopeFacts facts = file.analysis(ScopeAnalysis.KEY);
    for (ScopeFacts.Opening opening : facts.openings()) {
      Scope s = opening.scope();
      if (!s.opened() || opening.loops().isEmpty() || s.closedBy() != null || facts.handedOff(s)) {
        continue;
      }
      Statement loop = opening.loops().get(0);
      if (facts.opensWithin(s, loop) && !facts.closesWithin(s, loop)) {
        boolean batch = s.kind() == Scope.Kind.BATCH;
        Node at = s.site() instanceof ForEachStmt f ? f.getVariable() : s.site();
        reporter.at(this, at)
            .message(ID + (batch ? ".unclosed-batch" : ".unclosed-scope"), s.label(), Snippets.line(loop))
            .related(loop, "related.memory.allocating-loop")
            .fix(ID + (batch ? ".fix.close-batch" : ".fix.close-scope"), s.label())
            .emit();
      }
    }
    Set<Node> accumulated = Collections.newSetFromMap(new IdentityHashMap<>());
    for (ScopeFacts.Store store : facts.stores()) {
      if (store.kind() == ScopeFacts.StoreKind.ACCUMULATE && GraphAccumulationRule.reportsGraph(facts, store)) {
        accumulated.add(store.value()); // the same line is already a graph accumulation
      }
    }
    Map<Statement, Map<Scope, ScopeFacts.Allocation>> firsts = new IdentityHashMap<>();
    for (ScopeFacts.Allocation alloc : facts.allocations()) {
      if (alloc.loops().isEmpty() || facts.released(alloc.call()) || facts.kept(alloc.call())
          || accumulated.contains(alloc.call())) {
        continue;
      }
      Statement loop = alloc.loops().get(0);
      Set<Scope> owners = alloc.data().scopes();
      if (owners.size() != 1) {
        continue; // owned by one scope on some paths and another on others: say nothing
      }
      Scope owner = owners.iterator().next();
      if (!owner.ownsMemory() || alloc.loops().stream().anyMatch(l -> facts.opensWithin(owner, l))) {
        continue; // renewed by some enclosing loop: growth is bounded by one of its iterations
      }
      if (facts.chosenByCaller(owner)) {
        continue; // arrays routed on purpose into the caller's manager: the caller releases them
      }
      firsts.computeIfAbsent(loop, k -> new java.util.HashMap<>()).putIfAbsent(owner, alloc);
    }
    for (Map.Entry<Statement, Map<Scope, ScopeFacts.Allocation>> perLoop : firsts.entrySet()) {
      Statement loop = perLoop.getKey();
      for (Map.Entry<Scope, ScopeFacts.Allocation> e : perLoop.getValue().entrySet()) {
        Scope owner = e.getKey();
        ScopeFacts.Allocation alloc = e.getValue();
        String variant = switch (owner.kind()) {
          case WORKSPACE -> ".workspace";
          case TENSOR_OWNER -> ".tensor-owner";
          case BATCH -> ".batch";
          default -> "";
        };
        String fix = switch (owner.kind()) {
          case WORKSPACE -> ".fix.workspace-per-iteration";
          case TENSOR_OWNER -> ".fix.temp-attach";
          default -> ".fix.sub-manager";
        };
        String whereFrom = owner.kind() == Scope.Kind.TENSOR_OWNER ? "related.memory.array-enters"
            : owner.opened() ? "related.memory.scope-outside-loop" : "related.memory.scope-from-outside";
        reporter.at(this, alloc.call())
            .message(ID + variant, Snippets.of(alloc.call()), Snippets.line(loop), owner.label())
            .related(owner.site(), whereFrom, owner.label())
            .related(loop, "related.memory.allocating-loop")
            .fix(ID + fix, owner.label())
            .emit();
      }
    }
  }
}
