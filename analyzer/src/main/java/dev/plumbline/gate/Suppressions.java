package dev.plumbline.gate;

import dev.plumbline.discover.SourceFile;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.finding.Finding;
import dev.plumbline.parse.LineMap;
import dev.plumbline.parse.SourceParser;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The post-scan stage that marks findings covered by a suppression written in the code. Marked
 * findings keep their place in the result (and in SARIF, as {@code suppressions} with the
 * justification) but no longer count towards the fail level.
 *
 * <p>Reads the suppressions again from the text the scan kept for each file with findings;
 * only those files are parsed again.
 */
public final class Suppressions {
  private Suppressions() {}

  public static ScanResult apply(ScanResult result) {
    Map<String, Optional<SuppressionSites>> byFile = new HashMap<>();
    List<Finding> out = new ArrayList<>(result.findings().size());
    for (Finding f : result.findings()) {
      if (f.isSuppressed()) {
        out.add(f);
        continue;
      }
      Optional<SuppressionSites> sites = byFile.computeIfAbsent(f.location().uri(),
          uri -> result.source(uri).flatMap(text -> read(uri, text)));
      Optional<SuppressionSites.Site> site = sites
          .flatMap(s -> s.match(f.ruleId(), f.location().range().startLine()));
      out.add(site.map(s -> f.withSuppression(s.reason().orElse(""))).orElse(f));
    }
    return result.withFindings(out);
  }

  /** Notebooks map lines, so their positions cannot be matched here; they keep every finding. */
  private static Optional<SuppressionSites> read(String uri, String text) {
    SourceFile file = new SourceFile(Path.of(uri), uri);
    if (file.isNotebook()) {
      return Optional.empty();
    }
    return new SourceParser().parseText(file, text, LineMap.IDENTITY, List.of()).parsed()
        .map(p -> SuppressionSites.of(p.unit(), text));
  }
}
