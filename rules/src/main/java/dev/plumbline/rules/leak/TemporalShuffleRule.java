package dev.plumbline.rules.leak;

import com.github.javaparser.ast.Node;
import dev.plumbline.analysis.provenance.DataValue;
import dev.plumbline.analysis.provenance.ProvenanceAnalysis;
import dev.plumbline.analysis.provenance.ProvenanceFacts;
import dev.plumbline.analysis.provenance.Role;
import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.FindingReporter;
import dev.plumbline.engine.Rule;
import dev.plumbline.engine.RuleDescriptor;
import dev.plumbline.finding.Severity;
import dev.plumbline.rules.Snippets;
import java.util.List;

/**
 * Time-ordered rows (read by a sequence record reader, or from sources whose names say time or
 * date) shuffled before they are split, or split at random: rows from later times land in
 * training while earlier ones are tested, so the test score measures interpolation, not
 * forecasting. A warning: whether the order matters depends on the task, which the code does
 * not say.
 */
public final class TemporalShuffleRule implements Rule {
  public static final String ID = "leak.temporal-shuffle";
  static final RuleDescriptor DESCRIPTOR =
      new RuleDescriptor(ID, Severity.WARNING, List.of("leakage", "correctness", "time-series"));

  @Override
  public RuleDescriptor descriptor() {
    return DESCRIPTOR;
  }

  @Override
  public void check(FileContext file, FindingReporter reporter) {
    ProvenanceFacts facts = file.analysis(ProvenanceAnalysis.KEY);
    for (ProvenanceFacts.Shuffle shuffle : facts.shuffles()) {
      DataValue data = shuffle.data();
      if (!data.isTimeOrdered() || !data.holds(Role.WHOLE)) {
        continue; // shuffling a part after the split (the training rows) keeps the test rows last
      }
      ProvenanceFacts.Split split = null;
      for (ProvenanceFacts.Split s : facts.splitsOf(shuffle.graph(), data.lineages())) {
        if (s.graph() != shuffle.graph() || DataValue.BY_POSITION.compare(s.call(), shuffle.call()) > 0) {
          split = s;
          break;
        }
      }
      if (split == null) {
        continue;
      }
      Node evidence = Evidence.origin(file, timeOrigin(data), shuffle.target());
      reporter.at(this, shuffle.call())
          .message(ID, Snippets.of(shuffle.target()), Snippets.of(evidence), Snippets.line(evidence),
              Snippets.line(split.call()))
          .related(evidence, "related.time-ordered", Snippets.of(shuffle.target()))
          .related(split.call(), "related.split-here", Snippets.of(split.splitData()))
          .emit();
    }
    for (ProvenanceFacts.Split split : facts.splits()) {
      if (!split.random() || !split.data().isTimeOrdered()) {
        continue;
      }
      Node evidence = Evidence.origin(file, timeOrigin(split.data()), split.splitData());
      reporter.at(this, split.call())
          .message(ID + ".random-split", Snippets.of(split.splitData()), Snippets.of(evidence),
              Snippets.line(evidence))
          .related(evidence, "related.time-ordered", Snippets.of(split.splitData()))
          .fix(ID + ".fix.random-split", Snippets.of(split.splitData()))
          .emit();
    }
  }

  /** A view of the value whose origins are its time-order evidence. */
  private static DataValue timeOrigin(DataValue data) {
    return new DataValue(data.kind(), data.roles(), data.guessed(), data.lineages(), data.sites(),
        data.parts(), data.timeOrdered(), data.timeOrdered());
  }
}
