package dev.plumbline.engine;

import java.util.Set;
import java.util.TreeSet;

/**
 * The part of the user's configuration that analyses may consult, read-only and the same for
 * every file of a scan. Reached through {@link FileContext#settings()}.
 *
 * @param testDataNames extra identifiers (variables, fields, methods, parameters) that the
 *     project uses for held-out test data, beyond what the API model and split calls show; a
 *     hint for the provenance analysis, never evidence on its own
 */
public record AnalysisSettings(Set<String> testDataNames) {
  public static final AnalysisSettings DEFAULTS = new AnalysisSettings(Set.of());

  public AnalysisSettings {
    testDataNames = java.util.Collections.unmodifiableSet(new TreeSet<>(testDataNames));
  }

  /** Whether {@code identifier} is one of the configured test-data names (exact, case-sensitive). */
  public boolean marksTestData(String identifier) {
    return testDataNames.contains(identifier);
  }
}
