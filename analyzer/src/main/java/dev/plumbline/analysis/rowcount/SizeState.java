package dev.plumbline.analysis.rowcount;

import dev.plumbline.types.Variable;
import java.util.HashMap;
import java.util.Map;

/**
 * The store of the row-count analysis: the known size of each tracked local variable or
 * parameter. A must-analysis: join keeps only the entries both sides agree on, so a size is
 * known after a merge only if every path gives it. Entries only disappear under join, so
 * iteration stabilizes without widening. Immutable.
 */
final class SizeState {
  static final SizeState EMPTY = new SizeState(Map.of());

  private final Map<Variable, Size> sizes;

  private SizeState(Map<Variable, Size> sizes) {
    this.sizes = sizes;
  }

  Size get(Variable v) {
    return sizes.get(v);
  }

  SizeState with(Variable v, Size size) {
    if (size == null ? !sizes.containsKey(v) : size.equals(sizes.get(v))) {
      return this;
    }
    Map<Variable, Size> copy = new HashMap<>(sizes);
    if (size == null) {
      copy.remove(v);
    } else {
      copy.put(v, size);
    }
    return new SizeState(Map.copyOf(copy));
  }

  SizeState join(SizeState other) {
    if (other == this) {
      return this;
    }
    Map<Variable, Size> both = new HashMap<>();
    sizes.forEach((v, s) -> {
      if (s.equals(other.sizes.get(v))) {
        both.put(v, s);
      }
    });
    return both.size() == sizes.size() ? this : new SizeState(Map.copyOf(both));
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof SizeState s && s.sizes.equals(sizes);
  }

  @Override
  public int hashCode() {
    return sizes.hashCode();
  }
}
