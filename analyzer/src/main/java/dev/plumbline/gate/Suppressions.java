package dev.plumbline.gate;

import dev.plumbline.finding.Finding;
import dev.plumbline.parse.ParsedSource;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Marks findings covered by a suppression written in the code. Marked findings keep their place
 * in the result (and in SARIF, as {@code suppressions} with the justification) but no longer
 * count towards the fail level.
 *
 * <p>A {@linkplain dev.plumbline.engine.Scanner.FileStage file stage}: it runs on each file's
 * worker while the file's tree is at hand, so no file is parsed twice.
 */
public final class Suppressions {
  private Suppressions() {}

  /** Notebooks map lines, so their positions cannot be matched here; they keep every finding. */
  public static List<Finding> mark(ParsedSource source, List<Finding> findings) {
    if (findings.isEmpty() || source.file().isNotebook()) {
      return findings;
    }
    SuppressionSites sites = SuppressionSites.of(source.unit(), source.text());
    List<Finding> out = new ArrayList<>(findings.size());
    for (Finding f : findings) {
      Optional<SuppressionSites.Site> site = f.isSuppressed() ? Optional.empty()
          : sites.match(f.ruleId(), f.location().range().startLine());
      out.add(site.map(s -> f.withSuppression(s.reason().orElse(""))).orElse(f));
    }
    return out;
  }
}
