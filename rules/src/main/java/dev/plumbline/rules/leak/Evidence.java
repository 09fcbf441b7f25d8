package dev.plumbline.rules.leak;

import com.github.javaparser.ast.Node;
import dev.plumbline.analysis.provenance.DataValue;
import dev.plumbline.analysis.provenance.Role;
import dev.plumbline.engine.FileContext;
import dev.plumbline.rules.Snippets;
import java.util.EnumSet;
import java.util.Optional;
import java.util.Set;

/** How sure the provenance facts are that data holds test rows, and where they became test rows. */
final class Evidence {
  /** How a value holds test rows. */
  enum Certainty {
    /** Test rows on every path, from a split or a declared usage. */
    CERTAIN,
    /** Test rows on some paths, other rows on others (or mixed in). */
    POSSIBLE,
    /** Only names say so. */
    NAMED,
    /** Rows held out by a split whose purpose the code does not say. */
    HELD_OUT,
    /** No test or held-out rows. */
    NONE
  }

  private static final Set<Role> TEST_ONLY = EnumSet.of(Role.TEST);

  private Evidence() {}

  /** Test rows, for rules that must not confuse validation with test (tuning). */
  static Certainty testRows(DataValue data) {
    if (data == null || data.kind() != DataValue.Kind.DATA || !data.holds(Role.TEST)) {
      return Certainty.NONE;
    }
    if (!data.evidenced(Role.TEST)) {
      return Certainty.NAMED;
    }
    return data.roles().equals(TEST_ONLY) ? Certainty.CERTAIN : Certainty.POSSIBLE;
  }

  /** Test or held-out rows, for rules where learning from either is wrong (fitting, training). */
  static Certainty heldOutRows(DataValue data) {
    Certainty test = testRows(data);
    if (test != Certainty.NONE) {
      return test;
    }
    if (data != null && data.kind() == DataValue.Kind.DATA && data.holds(Role.HELD_OUT)) {
      return Certainty.HELD_OUT;
    }
    return Certainty.NONE;
  }

  /** Data rows whose every role is known only from names (a source called "test.csv"). */
  static boolean rolesOnlyNamed(DataValue data) {
    return data != null && data.kind() == DataValue.Kind.DATA && !data.roles().isEmpty()
        && data.guessed().equals(data.roles());
  }

  /** Where the rows became test (or held-out) rows, in this file; else {@code fallback}. */
  static Node origin(FileContext file, DataValue data, Node fallback) {
    Optional<Node> o = data.origins().stream()
        .filter(n -> inFile(file, n))
        .min(DataValue.BY_POSITION);
    return o.orElse(fallback);
  }

  static boolean inFile(FileContext file, Node n) {
    return n.findCompilationUnit().orElse(null) == file.source().unit();
  }

  static String snippet(Node n) {
    return Snippets.of(n);
  }
}
