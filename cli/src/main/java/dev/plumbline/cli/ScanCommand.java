package dev.plumbline.cli;

import dev.plumbline.engine.Scanner;
import dev.plumbline.gate.ConfigException;
import dev.plumbline.gate.FailLevel;
import dev.plumbline.gate.QualityGate;
import dev.plumbline.model.ApiModel;
import dev.plumbline.report.HtmlReport;
import dev.plumbline.report.ReportContext;
import dev.plumbline.report.SarifReport;
import dev.plumbline.report.TextReport;
import dev.plumbline.engine.Rule;
import dev.plumbline.rules.BuiltInRules;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code plumbline scan PATH...}: analyze, apply the gate's stages, report. */
@Command(name = "scan", mixinStandardHelpOptions = true,
    description = "Scan Java sources for defects in training code.")
final class ScanCommand implements Callable<Integer> {

  enum Format { text, sarif, html }

  /** The fail levels as the command line spells them. */
  enum FailOn {
    error(FailLevel.ERROR), warning(FailLevel.WARNING), note(FailLevel.NOTE), none(FailLevel.NONE);

    final FailLevel level;

    FailOn(FailLevel level) {
      this.level = level;
    }
  }

  private final Main.Environment env;

  @Mixin
  GateOptions gate = new GateOptions();

  @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "text",
      description = "Output format: ${COMPLETION-CANDIDATES} (default: ${DEFAULT-VALUE}).")
  Format format;

  @Option(names = "--output", paramLabel = "FILE", description = "Write the report here instead of standard output.")
  String output;

  @Option(names = "--fail-on", paramLabel = "LEVEL",
      description = "Exit 1 when a finding is at or above: ${COMPLETION-CANDIDATES} "
          + "(default: the configuration's, else warning).")
  FailOn failOn;

  @Option(names = "--baseline", paramLabel = "FILE",
      description = "Report only findings not recorded in this baseline (see 'plumbline baseline').")
  String baseline;

  ScanCommand(Main.Environment env) {
    this.env = env;
  }

  @Override
  public Integer call() {
    QualityGate.Options options = gate.validate(env.workingDirectory(), Optional.ofNullable(baseline),
        Optional.ofNullable(failOn).map(f -> f.level));
    Optional<Path> out = outputPath(env.workingDirectory(), output);
    QualityGate.Outcome outcome;
    try (ScanProgress progress = new ScanProgress(env.errIsTerminal(), env.rawErr(), env.err(),
        () -> System.nanoTime() / 1_000_000)) {
      // The HTML report needs training entry points and test-set sizes for its verdicts.
      outcome = run(options, progress, format == Format.html, env.rules());
    }
    ReportContext ctx = new ReportContext(outcome.result(), BuiltInRules.messages(),
        env.workingDirectory(), PlumblineCommand.version(), outcome.baseline());
    String report = render(ctx, format);
    if (out.isPresent()) {
      writeAtomically(out.get(), report);
      long active = outcome.result().findings().stream().filter(f -> !f.isSuppressed()).count();
      env.err().println("plumbline: wrote " + out.get() + " (" + active + " findings in "
          + outcome.result().filesAnalyzed() + " files)");
    } else {
      env.out().print(report);
      env.out().flush();
    }
    return exitCode(outcome);
  }

  /** Runs the gate with the built-in rules; a bad configuration or baseline is a usage error. */
  static QualityGate.Outcome run(QualityGate.Options options) {
    return run(options, Scanner.ScanListener.NONE, false);
  }

  static QualityGate.Outcome run(QualityGate.Options options, Scanner.ScanListener listener,
      boolean audit) {
    return run(options, listener, audit, BuiltInRules.all());
  }

  /** As above with a given rule set (the environment's: tests plant failing rules there). */
  static QualityGate.Outcome run(QualityGate.Options options, Scanner.ScanListener listener,
      boolean audit, List<Rule> rules) {
    QualityGate gate = new QualityGate(ApiModel.loadDefault(), rules,
        BuiltInRules.projectAnalyses(), listener);
    if (audit) {
      gate = gate.withAudit();
    }
    try {
      return gate.run(options);
    } catch (ConfigException e) {
      throw new Main.UsageError(e.getMessage());
    }
  }

  static Optional<Path> outputPath(Path cwd, String output) {
    Optional<Path> out = Optional.ofNullable(output).map(o -> cwd.resolve(o).normalize());
    if (out.isPresent() && Files.isDirectory(out.get())) {
      throw new Main.UsageError("--output names a folder, not a file: " + output);
    }
    return out;
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

  static int exitCode(QualityGate.Outcome outcome) {
    return switch (outcome.verdict()) {
      case INCOMPLETE -> Main.EXIT_INCOMPLETE;
      case FINDINGS_AT_FAIL_LEVEL -> Main.EXIT_FINDINGS;
      case PASS -> Main.EXIT_OK;
    };
  }

  /** Writes through a temporary file in the same folder so a failed write never leaves half a report. */
  static void writeAtomically(Path target, String content) {
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
