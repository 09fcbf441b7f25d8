package dev.plumbline.report;

import dev.plumbline.engine.MessageCatalog;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.gate.BaselineSummary;
import java.nio.file.Path;
import java.util.Optional;

/**
 * What every report writer needs: the result, the wording, the base directory the report names
 * are relative to, the tool version, and, when the scan was filtered against a baseline, how
 * it compared.
 */
public record ReportContext(ScanResult result, MessageCatalog messages, Path baseDirectory,
    String toolVersion, Optional<BaselineSummary> baseline) {

  public ReportContext {
    baseline = baseline == null ? Optional.empty() : baseline;
  }

  public ReportContext(ScanResult result, MessageCatalog messages, Path baseDirectory, String toolVersion) {
    this(result, messages, baseDirectory, toolVersion, Optional.empty());
  }
}
