package dev.plumbline.gate;

import dev.plumbline.engine.RuleDescriptor;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.finding.Finding;
import dev.plumbline.finding.Severity;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.function.Function;
import java.util.stream.Collectors;

/**
 * The post-scan stage that applies configured severities. A configured severity replaces the
 * rule's default; a finding the rule reported below its default (a "possible" variant, where the
 * analysis is less sure) stays the same number of steps below the configured one, never below
 * note, so configuration cannot make an unsure finding sound certain.
 */
public final class SeverityOverrides {
  private SeverityOverrides() {}

  public static ScanResult apply(ScanResult result, GateConfig config) {
    if (config.rules().isEmpty()) {
      return result;
    }
    Map<String, RuleDescriptor> rules = result.rules().stream()
        .collect(Collectors.toMap(RuleDescriptor::id, Function.identity()));
    List<Finding> out = result.findings().stream().map(f -> {
      Optional<Severity> configured = config.severity(f.ruleId());
      RuleDescriptor rule = rules.get(f.ruleId());
      if (configured.isEmpty() || rule == null) {
        return f;
      }
      return f.withSeverity(shifted(configured.get(), rule.defaultSeverity(), f.severity()));
    }).toList();
    return result.withFindings(out);
  }

  static Severity shifted(Severity configured, Severity ruleDefault, Severity reported) {
    int below = Math.max(0, ruleDefault.ordinal() - reported.ordinal());
    return Severity.values()[Math.max(0, configured.ordinal() - below)];
  }
}
