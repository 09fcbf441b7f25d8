package dev.plumbline.rules.leak;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumbline.engine.ScanRequest;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.engine.Scanner;
import dev.plumbline.finding.Finding;
import dev.plumbline.fix.EditApplier;
import dev.plumbline.model.ApiModel;
import dev.plumbline.rules.BuiltInRules;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * When the fit moves to the training part, and every condition under which it must not. Each
 * source here still has the leak; only the presence and text of the fix is in question.
 */
class FitOnTrainingPartTest {
  @TempDir
  Path dir;

  private static final String HEADER = """
      import java.util.function.Consumer;
      import org.nd4j.linalg.dataset.DataSet;
      import org.nd4j.linalg.dataset.SplitTestAndTrain;
      import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
      import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;
      class Prep {
        NormalizerStandardize shared = new NormalizerStandardize();
      """;

  private Finding leak(String body) throws IOException {
    Files.writeString(dir.resolve("Prep.java"), HEADER + body + "}\n");
    ScanResult result = new Scanner(ApiModel.loadDefault(), BuiltInRules.all())
        .scan(ScanRequest.of(dir, List.of(dir)).withJobs(1));
    List<Finding> leaks = result.findings().stream()
        .filter(f -> f.ruleId().equals(PreprocessingBeforeSplitRule.ID)).toList();
    assertEquals(1, leaks.size(), () -> "findings: " + result.findings() + result.notifications());
    return leaks.get(0);
  }

  private String fixed(String body) throws IOException {
    Finding f = leak(body);
    assertTrue(f.fix().isPresent(), "a fix is offered");
    assertTrue(f.fix().get().safe());
    String text = Files.readString(dir.resolve("Prep.java"));
    return EditApplier.apply(text, List.of(f.fix().get())).text().substring(HEADER.length());
  }

  private void noFix(String body) throws IOException {
    assertTrue(leak(body).fix().isEmpty(), "no fix may be offered");
  }

  @Test
  void fitMovesBelowTheTrainingPart() throws IOException {
    assertEquals("""
          void prepare(DataSetIterator it) {
            DataSet all = it.next();
            NormalizerStandardize n = new NormalizerStandardize();
            SplitTestAndTrain split = all.splitTestAndTrain(0.8);
            DataSet train = split.getTrain();
            n.fit(train);
            n.transform(train);
          }
        }
        """, fixed("""
          void prepare(DataSetIterator it) {
            DataSet all = it.next();
            NormalizerStandardize n = new NormalizerStandardize();
            n.fit(all);
            SplitTestAndTrain split = all.splitTestAndTrain(0.8);
            DataSet train = split.getTrain();
            n.transform(train);
          }
        """));
  }

  @Test
  void fitAfterTheSplitTakesTheTrainingPartInPlace() throws IOException {
    assertEquals("""
          void prepare(DataSet all, boolean log) {
            SplitTestAndTrain split = all.splitTestAndTrain(0.8);
            DataSet train = split.getTrain();
            NormalizerStandardize n = new NormalizerStandardize();
            if (log) {
              n.fit(train);
            }
          }
        }
        """, fixed("""
          void prepare(DataSet all, boolean log) {
            SplitTestAndTrain split = all.splitTestAndTrain(0.8);
            DataSet train = split.getTrain();
            NormalizerStandardize n = new NormalizerStandardize();
            if (log) {
              n.fit(all);
            }
          }
        """));
  }

  @Test
  void noFixWhenTwoVariablesHoldTheTrainingPart() throws IOException {
    noFix("""
          void prepare(DataSet all) {
            NormalizerStandardize n = new NormalizerStandardize();
            n.fit(all);
            SplitTestAndTrain split = all.splitTestAndTrain(0.8);
            DataSet a = split.getTrain();
            DataSet b = split.getTrain();
          }
        """);
  }

  @Test
  void noFixWhenTheTrainingVariableIsReassigned() throws IOException {
    noFix("""
          void prepare(DataSet all, DataSet other) {
            SplitTestAndTrain split = all.splitTestAndTrain(0.8);
            DataSet train = split.getTrain();
            NormalizerStandardize n = new NormalizerStandardize();
            n.fit(all);
            train = other;
          }
        """);
  }

  @Test
  void noFixWhenTheNormalizerIsUsedBetweenFitAndNewPlace() throws IOException {
    noFix("""
          void prepare(DataSet all) {
            NormalizerStandardize n = new NormalizerStandardize();
            n.fit(all);
            n.transform(all);
            SplitTestAndTrain split = all.splitTestAndTrain(0.8);
            DataSet train = split.getTrain();
          }
        """);
  }

  @Test
  void noFixWhenTheNormalizerCouldBeSeenElsewhereBeforeTheFit() throws IOException {
    noFix("""
          void prepare(DataSet all) {
            NormalizerStandardize n = new NormalizerStandardize();
            Consumer<DataSet> later = d -> n.transform(d);
            n.fit(all);
            SplitTestAndTrain split = all.splitTestAndTrain(0.8);
            DataSet train = split.getTrain();
          }
        """);
    noFix("""
          void prepare(DataSet all) {
            shared.fit(all);
            SplitTestAndTrain split = all.splitTestAndTrain(0.8);
            DataSet train = split.getTrain();
          }
        """);
  }

  @Test
  void noFixWhenTheTypesDifferOrTheArgumentIsNotAPlainVariable() throws IOException {
    noFix("""
          void prepare(DataSet all) {
            NormalizerStandardize n = new NormalizerStandardize();
            n.fit(all.copy());
            SplitTestAndTrain split = all.splitTestAndTrain(0.8);
            DataSet train = split.getTrain();
          }
        """);
  }

  @Test
  void noFixWhenTheFitIsNestedBeforeTheSplitOrOnlyPossible() throws IOException {
    noFix("""
          void prepare(DataSet all, boolean warm) {
            NormalizerStandardize n = new NormalizerStandardize();
            if (warm) {
              n.fit(all);
            }
            SplitTestAndTrain split = all.splitTestAndTrain(0.8);
            DataSet train = split.getTrain();
          }
        """);
    noFix("""
          void prepare(DataSet all, boolean quick) {
            SplitTestAndTrain split = all.splitTestAndTrain(0.8);
            DataSet train = split.getTrain();
            DataSet source = quick ? all : train;
            NormalizerStandardize n = new NormalizerStandardize();
            n.fit(source);
          }
        """);
  }
}
