package dev.plumbline.cli;

import dev.plumbline.gate.Baseline;
import dev.plumbline.gate.QualityGate;
import dev.plumbline.rules.BuiltInRules;
import java.nio.file.Path;
import java.util.Optional;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code plumbline baseline PATH... --output FILE}: record today's findings as accepted. */
@Command(name = "baseline", mixinStandardHelpOptions = true,
    description = "Record the current findings in a baseline file, so later scans with "
        + "--baseline report only new ones.")
final class BaselineCommand implements Callable<Integer> {
  private final Main.Environment env;

  @Mixin
  GateOptions gate = new GateOptions();

  @Option(names = "--output", paramLabel = "FILE", required = true, description = "The baseline file to write.")
  String output;

  BaselineCommand(Main.Environment env) {
    this.env = env;
  }

  @Override
  public Integer call() {
    QualityGate.Options options = gate.validate(env.workingDirectory(), Optional.empty(), Optional.empty());
    Path out = ScanCommand.outputPath(env.workingDirectory(), output).orElseThrow();
    QualityGate.Outcome outcome = ScanCommand.run(options);
    Baseline baseline = Baseline.of(outcome.result(), BuiltInRules.messages());
    ScanCommand.writeAtomically(out, baseline.render());
    env.err().println("plumbline: wrote " + out + " (" + baseline.entries().size() + " findings in "
        + outcome.result().filesAnalyzed() + " files)");
    if (outcome.result().incomplete()) {
      env.err().println("plumbline: analysis incomplete; files that could not be analyzed have no entries");
      return Main.EXIT_INCOMPLETE;
    }
    return Main.EXIT_OK;
  }
}
