package dev.plumbline.analysis.shape;

import java.util.ArrayList;
import java.util.List;
import java.util.Set;

/**
 * A DL4J network configuration as the builder chain states it: the layers in order (a
 * {@code list()} stack) or by name with their inputs (a {@code graphBuilder()} graph), with the
 * literal {@code nIn}/{@code nOut} of each. The same value stands for the builder, the built
 * configuration and the network made from it, since all three fix the same widths.
 *
 * <p>Join is equality: two different configurations join to null (nothing known), which also
 * bounds configurations grown in a loop.
 *
 * @param graph whether this is a computation graph (layers named, inputs explicit)
 * @param layers the layers added so far, in order
 * @param inputTypeSet whether {@code setInputType} is called: DL4J then derives widths itself
 * @param overrideNin whether DL4J replaces each list layer's {@code nIn} with the previous
 *     layer's {@code nOut} when it builds ({@code overrideNinUponBuild}, true unless set false)
 */
public record NetworkValue(boolean graph, List<Entry> layers, boolean inputTypeSet, Truth overrideNin)
    implements ShapeValue {

  public NetworkValue {
    layers = List.copyOf(layers);
  }

  /**
   * A layer configuration (builder or built layer).
   *
   * @param kind the layer family from the API model ({@code feed-forward}, {@code recurrent}), or
   *     null for a layer whose widths do not chain
   * @param nIn the literal input width, unknown if not set or not constant
   * @param nOut the literal output width
   * @param site where the layer builder was created
   */
  public record Layer(String kind, Dim nIn, Dim nOut, Site site) implements ShapeValue {
    public Layer withNIn(Dim d) {
      return new Layer(kind, d, nOut, site);
    }

    public Layer withNOut(Dim d) {
      return new Layer(kind, nIn, d, site);
    }

    @Override
    public ShapeValue join(ShapeValue other) {
      if (!(other instanceof Layer l) || !java.util.Objects.equals(l.kind, kind) || !l.site.equals(site)) {
        return null;
      }
      return new Layer(kind, l.nIn.equals(nIn) ? nIn : Dim.UNKNOWN, l.nOut.equals(nOut) ? nOut : Dim.UNKNOWN, site);
    }

    @Override
    public ShapeValue forgetting(Set<Symbol> symbols, Site at) {
      return new Layer(kind, java.util.Collections.disjoint(nIn.symbols(), symbols) ? nIn : Dim.UNKNOWN,
          java.util.Collections.disjoint(nOut.symbols(), symbols) ? nOut : Dim.UNKNOWN, site);
    }
  }

  /**
   * One added layer.
   *
   * @param name the layer's name in a graph, null in a list
   * @param layer the layer, or null when the added value is not known
   * @param inputs names of its inputs in a graph
   * @param call the {@code layer(...)} or {@code addLayer(...)} call
   */
  public record Entry(String name, Layer layer, List<String> inputs, Site call) {
    public Entry {
      inputs = List.copyOf(inputs);
    }
  }

  public static NetworkValue empty(boolean graph) {
    return new NetworkValue(graph, List.of(), false, Truth.TRUE);
  }

  public NetworkValue adding(Entry e) {
    List<Entry> l = new ArrayList<>(layers);
    l.add(e);
    return new NetworkValue(graph, l, inputTypeSet, overrideNin);
  }

  public NetworkValue withInputType() {
    return new NetworkValue(graph, layers, true, overrideNin);
  }

  public NetworkValue withOverrideNin(Truth t) {
    return new NetworkValue(graph, layers, inputTypeSet, t);
  }

  /** The entry whose name is {@code name} in a graph. */
  public Entry named(String name) {
    for (Entry e : layers) {
      if (name.equals(e.name())) {
        return e;
      }
    }
    return null;
  }

  @Override
  public ShapeValue join(ShapeValue other) {
    return other instanceof NetworkValue n && n.equals(this) ? this : null;
  }

  @Override
  public ShapeValue forgetting(Set<Symbol> symbols, Site site) {
    List<Entry> l = new ArrayList<>();
    for (Entry e : layers) {
      l.add(new Entry(e.name(), e.layer() == null ? null : (Layer) e.layer().forgetting(symbols, site),
          e.inputs(), e.call()));
    }
    return new NetworkValue(graph, l, inputTypeSet, overrideNin);
  }
}
