package dev.plumbline.rules;

import dev.plumbline.analysis.loops.ConfigurationReach;
import dev.plumbline.analysis.provenance.ProvenanceSummarizer;
import dev.plumbline.analysis.randomness.ProjectSeeding;
import dev.plumbline.analysis.scope.ScopeSummaryAnalysis;
import dev.plumbline.engine.MessageCatalog;
import dev.plumbline.engine.ProjectAnalysis;
import dev.plumbline.engine.Rule;
import dev.plumbline.rules.check.AssertValidationRule;
import dev.plumbline.rules.leak.FitOnTestRule;
import dev.plumbline.rules.leak.PreprocessingBeforeSplitRule;
import dev.plumbline.rules.leak.TemporalShuffleRule;
import dev.plumbline.rules.leak.TestInTuningRule;
import dev.plumbline.rules.memory.GraphAccumulationRule;
import dev.plumbline.rules.memory.ScopeEscapeRule;
import dev.plumbline.rules.repro.UnseededRandomnessRule;
import dev.plumbline.rules.shape.ImplicitBroadcastRule;
import dev.plumbline.rules.shape.ReducedDimBroadcastRule;
import dev.plumbline.rules.shape.ShapeMismatchRule;
import dev.plumbline.rules.shape.UncheckedReshapeRule;
import dev.plumbline.rules.suppression.InvalidSuppressionRule;
import dev.plumbline.rules.tensor.DiscardedResultRule;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.ResourceBundle;
import java.util.Set;
import java.util.TreeSet;

/** The rules that ship with plumbline, their wording, and the project analyses they need. */
public final class BuiltInRules {
  /** Bundle with every rule's texts and finding messages. */
  public static final String BUNDLE = "dev.plumbline.rules.messages";

  private BuiltInRules() {}

  /** All built-in rules, sorted by id. New instances each call; rules are stateless. */
  public static List<Rule> all() {
    List<Rule> rules = new ArrayList<>(List.<Rule>of(
        new PreprocessingBeforeSplitRule(),
        // ---- provenance and loop roles (issue 3)
        new FitOnTestRule(),
        new TestInTuningRule(),
        new TemporalShuffleRule(),
        new UnseededRandomnessRule(),
        // ---- memory and tensor-result rules (scope analysis, issue 5)
        new GraphAccumulationRule(),
        new ScopeEscapeRule(),
        new DiscardedResultRule(),
        // ---- shape rules (issue 4)
        new ShapeMismatchRule(),
        new ImplicitBroadcastRule(),
        new ReducedDimBroadcastRule(),
        new UncheckedReshapeRule(),
        new AssertValidationRule()));
    // ---- the suppression check knows every rule id, its own included
    Set<String> ids = new TreeSet<>();
    rules.forEach(r -> ids.add(r.descriptor().id()));
    ids.add(InvalidSuppressionRule.ID);
    rules.add(new InvalidSuppressionRule(ids));
    return rules.stream()
        .sorted(Comparator.comparing(r -> r.descriptor().id()))
        .toList();
  }

  public static Optional<Rule> byId(String id) {
    return all().stream().filter(r -> r.descriptor().id().equals(id)).findFirst();
  }

  /** Project-wide analyses (method summaries) that the rules' analyses consult. */
  public static List<ProjectAnalysis> projectAnalyses() {
    return List.of(
        // ---- provenance (issue 3)
        new ProvenanceSummarizer(),
        new ConfigurationReach(),
        new ProjectSeeding(),
        // ---- helper summaries for the scope analysis (issue 5)
        new ScopeSummaryAnalysis());
  }

  public static MessageCatalog messages() {
    return MessageCatalog.withCore(List.of(ResourceBundle.getBundle(BUNDLE, Locale.ROOT)));
  }
}
