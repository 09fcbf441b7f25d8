package dev.plumbline.analysis.shape;

import com.github.javaparser.ast.Node;
import java.util.Comparator;

/**
 * A named size that is fixed but not known statically: a batch size read from {@code size(0)},
 * an {@code int} parameter, a field, a value computed by a call we do not model.
 *
 * <p>Identity is the evaluation site (a node of the scanned code), so two reads of the same
 * unchanging thing give the same symbol and compare equal, while two different sites never do.
 * Re-evaluating a site (a loop) gives a new run-time value under the same symbol; the analysis
 * forgets every fact that mentions the old one before binding the new one (see
 * {@link ShapeState#forget}). Symbols stand for sizes of at least one: the analysis does not
 * reason about empty batches.
 */
public final class Symbol {
  /** Display order: by name, then by position of the site. */
  public static final Comparator<Symbol> ORDER = Comparator.comparing(Symbol::name)
      .thenComparingLong(Symbol::position);

  private final Object site;
  private final String name;
  private final long position;

  private Symbol(Object site, String name, long position) {
    this.site = site;
    this.name = name;
    this.position = position;
  }

  /** The symbol evaluated at {@code site}, displayed as {@code name}. */
  public static Symbol at(Node site, String name) {
    long pos = site.getBegin().map(p -> (long) p.line * 100_000L + p.column).orElse(0L);
    return new Symbol(site, name, pos);
  }

  /** A symbol with no source site, for tests and for the differential check against the libraries. */
  public static Symbol named(String name) {
    return new Symbol(new Object(), name, 0);
  }

  public String name() {
    return name;
  }

  /** The source node that evaluates this symbol, or null for a synthetic one. */
  public Node site() {
    return site instanceof Node n ? n : null;
  }

  long position() {
    return position;
  }

  /** Same symbol: the same site (names are for display only). */
  @Override
  public boolean equals(Object o) {
    return o instanceof Symbol s && s.site == site;
  }

  @Override
  public int hashCode() {
    return System.identityHashCode(site);
  }

  @Override
  public String toString() {
    return name;
  }
}
