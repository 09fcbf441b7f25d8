package dev.plumbline.corpus;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.FindingReporter;
import dev.plumbline.engine.Rule;
import dev.plumbline.engine.RuleDescriptor;
import dev.plumbline.engine.ScanRequest;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.engine.Scanner;
import dev.plumbline.finding.Finding;
import dev.plumbline.finding.Notification;
import dev.plumbline.finding.Severity;
import dev.plumbline.model.ApiModel;
import dev.plumbline.rules.BuiltInRules;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * A rule that throws on one file costs only that rule's findings on that file: the failure is a
 * notification naming rule and file, the scan is marked incomplete (exit code 3 on the command
 * line), and every other finding of the corpus is still reported.
 */
class FailureIsolationTest {
  static final String VICTIM = "src/main/java/corpus/leak/preprocessing/NormalizerBeforeSplit.java";

  /** Throws on one file, in the way a real rule bug would: deep inside its query. */
  static final class PlantedFailure implements Rule {
    private final Class<? extends Throwable> kind;

    PlantedFailure(Class<? extends Throwable> kind) {
      this.kind = kind;
    }

    @Override
    public RuleDescriptor descriptor() {
      return new RuleDescriptor("test.planted-failure", Severity.ERROR, List.of());
    }

    @Override
    public void check(FileContext file, FindingReporter reporter) {
      if (!file.uri().equals(VICTIM)) {
        return;
      }
      if (kind == StackOverflowError.class) {
        recurse(0);
      }
      throw new IllegalStateException("planted failure");
    }

    private static int recurse(int n) {
      return recurse(n + 1) + 1;
    }
  }

  private static ScanResult scan(List<Rule> rules) {
    return new Scanner(ApiModel.loadDefault(), rules, BuiltInRules.projectAnalyses(), Scanner.ScanListener.NONE)
        .scan(new ScanRequest(List.of(CorpusScan.SOURCES), CorpusScan.MODULE, List.of(), List.of(), 2));
  }

  private static List<Rule> withPlanted(Class<? extends Throwable> kind) {
    List<Rule> rules = new ArrayList<>(BuiltInRules.all());
    rules.add(new PlantedFailure(kind));
    return rules;
  }

  @Test
  void throwingRuleBecomesNotificationAndTheRestIsComplete() {
    ScanResult clean = scan(BuiltInRules.all());
    ScanResult broken = scan(withPlanted(IllegalStateException.class));
    assertEquals(clean.findings(), broken.findings(), "every real finding is still reported");
    assertTrue(broken.incomplete());
    assertEquals(1, broken.notifications().size(), () -> broken.notifications().toString());
    Notification n = broken.notifications().get(0);
    assertEquals("notification.rule-failed", n.message().key());
    assertEquals(List.of("test.planted-failure", VICTIM, "IllegalStateException: planted failure"),
        n.message().arguments());
    assertEquals(VICTIM, n.location().orElseThrow().uri());
  }

  @Test
  void stackOverflowInsideARuleIsContainedToo() {
    ScanResult broken = scan(withPlanted(StackOverflowError.class));
    assertTrue(broken.incomplete());
    assertEquals(List.of("test.planted-failure", VICTIM, "StackOverflowError"),
        broken.notifications().get(0).message().arguments());
    List<Finding> victimFindings = broken.findings().stream()
        .filter(f -> f.location().uri().equals(VICTIM)).toList();
    assertTrue(!victimFindings.isEmpty(), "the other rules' findings on the same file stay");
  }
}
