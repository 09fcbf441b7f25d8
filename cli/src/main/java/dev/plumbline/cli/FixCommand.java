package dev.plumbline.cli;

import dev.plumbline.discover.Discovery;
import dev.plumbline.discover.SourceFile;
import dev.plumbline.engine.MessageCatalog;
import dev.plumbline.engine.ScanRequest;
import dev.plumbline.finding.Message;
import dev.plumbline.fix.Fixer;
import dev.plumbline.gate.QualityGate;
import dev.plumbline.rules.BuiltInRules;
import java.io.IOException;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/**
 * {@code plumbline fix PATH... [--dry-run]}: apply the fixes marked safe. Suppressed findings
 * and fixes that need review are left alone; {@code --dry-run} prints the unified diff and
 * changes nothing.
 */
@Command(name = "fix", mixinStandardHelpOptions = true,
    description = "Apply the fixes marked safe to the scanned files (--dry-run: show the diff only).")
final class FixCommand implements Callable<Integer> {
  private final Main.Environment env;

  @Mixin
  GateOptions gate = new GateOptions();

  @Option(names = "--dry-run", description = "Print the unified diff of the fixes and change nothing.")
  boolean dryRun;

  FixCommand(Main.Environment env) {
    this.env = env;
  }

  @Override
  public Integer call() {
    QualityGate.Options options = gate.validate(env.workingDirectory(), Optional.empty(), Optional.empty());
    QualityGate.Outcome outcome = ScanCommand.run(options);
    Fixer.Plan plan = Fixer.plan(outcome.result(), filesOf(outcome.request()));
    MessageCatalog messages = BuiltInRules.messages();
    int fixed = 0;
    int files = 0;
    boolean problems = false;
    for (Fixer.FilePlan file : plan.files()) {
      if (file.problem() != null) {
        problems = true;
        env.err().println("plumbline: " + file.file().uri() + ": "
            + messages.render(Message.of(file.problem().messageKey, file.file().uri())));
        continue;
      }
      for (var f : file.overlapping()) {
        env.err().println("plumbline: " + f.location().display() + ": fix not applied, it overlaps another fix ["
            + f.ruleId() + "]; run fix again after this one");
      }
      if (!file.changes()) {
        continue;
      }
      if (dryRun) {
        env.out().print(file.diff());
      } else {
        try {
          Fixer.write(file);
        } catch (IOException e) {
          problems = true;
          env.err().println("plumbline: cannot write " + file.file().uri() + ": " + e.getMessage());
          continue;
        }
        env.out().println("fixed " + file.file().uri() + " (" + file.fixed().size()
            + (file.fixed().size() == 1 ? " finding)" : " findings)"));
      }
      fixed += file.fixed().size();
      files++;
    }
    env.out().flush();
    env.err().println("plumbline: " + (dryRun ? "would fix " : "fixed ") + fixed
        + (fixed == 1 ? " finding in " : " findings in ") + files + (files == 1 ? " file" : " files")
        + (plan.reviewOnly() > 0 ? "; " + plan.reviewOnly() + " more have fixes that need review (see --format sarif)" : ""));
    return problems || outcome.result().incomplete() ? Main.EXIT_INCOMPLETE : Main.EXIT_OK;
  }

  /** The files the scan read, by report name: the same discovery, run again. */
  private static Map<String, SourceFile> filesOf(ScanRequest request) {
    Discovery discovery = new Discovery(new Discovery.Options(request.baseDirectory(),
        request.includes(), request.excludes(), false));
    Map<String, SourceFile> out = new TreeMap<>();
    for (SourceFile f : discovery.discover(request.paths()).files()) {
      out.put(f.uri(), f);
    }
    return out;
  }
}
