package dev.plumbline.analysis.shape;

import dev.plumbline.types.Variable;
import java.util.HashMap;
import java.util.HashSet;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.stream.Collectors;

/**
 * The store of the shape analysis: the abstract value of each variable we know something
 * about at one program point. A variable that is absent has no known value (top).
 *
 * <p>Join is pointwise {@link ShapeValue#join}; a variable known on only one side is dropped
 * (a must-analysis for shapes: a fact survives a merge only if every path agrees). Widening
 * drops every variable whose value changed since the previous visit of the loop head, so a
 * loop reaches its fixed point after one more iteration however its sizes grow (a product
 * {@code b, 2*b, 4*b, ...} or a configuration that gains a layer per iteration). Immutable.
 */
public final class ShapeState {
  static final ShapeState EMPTY = new ShapeState(Map.of());

  private final Map<Variable, ShapeValue> values;

  private ShapeState(Map<Variable, ShapeValue> values) {
    this.values = values;
  }

  public Optional<ShapeValue> get(Variable v) {
    return Optional.ofNullable(values.get(v));
  }

  ShapeState with(Variable v, ShapeValue value) {
    if (java.util.Objects.equals(values.get(v), value)) {
      return this;
    }
    Map<Variable, ShapeValue> copy = new HashMap<>(values);
    if (value == null) {
      copy.remove(v);
    } else {
      copy.put(v, value);
    }
    return new ShapeState(Map.copyOf(copy));
  }

  ShapeState join(ShapeState other) {
    if (other == this) {
      return this;
    }
    Map<Variable, ShapeValue> merged = new HashMap<>();
    for (Map.Entry<Variable, ShapeValue> e : values.entrySet()) {
      ShapeValue joined = ShapeValue.join(e.getValue(), other.values.get(e.getKey()));
      if (joined != null) {
        merged.put(e.getKey(), joined);
      }
    }
    return new ShapeState(Map.copyOf(merged));
  }

  ShapeState widen(ShapeState next) {
    Map<Variable, ShapeValue> kept = new HashMap<>();
    for (Map.Entry<Variable, ShapeValue> e : values.entrySet()) {
      if (e.getValue().equals(next.values.get(e.getKey()))) {
        kept.put(e.getKey(), e.getValue());
      }
    }
    return new ShapeState(Map.copyOf(kept));
  }

  /**
   * Forgets what the state says about the previous evaluation of {@code site}: symbols read
   * there, tensors made there and reductions computed there. Called before the site binds a new
   * value, so facts from an earlier loop iteration are never mixed with the current one.
   */
  ShapeState forget(Site site) {
    Set<Symbol> symbols = new HashSet<>();
    boolean mentioned = false;
    for (ShapeValue v : values.values()) {
      if (mentions(v, site, symbols)) {
        mentioned = true;
      }
    }
    if (!mentioned) {
      return this;
    }
    Map<Variable, ShapeValue> copy = new HashMap<>();
    values.forEach((k, v) -> {
      ShapeValue f = v.forgetting(symbols, site);
      if (f != null) {
        copy.put(k, f);
      }
    });
    return new ShapeState(Map.copyOf(copy));
  }

  private static boolean mentions(ShapeValue v, Site site, Set<Symbol> out) {
    boolean found = false;
    if (v instanceof ShapeValue.Tensor t) {
      for (Symbol s : t.shape().symbols()) {
        if (s.site() == site.node()) {
          out.add(s);
          found = true;
        }
      }
      found |= site.equals(t.origin());
      found |= t.reducedFrom() != null && (site.equals(t.reducedFrom().source()) || site.equals(t.reducedFrom().call()));
    } else if (v instanceof ShapeValue.Int i) {
      for (Symbol s : i.value().symbols()) {
        if (s.site() == site.node()) {
          out.add(s);
          found = true;
        }
      }
    } else if (v instanceof ShapeValue.Tuple tu && tu.elements() != null) {
      for (Dim d : tu.elements()) {
        for (Symbol s : d.symbols()) {
          if (s.site() == site.node()) {
            out.add(s);
            found = true;
          }
        }
      }
    } else if (v instanceof ShapeValue.TensorList l) {
      for (ShapeValue.Tensor t : l.items()) {
        found |= mentions(t, site, out);
      }
    } else if (v instanceof NetworkValue n) {
      for (NetworkValue.Entry e : n.layers()) {
        if (e.layer() != null) {
          found |= mentions(new ShapeValue.Int(e.layer().nIn()), site, out);
          found |= mentions(new ShapeValue.Int(e.layer().nOut()), site, out);
        }
      }
    }
    return found;
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof ShapeState s && s.values.equals(values);
  }

  @Override
  public int hashCode() {
    return values.hashCode();
  }

  /** Stable one-line dump: variables in declaration order, tensors by shape. */
  @Override
  public String toString() {
    return values.entrySet().stream()
        .sorted(Map.Entry.comparingByKey(Variable.BY_POSITION))
        .map(e -> e.getKey().name() + "=" + describe(e.getValue()))
        .collect(Collectors.joining(", ", "{", "}"));
  }

  static String describe(ShapeValue v) {
    if (v instanceof ShapeValue.Tensor t) {
      return t.shape().toString() + (t.uncheckedReshapes().isEmpty() ? "" : "!") + (t.checked() ? "✓" : "");
    }
    if (v instanceof ShapeValue.Int i) {
      return i.value().toString();
    }
    if (v instanceof ShapeValue.Tuple t) {
      return t.elements() == null ? "(...)" : t.elements().toString().replace('[', '(').replace(']', ')');
    }
    return v.getClass().getSimpleName();
  }
}
