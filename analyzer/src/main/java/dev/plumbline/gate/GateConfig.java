package dev.plumbline.gate;

import dev.plumbline.engine.AnalysisSettings;
import dev.plumbline.engine.Rule;
import dev.plumbline.finding.Severity;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeMap;

/**
 * A validated configuration file; see {@code docs/configuration.md}. Immutable. Settings the
 * command line also has (fail level, globs) are combined with it by {@link QualityGate}.
 *
 * @param failOn fail level, when the file sets one
 * @param include globs a file's report name must match (empty: all)
 * @param exclude globs that remove files
 * @param rules per-rule settings by rule id; rules not named keep their defaults
 * @param testDataNames extra identifiers that mark test data, passed to the analyses
 */
public record GateConfig(Optional<FailLevel> failOn, List<String> include, List<String> exclude,
    Map<String, RuleSetting> rules, Set<String> testDataNames) {

  /** No file: every rule on at its default severity. */
  public static final GateConfig EMPTY =
      new GateConfig(Optional.empty(), List.of(), List.of(), Map.of(), Set.of());

  /**
   * One rule's settings.
   *
   * @param enabled whether the rule runs at all
   * @param severity replaces the rule's default severity, when set
   */
  public record RuleSetting(boolean enabled, Optional<Severity> severity) {}

  public GateConfig {
    include = List.copyOf(include);
    exclude = List.copyOf(exclude);
    rules = java.util.Collections.unmodifiableMap(new TreeMap<>(rules));
    testDataNames = Set.copyOf(testDataNames);
  }

  public boolean enabled(String ruleId) {
    RuleSetting s = rules.get(ruleId);
    return s == null || s.enabled();
  }

  public Optional<Severity> severity(String ruleId) {
    RuleSetting s = rules.get(ruleId);
    return s == null ? Optional.empty() : s.severity();
  }

  /** The rules to run: {@code all} minus the disabled ones, in the given order. */
  public List<Rule> enabledRules(List<Rule> all) {
    return all.stream().filter(r -> enabled(r.descriptor().id())).toList();
  }

  public AnalysisSettings analysisSettings() {
    return new AnalysisSettings(testDataNames);
  }
}
