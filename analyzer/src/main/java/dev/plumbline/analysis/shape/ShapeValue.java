package dev.plumbline.analysis.shape;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

/**
 * The abstract value of one expression or variable in the shape analysis. Values are
 * immutable; {@link #join} is the least upper bound, with {@code null} standing for "nothing
 * known" (the top of the lattice): two values of different kinds, or of incompatible contents,
 * join to null.
 */
public sealed interface ShapeValue
    permits ShapeValue.Tensor, ShapeValue.Int, ShapeValue.Tuple, ShapeValue.TensorList, NetworkValue.Layer,
    NetworkValue {

  /** Least upper bound; null when nothing useful is common. */
  ShapeValue join(ShapeValue other);

  /** This value with every fact about the symbols or the site forgotten (the site runs again). */
  ShapeValue forgetting(Set<Symbol> symbols, Site site);

  static ShapeValue join(ShapeValue a, ShapeValue b) {
    if (a == null || b == null) {
      return null;
    }
    return a.equals(b) ? a : a.join(b);
  }

  /**
   * A reduction without kept dimensions: which tensor it reduced and along which axes, so that
   * combining it with that same tensor again can be recognized.
   *
   * @param source the origin of the reduced tensor
   * @param sourceShape the reduced tensor's shape
   * @param axes reduced axes, normalized and sorted
   * @param call the reducing call
   */
  record Reduction(Site source, TensorShape sourceShape, List<Integer> axes, Site call) {}

  /**
   * A tensor.
   *
   * @param shape its abstract shape
   * @param framework whose tensor it is (null when unknown)
   * @param origin where this tensor object was made (a creating call, a parameter, a field); two
   *     values with the same origin are the same tensor; null when unknown
   * @param reducedFrom set when the tensor is a reduction without kept dimensions
   * @param uncheckedReshapes reshape or permute calls with computed sizes whose result this is,
   *     not yet checked
   * @param checked whether code checked this tensor's shape on every path here
   */
  record Tensor(TensorShape shape, Framework framework, Site origin, Reduction reducedFrom,
      Set<Site> uncheckedReshapes, boolean checked) implements ShapeValue {

    public Tensor {
      uncheckedReshapes = Set.copyOf(uncheckedReshapes);
    }

    public static Tensor of(TensorShape shape, Framework framework, Site origin) {
      return new Tensor(shape, framework, origin, null, Set.of(), false);
    }

    public Tensor withShape(TensorShape s) {
      return new Tensor(s, framework, origin, reducedFrom, uncheckedReshapes, checked);
    }

    public Tensor withOrigin(Site o) {
      return new Tensor(shape, framework, o, reducedFrom, uncheckedReshapes, checked);
    }

    /** After a check of its shape: nothing is pending any more. */
    public Tensor asChecked() {
      return new Tensor(shape, framework, origin, reducedFrom, Set.of(), true);
    }

    public Tensor withUnchecked(Set<Site> reshapes) {
      return new Tensor(shape, framework, origin, reducedFrom, reshapes, checked);
    }

    public Tensor withReduction(Reduction r) {
      return new Tensor(shape, framework, origin, r, uncheckedReshapes, checked);
    }

    @Override
    public ShapeValue join(ShapeValue other) {
      if (!(other instanceof Tensor t)) {
        return null;
      }
      Set<Site> pending = new HashSet<>(uncheckedReshapes);
      pending.addAll(t.uncheckedReshapes);
      return new Tensor(shape.join(t.shape), framework == t.framework ? framework : null,
          same(origin, t.origin), same(reducedFrom, t.reducedFrom), pending, checked && t.checked);
    }

    @Override
    public ShapeValue forgetting(Set<Symbol> symbols, Site site) {
      Reduction r = reducedFrom != null && (site.equals(reducedFrom.source()) || site.equals(reducedFrom.call()))
          ? null : reducedFrom;
      return new Tensor(shape.forgetting(symbols), framework, site.equals(origin) ? null : origin, r,
          uncheckedReshapes, checked);
    }
  }

  /** An {@code int} or {@code long} value. */
  record Int(Dim value) implements ShapeValue {
    @Override
    public ShapeValue join(ShapeValue other) {
      return other instanceof Int i && i.value.equals(value) ? this : new Int(Dim.UNKNOWN);
    }

    @Override
    public ShapeValue forgetting(Set<Symbol> symbols, Site site) {
      return java.util.Collections.disjoint(value.symbols(), symbols) ? this : new Int(Dim.UNKNOWN);
    }
  }

  /**
   * An array of sizes ({@code long[]}, {@code int[]}) or a DJL {@code Shape}: its elements, and
   * for a data array its shape as nested data ({@code new double[][] {{1, 2}, {3, 4}}} is
   * {@code [2, 2]}), which may be null. {@code shapeOfTensor} says the sizes are a tensor's whole
   * shape, read as one ({@code y.shape()}, {@code y.getShape()}) and not changed since: a reshape
   * to them lays the data out as that tensor is laid out, whatever its sizes are.
   */
  record Tuple(List<Dim> elements, TensorShape data, boolean shapeOfTensor) implements ShapeValue {
    public Tuple {
      elements = elements == null ? null : List.copyOf(elements);
    }

    public Tuple(List<Dim> elements, TensorShape data) {
      this(elements, data, false);
    }

    public static Tuple of(List<Dim> elements) {
      return new Tuple(elements, TensorShape.of(Dim.of(elements.size())));
    }

    /** A tensor's whole shape: its sizes when the rank is known, else nothing but the mark. */
    public static Tuple shapeOf(TensorShape shape) {
      return shape.rankKnown()
          ? new Tuple(shape.dims(), TensorShape.of(Dim.of(shape.rank())), true)
          : new Tuple(null, null, true);
    }

    /**
     * This array after a store into one of its elements: {@code index} and {@code value} when
     * known (index null: any element may have changed). The array keeps its length; it is no
     * longer a tensor's shape as read.
     */
    public Tuple storing(Long index, Dim value) {
      List<Dim> e = null;
      if (elements != null) {
        e = new ArrayList<>(elements);
        for (int i = 0; i < e.size(); i++) {
          if (index == null) {
            e.set(i, Dim.UNKNOWN);
          } else if (i == index) {
            e.set(i, value);
          }
        }
      }
      return new Tuple(e, data, false);
    }

    /** This array after code we do not see may have written into it: length kept, contents unknown. */
    public Tuple overwritten() {
      List<Dim> e = elements == null ? null : java.util.Collections.nCopies(elements.size(), Dim.UNKNOWN);
      TensorShape d = data == null || !data.rankKnown() || data.rank() <= 1 ? data : TensorShape.ofRank(data.rank());
      return new Tuple(e, d, false);
    }

    @Override
    public ShapeValue join(ShapeValue other) {
      if (!(other instanceof Tuple t)) {
        return null;
      }
      List<Dim> e = null;
      if (elements != null && t.elements != null && elements.size() == t.elements.size()) {
        e = new ArrayList<>();
        for (int i = 0; i < elements.size(); i++) {
          e.add(elements.get(i).equals(t.elements.get(i)) ? elements.get(i) : Dim.UNKNOWN);
        }
      }
      TensorShape d = data == null || t.data == null ? null : data.join(t.data);
      return new Tuple(e, d, shapeOfTensor && t.shapeOfTensor);
    }

    @Override
    public ShapeValue forgetting(Set<Symbol> symbols, Site site) {
      List<Dim> e = elements == null ? null : elements.stream()
          .map(d -> java.util.Collections.disjoint(d.symbols(), symbols) ? d : Dim.UNKNOWN).toList();
      return new Tuple(e, data == null ? null : data.forgetting(symbols), shapeOfTensor);
    }
  }

  /** A list of tensors (DJL {@code NDList}). */
  record TensorList(List<Tensor> items) implements ShapeValue {
    public TensorList {
      items = List.copyOf(items);
    }

    @Override
    public ShapeValue join(ShapeValue other) {
      if (!(other instanceof TensorList l) || l.items.size() != items.size()) {
        return null;
      }
      List<Tensor> out = new ArrayList<>();
      for (int i = 0; i < items.size(); i++) {
        out.add((Tensor) items.get(i).join(l.items.get(i)));
      }
      return new TensorList(out);
    }

    @Override
    public ShapeValue forgetting(Set<Symbol> symbols, Site site) {
      return new TensorList(items.stream().map(t -> (Tensor) t.forgetting(symbols, site)).toList());
    }
  }

  private static <T> T same(T a, T b) {
    return a != null && a.equals(b) ? a : null;
  }
}
