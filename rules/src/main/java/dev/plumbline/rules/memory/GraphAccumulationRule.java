package dev.plumbline.rules.memory;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.stmt.Statement;
import dev.plumbline.analysis.scope.Loops;
import dev.plumbline.analysis.scope.Scope;
import dev.plumbline.analysis.scope.ScopeAnalysis;
import dev.plumbline.analysis.scope.ScopeFacts;
import dev.plumbline.analysis.scope.TensorValue;
import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.FindingReporter;
import dev.plumbline.engine.Rule;
import dev.plumbline.engine.RuleDescriptor;
import dev.plumbline.finding.Severity;
import dev.plumbline.rules.Snippets;
import java.util.Comparator;
import java.util.List;

/**
 * A tensor still attached to an autograd graph, or owned by a scope that closes every iteration,
 * kept beyond the iteration that made it.
 *
 * <p>Attached: each iteration of a training loop records a new graph; a value built from the
 * previous iteration's total, or collected in a list, keeps every graph reachable, so memory
 * grows with the number of iterations. Certain (error) when every path gives an attached value,
 * possible (warning) otherwise; a field that holds one is a warning (one graph kept past its
 * step). Closed scope: an array owned by a batch's manager or a workspace that closes at the end
 * of each iteration is kept in a holder that survives it, so the kept arrays are released (DJL)
 * or overwritten (ND4J); this is checked first, because when the scope closes, it, not the
 * graph, decides what happens to the array.
 */
public final class GraphAccumulationRule implements Rule {
  public static final String ID = "memory.graph-accumulation";
  static final RuleDescriptor DESCRIPTOR =
      new RuleDescriptor(ID, Severity.ERROR, List.of("memory", "autograd", "correctness"));

  @Override
  public RuleDescriptor descriptor() {
    return DESCRIPTOR;
  }

  @Override
  public void check(FileContext file, FindingReporter reporter) {
    ScopeFacts facts = file.analysis(ScopeAnalysis.KEY);
    for (ScopeFacts.Store store : facts.stores()) {
      Scope closing = closingScope(facts, store);
      if (closing != null) {
        reportClosedScope(reporter, store, closing);
        continue;
      }
      if (!store.data().mayBeAttached() || !growsAcrossIterations(store)) {
        continue;
      }
      Statement loop = graphLoop(facts, store);
      boolean certain = store.data().certainlyAttached();
      String holder = store.holder().name();
      Node origin = store.data().origins().isEmpty() ? null : store.data().origins().sorted().get(0);
      if (store.kind() == ScopeFacts.StoreKind.FIELD || loop == null && store.holder().isField()) {
        String value = Snippets.of(store.value());
        reporter.at(this, store.at())
            .message(ID + ".field", holder, value)
            .related(origin, "related.memory.graph-origin", Snippets.of(origin))
            .fix(ID + ".fix.detach", value)
            .severity(Severity.WARNING)
            .emit();
      } else if (loop != null && store.operand() == null) {
        // The holder is fed back through a call (a recurrent state): each step extends its graph.
        reporter.at(this, store.at())
            .message(ID + ".state" + (certain ? "" : ".possible"), holder, Snippets.of(store.value()),
                Snippets.line(loop))
            .related(origin, "related.memory.graph-origin", Snippets.of(origin))
            .related(loop, "related.memory.training-loop")
            .fix(ID + ".fix.detach-state", holder)
            .severity(certain ? Severity.ERROR : Severity.WARNING)
            .emit();
      } else if (loop != null) {
        String variant = store.kind() == ScopeFacts.StoreKind.COLLECT ? ".collect" : "";
        String operand = Snippets.of(store.operand());
        reporter.at(this, store.at())
            .message(ID + variant + (certain ? "" : ".possible"), holder, operand, Snippets.line(loop))
            .related(origin, "related.memory.graph-origin", Snippets.of(origin))
            .related(loop, "related.memory.training-loop")
            .fix(ID + ".fix.detach", operand)
            .severity(certain ? Severity.ERROR : Severity.WARNING)
            .emit();
      }
    }
    for (ScopeFacts.GraphOperation op : facts.graphOperations()) {
      for (Statement loop : op.loops()) {
        if (facts.traits(loop).runsSameDiff()) {
          reporter.at(this, op.call())
              .message(ID + ".samediff", Snippets.of(op.call()), Snippets.line(loop))
              .related(loop, "related.memory.samediff-loop")
              .fix(ID + ".fix.samediff")
              .emit();
          break;
        }
      }
    }
  }

  /**
   * The innermost loop across whose iterations the holder keeps the value and each of whose
   * iterations records a new graph (a training step); null if none.
   */
  static Statement graphLoop(ScopeFacts facts, ScopeFacts.Store store) {
    for (Statement loop : store.loops()) {
      if (facts.traits(loop).recordsGradients()) {
        return loop;
      }
    }
    return null;
  }

  /** Whether this store is an attached value accumulated across a training loop (reported here). */
  static boolean reportsGraph(ScopeFacts facts, ScopeFacts.Store store) {
    return store.data().mayBeAttached() && growsAcrossIterations(store) && closingScope(facts, store) == null
        && (graphLoop(facts, store) != null || store.holder().isField());
  }

  /**
   * A collection keeps one graph per store; a running value only grows when its previous value
   * is itself attached (a total detached at the start of each iteration keeps one graph at a time).
   */
  private static boolean growsAcrossIterations(ScopeFacts.Store store) {
    return switch (store.kind()) {
      case ACCUMULATE, IN_PLACE -> store.chainsGraph();
      case COLLECT, FIELD -> true;
    };
  }

  /**
   * A scope owning the stored value that is closed before the holder is next used: every owning
   * scope opens and closes within one iteration of a loop the holder survives, or (for a field)
   * closes at the end of a try-with-resources around the store. Null if some owner outlives that.
   */
  static Scope closingScope(ScopeFacts facts, ScopeFacts.Store store) {
    TensorValue data = store.data();
    if (store.kind() == ScopeFacts.StoreKind.IN_PLACE || data.scopes().isEmpty()) {
      return null; // an in-place update copies the values; it keeps no reference
    }
    for (Statement loop : store.loops()) {
      if (data.scopes().stream().allMatch(s -> s.ownsMemory() && facts.livesOneIteration(s, loop))) {
        return first(data);
      }
    }
    if (store.holder().isField() && data.scopes().stream().allMatch(
        s -> s.ownsMemory() && s.closedBy() != null && Loops.within(store.at(), s.closedBy()))) {
      return first(data);
    }
    return null;
  }

  private static Scope first(TensorValue data) {
    return data.scopes().stream()
        .min(Comparator.comparingInt((Scope s) -> s.site().getBegin().map(p -> p.line).orElse(0))
            .thenComparingInt(s -> s.site().getBegin().map(p -> p.column).orElse(0)))
        .orElseThrow();
  }

  private void reportClosedScope(FindingReporter reporter, ScopeFacts.Store store, Scope scope) {
    boolean workspace = scope.kind() == Scope.Kind.WORKSPACE;
    String value = Snippets.of(store.value());
    String variant = switch (scope.kind()) {
      case WORKSPACE -> ".closed-workspace";
      case BATCH -> ".closed-batch";
      default -> ".closed-manager";
    };
    reporter.at(this, store.at())
        .message(ID + variant, store.holder().name(), value, scope.label())
        .related(scope.site(), workspace ? "related.memory.workspace-opened" : "related.memory.scope-per-iteration",
            scope.label())
        .fix(ID + (workspace ? ".fix.leave-workspace" : ".fix.keep-java-value"), value)
        .emit();
  }
}
