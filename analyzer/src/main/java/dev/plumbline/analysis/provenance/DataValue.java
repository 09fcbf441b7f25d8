package dev.plumbline.analysis.provenance;

import com.github.javaparser.ast.Node;
import java.util.Collections;
import java.util.EnumSet;
import java.util.HashSet;
import java.util.Set;

/**
 * The abstract value of one data-holding expression: which rows it may hold (a may-set of
 * roles), of which lineages, and what shape of holder it is.
 *
 * <p>Join is set union on roles, lineages and sites; two different kinds join to
 * {@link Kind#MIXED}, which queries treat as "nothing known". Immutable.
 *
 * @param kind data rows, a split holder, an array of split parts, or a statistic of data
 * @param roles which rows the value may hold
 * @param lineages which bodies of data those rows come from
 * @param sites for a holder or parts: the split calls; for a statistic: the computing calls
 * @param parts for {@link Kind#PARTS}: how many parts the split made (0 if unknown)
 */
public record DataValue(Kind kind, Set<Role> roles, Set<Lineage> lineages, Set<Node> sites, int parts) {

  public enum Kind { DATA, SPLIT_HOLDER, PARTS, STATISTIC, MIXED }

  public DataValue {
    roles = roles.isEmpty() ? Set.of() : Collections.unmodifiableSet(EnumSet.copyOf(roles));
    lineages = Set.copyOf(lineages);
    Set<Node> identity = Collections.newSetFromMap(new java.util.IdentityHashMap<>());
    identity.addAll(sites);
    sites = Collections.unmodifiableSet(identity);
  }

  public static DataValue data(Set<Role> roles, Set<Lineage> lineages) {
    return new DataValue(Kind.DATA, roles, lineages, Set.of(), 0);
  }

  public static DataValue fresh(Lineage lineage) {
    return data(EnumSet.of(Role.WHOLE), Set.of(lineage));
  }

  public DataValue withKind(Kind k, Set<Node> newSites, int partCount) {
    return new DataValue(k, roles, lineages, newSites, partCount);
  }

  public boolean holds(Role r) {
    return roles.contains(r);
  }

  /** Only whole, unsplit rows: every path agrees. */
  public boolean onlyWhole() {
    return kind == Kind.DATA && roles.equals(EnumSet.of(Role.WHOLE));
  }

  public DataValue join(DataValue other) {
    if (other == null || other.equals(this)) {
      return this;
    }
    EnumSet<Role> r = EnumSet.noneOf(Role.class);
    r.addAll(roles);
    r.addAll(other.roles);
    Set<Lineage> l = new HashSet<>(lineages);
    l.addAll(other.lineages);
    Set<Node> s = Collections.newSetFromMap(new java.util.IdentityHashMap<>());
    s.addAll(sites);
    s.addAll(other.sites);
    Kind k = kind == other.kind ? kind : Kind.MIXED;
    return new DataValue(k, r, l, s, parts == other.parts ? parts : 0);
  }

  @Override
  public boolean equals(Object o) {
    if (!(o instanceof DataValue v)) {
      return false;
    }
    return kind == v.kind && parts == v.parts && roles.equals(v.roles) && lineages.equals(v.lineages)
        && sites.size() == v.sites.size() && sites.containsAll(v.sites);
  }

  @Override
  public int hashCode() {
    int h = kind.hashCode() * 31 + roles.hashCode();
    h = h * 31 + lineages.hashCode();
    for (Node n : sites) {
      h += System.identityHashCode(n);
    }
    return h * 31 + parts;
  }
}
