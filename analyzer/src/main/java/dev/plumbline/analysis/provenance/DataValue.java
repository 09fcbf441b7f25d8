package dev.plumbline.analysis.provenance;

import com.github.javaparser.ast.Node;
import java.util.Collection;
import java.util.Collections;
import java.util.Comparator;
import java.util.EnumSet;
import java.util.HashSet;
import java.util.IdentityHashMap;
import java.util.Optional;
import java.util.Set;

/**
 * The abstract value of one data-holding expression: which rows it may hold (a may-set of
 * roles), of which lineages, what shape of holder it is, and where that knowledge comes from.
 *
 * <p>Join is set union on roles, lineages, sites, origins and time-order evidence; two different
 * kinds join to {@link Kind#MIXED}, which queries treat as "nothing known". A role is
 * <em>guessed</em> when only a name (a path, a variable called {@code testSet}) says so on every
 * path that gives it; a role backed by a split or a declared usage on some path is not guessed.
 * Immutable. Node sets compare by identity (JavaParser's {@code Node.equals} is structural).
 *
 * @param kind data rows, a split holder, an array of split parts, a statistic of data, or a
 *     dataset builder whose declared usage is known but whose rows are not built yet
 * @param roles which rows the value may hold
 * @param guessed the subset of {@code roles} known only from names
 * @param lineages which bodies of data those rows come from
 * @param sites for a holder or parts: the split calls; for a statistic: the computing calls
 * @param parts for {@link Kind#PARTS}: how many parts the split made (0 if unknown)
 * @param origins where the rows became train, validation or test rows (split parts, usage
 *     arguments, named sources, helper calls, fields), all in the file being analyzed
 * @param timeOrdered where the rows were read as time-ordered data; empty when not known to be
 */
public record DataValue(Kind kind, Set<Role> roles, Set<Role> guessed, Set<Lineage> lineages,
    Set<Node> sites, int parts, Set<Node> origins, Set<Node> timeOrdered) {

  public enum Kind { DATA, SPLIT_HOLDER, PARTS, STATISTIC, PENDING, MIXED }

  /** Source order of nodes, for picking a stable first origin or site. */
  public static final Comparator<Node> BY_POSITION = Comparator
      .comparingInt((Node n) -> n.getBegin().map(p -> p.line).orElse(0))
      .thenComparingInt(n -> n.getBegin().map(p -> p.column).orElse(0))
      .thenComparingInt(n -> n.getEnd().map(p -> p.line).orElse(0))
      .thenComparingInt(n -> n.getEnd().map(p -> p.column).orElse(0));

  public DataValue {
    roles = roles.isEmpty() ? Set.of() : Collections.unmodifiableSet(EnumSet.copyOf(roles));
    EnumSet<Role> g = EnumSet.noneOf(Role.class);
    g.addAll(guessed);
    g.retainAll(roles);
    guessed = Collections.unmodifiableSet(g);
    lineages = Set.copyOf(lineages);
    sites = identitySet(sites);
    origins = identitySet(origins);
    timeOrdered = identitySet(timeOrdered);
  }

  public static DataValue data(Set<Role> roles, Set<Lineage> lineages) {
    return new DataValue(Kind.DATA, roles, Set.of(), lineages, Set.of(), 0, Set.of(), Set.of());
  }

  public static DataValue fresh(Lineage lineage) {
    return data(EnumSet.of(Role.WHOLE), Set.of(lineage));
  }

  public DataValue withKind(Kind k, Set<Node> newSites, int partCount) {
    return new DataValue(k, roles, guessed, lineages, newSites, partCount, origins, timeOrdered);
  }

  /** The same lineages and time-order evidence with new roles, decided at {@code origin}. */
  public DataValue withRoles(Set<Role> newRoles, Set<Role> newGuessed, Node origin) {
    return new DataValue(Kind.DATA, newRoles, newGuessed, lineages, Set.of(), 0,
        origin == null ? Set.of() : Set.of(origin), timeOrdered);
  }

  public DataValue withTimeOrder(Node evidence) {
    Set<Node> t = identitySet(timeOrdered);
    t.add(evidence);
    return new DataValue(kind, roles, guessed, lineages, sites, parts, origins, t);
  }

  public boolean holds(Role r) {
    return roles.contains(r);
  }

  /** Whether {@code r} is held on some path by evidence stronger than a name. */
  public boolean evidenced(Role r) {
    return roles.contains(r) && !guessed.contains(r);
  }

  /** Only whole, unsplit rows: every path agrees. */
  public boolean onlyWhole() {
    return kind == Kind.DATA && roles.equals(EnumSet.of(Role.WHOLE));
  }

  public boolean isTimeOrdered() {
    return !timeOrdered.isEmpty();
  }

  /** The first origin in source order, if any. */
  public Optional<Node> firstOrigin() {
    return origins.stream().min(BY_POSITION);
  }

  public Optional<Node> firstTimeOrderEvidence() {
    return timeOrdered.stream().min(BY_POSITION);
  }

  public DataValue join(DataValue other) {
    if (other == null || other.equals(this)) {
      return this;
    }
    EnumSet<Role> r = EnumSet.noneOf(Role.class);
    r.addAll(roles);
    r.addAll(other.roles);
    EnumSet<Role> g = EnumSet.copyOf(r);
    for (Role role : r) {
      if (evidenced(role) || other.evidenced(role)) {
        g.remove(role);
      }
    }
    Set<Lineage> l = new HashSet<>(lineages);
    l.addAll(other.lineages);
    Kind k = kind == other.kind ? kind : Kind.MIXED;
    return new DataValue(k, r, g, l, union(sites, other.sites), parts == other.parts ? parts : 0,
        union(origins, other.origins), union(timeOrdered, other.timeOrdered));
  }

  static Set<Node> identitySet(Collection<Node> nodes) {
    Set<Node> s = Collections.newSetFromMap(new IdentityHashMap<>());
    s.addAll(nodes);
    return s;
  }

  private static Set<Node> union(Set<Node> a, Set<Node> b) {
    Set<Node> s = identitySet(a);
    s.addAll(b);
    return s;
  }

  @Override
  public boolean equals(Object o) {
    if (!(o instanceof DataValue v)) {
      return false;
    }
    return kind == v.kind && parts == v.parts && roles.equals(v.roles) && guessed.equals(v.guessed)
        && lineages.equals(v.lineages) && sameNodes(sites, v.sites) && sameNodes(origins, v.origins)
        && sameNodes(timeOrdered, v.timeOrdered);
  }

  private static boolean sameNodes(Set<Node> a, Set<Node> b) {
    return a.size() == b.size() && a.containsAll(b);
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
