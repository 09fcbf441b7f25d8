package dev.plumbline.analysis.shape;

import java.util.HashMap;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalLong;
import java.util.stream.Collectors;

/**
 * An integer the shape analysis tracks: a dimension size or an {@code int}/{@code long} value.
 * Either unknown, or a monomial {@code c * s1^e1 * s2^e2 ...} over {@link Symbol}s (a constant
 * when there are no symbols). Monomials are closed under multiplication, which is what reshape
 * element counts and {@code -1} inference need; sums are kept only when both sides have the
 * same symbols ({@code b + b = 2*b}), otherwise they become unknown.
 *
 * <p>Comparisons are three-valued and assume every symbol stands for a size of at least one:
 * {@code 2*b} is certainly not {@code 1}; {@code b} and {@code 16} may or may not be equal.
 * Immutable.
 */
public final class Dim {
  public static final Dim UNKNOWN = new Dim(false, 0, Map.of());
  private static final Dim[] SMALL = new Dim[65];

  static {
    for (int i = 0; i < SMALL.length; i++) {
      SMALL[i] = new Dim(true, i, Map.of());
    }
  }

  private final boolean known;
  private final long coefficient;
  private final Map<Symbol, Integer> exponents;

  private Dim(boolean known, long coefficient, Map<Symbol, Integer> exponents) {
    this.known = known;
    this.coefficient = coefficient;
    this.exponents = exponents;
  }

  public static Dim of(long constant) {
    return constant >= 0 && constant < SMALL.length ? SMALL[(int) constant] : new Dim(true, constant, Map.of());
  }

  public static Dim of(Symbol symbol) {
    return new Dim(true, 1, Map.of(symbol, 1));
  }

  public boolean known() {
    return known;
  }

  public boolean isConstant() {
    return known && exponents.isEmpty();
  }

  /** The constant value, if this is a known constant. */
  public OptionalLong constant() {
    return isConstant() ? OptionalLong.of(coefficient) : OptionalLong.empty();
  }

  /** Whether this is the given constant. */
  public boolean is(long value) {
    return isConstant() && coefficient == value;
  }

  /** Symbols this value mentions (empty for constants and unknown). */
  public java.util.Set<Symbol> symbols() {
    return exponents.keySet();
  }

  public Truth equalTo(Dim other) {
    if (!known || !other.known) {
      return Truth.UNKNOWN;
    }
    if (exponents.equals(other.exponents)) {
      return Truth.of(coefficient == other.coefficient);
    }
    if (isConstant() && other.coefficient > 0 && coefficient < other.coefficient) {
      return Truth.FALSE; // other >= its coefficient because symbols are >= 1
    }
    if (other.isConstant() && coefficient > 0 && other.coefficient < coefficient) {
      return Truth.FALSE;
    }
    return Truth.UNKNOWN;
  }

  /** Whether this size is one, the size that broadcasts. */
  public Truth isOne() {
    return equalTo(of(1));
  }

  public Dim times(Dim other) {
    if (is(0) || other.is(0)) {
      return of(0);
    }
    if (!known || !other.known) {
      return UNKNOWN;
    }
    Map<Symbol, Integer> e = new HashMap<>(exponents);
    other.exponents.forEach((s, n) -> e.merge(s, n, Integer::sum));
    long c;
    try {
      c = Math.multiplyExact(coefficient, other.coefficient);
    } catch (ArithmeticException overflow) {
      return UNKNOWN;
    }
    return make(c, e);
  }

  public Dim plus(Dim other) {
    if (!known || !other.known) {
      return UNKNOWN;
    }
    if (!exponents.equals(other.exponents)) {
      return UNKNOWN;
    }
    try {
      return make(Math.addExact(coefficient, other.coefficient), exponents);
    } catch (ArithmeticException overflow) {
      return UNKNOWN;
    }
  }

  public Dim minus(Dim other) {
    return plus(other.times(of(-1)));
  }

  /** Java integer division; kept only when both are constants. */
  public Dim dividedBy(Dim other) {
    if (isConstant() && other.isConstant() && other.coefficient != 0) {
      return of(coefficient / other.coefficient);
    }
    return exactQuotient(other).orElse(UNKNOWN);
  }

  /** {@code this / other} when it is certainly a whole monomial; empty when unknown or not whole. */
  public Optional<Dim> exactQuotient(Dim other) {
    if (!known || !other.known || other.coefficient == 0 || coefficient % other.coefficient != 0) {
      return Optional.empty();
    }
    Map<Symbol, Integer> e = new HashMap<>(exponents);
    for (Map.Entry<Symbol, Integer> d : other.exponents.entrySet()) {
      Integer have = e.get(d.getKey());
      if (have == null || have < d.getValue()) {
        return Optional.empty();
      }
      e.put(d.getKey(), have - d.getValue());
    }
    return Optional.of(make(coefficient / other.coefficient, e));
  }

  /** Whether {@code this} is certainly a whole multiple of {@code other}: FALSE only for constants. */
  public Truth divisibleBy(Dim other) {
    if (exactQuotient(other).isPresent()) {
      return Truth.TRUE;
    }
    if (isConstant() && other.isConstant()) {
      return Truth.FALSE;
    }
    return Truth.UNKNOWN;
  }

  /** The value with each symbol replaced by a number; null when a symbol has no value or unknown. */
  public Long evaluate(Map<Symbol, Long> values) {
    if (!known) {
      return null;
    }
    long v = coefficient;
    for (Map.Entry<Symbol, Integer> e : exponents.entrySet()) {
      Long s = values.get(e.getKey());
      if (s == null) {
        return null;
      }
      for (int i = 0; i < e.getValue(); i++) {
        v *= s;
      }
    }
    return v;
  }

  private static Dim make(long c, Map<Symbol, Integer> e) {
    e.values().removeIf(n -> n == 0);
    if (c == 0 || e.isEmpty()) {
      return of(c);
    }
    return new Dim(true, c, Map.copyOf(e));
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof Dim d && d.known == known && d.coefficient == coefficient
        && d.exponents.equals(exponents);
  }

  @Override
  public int hashCode() {
    return Boolean.hashCode(known) * 31 + Long.hashCode(coefficient) * 17 + exponents.hashCode();
  }

  /** {@code 16}, {@code b}, {@code 2*b}, {@code b*c}; {@code ?} when unknown. */
  @Override
  public String toString() {
    if (!known) {
      return "?";
    }
    if (exponents.isEmpty()) {
      return Long.toString(coefficient);
    }
    String product = exponents.entrySet().stream()
        .sorted(Map.Entry.comparingByKey(Symbol.ORDER))
        .map(e -> String.join("*", java.util.Collections.nCopies(e.getValue(), e.getKey().name())))
        .collect(Collectors.joining("*"));
    if (coefficient == 1) {
      return product;
    }
    return coefficient == -1 ? "-" + product : coefficient + "*" + product;
  }
}
