package dev.plumbline.analysis.shape;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Collectors;

/**
 * The abstract shape of a tensor: a known rank with one {@link Dim} per axis, or an unknown rank
 * with whatever leading sizes checks and {@code size(i)} reads have told us.
 *
 * <p>Join keeps what both sides agree on: equal ranks join axis by axis (a size that differs
 * becomes unknown); different or unknown ranks give an unknown rank that keeps the agreeing
 * leading sizes. The lattice has finite height per program (sizes only ever become unknown),
 * so no separate widening is needed. Immutable.
 */
public final class TensorShape {
  private static final TensorShape UNKNOWN = new TensorShape(-1, List.of(), Map.of());

  private final int rank;
  private final List<Dim> dims;
  /** For an unknown rank: sizes known at some axes, by axis index. */
  private final Map<Integer, Dim> partial;

  private TensorShape(int rank, List<Dim> dims, Map<Integer, Dim> partial) {
    this.rank = rank;
    this.dims = dims;
    this.partial = partial;
  }

  public static TensorShape unknown() {
    return UNKNOWN;
  }

  public static TensorShape of(List<Dim> dims) {
    return new TensorShape(dims.size(), List.copyOf(dims), Map.of());
  }

  public static TensorShape of(Dim... dims) {
    return of(List.of(dims));
  }

  public static TensorShape ofConstants(long... sizes) {
    List<Dim> d = new ArrayList<>();
    for (long s : sizes) {
      d.add(Dim.of(s));
    }
    return of(d);
  }

  /** Known rank, every size unknown. */
  public static TensorShape ofRank(int rank) {
    return of(Collections.nCopies(rank, Dim.UNKNOWN));
  }

  public boolean rankKnown() {
    return rank >= 0;
  }

  /** The rank, or -1 when unknown. */
  public int rank() {
    return rank;
  }

  /** Sizes by axis; only for a known rank. */
  public List<Dim> dims() {
    if (rank < 0) {
      throw new IllegalStateException("rank unknown");
    }
    return dims;
  }

  /** Size at an axis (negative counts from the end when the rank is known); unknown if not known. */
  public Dim dim(int axis) {
    if (rank >= 0) {
      int a = axis < 0 ? axis + rank : axis;
      return a >= 0 && a < rank ? dims.get(a) : Dim.UNKNOWN;
    }
    return axis >= 0 ? partial.getOrDefault(axis, Dim.UNKNOWN) : Dim.UNKNOWN;
  }

  /** Whether the rank and every size are known (constants or symbols). */
  public boolean fullyKnown() {
    return rank >= 0 && dims.stream().allMatch(Dim::known);
  }

  /** Whether the rank is known and every size is a constant. */
  public boolean allConstant() {
    return rank >= 0 && dims.stream().allMatch(Dim::isConstant);
  }

  /** Number of elements: the product of the sizes, unknown unless every size is known. */
  public Dim elementCount() {
    if (rank < 0) {
      return Dim.UNKNOWN;
    }
    Dim n = Dim.of(1);
    for (Dim d : dims) {
      n = n.times(d);
    }
    return n;
  }

  /** This shape with the size at {@code axis} set (learned from a check or a size read). */
  public TensorShape withDim(int axis, Dim size) {
    if (rank >= 0) {
      int a = axis < 0 ? axis + rank : axis;
      if (a < 0 || a >= rank) {
        return this;
      }
      List<Dim> d = new ArrayList<>(dims);
      d.set(a, size);
      return of(d);
    }
    if (axis < 0) {
      return this;
    }
    Map<Integer, Dim> p = new TreeMap<>(partial);
    p.put(axis, size);
    return new TensorShape(-1, List.of(), Collections.unmodifiableMap(p));
  }

  /** This shape with its rank learned, keeping known leading sizes. */
  public TensorShape withRank(int newRank) {
    if (rank == newRank) {
      return this;
    }
    if (rank >= 0) {
      return this; // contradicting facts: keep what we had
    }
    List<Dim> d = new ArrayList<>(Collections.nCopies(newRank, Dim.UNKNOWN));
    partial.forEach((axis, size) -> {
      if (axis < newRank) {
        d.set(axis, size);
      }
    });
    return of(d);
  }

  /** Whether the two shapes are certainly the same, certainly different, or unknown. */
  public Truth sameAs(TensorShape other) {
    if (rank < 0 || other.rank < 0) {
      return Truth.UNKNOWN;
    }
    if (rank != other.rank) {
      return Truth.FALSE;
    }
    Truth t = Truth.TRUE;
    for (int i = 0; i < rank; i++) {
      t = t.and(dims.get(i).equalTo(other.dims.get(i)));
    }
    return t;
  }

  public TensorShape join(TensorShape other) {
    if (other == null || other.equals(this)) {
      return this;
    }
    if (rank >= 0 && rank == other.rank) {
      List<Dim> d = new ArrayList<>();
      for (int i = 0; i < rank; i++) {
        d.add(dims.get(i).equals(other.dims.get(i)) ? dims.get(i) : Dim.UNKNOWN);
      }
      return of(d);
    }
    Map<Integer, Dim> p = new TreeMap<>();
    int n = Math.max(rank < 0 ? maxPartialAxis() : rank, other.rank < 0 ? other.maxPartialAxis() : other.rank);
    for (int i = 0; i <= n; i++) {
      Dim a = dim(i);
      if (a.known() && a.equals(other.dim(i))) {
        p.put(i, a);
      }
    }
    return p.isEmpty() ? UNKNOWN : new TensorShape(-1, List.of(), Collections.unmodifiableMap(p));
  }

  private int maxPartialAxis() {
    return partial.keySet().stream().mapToInt(Integer::intValue).max().orElse(-1);
  }

  /** Every symbol the shape mentions. */
  public java.util.Set<Symbol> symbols() {
    java.util.Set<Symbol> out = new java.util.HashSet<>();
    (rank >= 0 ? dims : partial.values()).forEach(d -> out.addAll(d.symbols()));
    return out;
  }

  /** The shape with every dimension mentioning a symbol in {@code drop} made unknown. */
  public TensorShape forgetting(java.util.Set<Symbol> drop) {
    if (java.util.Collections.disjoint(symbols(), drop)) {
      return this;
    }
    if (rank >= 0) {
      return of(dims.stream().map(d -> java.util.Collections.disjoint(d.symbols(), drop) ? d : Dim.UNKNOWN)
          .toList());
    }
    Map<Integer, Dim> p = new TreeMap<>(partial);
    p.values().removeIf(d -> !java.util.Collections.disjoint(d.symbols(), drop));
    return p.isEmpty() ? UNKNOWN : new TensorShape(-1, List.of(), Collections.unmodifiableMap(p));
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof TensorShape s && s.rank == rank && s.dims.equals(dims) && s.partial.equals(partial);
  }

  @Override
  public int hashCode() {
    return rank * 31 + dims.hashCode() * 7 + partial.hashCode();
  }

  /** {@code [b, 16]}; an unknown rank shows what is known, e.g. {@code [b, ...]} or {@code [...]}. */
  @Override
  public String toString() {
    if (rank >= 0) {
      return dims.stream().map(Dim::toString).collect(Collectors.joining(", ", "[", "]"));
    }
    if (partial.isEmpty()) {
      return "[...]";
    }
    List<String> parts = new ArrayList<>();
    for (int i = 0; i <= maxPartialAxis(); i++) {
      parts.add(dim(i).toString());
    }
    parts.add("...");
    return String.join(", ", parts).transform(s -> "[" + s + "]");
  }
}
