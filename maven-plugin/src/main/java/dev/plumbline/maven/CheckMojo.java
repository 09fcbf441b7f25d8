package dev.plumbline.maven;

import dev.plumbline.engine.Scanner;
import dev.plumbline.finding.Finding;
import dev.plumbline.gate.ConfigException;
import dev.plumbline.gate.FailLevel;
import dev.plumbline.gate.QualityGate;
import dev.plumbline.model.ApiModel;
import dev.plumbline.report.ReportContext;
import dev.plumbline.report.SarifReport;
import dev.plumbline.report.TextReport;
import dev.plumbline.rules.BuiltInRules;
import java.io.File;
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
import org.apache.maven.plugin.AbstractMojo;
import org.apache.maven.plugin.MojoExecutionException;
import org.apache.maven.plugin.MojoFailureException;
import org.apache.maven.plugins.annotations.LifecyclePhase;
import org.apache.maven.plugins.annotations.Mojo;
import org.apache.maven.plugins.annotations.Parameter;
import org.apache.maven.project.MavenProject;

/**
 * Scans the project's Java sources as {@code plumbline scan} does (configuration, suppressions,
 * baseline, fail level) and fails the build on findings at or above the fail level. Writes a
 * SARIF report for code-scanning upload and prints the findings in the compiler style.
 *
 * <p>Report names, and so fingerprints and baselines, are relative to the project's base
 * directory, the same as running {@code plumbline scan} from that directory.
 */
@Mojo(name = "check", defaultPhase = LifecyclePhase.VERIFY, threadSafe = true)
public final class CheckMojo extends AbstractMojo {

  @Parameter(defaultValue = "${project}", readonly = true, required = true)
  private MavenProject project;

  /** Skip the check. */
  @Parameter(property = "plumbline.skip", defaultValue = "false")
  private boolean skip;

  /** error, warning, note or none; default: the configuration file's, else warning. */
  @Parameter(property = "plumbline.failOn")
  private String failOn;

  /** Configuration file (see docs/configuration.md); used when given. */
  @Parameter(property = "plumbline.config")
  private File config;

  /** Baseline file written by {@code plumbline baseline}; only findings not in it count. */
  @Parameter(property = "plumbline.baseline")
  private File baseline;

  /** Only scan files whose report name matches one of these globs (replaces the configuration's). */
  @Parameter
  private List<String> includes = new ArrayList<>();

  /** Skip files whose report name matches (added to the configuration's). */
  @Parameter
  private List<String> excludes = new ArrayList<>();

  /** Also scan the test sources. */
  @Parameter(property = "plumbline.includeTestSources", defaultValue = "false")
  private boolean includeTestSources;

  /** Where the SARIF report goes. */
  @Parameter(property = "plumbline.sarifFile", defaultValue = "${project.build.directory}/plumbline.sarif")
  private File sarifFile;

  /** Worker threads; default: the number of cores. */
  @Parameter(property = "plumbline.jobs")
  private Integer jobs;

  /** Fail the build when some source could not be analyzed (the command line's exit code 3). */
  @Parameter(property = "plumbline.failOnIncomplete", defaultValue = "true")
  private boolean failOnIncomplete;

  @Override
  public void execute() throws MojoExecutionException, MojoFailureException {
    if (skip) {
      getLog().info("plumbline: skipped");
      return;
    }
    List<Path> roots = new ArrayList<>();
    addExisting(roots, project.getCompileSourceRoots());
    if (includeTestSources) {
      addExisting(roots, project.getTestCompileSourceRoots());
    }
    if (roots.isEmpty()) {
      getLog().info("plumbline: no source folders to scan");
      return;
    }
    Optional<FailLevel> level = Optional.empty();
    if (failOn != null && !failOn.isBlank()) {
      level = FailLevel.parse(failOn.strip());
      if (level.isEmpty()) {
        throw new MojoExecutionException("plumbline: failOn must be error, warning, note or none; got '"
            + failOn + "'");
      }
    }
    int threads = jobs == null ? Runtime.getRuntime().availableProcessors() : jobs;
    if (threads < 1 || threads > 256) {
      throw new MojoExecutionException("plumbline: jobs must be between 1 and 256, got " + threads);
    }
    Path base = project.getBasedir().toPath();
    QualityGate.Options options = new QualityGate.Options(roots, base,
        existing(config, "config"), existing(baseline, "baseline"), level, includes, excludes, threads);
    QualityGate gate = new QualityGate(ApiModel.loadDefault(), BuiltInRules.all(),
        BuiltInRules.projectAnalyses(), Scanner.ScanListener.NONE);
    QualityGate.Outcome outcome;
    try {
      outcome = gate.run(options);
    } catch (ConfigException e) {
      throw new MojoExecutionException("plumbline: " + e.getMessage());
    }
    ReportContext ctx = new ReportContext(outcome.result(), BuiltInRules.messages(), base,
        version(), outcome.baseline());
    writeSarif(ctx);
    log(ctx, outcome);
    List<Finding> failing = outcome.failing();
    if (outcome.result().incomplete() && failOnIncomplete) {
      throw new MojoFailureException("plumbline: analysis incomplete: some sources could not be "
          + "analyzed (see the messages above); set plumbline.failOnIncomplete=false to allow it");
    }
    if (!failing.isEmpty()) {
      throw new MojoFailureException("plumbline: " + failing.size()
          + (failing.size() == 1 ? " finding" : " findings") + " at or above '"
          + outcome.failLevel().label() + "'; report: " + sarifFile);
    }
  }

  private void addExisting(List<Path> roots, List<String> folders) {
    for (String f : folders) {
      Path p = Path.of(f);
      if (Files.isDirectory(p)) {
        roots.add(p);
      }
    }
  }

  private static Optional<Path> existing(File file, String what) throws MojoExecutionException {
    if (file == null) {
      return Optional.empty();
    }
    if (!file.isFile()) {
      throw new MojoExecutionException("plumbline: " + what + " file not found: " + file);
    }
    return Optional.of(file.toPath());
  }

  private void writeSarif(ReportContext ctx) throws MojoExecutionException {
    Path target = sarifFile.toPath().toAbsolutePath();
    try {
      Files.createDirectories(target.getParent());
      Path tmp = Files.createTempFile(target.getParent(), ".plumbline-", ".tmp");
      try {
        Files.writeString(tmp, SarifReport.render(ctx), StandardCharsets.UTF_8);
        Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
      } finally {
        Files.deleteIfExists(tmp);
      }
    } catch (IOException e) {
      throw new MojoExecutionException("plumbline: cannot write " + target + ": " + e.getMessage(), e);
    }
  }

  /** The compiler-style report: as errors when the build fails on it, else as warnings. */
  private void log(ReportContext ctx, QualityGate.Outcome outcome) {
    StringWriter text = new StringWriter();
    TextReport.write(ctx, new PrintWriter(text));
    boolean failing = !outcome.failing().isEmpty() || outcome.result().incomplete();
    boolean any = outcome.result().findings().stream().anyMatch(f -> !f.isSuppressed())
        || !outcome.result().notifications().isEmpty();
    for (String line : text.toString().split("\n")) {
      if (failing) {
        getLog().error(line);
      } else if (any) {
        getLog().warn(line);
      } else {
        getLog().info("plumbline: " + line);
      }
    }
  }

  private static String version() {
    Package p = CheckMojo.class.getPackage();
    return p != null && p.getImplementationVersion() != null ? p.getImplementationVersion() : "unknown";
  }
}
