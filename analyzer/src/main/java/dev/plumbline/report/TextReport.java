package dev.plumbline.report;

import dev.plumbline.finding.Finding;
import dev.plumbline.finding.Notification;
import dev.plumbline.finding.RelatedLocation;
import dev.plumbline.finding.Severity;
import dev.plumbline.fix.TextLines;
import java.io.PrintWriter;
import java.util.Optional;

/**
 * Terminal output in the usual compiler diagnostic style:
 * <pre>
 * path:line:col: severity: message [rule-id]
 *     offending line
 *     ^~~~~~~~~~
 *   path:line:col: note: related place
 *   fix: hint
 * </pre>
 * Suppressed findings are not printed; they are counted in the summary. In a notebook the line
 * is the notebook file's line and a further line names the cell and the line within it.
 */
public final class TextReport {
  private TextReport() {}

  public static void write(ReportContext ctx, PrintWriter out) {
    int shown = 0;
    int suppressed = 0;
    int[] bySeverity = new int[Severity.values().length];
    String linesOf = null; // findings come file by file: each file's lines are indexed once
    TextLines lines = null;
    for (Finding f : ctx.result().findings()) {
      if (f.isSuppressed()) {
        suppressed++;
        continue;
      }
      shown++;
      bySeverity[f.severity().ordinal()]++;
      out.println(f.location().display() + ": " + f.severity().label() + ": "
          + ctx.messages().render(f.message()) + " [" + f.ruleId() + "]");
      if (!f.location().uri().equals(linesOf)) {
        linesOf = f.location().uri();
        lines = new TextLines(ctx.result().source(linesOf).orElse(""));
      }
      Optional<String> line = Excerpts.line(lines, f.location().range().startLine());
      if (line.isPresent()) {
        out.println("    " + line.get());
        out.println("    " + Excerpts.caret(line.get(), f.location().range()));
      }
      ctx.result().cellOf(f.location()).ifPresent(c ->
          out.println("  in notebook cell " + c.cell() + ", line " + c.line()));
      for (RelatedLocation r : f.related()) {
        String cell = ctx.result().cellOf(r.location())
            .map(c -> " (cell " + c.cell() + ", line " + c.line() + ")").orElse("");
        out.println("  " + r.location().display() + ": note: " + ctx.messages().render(r.message()) + cell);
      }
      out.println("  fix: " + ctx.messages().render(f.fixHint()));
      out.println();
    }
    for (Notification n : ctx.result().notifications()) {
      String where = n.location().map(l -> l.display() + ": ").orElse("");
      out.println(where + n.level().label() + ": " + ctx.messages().render(n.message())
          + " [plumbline]");
    }
    StringBuilder summary = new StringBuilder();
    summary.append(shown).append(shown == 1 ? " finding" : " findings");
    summary.append(" (").append(bySeverity[Severity.ERROR.ordinal()]).append(" errors, ")
        .append(bySeverity[Severity.WARNING.ordinal()]).append(" warnings, ")
        .append(bySeverity[Severity.NOTE.ordinal()]).append(" notes)");
    if (suppressed > 0) {
      summary.append(", ").append(suppressed).append(" suppressed");
    }
    ctx.baseline().ifPresent(b -> {
      summary.append(", ").append(b.known()).append(" known from ").append(b.file());
      if (b.stale() > 0) {
        summary.append(" (").append(b.stale()).append(b.stale() == 1 ? " entry" : " entries")
            .append(" no longer found)");
      }
    });
    summary.append(" in ").append(ctx.result().filesAnalyzed()).append(" of ")
        .append(ctx.result().filesDiscovered()).append(" files");
    if (ctx.result().incomplete()) {
      summary.append("; analysis incomplete");
    }
    out.println(summary);
    out.flush();
  }
}
