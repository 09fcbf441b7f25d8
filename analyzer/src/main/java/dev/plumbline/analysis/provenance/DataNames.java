package dev.plumbline.analysis.provenance;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.expr.LambdaExpr;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.expr.NameExpr;
import com.github.javaparser.ast.expr.ObjectCreationExpr;
import com.github.javaparser.ast.expr.StringLiteralExpr;
import dev.plumbline.engine.AnalysisSettings;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;

/**
 * The weak, named-heuristic source of roles: what the words in a path, a file name or a
 * variable name say about the rows a newly loaded value holds ({@code "data/holdout.csv"},
 * {@code testIterator}), and whether they say the rows are ordered in time.
 *
 * <p>Words are split at non-letters and at lower-to-upper case changes, then compared whole, so
 * {@code latest} and {@code contest} say nothing. Names that mention two purposes at once
 * ({@code trainTestSplit}) say nothing. Only held-out purposes are read from names: a name that
 * says "train" is left as whole data, so a fit on it that is later split is still seen. The word
 * lists are common practice in naming, not a published standard.
 */
final class DataNames {
  private static final Set<String> TEST_WORDS = Set.of("test", "tests", "testing", "holdout", "heldout");
  private static final Set<String> VALIDATION_WORDS = Set.of("validation", "valid", "val", "validate", "dev");
  private static final Set<String> TRAIN_WORDS = Set.of("train", "training", "trn");
  private static final Set<String> TIME_WORDS = Set.of("time", "times", "timeseries", "timestamp",
      "timestamps", "date", "dates", "dated", "hourly", "daily", "weekly", "monthly", "chronological",
      "temporal", "series", "sequence", "sequences");

  private DataNames() {}

  /**
   * The held-out role these names say: test when one of them is exactly a name the project's
   * configuration lists for test data ({@code test-data-names}), else what their words say, if
   * they say exactly one purpose.
   */
  static Optional<Role> heldOutRole(List<String> names, AnalysisSettings settings) {
    for (String name : names) {
      if (settings.marksTestData(name)) {
        return Optional.of(Role.TEST);
      }
    }
    return heldOutRole(names);
  }

  /** The held-out role the words of these names say, if they say exactly one. */
  static Optional<Role> heldOutRole(List<String> names) {
    int says = 0;
    for (String name : names) {
      says |= wordsSay(name);
    }
    boolean test = (says & TEST) != 0;
    if ((says & TRAIN) != 0 || test == ((says & VALIDATION) != 0)) {
      return Optional.empty();
    }
    return Optional.of(test ? Role.TEST : Role.VALIDATION);
  }

  static boolean saysTimeOrdered(List<String> names) {
    for (String name : names) {
      if ((wordsSay(name) & TIME) != 0) {
        return true;
      }
    }
    return false;
  }

  private static final int TEST = 1;
  private static final int VALIDATION = 2;
  private static final int TRAIN = 4;
  private static final int TIME = 8;
  /**
   * What each name's words say, as the bits above. The analyses ask about the same names on
   * every pass over a method, and splitting a name into words each time was a visible part of
   * their cost. A pure function of the name, so shared by every scan in the JVM; bounded, so
   * that scanning many projects in one JVM cannot grow it without end.
   */
  private static final Map<String, Integer> SAID = new ConcurrentHashMap<>();
  private static final int SAID_LIMIT = 100_000;

  private static int wordsSay(String name) {
    Integer known = SAID.get(name);
    if (known != null) {
      return known;
    }
    int says = 0;
    for (String w : words(name)) {
      says |= (TEST_WORDS.contains(w) ? TEST : 0) | (VALIDATION_WORDS.contains(w) ? VALIDATION : 0)
          | (TRAIN_WORDS.contains(w) ? TRAIN : 0) | (TIME_WORDS.contains(w) ? TIME : 0);
    }
    if (SAID.size() < SAID_LIMIT) {
      SAID.put(name, says);
    }
    return says;
  }

  /**
   * The names and string literals that describe where a loaded value comes from: the string
   * literals, variable names and method names inside the creating expression, not entering
   * lambdas.
   */
  static List<String> namesIn(Node creation) {
    List<String> out = new ArrayList<>();
    collect(creation, out);
    return out;
  }

  private static void collect(Node n, List<String> out) {
    if (n instanceof LambdaExpr) {
      return;
    }
    if (n instanceof StringLiteralExpr s) {
      out.add(s.getValue());
    } else if (n instanceof NameExpr name) {
      out.add(name.getNameAsString());
    } else if (n instanceof MethodCallExpr call) {
      out.add(call.getNameAsString());
    } else if (n instanceof ObjectCreationExpr) {
      // the type name says what kind of reader it is, not which rows it reads
    }
    for (Node child : n.getChildNodes()) {
      if (!(n instanceof ObjectCreationExpr oce && child == oce.getType())) {
        collect(child, out);
      }
    }
  }

  static List<String> words(String name) {
    List<String> out = new ArrayList<>();
    StringBuilder current = new StringBuilder();
    char previous = 0;
    for (int i = 0; i < name.length(); i++) {
      char c = name.charAt(i);
      if (!Character.isLetter(c)) {
        flush(current, out);
      } else {
        if (Character.isUpperCase(c) && Character.isLowerCase(previous)) {
          flush(current, out);
        }
        current.append(c);
      }
      previous = c;
    }
    flush(current, out);
    return out;
  }

  private static void flush(StringBuilder current, List<String> out) {
    if (current.length() > 0) {
      out.add(current.toString().toLowerCase(Locale.ROOT));
      current.setLength(0);
    }
  }
}
