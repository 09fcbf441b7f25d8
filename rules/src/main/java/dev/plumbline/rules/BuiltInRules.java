package dev.plumbline.rules;

import dev.plumbline.engine.MessageCatalog;
import dev.plumbline.engine.ProjectAnalysis;
import dev.plumbline.engine.Rule;
import dev.plumbline.analysis.scope.ScopeSummaryAnalysis;
import dev.plumbline.rules.leak.PreprocessingBeforeSplitRule;
import dev.plumbline.rules.memory.GraphAccumulationRule;
import dev.plumbline.rules.memory.ScopeEscapeRule;
import dev.plumbline.rules.tensor.DiscardedResultRule;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.ResourceBundle;

/** The rules that ship with plumbline, their wording, and the project analyses they need. */
public final class BuiltInRules {
  /** Bundle with every rule's texts and finding messages. */
  public static final String BUNDLE = "dev.plumbline.rules.messages";

  private BuiltInRules() {}

  /** All built-in rules, sorted by id. New instances each call; rules are stateless. */
  public static List<Rule> all() {
    return List.<Rule>of(
            new PreprocessingBeforeSplitRule(),
            // memory and tensor-result rules (scope analysis)
            new GraphAccumulationRule(),
            new ScopeEscapeRule(),
            new DiscardedResultRule())
        .stream()
        .sorted(Comparator.comparing(r -> r.descriptor().id()))
        .toList();
  }

  public static Optional<Rule> byId(String id) {
    return all().stream().filter(r -> r.descriptor().id().equals(id)).findFirst();
  }

  /** Project-wide analyses (method summaries) that the rules' analyses consult. */
  public static List<ProjectAnalysis> projectAnalyses() {
    return List.of(
        // helper summaries for the scope analysis
        new ScopeSummaryAnalysis());
  }

  public static MessageCatalog messages() {
    return MessageCatalog.withCore(List.of(ResourceBundle.getBundle(BUNDLE, Locale.ROOT)));
  }
}
