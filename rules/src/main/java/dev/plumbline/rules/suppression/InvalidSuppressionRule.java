package dev.plumbline.rules.suppression;

import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.FindingReporter;
import dev.plumbline.engine.Rule;
import dev.plumbline.engine.RuleDescriptor;
import dev.plumbline.finding.Severity;
import dev.plumbline.gate.SuppressionSites;
import java.util.List;
import java.util.Set;

/**
 * A suppression that suppresses nothing: it names a rule that does not exist (a typo, or a rule
 * that was renamed), names no rule, or is a suppression comment without a reason. The finding it
 * was meant to cover still shows; this says why.
 */
public final class InvalidSuppressionRule implements Rule {
  public static final String ID = "suppression.invalid";
  static final RuleDescriptor DESCRIPTOR =
      new RuleDescriptor(ID, Severity.WARNING, List.of("maintainability", "configuration"));

  private final Set<String> knownRules;

  /** @param knownRules every rule id a suppression may name, this rule's included */
  public InvalidSuppressionRule(Set<String> knownRules) {
    this.knownRules = Set.copyOf(knownRules);
  }

  @Override
  public RuleDescriptor descriptor() {
    return DESCRIPTOR;
  }

  @Override
  public void check(FileContext file, FindingReporter reporter) {
    SuppressionSites sites = file.analysis(SuppressionSites.KEY);
    for (SuppressionSites.Site site : sites.sites()) {
      if (!knownRules.contains(site.ruleId())) {
        reporter.at(this, site.node())
            .message(ID, site.ruleId())
            .fix(ID + ".fix.unknown-rule")
            .emit();
      }
    }
    for (SuppressionSites.Problem problem : sites.problems()) {
      String variant = switch (problem.kind()) {
        case MISSING_REASON -> "missing-reason";
        case MISSING_RULE_ID -> "missing-rule-id";
        case BAD_RULE_ID -> "bad-rule-id";
        case UNKNOWN_DIRECTIVE -> "unknown-directive";
      };
      reporter.at(this, problem.node())
          .message(ID + "." + variant, problem.text())
          .fix(ID + ".fix.syntax")
          .emit();
    }
  }
}
