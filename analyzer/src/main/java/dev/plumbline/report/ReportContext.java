package dev.plumbline.report;

import dev.plumbline.engine.MessageCatalog;
import dev.plumbline.engine.ScanResult;
import java.nio.file.Path;

/**
 * What every report writer needs: the result, the wording, the base directory the report names
 * are relative to, and the tool version.
 */
public record ReportContext(ScanResult result, MessageCatalog messages, Path baseDirectory,
    String toolVersion) {}
