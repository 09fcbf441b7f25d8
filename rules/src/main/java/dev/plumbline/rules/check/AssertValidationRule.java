package dev.plumbline.rules.check;

import dev.plumbline.analysis.shape.ShapeAnalysis;
import dev.plumbline.analysis.shape.ShapeFacts;
import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.FindingReporter;
import dev.plumbline.engine.Rule;
import dev.plumbline.engine.RuleDescriptor;
import dev.plumbline.finding.Severity;
import dev.plumbline.rules.Snippets;
import java.util.List;
import java.util.Locale;

/**
 * A Java {@code assert} that validates a tensor's shape, the data, or an argument callers pass
 * in, in production code: asserts only run when the JVM starts with {@code -ea}, so the check
 * is off exactly where bad input arrives. Silent on internal invariants, in test code
 * ({@code src/test}), on parameters of private methods (Java's own guidance allows asserts for
 * those), and on asserts the analysis proves already hold (an explicit check came first).
 */
public final class AssertValidationRule implements Rule {
  public static final String ID = "check.assert-validation";
  static final RuleDescriptor DESCRIPTOR = new RuleDescriptor(ID, Severity.WARNING, List.of("robustness", "validation"));

  @Override
  public RuleDescriptor descriptor() {
    return DESCRIPTOR;
  }

  @Override
  public void check(FileContext file, FindingReporter reporter) {
    for (ShapeFacts.Assertion a : file.analysis(ShapeAnalysis.KEY).assertions()) {
      if (a.inTestCode() || a.alreadyHolds() || a.subject() == ShapeFacts.AssertSubject.OTHER) {
        continue;
      }
      String condition = a.statement().getCheck().toString();
      FindingReporter.Report.Builder b = reporter.at(this, a.statement());
      if (a.shape() != null) {
        b.involves("involved.shape", Snippets.of(a.about()), a.shape().toString());
      }
      b
          .message(ID + "." + a.subject().name().toLowerCase(Locale.ROOT), Snippets.of(a.about()),
              a.shape() == null ? "[...]" : a.shape().toString(), Snippets.of(a.statement().getCheck()))
          .fix(ID + ".fix", condition.length() > 80 ? "condition" : condition)
          .emit();
    }
  }
}
