package dev.plumbline.cli;

import dev.plumbline.engine.MessageCatalog;
import dev.plumbline.engine.Rule;
import dev.plumbline.rules.BuiltInRules;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;

/** Lists the rules: id, default severity and one-line description. */
@Command(name = "rules", mixinStandardHelpOptions = true, description = "List the rules.")
final class RulesCommand implements Callable<Integer> {
  private final Main.Environment env;

  RulesCommand(Main.Environment env) {
    this.env = env;
  }

  @Override
  public Integer call() {
    MessageCatalog messages = BuiltInRules.messages();
    int width = BuiltInRules.all().stream().mapToInt(r -> r.descriptor().id().length()).max().orElse(10);
    for (Rule r : BuiltInRules.all()) {
      String id = r.descriptor().id();
      env.out().printf("%-" + width + "s  %-7s  %s%n", id, r.descriptor().defaultSeverity().label(),
          messages.text("rule." + id + ".short"));
    }
    env.out().flush();
    return Main.EXIT_OK;
  }
}
