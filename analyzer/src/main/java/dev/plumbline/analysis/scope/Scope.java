package dev.plumbline.analysis.scope;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.stmt.TryStmt;

/**
 * A region that owns tensors or records their graph: a DJL manager (or the manager of a batch),
 * an ND4J workspace, or a DJL gradient recording. Identified by the place it is opened or enters
 * the method; canonical per site within one analysis, so identity of the site is equality.
 */
public final class Scope {

  public enum Kind {
    /** Gradient recording ({@code GradientCollector}): operations build an autograd graph. */
    AUTOGRAD,
    /** A DJL {@code NDManager}: arrays created through it, or from its arrays, live until it closes. */
    MANAGER,
    /** The manager a DJL {@code Batch} owns; closing the batch closes it. */
    BATCH,
    /** The (unseen) manager owning a DJL array that enters the method from outside. */
    TENSOR_OWNER,
    /** An active ND4J workspace: arrays created while it is open live in its memory. */
    WORKSPACE,
    /** ND4J {@code scopeOutOfWorkspaces()}: arrays created inside are ordinary heap arrays. */
    NO_WORKSPACE
  }

  private final Node site;
  private final Kind kind;
  private final String label;
  private final boolean opened;
  private final TryStmt closedBy;

  Scope(Node site, Kind kind, String label, boolean opened, TryStmt closedBy) {
    this.site = site;
    this.kind = kind;
    this.label = label;
    this.opened = opened;
    this.closedBy = closedBy;
  }

  /** The call, declaration or loop where the scope is opened or enters the method. */
  public Node site() {
    return site;
  }

  public Kind kind() {
    return kind;
  }

  /** How the code names it: the manager variable, or the array whose manager it is. */
  public String label() {
    return label;
  }

  /** Whether {@link #site()} opens a new scope (rather than receiving one from elsewhere). */
  public boolean opened() {
    return opened;
  }

  /** The try-with-resources statement that closes it, if it is declared as a resource. */
  public TryStmt closedBy() {
    return closedBy;
  }

  /** Whether the scope owns memory (as opposed to recording gradients). */
  public boolean ownsMemory() {
    return kind != Kind.AUTOGRAD && kind != Kind.NO_WORKSPACE;
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof Scope s && s.site == site && s.kind == kind;
  }

  @Override
  public int hashCode() {
    return System.identityHashCode(site) * 31 + kind.hashCode();
  }

  @Override
  public String toString() {
    return kind + " " + label + "@" + site.getBegin().map(p -> p.line + ":" + p.column).orElse("?");
  }
}
