package dev.plumbline.rules.leak;

import com.github.javaparser.ast.Node;
import dev.plumbline.analysis.provenance.ProvenanceAnalysis;
import dev.plumbline.analysis.provenance.ProvenanceFacts;
import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.FindingReporter;
import dev.plumbline.engine.Rule;
import dev.plumbline.engine.RuleDescriptor;
import dev.plumbline.flow.ControlFlowGraph;
import dev.plumbline.finding.Severity;
import dev.plumbline.rules.Snippets;
import java.util.List;

/**
 * A normalizer that learns statistics, or a model, fitted on test (or held-out) rows: the test
 * rows then shape what is learned and the test score no longer measures unseen data. Certain
 * (error) when every path gives test rows from a split or a declared usage; a warning when only
 * some paths do, when the rows are held out for an unsaid purpose, or when only names say test.
 * Fixed-range scalers, which learn nothing, are not reported.
 */
public final class FitOnTestRule implements Rule {
  public static final String ID = "leak.fit-on-test";
  static final RuleDescriptor DESCRIPTOR =
      new RuleDescriptor(ID, Severity.ERROR, List.of("leakage", "correctness", "evaluation"));

  @Override
  public RuleDescriptor descriptor() {
    return DESCRIPTOR;
  }

  @Override
  public void check(FileContext file, FindingReporter reporter) {
    ProvenanceFacts facts = file.analysis(ProvenanceAnalysis.KEY);
    for (ProvenanceFacts.Fit fit : facts.fits()) {
      if (fit.learns() && !splitAfterwards(facts, fit.graph(), fit.data())) {
        report(file, reporter, fit.call(), fit.preprocessorName(), fit.argument(), fit.data(), "",
            ID + ".fix.normalizer");
      }
    }
    for (ProvenanceFacts.Train train : facts.trains()) {
      if (splitAfterwards(facts, train.graph(), train.data())) {
        continue;
      }
      report(file, reporter, train.call(), train.model(), train.argument(), train.data(), "train",
          ID + ".fix.model");
    }
  }

  private void report(FileContext file, FindingReporter reporter, Node call, String learner,
      Node argument, dev.plumbline.analysis.provenance.DataValue data, String what, String fixKey) {
    Evidence.Certainty certainty = Evidence.heldOutRows(data);
    if (certainty == Evidence.Certainty.NONE) {
      return;
    }
    String variant = switch (certainty) {
      case CERTAIN -> what;
      case POSSIBLE -> join(what, "possible");
      case NAMED -> join(what, "named");
      default -> join(what, "held-out");
    };
    Node origin = Evidence.origin(file, data, argument);
    reporter.at(this, call)
        .message(variant.isEmpty() ? ID : ID + "." + variant, learner, Snippets.of(argument),
            Snippets.of(origin), Snippets.line(origin))
        .related(origin, certainty == Evidence.Certainty.NAMED ? "related.named-test" : "related.becomes-test",
            Snippets.of(argument))
        .fix(fixKey, learner, Snippets.of(argument))
        .severity(certainty == Evidence.Certainty.CERTAIN ? Severity.ERROR : Severity.WARNING)
        .emit();
  }

  /**
   * Rows that only a name calls test and that the same method then splits into parts: the code
   * treats them as the whole set, so they are not test rows ({@link PreprocessingBeforeSplitRule}
   * reports a fit on them).
   */
  private static boolean splitAfterwards(ProvenanceFacts facts, ControlFlowGraph graph,
      dev.plumbline.analysis.provenance.DataValue data) {
    return Evidence.rolesOnlyNamed(data) && !facts.splitsOf(graph, data.lineages()).isEmpty();
  }

  private static String join(String what, String variant) {
    return what.isEmpty() ? variant : what + "-" + variant;
  }
}
