package dev.plumbline.cli;

import java.io.IOException;
import java.io.InputStream;
import java.util.Properties;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/** The top-level command: only subcommands do work. */
@Command(name = "plumbline",
    mixinStandardHelpOptions = true,
    versionProvider = PlumblineCommand.Version.class,
    description = "Finds defects in deep-learning training code without running it.",
    subcommands = {ScanCommand.class, BaselineCommand.class, FixCommand.class, RulesCommand.class,
        ExplainCommand.class},
    exitCodeListHeading = "%nExit codes:%n",
    exitCodeList = {
        "0:nothing at or above the fail level",
        "1:findings at or above the fail level",
        "2:usage or configuration error",
        "3:analysis incomplete (some files could not be analyzed); findings still written"})
final class PlumblineCommand implements Runnable {
  @CommandLine.Spec
  CommandLine.Model.CommandSpec spec;

  @Override
  public void run() {
    throw new CommandLine.ParameterException(spec.commandLine(), "a subcommand is required: scan, baseline, fix, rules or explain");
  }

  static String version() {
    Properties p = new Properties();
    try (InputStream in = PlumblineCommand.class.getResourceAsStream("version.properties")) {
      if (in != null) {
        p.load(in);
      }
    } catch (IOException e) {
      return "unknown";
    }
    return p.getProperty("version", "unknown");
  }

  static final class Version implements CommandLine.IVersionProvider {
    @Override
    public String[] getVersion() {
      return new String[] {"plumbline " + version()};
    }
  }
}
