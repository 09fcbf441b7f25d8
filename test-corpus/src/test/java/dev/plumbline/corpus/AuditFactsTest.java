package dev.plumbline.corpus;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumbline.analysis.entrypoints.Evaluation;
import dev.plumbline.analysis.entrypoints.TrainingEntryPoint;
import dev.plumbline.engine.ScanRequest;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.engine.Scanner;
import dev.plumbline.model.ApiModel;
import dev.plumbline.report.audit.AuditVerdicts;
import dev.plumbline.report.audit.TestSetPrecision;
import dev.plumbline.rules.BuiltInRules;
import java.util.List;
import java.util.OptionalLong;
import org.junit.jupiter.api.Test;

/** Training entry points, their evaluations and test-set sizes found in the demo and notebook. */
class AuditFactsTest {

  static ScanResult audit(java.nio.file.Path... roots) {
    Scanner scanner = new Scanner(ApiModel.loadDefault(), BuiltInRules.all(),
        BuiltInRules.projectAnalyses(), Scanner.ScanListener.NONE).withAudit();
    return scanner.scan(new ScanRequest(List.of(roots), CorpusScan.MODULE, List.of(), List.of(), 2));
  }

  @Test
  void demoHasALeakyRunAndACleanOneWithTheirTestRows() {
    ScanResult result = audit(CorpusScan.DEMO);
    assertEquals(List.of("HiveStressTrainer.main(String[])", "HiveWinterCheck.main(String[])"),
        result.entryPoints().stream().map(TrainingEntryPoint::name).toList());
    TrainingEntryPoint stress = result.entryPoints().get(0);
    assertEquals(1, stress.evaluations().size());
    Evaluation e = stress.evaluations().get(0);
    assertEquals(List.of("TEST"), e.roles());
    // 2,000 generated rows (HiveReadings.generate's first argument), 80 % kept for training.
    assertEquals(OptionalLong.of(400), e.rows());
    assertTrue(e.measuresAccuracy());
    dev.plumbline.finding.Finding leak = result.findings().stream()
        .filter(f -> f.ruleId().equals("leak.preprocessing-before-split")).findFirst().orElseThrow();
    assertTrue(stress.covers(leak.location()), "the leak lies in main");
    // 15,000 rows, the first 3,000 for training.
    assertEquals(OptionalLong.of(12_000), result.entryPoints().get(1).evaluations().get(0).rows());

    List<AuditVerdicts.EntryVerdict> verdicts = AuditVerdicts.of(result);
    AuditVerdicts.EvaluationVerdict leaky = verdicts.get(0).evaluations().get(0);
    assertEquals(1, leaky.risks().size());
    assertEquals(AuditVerdicts.Reason.SHARES_DATA, leaky.risks().get(0).reason(),
        "the leak's split and data source are where the evaluated rows come from");
    assertEquals(TestSetPrecision.Judgement.TOO_SMALL, leaky.precision().orElseThrow().judgement());
    AuditVerdicts.EvaluationVerdict winter = verdicts.get(1).evaluations().get(0);
    assertFalse(winter.atRisk(), "no finding in the winter check's run");
    assertEquals(TestSetPrecision.Judgement.NARROW, winter.precision().orElseThrow().judgement());
  }

  @Test
  void notebookCellsAreAnEntryPointWithTheirTestRowsCounted() {
    ScanResult result = audit(CorpusScan.NOTEBOOKS);
    assertEquals(1, result.entryPoints().size(), () -> result.entryPoints().toString());
    TrainingEntryPoint cells = result.entryPoints().get(0);
    assertEquals("cells of notebooks/HerbWateringLeak.ipynb", cells.name());
    Evaluation e = cells.evaluations().get(0);
    assertEquals(OptionalLong.of(150), e.rows(), "600 rows, the first 450 for training");
    assertEquals(new dev.plumbline.parse.LineMap.CellPosition(5, 5), result.cellOf(e.location()).orElseThrow());
  }
}
