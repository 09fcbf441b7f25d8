package dev.plumbline.rules.leak;

import com.github.javaparser.ast.Node;
import dev.plumbline.analysis.provenance.DataValue;
import dev.plumbline.analysis.provenance.Lineage;
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
 * A preprocessor or statistic learned from rows that the same code later splits into training
 * and held-out parts: the held-out rows shaped what the model sees, so held-out scores are
 * optimistic. Certain (error) when every path gives whole rows; possible (warning) when some
 * path gives whole rows and another a part. Rows that only a name calls train or test, and that
 * the code then splits, count as whole.
 */
public final class PreprocessingBeforeSplitRule implements Rule {
  public static final String ID = "leak.preprocessing-before-split";
  static final RuleDescriptor DESCRIPTOR =
      new RuleDescriptor(ID, Severity.ERROR, List.of("leakage", "correctness", "preprocessing"));

  @Override
  public RuleDescriptor descriptor() {
    return DESCRIPTOR;
  }

  @Override
  public void check(FileContext file, FindingReporter reporter) {
    ProvenanceFacts facts = file.analysis(ProvenanceAnalysis.KEY);
    for (ProvenanceFacts.Fit fit : facts.fits()) {
      boolean namedOnly = Evidence.rolesOnlyNamed(fit.data());
      if (!fit.learns() || fit.data().kind() != DataValue.Kind.DATA
          || !fit.data().holds(Role.WHOLE) && !namedOnly) {
        continue;
      }
      List<ProvenanceFacts.Split> splits = facts.splitsOf(fit.graph(), fit.data().lineages());
      if (splits.isEmpty()) {
        continue;
      }
      ProvenanceFacts.Split split = splits.get(0);
      // Rows whose only role comes from a name ("test.csv") and that this code then splits are
      // the whole set, whatever the name says: the split is stronger evidence than the name.
      boolean certain = fit.data().onlyWhole() || namedOnly;
      reporter.at(this, fit.call())
          .message(certain ? ID : ID + ".possible", fit.preprocessorName(),
              Snippets.of(fit.argument()), Snippets.of(split.splitData()), Snippets.line(split.call()))
          .related(split.call(), "related.split-here", Snippets.of(split.splitData()))
          .related(entry(file, fit.data(), split), "related.data-enters", Snippets.of(fit.argument()))
          .fix(ID + ".fix.fit-on-train", fit.preprocessorName())
          .involves("involved.data-role", Snippets.of(fit.argument()), Snippets.roles(fit.data().roles()))
          .severity(certain ? Severity.ERROR : Severity.WARNING)
          .edit(FitOnTrainingPart.plan(file, facts, fit, splits).orElse(null))
          .emit();
    }
    for (ProvenanceFacts.StatisticUse use : facts.statisticUses()) {
      DataValue over = use.data();
      if (!over.holds(Role.WHOLE)) {
        continue;
      }
      List<ProvenanceFacts.Split> splits = facts.splitsOf(use.graph(), over.lineages());
      if (splits.isEmpty()) {
        continue;
      }
      ProvenanceFacts.Split split = splits.get(0);
      boolean certain = over.roles().equals(java.util.EnumSet.of(Role.WHOLE));
      reporter.at(this, use.call())
          .message(certain ? ID + ".statistic" : ID + ".statistic-possible",
              use.call().getNameAsString(), Snippets.of(use.over()), Snippets.of(split.splitData()),
              Snippets.line(split.call()))
          .related(split.call(), "related.split-here", Snippets.of(split.splitData()))
          .related(use.use(), "related.statistic-used", use.call().getNameAsString())
          .fix(ID + ".fix.statistic-on-train", use.call().getNameAsString())
          .involves("involved.data-role", Snippets.of(use.over()), Snippets.roles(over.roles()))
          .severity(certain ? Severity.ERROR : Severity.WARNING)
          .emit();
    }
  }

  /**
   * Where the split lineage entered the method, when it is a different place from the split and
   * in this file (a helper in another file may return rows of its own class's field).
   */
  private static Node entry(FileContext file, DataValue data, ProvenanceFacts.Split split) {
    return data.lineages().stream()
        .filter(l -> split.data().lineages().contains(l))
        .filter(l -> Evidence.inFile(file, l.site()))
        .sorted(Lineage.BY_POSITION)
        .map(Lineage::site)
        .findFirst()
        .orElse(null);
  }
}
