package dev.plumbline.fix;

import dev.plumbline.discover.SourceFile;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.finding.Edit;
import dev.plumbline.finding.Finding;
import dev.plumbline.parse.LineMap;
import dev.plumbline.parse.SourceParser;
import dev.plumbline.parse.SourceText;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.IdentityHashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Plans and writes the safe fixes of a scan, file by file. A file is changed only when every
 * check passes: it still holds exactly the text that was scanned, it is valid UTF-8 (so
 * rewriting loses no bytes), and the fixed text still parses. Otherwise the file is left as it
 * is and the reason is reported. Suppressed findings and fixes not marked safe are never applied.
 */
public final class Fixer {

  /** Why a file's fixes were not written. Keys of the notification bundle. */
  public enum FileProblem {
    CHANGED_SINCE_SCAN("fix.changed-since-scan"),
    NOT_UTF8("fix.not-utf8"),
    UNREADABLE("fix.unreadable"),
    MAPPED_LINES("fix.mapped-lines"),
    DOES_NOT_PARSE_AFTER("fix.does-not-parse-after");

    public final String messageKey;

    FileProblem(String key) {
      this.messageKey = key;
    }
  }

  /**
   * The plan for one file.
   *
   * @param fixed findings whose edits were applied
   * @param overlapping findings whose safe edit clashed with one applied before it
   * @param problem set when nothing is written to this file
   */
  public record FilePlan(SourceFile file, String before, String after, boolean byteOrderMark,
      List<Finding> fixed, List<Finding> overlapping, FileProblem problem) {

    public boolean changes() {
      return problem == null && !fixed.isEmpty() && !before.equals(after);
    }

    /** Unified diff with {@code a/} and {@code b/} prefixes, as {@code git diff} prints. */
    public String diff() {
      return UnifiedDiff.of("a/" + file.uri(), "b/" + file.uri(), before, after);
    }
  }

  /** All files with at least one safe fix, in report order, and the count of unsafe ones left. */
  public record Plan(List<FilePlan> files, int reviewOnly) {
    public Plan {
      files = List.copyOf(files);
    }
  }

  private Fixer() {}

  /**
   * Plans the safe fixes of {@code result}. {@code files} maps report names to the files the
   * scan read (the same discovery the scan ran), so a fix is written where the code came from.
   */
  public static Plan plan(ScanResult result, Map<String, SourceFile> files) {
    Map<String, List<Finding>> byFile = new LinkedHashMap<>();
    int reviewOnly = 0;
    for (Finding f : result.findings()) {
      if (f.isSuppressed() || f.fix().isEmpty()) {
        continue;
      }
      if (!f.fix().get().safe()) {
        reviewOnly++;
        continue;
      }
      byFile.computeIfAbsent(f.location().uri(), k -> new ArrayList<>()).add(f);
    }
    List<FilePlan> plans = new ArrayList<>();
    for (Map.Entry<String, List<Finding>> e : byFile.entrySet()) {
      SourceFile file = files.get(e.getKey());
      String scanned = result.source(e.getKey()).orElse(null);
      if (file == null || scanned == null) {
        continue;
      }
      plans.add(planFile(file, scanned, e.getValue()));
    }
    return new Plan(plans, reviewOnly);
  }

  private static FilePlan planFile(SourceFile file, String scanned, List<Finding> findings) {
    if (file.isNotebook()) {
      return failed(file, scanned, findings, false, FileProblem.MAPPED_LINES);
    }
    byte[] bytes;
    try {
      bytes = Files.readAllBytes(file.path());
    } catch (IOException | SecurityException e) {
      return failed(file, scanned, findings, false, FileProblem.UNREADABLE);
    }
    boolean bom = bytes.length >= 3 && (bytes[0] & 0xff) == 0xEF && (bytes[1] & 0xff) == 0xBB
        && (bytes[2] & 0xff) == 0xBF;
    SourceText current = SourceText.decode(bytes);
    if (current.hadInvalidBytes()) {
      return failed(file, scanned, findings, bom, FileProblem.NOT_UTF8);
    }
    if (!current.text().equals(scanned)) {
      return failed(file, scanned, findings, bom, FileProblem.CHANGED_SINCE_SCAN);
    }
    List<Edit> edits = new ArrayList<>();
    Map<Edit, Finding> owner = new IdentityHashMap<>();
    for (Finding f : findings) {
      Edit edit = f.fix().get();
      edits.add(edit);
      owner.put(edit, f);
    }
    EditApplier.Result applied = EditApplier.apply(scanned, edits);
    List<Finding> fixed = applied.applied().stream().map(owner::get).toList();
    List<Finding> overlapping = applied.skipped().stream().map(s -> owner.get(s.edit())).toList();
    SourceParser.Outcome reparsed = new SourceParser().parseText(file, applied.text(),
        LineMap.IDENTITY, List.of());
    if (reparsed.parsed().isEmpty()) {
      return failed(file, scanned, findings, bom, FileProblem.DOES_NOT_PARSE_AFTER);
    }
    return new FilePlan(file, scanned, applied.text(), bom, fixed, overlapping, null);
  }

  private static FilePlan failed(SourceFile file, String text, List<Finding> findings, boolean bom,
      FileProblem problem) {
    return new FilePlan(file, text, text, bom, List.of(), findings, problem);
  }

  /**
   * Writes a planned file through a temporary file in the same folder, keeping its byte-order
   * mark, so a failed write never leaves half a file.
   */
  public static void write(FilePlan plan) throws IOException {
    if (!plan.changes()) {
      return;
    }
    Path target = plan.file().path().toRealPath();
    Path dir = target.toAbsolutePath().getParent();
    Path tmp = Files.createTempFile(dir, ".plumbline-fix-", ".tmp");
    try {
      byte[] body = plan.after().getBytes(StandardCharsets.UTF_8);
      byte[] out = body;
      if (plan.byteOrderMark()) {
        out = new byte[body.length + 3];
        out[0] = (byte) 0xEF;
        out[1] = (byte) 0xBB;
        out[2] = (byte) 0xBF;
        System.arraycopy(body, 0, out, 3, body.length);
      }
      Files.write(tmp, out);
      try {
        Files.setPosixFilePermissions(tmp, Files.getPosixFilePermissions(target));
      } catch (UnsupportedOperationException ignored) {
        // not a POSIX file system: the default permissions stand
      }
      Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
    } finally {
      Files.deleteIfExists(tmp);
    }
  }
}
