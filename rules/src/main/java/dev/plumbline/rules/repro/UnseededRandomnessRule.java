package dev.plumbline.rules.repro;

import dev.plumbline.analysis.randomness.RandomnessAnalysis;
import dev.plumbline.analysis.randomness.RandomnessFacts;
import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.FindingReporter;
import dev.plumbline.engine.Rule;
import dev.plumbline.engine.RuleDescriptor;
import dev.plumbline.finding.Severity;
import dev.plumbline.rules.Snippets;
import java.util.List;

/**
 * Reported numbers that depend on a random generator nobody seeds: data shuffled from the
 * clock, splits or shuffles driven by {@code new Random()}, network configurations without a
 * seed, DJL splits and shuffled sampling with the engine generator unseeded. The numbers differ
 * on every run, so a change cannot be told from noise. A warning: the numbers are not wrong,
 * only not repeatable.
 */
public final class UnseededRandomnessRule implements Rule {
  public static final String ID = "repro.unseeded-randomness";
  static final RuleDescriptor DESCRIPTOR =
      new RuleDescriptor(ID, Severity.WARNING, List.of("reproducibility"));

  @Override
  public RuleDescriptor descriptor() {
    return DESCRIPTOR;
  }

  @Override
  public void check(FileContext file, FindingReporter reporter) {
    for (RandomnessFacts.Draw draw : file.analysis(RandomnessAnalysis.KEY).draws()) {
      String variant = switch (draw.kind()) {
        case CLOCK_SHUFFLE -> ID + ".clock-shuffle";
        case UNSEEDED_GENERATOR -> ID;
        case CONFIGURATION_WITHOUT_SEED -> ID + ".configuration";
        case UNSEEDED_FRAMEWORK_GENERATOR -> ID + ".framework";
      };
      FindingReporter.Report.Builder b = reporter.at(this, draw.at())
          .message(variant, draw.subject().length() > 48 ? Snippets.of(draw.at()) : draw.subject(),
              Snippets.of(draw.source()), Snippets.line(draw.source()))
          .fix(variant + ".fix", draw.subject());
      if (draw.source() != draw.at()) {
        b.related(draw.source(), "related.unseeded-generator", Snippets.of(draw.source()));
      }
      b.emit();
    }
  }
}
