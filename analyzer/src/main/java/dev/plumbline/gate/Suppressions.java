package dev.plumbline.gate;

import dev.plumbline.engine.FileContext;
import dev.plumbline.finding.Finding;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Marks findings covered by a suppression written in the code. Marked findings keep their place
 * in the result (and in SARIF, as {@code suppressions} with the justification) but no longer
 * count towards the fail level.
 *
 * <p>A {@linkplain dev.plumbline.engine.Scanner.FileStage file stage}: it runs on each file's
 * worker with the file's context, so no file is parsed twice and the suppression sites found for
 * {@code suppression.invalid} serve here too.
 */
public final class Suppressions {
  private Suppressions() {}

  /** Notebooks map lines, so their positions cannot be matched here; they keep every finding. */
  public static List<Finding> mark(FileContext file, List<Finding> findings) {
    if (findings.isEmpty() || file.source().file().isNotebook()) {
      return findings;
    }
    SuppressionSites sites = file.analysis(SuppressionSites.KEY); // shared with suppression.invalid
    List<Finding> out = new ArrayList<>(findings.size());
    for (Finding f : findings) {
      Optional<SuppressionSites.Site> site = f.isSuppressed() ? Optional.empty()
          : sites.match(f.ruleId(), f.location().range().startLine());
      out.add(site.map(s -> f.withSuppression(s.reason().orElse(""))).orElse(f));
    }
    return out;
  }
}
