package dev.plumbline.analysis.provenance;

import dev.plumbline.types.Variable;
import java.util.HashMap;
import java.util.Map;
import java.util.Optional;
import java.util.stream.Collectors;

/**
 * The store of the provenance analysis: the data value of each tracked variable at one program
 * point. A variable that is absent holds nothing we track.
 *
 * <p>Join is pointwise {@link DataValue#join}; a variable present on only one side keeps its
 * value (a may-analysis: "may hold test rows" survives a merge). The lattice is finite per
 * method (roles, kinds and lineage sites are finite), so no widening is needed. Immutable.
 */
public final class ProvenanceState {
  static final ProvenanceState EMPTY = new ProvenanceState(Map.of());

  private final Map<Variable, DataValue> values;

  private ProvenanceState(Map<Variable, DataValue> values) {
    this.values = values;
  }

  public Optional<DataValue> get(Variable v) {
    return Optional.ofNullable(values.get(v));
  }

  ProvenanceState with(Variable v, DataValue value) {
    Map<Variable, DataValue> copy = new HashMap<>(values);
    if (value == null) {
      copy.remove(v);
    } else {
      copy.put(v, value);
    }
    return new ProvenanceState(Map.copyOf(copy));
  }

  ProvenanceState join(ProvenanceState other) {
    if (other == this || other.values.isEmpty()) {
      return this;
    }
    if (values.isEmpty()) {
      return other;
    }
    Map<Variable, DataValue> merged = new HashMap<>(values);
    other.values.forEach((k, v) -> merged.merge(k, v, DataValue::join));
    return new ProvenanceState(Map.copyOf(merged));
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof ProvenanceState s && s.values.equals(values);
  }

  @Override
  public int hashCode() {
    return values.hashCode();
  }

  /** Stable one-line dump: variables in declaration order. */
  @Override
  public String toString() {
    return values.entrySet().stream()
        .sorted(Map.Entry.comparingByKey(Variable.BY_POSITION))
        .map(e -> e.getKey().name() + "=" + e.getValue().kind() + e.getValue().roles()
            + e.getValue().lineages().stream().sorted(Lineage.BY_POSITION).toList())
        .collect(Collectors.joining(", ", "{", "}"));
  }
}
