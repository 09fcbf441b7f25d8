package dev.plumbline.cli;

import dev.plumbline.engine.MessageCatalog;
import dev.plumbline.engine.Rule;
import dev.plumbline.rules.BuiltInRules;
import java.io.PrintWriter;
import java.util.Optional;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;

/** Prints what a rule finds, why it matters, how to fix it and an example. */
@Command(name = "explain", mixinStandardHelpOptions = true, description = "Explain one rule.")
final class ExplainCommand implements Callable<Integer> {
  private final Main.Environment env;

  @Parameters(index = "0", paramLabel = "RULE", description = "Rule id, e.g. leak.fit-on-test")
  String ruleId;

  ExplainCommand(Main.Environment env) {
    this.env = env;
  }

  @Override
  public Integer call() {
    Optional<Rule> rule = BuiltInRules.byId(ruleId);
    if (rule.isEmpty()) {
      throw new Main.UsageError("unknown rule '" + ruleId + "'; 'plumbline rules' lists them");
    }
    MessageCatalog m = BuiltInRules.messages();
    String p = "rule." + ruleId;
    PrintWriter out = env.out();
    out.println(ruleId + " (" + rule.get().descriptor().defaultSeverity().label() + "): "
        + m.text(p + ".short"));
    out.println();
    out.println(m.text(p + ".full"));
    out.println();
    out.println("Why it matters:");
    out.println("  " + m.text(p + ".why"));
    out.println();
    out.println("How to fix:");
    out.println("  " + m.text(p + ".fix"));
    String example = m.text(p + ".example");
    if (!example.isEmpty()) {
      out.println();
      out.println("Example:");
      example.lines().forEach(l -> out.println("  " + l));
    }
    out.flush();
    return Main.EXIT_OK;
  }
}
