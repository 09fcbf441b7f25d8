package dev.plumbline.report.audit;

import dev.plumbline.analysis.entrypoints.Evaluation;
import dev.plumbline.analysis.entrypoints.TrainingEntryPoint;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.finding.Finding;
import dev.plumbline.finding.Location;
import dev.plumbline.finding.RelatedLocation;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;

/**
 * Which reported numbers are at risk: links each evaluation of each training entry point to the
 * findings that threaten it.
 *
 * <p>A finding threatens numbers when its rule id starts with {@code leak.} (test rows shaped
 * training or selection) or {@code repro.} (numbers that change from run to run); other rules
 * (shapes, memory) make a run fail or waste resources but do not bias what it reports. Such a
 * finding is linked to every evaluation of an entry point whose run it lies in (inside the entry
 * point or a project method it reaches): {@link Reason#SHARES_DATA} when the finding's own or
 * related locations are where the evaluated data entered or was split, else
 * {@link Reason#SAME_RUN}. Suppressed findings are not linked.
 *
 * <p>Errs towards linking: a run that trains two models on separate data links a leak in one to
 * the evaluations of both (reason {@code SAME_RUN}). An evaluation with no link has no known
 * risk, which is not a proof that its number is right.
 */
public final class AuditVerdicts {
  private AuditVerdicts() {}

  public enum Reason { SHARES_DATA, SAME_RUN }

  /** A finding that threatens an evaluation, and why they are linked. */
  public record Link(Finding finding, Reason reason) {}

  /** One evaluation with the findings that threaten it and the precision of its test set. */
  public record EvaluationVerdict(Evaluation evaluation, List<Link> risks,
      Optional<TestSetPrecision> precision) {
    public EvaluationVerdict {
      risks = List.copyOf(risks);
    }

    public boolean atRisk() {
      return !risks.isEmpty();
    }
  }

  /** An entry point and the verdict on each of its evaluations. */
  public record EntryVerdict(TrainingEntryPoint entryPoint, List<EvaluationVerdict> evaluations) {
    public EntryVerdict {
      evaluations = List.copyOf(evaluations);
    }

    public long atRiskCount() {
      return evaluations.stream().filter(EvaluationVerdict::atRisk).count();
    }
  }

  /** Whether findings of this rule put reported numbers at risk. */
  public static boolean threatensNumbers(String ruleId) {
    return ruleId.startsWith("leak.") || ruleId.startsWith("repro.");
  }

  public static List<EntryVerdict> of(ScanResult result) {
    List<EntryVerdict> out = new ArrayList<>();
    for (TrainingEntryPoint entry : result.entryPoints()) {
      List<Finding> inRun = new ArrayList<>();
      for (Finding f : result.findings()) {
        if (!f.isSuppressed() && threatensNumbers(f.ruleId()) && entry.covers(f.location())) {
          inRun.add(f);
        }
      }
      List<EvaluationVerdict> verdicts = new ArrayList<>();
      for (Evaluation e : entry.evaluations()) {
        Set<Location> sources = new HashSet<>(e.dataSources());
        List<Link> links = new ArrayList<>();
        for (Finding f : inRun) {
          links.add(new Link(f, touches(f, sources) ? Reason.SHARES_DATA : Reason.SAME_RUN));
        }
        Optional<TestSetPrecision> precision = e.rows().isPresent() && e.measuresAccuracy()
            ? Optional.of(TestSetPrecision.of(e.rows().getAsLong())) : Optional.empty();
        verdicts.add(new EvaluationVerdict(e, links, precision));
      }
      out.add(new EntryVerdict(entry, verdicts));
    }
    return out;
  }

  private static boolean touches(Finding f, Set<Location> sources) {
    if (sources.contains(f.location())) {
      return true;
    }
    for (RelatedLocation r : f.related()) {
      if (sources.contains(r.location())) {
        return true;
      }
    }
    return false;
  }
}
