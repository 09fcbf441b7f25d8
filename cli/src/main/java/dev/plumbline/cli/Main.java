package dev.plumbline.cli;

import dev.plumbline.engine.Rule;
import dev.plumbline.rules.BuiltInRules;
import java.io.PrintStream;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;
import picocli.CommandLine;

/**
 * Command-line entry point. Parses options and calls the library; all work happens in
 * {@link dev.plumbline.engine.Scanner}. Streams and working directory are injected so the CLI
 * can be tested in-process; the return value is the documented exit code.
 */
public final class Main {
  /** Nothing at or above the fail level. */
  public static final int EXIT_OK = 0;
  /** Findings at or above the fail level. */
  public static final int EXIT_FINDINGS = 1;
  /** Usage or configuration error. */
  public static final int EXIT_USAGE = 2;
  /** Some input could not be analyzed; findings were still written. */
  public static final int EXIT_INCOMPLETE = 3;

  private Main() {}

  public static void main(String[] args) {
    int code = run(args, System.out, System.err, Path.of("").toAbsolutePath(), stderrIsTerminal());
    System.exit(code);
  }

  /** Whether standard error is a terminal, asked through jline; false when it cannot tell. */
  private static boolean stderrIsTerminal() {
    try {
      return org.jline.terminal.spi.TerminalProvider.load("exec")
          .isSystemStream(org.jline.terminal.spi.SystemStream.Error);
    } catch (java.io.IOException | RuntimeException | LinkageError e) {
      return false;
    }
  }

  public static int run(String[] args, PrintStream out, PrintStream err, Path workingDirectory) {
    return run(args, out, err, workingDirectory, false);
  }

  /** @param errIsTerminal whether {@code err} is a terminal (a progress bar instead of lines) */
  public static int run(String[] args, PrintStream out, PrintStream err, Path workingDirectory,
      boolean errIsTerminal) {
    return run(args, out, err, workingDirectory, errIsTerminal, BuiltInRules.all());
  }

  /** As {@link #run(String[], PrintStream, PrintStream, Path)} with a given rule set (tests). */
  static int run(String[] args, PrintStream out, PrintStream err, Path workingDirectory,
      List<Rule> rules) {
    return run(args, out, err, workingDirectory, false, rules);
  }

  private static int run(String[] args, PrintStream out, PrintStream err, Path workingDirectory,
      boolean errIsTerminal, List<Rule> rules) {
    PrintWriter outWriter = new PrintWriter(new java.io.OutputStreamWriter(out, StandardCharsets.UTF_8), true);
    PrintWriter errWriter = new PrintWriter(new java.io.OutputStreamWriter(err, StandardCharsets.UTF_8), true);
    Environment env = new Environment(out, outWriter, err, errWriter, workingDirectory, errIsTerminal,
        List.copyOf(rules));
    CommandLine cli = new CommandLine(new PlumblineCommand(), new CommandFactory(env));
    cli.setOut(outWriter);
    cli.setErr(errWriter);
    cli.setParameterExceptionHandler((ex, a) -> {
      errWriter.println("plumbline: " + ex.getMessage() + " (see 'plumbline "
          + subcommandName(ex.getCommandLine()) + "--help')");
      return EXIT_USAGE;
    });
    cli.setExecutionExceptionHandler((ex, commandLine, parseResult) -> {
      if (ex instanceof UsageError u) {
        errWriter.println("plumbline: " + u.getMessage());
        return EXIT_USAGE;
      }
      errWriter.println("plumbline: internal error: " + ex);
      return EXIT_INCOMPLETE;
    });
    int code = cli.execute(args);
    outWriter.flush();
    errWriter.flush();
    return code;
  }

  private static String subcommandName(CommandLine cl) {
    return cl.getParent() == null ? "" : cl.getCommandName() + " ";
  }

  /** A problem with the command line or configuration: one line, exit code 2, no stack trace. */
  static final class UsageError extends RuntimeException {
    private static final long serialVersionUID = 1L;

    UsageError(String message) {
      super(message);
    }
  }

  /** Injected streams, working directory and the rules a scan runs, shared by the subcommands. */
  record Environment(PrintStream rawOut, PrintWriter out, PrintStream rawErr, PrintWriter err,
      Path workingDirectory, boolean errIsTerminal, List<Rule> rules) {}

  /** Creates subcommands with the environment injected. */
  private record CommandFactory(Environment env) implements CommandLine.IFactory {
    @Override
    public <K> K create(Class<K> cls) throws Exception {
      try {
        return cls.getDeclaredConstructor(Environment.class).newInstance(env);
      } catch (NoSuchMethodException e) {
        return CommandLine.defaultFactory().create(cls);
      }
    }
  }
}
