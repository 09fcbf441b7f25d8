package dev.plumbline.rules.tensor;

import dev.plumbline.analysis.scope.ScopeAnalysis;
import dev.plumbline.analysis.scope.ScopeFacts;
import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.FindingReporter;
import dev.plumbline.engine.Rule;
import dev.plumbline.engine.RuleDescriptor;
import dev.plumbline.finding.Severity;
import dev.plumbline.rules.Snippets;
import java.util.List;

/**
 * A tensor operation that returns a new tensor and changes nothing else, called as a statement:
 * its result is its only product and is dropped, so the statement does nothing. Which methods
 * return a copy and which work in place comes from the API model. A dropped detaching copy
 * ({@code state.stopGradient();}, ND4J {@code out.detach();}) is an error: the code meant to cut
 * the receiver loose and did not, so it stays attached to its graph or workspace.
 */
public final class DiscardedResultRule implements Rule {
  public static final String ID = "tensor.discarded-result";
  static final RuleDescriptor DESCRIPTOR =
      new RuleDescriptor(ID, Severity.WARNING, List.of("correctness", "tensor"));

  @Override
  public RuleDescriptor descriptor() {
    return DESCRIPTOR;
  }

  @Override
  public void check(FileContext file, FindingReporter reporter) {
    ScopeFacts facts = file.analysis(ScopeAnalysis.KEY);
    for (ScopeFacts.DiscardedResult d : facts.discardedResults()) {
      String method = d.call().getNameAsString();
      String receiver = Snippets.of(d.receiver());
      String call = Snippets.of(d.call());
      switch (d.kind()) {
        case DETACH -> {
          boolean attached = d.receiverData() != null && d.receiverData().mayBeAttached();
          reporter.at(this, d.call())
              .message(ID + (attached ? ".detach-attached" : ".detach"), method, receiver)
              .fix(ID + ".fix.assign-back", receiver, call)
              .severity(Severity.ERROR)
              .emit();
        }
        case LEAVE_SCOPE -> reporter.at(this, d.call())
            .message(ID + ".leave-workspace", method, receiver)
            .fix(ID + ".fix.assign-back", receiver, call)
            .severity(Severity.ERROR)
            .emit();
        case TEMPORARY -> reporter.at(this, d.call())
            .message(ID + ".temporary", method, receiver)
            .fix(ID + ".fix.temporary", method)
            .emit();
        default -> {
          FindingReporter.Report.Builder b = reporter.at(this, d.call()).message(ID, method, receiver);
          if (d.inPlaceVariant() != null) {
            b.fix(ID + ".fix.in-place", receiver, call, inPlaceCall(d));
          } else {
            b.fix(ID + ".fix.assign", receiver, call);
          }
          b.emit();
        }
      }
    }
  }

  /** {@code x.addi(y)} for {@code x.add(y)}. */
  private static String inPlaceCall(ScopeFacts.DiscardedResult d) {
    StringBuilder sb = new StringBuilder(Snippets.of(d.receiver())).append('.').append(d.inPlaceVariant()).append('(');
    for (int i = 0; i < d.call().getArguments().size(); i++) {
      sb.append(i == 0 ? "" : ", ").append(Snippets.of(d.call().getArgument(i)));
    }
    return sb.append(')').toString();
  }
}
