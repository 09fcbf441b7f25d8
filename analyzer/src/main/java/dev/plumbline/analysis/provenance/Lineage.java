package dev.plumbline.analysis.provenance;

import com.github.javaparser.ast.Node;
import java.util.Comparator;
import java.util.function.Function;

/**
 * A body of data identified by the place it entered the method: a load call, a constructor, a
 * parameter or a field. Splitting a lineage yields parts of the same lineage, so a normalizer
 * fitted on the whole lineage can be matched with a split of it.
 *
 * <p>Equality is identity of the site node (JavaParser's {@code Node.equals} is structural).
 */
public final class Lineage {
  public static final Comparator<Lineage> BY_POSITION = Comparator
      .comparingInt((Lineage l) -> l.site.getBegin().map(p -> p.line).orElse(0))
      .thenComparingInt(l -> l.site.getBegin().map(p -> p.column).orElse(0))
      .thenComparing(Lineage::label);

  private final Node site;
  private final Function<Node, String> labeller;
  /** Made on first use: most lineages are never named in a message. */
  private String label;

  public Lineage(Node site, String label) {
    this.site = site;
    this.labeller = null;
    this.label = label;
  }

  /** A lineage whose label {@code labeller} makes from the site when first asked. */
  public Lineage(Node site, Function<Node, String> labeller) {
    this.site = site;
    this.labeller = labeller;
  }

  /** Where the data entered: a call, a {@code new}, a parameter or a field declarator. */
  public Node site() {
    return site;
  }

  /** Whether the data entered through a field: the same rows in every method of the class. */
  public boolean isField() {
    return site instanceof com.github.javaparser.ast.body.VariableDeclarator d
        && d.getParentNode().orElse(null) instanceof com.github.javaparser.ast.body.FieldDeclaration;
  }

  /** How the code names the data there, e.g. {@code allRows} or {@code loader.load()}. */
  public String label() {
    String l = label;
    if (l == null) {
      // Racy but benign: the label is a pure function of the site, and strings are immutable.
      l = labeller.apply(site);
      label = l;
    }
    return l;
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof Lineage other && other.site == site;
  }

  @Override
  public int hashCode() {
    return System.identityHashCode(site);
  }

  @Override
  public String toString() {
    return label() + "@" + site.getBegin().map(p -> p.line + ":" + p.column).orElse("?");
  }
}
