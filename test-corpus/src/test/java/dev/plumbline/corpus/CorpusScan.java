package dev.plumbline.corpus;

import dev.plumbline.engine.ScanRequest;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.engine.Scanner;
import dev.plumbline.gate.Suppressions;
import dev.plumbline.model.ApiModel;
import dev.plumbline.report.ReportContext;
import dev.plumbline.report.SarifReport;
import dev.plumbline.rules.BuiltInRules;
import java.nio.file.Path;
import java.util.List;

/** Scans the corpus the way the command line does. The module folder is the report base. */
final class CorpusScan {
  static final Path MODULE = Path.of("").toAbsolutePath();
  static final Path SOURCES = MODULE.resolve("src/main/java");
  static final Path DEMO = MODULE.resolve("demo-project/src/main/java");
  /** Java notebooks: their code is checked by compiling the unit the analyzer builds from them. */
  static final Path NOTEBOOKS = MODULE.resolve("notebooks");

  private CorpusScan() {}

  static ScanResult scan(int jobs, Path... roots) {
    Scanner scanner = new Scanner(ApiModel.loadDefault(), BuiltInRules.all(),
        BuiltInRules.projectAnalyses(), Scanner.ScanListener.NONE)
        // Suppressions written in the code apply, as in every gate run; no configuration, no baseline.
        .withFileStage(Suppressions::mark);
    return scanner.scan(new ScanRequest(List.of(roots), MODULE, List.of(), List.of(), jobs));
  }

  static String sarif(ScanResult result) {
    return SarifReport.render(new ReportContext(result, BuiltInRules.messages(), MODULE, "test"));
  }
}
