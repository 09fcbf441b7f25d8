package dev.plumbline.rules.leak;

import com.github.javaparser.ast.Node;
import dev.plumbline.analysis.loops.LoopRoleAnalysis;
import dev.plumbline.analysis.loops.LoopRoleFacts;
import dev.plumbline.analysis.provenance.ProvenanceFacts;
import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.FindingReporter;
import dev.plumbline.engine.Rule;
import dev.plumbline.engine.RuleDescriptor;
import dev.plumbline.finding.Severity;
import dev.plumbline.rules.Snippets;
import java.util.List;

/**
 * Test rows used to choose something: the best model or epoch, when to stop, or a
 * hyperparameter. The chosen thing is then fitted to the test set and the test score is
 * optimistic. Validation rows used the same way are correct practice and are not reported, nor
 * is a test set evaluated once (or only printed) outside any choice. Certain choices on certain
 * test rows are errors; comparisons left to a reader inside a hyperparameter loop, rows that may
 * not be test rows, and rows named test only by a name are warnings.
 */
public final class TestInTuningRule implements Rule {
  public static final String ID = "leak.test-in-tuning";
  static final RuleDescriptor DESCRIPTOR =
      new RuleDescriptor(ID, Severity.ERROR, List.of("leakage", "correctness", "model-selection"));

  @Override
  public RuleDescriptor descriptor() {
    return DESCRIPTOR;
  }

  @Override
  public void check(FileContext file, FindingReporter reporter) {
    LoopRoleFacts facts = file.analysis(LoopRoleAnalysis.KEY);
    for (LoopRoleFacts.SteeringUse use : facts.steeringUses()) {
      ProvenanceFacts.Evaluation e = use.evaluation();
      Evidence.Certainty certainty = Evidence.testRows(e.data());
      if (certainty == Evidence.Certainty.NONE || certainty == Evidence.Certainty.HELD_OUT) {
        continue;
      }
      Node origin = Evidence.origin(file, e.data(), e.argument());
      // The calculator is itself what the score decides: name the decision, not the call twice.
      String configurationSuffix = use.steering() == LoopRoleFacts.Steering.EARLY_STOPPING_CONFIGURATION
          ? ".early-stopping-configuration" : "";
      String variant = switch (certainty) {
        case POSSIBLE -> "possible" + configurationSuffix;
        case NAMED -> "named" + configurationSuffix;
        default -> switch (use.steering()) {
          case MODEL_SELECTION -> "selection";
          case EARLY_STOP -> "early-stop";
          case EARLY_STOPPING_CONFIGURATION -> "early-stopping-configuration";
          case HYPERPARAMETER_COMPARISON -> "hyperparameter";
        };
      };
      Node decided = use.kept() != null ? use.kept() : use.decision();
      String loopVariable = use.loop() != null ? use.loop().variable() : "";
      boolean firm = certainty == Evidence.Certainty.CERTAIN
          && use.steering() != LoopRoleFacts.Steering.HYPERPARAMETER_COMPARISON;
      reporter.at(this, e.call())
          .message(variant.equals("selection") ? ID : ID + "." + variant, Snippets.of(e.call()),
              Snippets.of(e.argument()), Snippets.of(origin), Snippets.line(origin),
              Snippets.of(decided), Snippets.line(decided), loopVariable)
          .related(use.decision() == e.call() ? null : use.decision(),
              use.steering() == LoopRoleFacts.Steering.HYPERPARAMETER_COMPARISON
                  ? "related.hyperparameter-configures" : "related.test-decides",
              use.steering() == LoopRoleFacts.Steering.HYPERPARAMETER_COMPARISON
                  ? loopVariable : Snippets.of(e.argument()))
          .related(origin, certainty == Evidence.Certainty.NAMED ? "related.named-test" : "related.becomes-test",
              Snippets.of(e.argument()))
          .fix(use.steering() == LoopRoleFacts.Steering.EARLY_STOPPING_CONFIGURATION
              ? ID + ".fix.early-stopping" : ID + ".fix.validation", Snippets.of(e.argument()))
          .severity(firm ? Severity.ERROR : Severity.WARNING)
          .emit();
    }
  }
}
