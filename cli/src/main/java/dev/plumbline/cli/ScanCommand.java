package dev.plumbline.cli;

import dev.plumbline.engine.MessageCatalog;
import dev.plumbline.engine.ScanRequest;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.engine.Scanner;
import dev.plumbline.finding.Finding;
import dev.plumbline.finding.Severity;
import dev.plumbline.model.ApiModel;
import dev.plumbline.report.HtmlReport;
import dev.plumbline.report.ReportContext;
import dev.plumbline.report.SarifReport;
import dev.plumbline.report.TextReport;
import dev.plumbline.rules.BuiltInRules;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code plumbline scan PATH...}: analyze and report. */
@Command(name = "scan", mixinStandardHelpOptions = true,
    description = "Scan Java sources for defects in training code.")
final class ScanCommand implements Callable<Integer> {

  enum Format { text, sarif, html }

  enum FailLevel {
    error(Severity.ERROR), warning(Severity.WARNING), note(Severity.NOTE), none(null);

    final Severity threshold;

    FailLevel(Severity threshold) {
      this.threshold = threshold;
    }
  }

  /** Validated options of one scan; immutable. */
  record Options(List<Path> paths, Format format, Optional<Path> output, FailLevel failOn,
      int jobs, List<String> includes, List<String> excludes) {}

  private final Main.Environment env;

  @Parameters(paramLabel = "PATH", arity = "1..*", description = "Files or folders to scan.")
  List<String> paths = new ArrayList<>();

  @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "text",
      description = "Output format: ${COMPLETION-CANDIDATES} (default: ${DEFAULT-VALUE}).")
  Format format;

  @Option(names = "--output", paramLabel = "FILE", description = "Write the report here instead of standard output.")
  String output;

  @Option(names = "--fail-on", paramLabel = "LEVEL", defaultValue = "warning",
      description = "Exit 1 when a finding is at or above: ${COMPLETION-CANDIDATES} (default: ${DEFAULT-VALUE}).")
  FailLevel failOn;

  @Option(names = "--jobs", paramLabel = "N", description = "Worker threads (default: number of cores).")
  Integer jobs;

  @Option(names = "--include", paramLabel = "GLOB", description = "Only scan files whose path matches (repeatable).")
  List<String> includes = new ArrayList<>();

  @Option(names = "--exclude", paramLabel = "GLOB", description = "Skip files whose path matches (repeatable).")
  List<String> excludes = new ArrayList<>();

  ScanCommand(Main.Environment env) {
    this.env = env;
  }

  @Override
  public Integer call() {
    Options options = validate();
    ScanResult result;
    try (ScanProgress progress = new ScanProgress(env.errIsTerminal(), env.rawErr(), env.err(),
        () -> System.nanoTime() / 1_000_000)) {
      Scanner scanner = new Scanner(ApiModel.loadDefault(), BuiltInRules.all(),
          BuiltInRules.projectAnalyses(), progress);
      if (options.format() == Format.html) {
        scanner = scanner.withAudit(); // training entry points and test-set sizes for the verdicts
      }
      result = scanner.scan(new ScanRequest(options.paths(), env.workingDirectory(),
          options.includes(), options.excludes(), options.jobs()));
    }
    MessageCatalog messages = BuiltInRules.messages();
    ReportContext ctx = new ReportContext(result, messages, env.workingDirectory(), PlumblineCommand.version());
    String report = render(ctx, options.format());
    if (options.output().isPresent()) {
      writeAtomically(options.output().get(), report);
      env.err().println("plumbline: wrote " + options.output().get() + " (" + countActive(result)
          + " findings in " + result.filesAnalyzed() + " files)");
    } else {
      env.out().print(report);
      env.out().flush();
    }
    return exitCode(result, options.failOn());
  }

  private Options validate() {
    List<Path> resolved = new ArrayList<>();
    for (String p : paths) {
      Path path = env.workingDirectory().resolve(p).normalize();
      if (!Files.exists(path)) {
        throw new Main.UsageError("path not found: " + p);
      }
      resolved.add(path);
    }
    int n = jobs == null ? Runtime.getRuntime().availableProcessors() : jobs;
    if (n < 1 || n > 256) {
      throw new Main.UsageError("--jobs must be between 1 and 256, got " + n);
    }
    Optional<Path> out = Optional.ofNullable(output).map(o -> env.workingDirectory().resolve(o).normalize());
    if (out.isPresent() && Files.isDirectory(out.get())) {
      throw new Main.UsageError("--output names a folder, not a file: " + output);
    }
    for (String glob : concat(includes, excludes)) {
      try {
        java.nio.file.FileSystems.getDefault().getPathMatcher("glob:" + glob);
      } catch (IllegalArgumentException e) {
        throw new Main.UsageError("bad glob '" + glob + "': " + e.getMessage());
      }
    }
    return new Options(List.copyOf(resolved), format, out, failOn, n, List.copyOf(includes),
        List.copyOf(excludes));
  }

  private static List<String> concat(List<String> a, List<String> b) {
    List<String> all = new ArrayList<>(a);
    all.addAll(b);
    return all;
  }

  static String render(ReportContext ctx, Format format) {
    return switch (format) {
      case sarif -> SarifReport.render(ctx);
      case html -> HtmlReport.render(ctx);
      case text -> {
        StringWriter sw = new StringWriter();
        TextReport.write(ctx, new PrintWriter(sw));
        yield sw.toString();
      }
    };
  }

  private static long countActive(ScanResult result) {
    return result.findings().stream().filter(f -> !f.isSuppressed()).count();
  }

  static int exitCode(ScanResult result, FailLevel failOn) {
    if (result.incomplete()) {
      return Main.EXIT_INCOMPLETE;
    }
    if (failOn.threshold == null) {
      return Main.EXIT_OK;
    }
    for (Finding f : result.findings()) {
      if (!f.isSuppressed() && f.severity().atLeast(failOn.threshold)) {
        return Main.EXIT_FINDINGS;
      }
    }
    return Main.EXIT_OK;
  }

  /** Writes through a temporary file in the same folder so a failed write never leaves half a report. */
  private static void writeAtomically(Path target, String content) {
    try {
      Path dir = target.toAbsolutePath().getParent();
      if (dir != null) {
        Files.createDirectories(dir);
      }
      Path tmp = Files.createTempFile(dir, ".plumbline-", ".tmp");
      try {
        Files.writeString(tmp, content, StandardCharsets.UTF_8);
        Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
      } finally {
        Files.deleteIfExists(tmp);
      }
    } catch (IOException e) {
      throw new Main.UsageError("cannot write " + target + ": " + e.getMessage());
    }
  }
}
