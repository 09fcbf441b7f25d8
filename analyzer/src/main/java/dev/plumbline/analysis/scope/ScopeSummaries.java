package dev.plumbline.analysis.scope;

import com.github.javaparser.ast.body.CallableDeclaration;
import java.util.IdentityHashMap;
import java.util.Map;
import java.util.Set;

/**
 * Summaries of the project's own methods for the scope analysis, computed once per scan by
 * {@link ScopeSummaryAnalysis} and published in {@code ProjectFacts} under this class. Keyed by
 * declaration identity. Immutable after construction; shared by all analysis threads.
 */
public final class ScopeSummaries {
  static final ScopeSummaries NONE = new ScopeSummaries(Map.of());

  private final Map<CallableDeclaration<?>, HelperSummary> byMethod;

  ScopeSummaries(Map<CallableDeclaration<?>, HelperSummary> byMethod) {
    Map<CallableDeclaration<?>, HelperSummary> copy = new IdentityHashMap<>(byMethod);
    this.byMethod = java.util.Collections.unmodifiableMap(copy);
  }

  /** The summary of a method, or null when there is none (nothing tracked, or not analyzed). */
  public HelperSummary of(CallableDeclaration<?> method) {
    return byMethod.get(method);
  }

  int size() {
    return byMethod.size();
  }

  /** Methods whose summary here differs from the one in {@code other} (or exists in one only). */
  Set<CallableDeclaration<?>> differingFrom(ScopeSummaries other) {
    Set<CallableDeclaration<?>> out = java.util.Collections.newSetFromMap(new IdentityHashMap<>());
    for (Map.Entry<CallableDeclaration<?>, HelperSummary> e : byMethod.entrySet()) {
      if (!e.getValue().equals(other.byMethod.get(e.getKey()))) {
        out.add(e.getKey());
      }
    }
    for (CallableDeclaration<?> m : other.byMethod.keySet()) {
      if (!byMethod.containsKey(m)) {
        out.add(m);
      }
    }
    return out;
  }

}
