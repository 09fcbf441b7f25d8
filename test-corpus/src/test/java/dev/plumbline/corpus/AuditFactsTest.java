package dev.plumbline.corpus;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumbline.analysis.entrypoints.Evaluation;
import dev.plumbline.analysis.entrypoints.TrainingEntryPoint;
import dev.plumbline.engine.ScanRequest;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.engine.Scanner;
import dev.plumbline.model.ApiModel;
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
  void demoMainTrainsAndEvaluatesOnFourHundredTestRows() {
    ScanResult result = audit(CorpusScan.DEMO);
    assertEquals(1, result.entryPoints().size(), () -> result.entryPoints().toString());
    TrainingEntryPoint main = result.entryPoints().get(0);
    assertEquals("HiveStressTrainer.main(String[])", main.name());
    assertEquals(1, main.evaluations().size());
    Evaluation e = main.evaluations().get(0);
    assertEquals(List.of("TEST"), e.roles());
    // 2,000 generated rows (HiveReadings.generate's first argument), 80 % kept for training.
    assertEquals(OptionalLong.of(400), e.rows());
    assertTrue(e.measuresAccuracy());
    assertTrue(main.covers(result.findings().get(0).location()), "the leak lies in main");
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
