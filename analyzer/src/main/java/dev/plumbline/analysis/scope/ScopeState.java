package dev.plumbline.analysis.scope;

import dev.plumbline.types.Variable;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.stream.Collectors;

/**
 * The store of the scope analysis at one program point: the value of each tracked variable, and
 * the gradient recordings and workspaces opened by a statement (not a try-with-resources, whose
 * extent is lexical) and not yet closed.
 *
 * <p>Join is pointwise {@link TensorValue#join} for variables (a variable present on one side
 * keeps its value: a may-analysis) and union for open scopes (open on some path). Values and
 * scopes are drawn from the finitely many sites of one method, so the lattice has finite height
 * and no widening is needed. Immutable.
 */
public final class ScopeState {
  static final ScopeState EMPTY = new ScopeState(Map.of(), Set.of());

  private final Map<Variable, TensorValue> values;
  private final Set<Scope> open;

  private ScopeState(Map<Variable, TensorValue> values, Set<Scope> open) {
    this.values = values;
    this.open = open;
  }

  public Optional<TensorValue> get(Variable v) {
    return Optional.ofNullable(values.get(v));
  }

  /** Scopes opened by a statement on some path to here and not closed since. */
  public Set<Scope> openScopes() {
    return open;
  }

  ScopeState with(Variable v, TensorValue value) {
    if (value == null ? !values.containsKey(v) : value.equals(values.get(v))) {
      return this;
    }
    Map<Variable, TensorValue> copy = new HashMap<>(values);
    if (value == null) {
      copy.remove(v);
    } else {
      copy.put(v, value);
    }
    return new ScopeState(Map.copyOf(copy), open);
  }

  ScopeState opening(Scope s) {
    if (open.contains(s)) {
      return this;
    }
    Set<Scope> copy = new HashSet<>(open);
    copy.add(s);
    return new ScopeState(values, Set.copyOf(copy));
  }

  ScopeState closing(Scope s) {
    if (!open.contains(s)) {
      return this;
    }
    Set<Scope> copy = new HashSet<>(open);
    copy.remove(s);
    return new ScopeState(values, Set.copyOf(copy));
  }

  ScopeState join(ScopeState other) {
    if (other == this || other.equals(EMPTY)) {
      return this;
    }
    if (equals(EMPTY)) {
      return other;
    }
    Map<Variable, TensorValue> merged = new HashMap<>(values);
    other.values.forEach((k, v) -> merged.merge(k, v, TensorValue::join));
    Set<Scope> o = new HashSet<>(open);
    o.addAll(other.open);
    return new ScopeState(Map.copyOf(merged), Set.copyOf(o));
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof ScopeState s && s.values.equals(values) && s.open.equals(open);
  }

  @Override
  public int hashCode() {
    return values.hashCode() * 31 + open.hashCode();
  }

  /** Stable one-line dump: variables in declaration order, then open scopes. */
  @Override
  public String toString() {
    String vars = values.entrySet().stream()
        .sorted(Map.Entry.comparingByKey(Variable.BY_POSITION))
        .map(e -> e.getKey().name() + "=" + e.getValue())
        .collect(Collectors.joining(", ", "{", "}"));
    if (open.isEmpty()) {
      return vars;
    }
    return vars + open.stream().sorted(Comparator.comparing(Scope::site, NodeSet.BY_POSITION))
        .map(s -> s.kind().name().toLowerCase(java.util.Locale.ROOT) + ":" + s.label())
        .collect(Collectors.joining(",", " open{", "}"));
  }
}
