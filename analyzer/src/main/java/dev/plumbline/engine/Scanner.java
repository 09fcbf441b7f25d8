package dev.plumbline.engine;

import com.github.javaparser.ast.CompilationUnit;
import dev.plumbline.analysis.entrypoints.CallableSummary;
import dev.plumbline.analysis.entrypoints.EntryPointAnalysis;
import dev.plumbline.analysis.entrypoints.TrainingEntryPoint;
import dev.plumbline.analysis.rowcount.RowCountSummaries;
import dev.plumbline.discover.Discovery;
import dev.plumbline.finding.Finding;
import dev.plumbline.finding.Location;
import dev.plumbline.finding.Message;
import dev.plumbline.finding.Notification;
import dev.plumbline.finding.RelatedLocation;
import dev.plumbline.finding.Severity;
import dev.plumbline.finding.SourceRange;
import dev.plumbline.model.ApiModel;
import dev.plumbline.parse.NotebookLayout;
import dev.plumbline.parse.ParsedSource;
import dev.plumbline.parse.SourceParser;
import dev.plumbline.types.ProjectIndex;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;
import java.util.TreeMap;
import java.util.concurrent.Callable;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.FutureTask;
import java.util.concurrent.ThreadFactory;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.BiFunction;
import java.util.function.Function;
import java.util.stream.IntStream;

/**
 * Runs the pipeline: discover, parse (in parallel), index the project, project-wide analyses,
 * then rules per file (in parallel), and returns sorted findings and notifications.
 *
 * <p>Failures are data: an unreadable or unparsable file, or a rule that throws on one file,
 * becomes a notification and the rest of the scan completes. Output does not depend on the
 * number of threads: every parallel stage's results are sorted before use.
 *
 * <p>The scanned code is only read and parsed; nothing is compiled, loaded or run.
 */
public final class Scanner {
  /** Analysis threads get a large stack so deeply nested code cannot overflow it. */
  static final long WORKER_STACK_BYTES = 512L * 1024 * 1024;

  private final ApiModel model;
  private final List<Rule> rules;
  private final List<ProjectAnalysis> projectAnalyses;
  private final ScanListener listener;
  private final boolean audit;
  private final FileStage fileStage;

  /**
   * Work on one file's findings while the file's context is at hand, on the file's worker thread
   * (marking suppressed findings, for instance). Returns the findings to keep, in the same order.
   */
  public interface FileStage {
    FileStage NONE = (file, findings) -> findings;

    List<Finding> apply(FileContext file, List<Finding> findings);
  }

  /** Progress callbacks (for a progress display); calls may come from several threads. */
  public interface ScanListener {
    ScanListener NONE = new ScanListener() {};

    default void discovered(int files) {}

    default void fileDone(String uri) {}
  }

  public Scanner(ApiModel model, List<Rule> rules, List<ProjectAnalysis> projectAnalyses,
      ScanListener listener) {
    this(model, rules, projectAnalyses, listener, false, FileStage.NONE);
  }

  private Scanner(ApiModel model, List<Rule> rules, List<ProjectAnalysis> projectAnalyses,
      ScanListener listener, boolean audit, FileStage fileStage) {
    this.model = model;
    this.rules = rules.stream()
        .sorted(Comparator.comparing(r -> r.descriptor().id()))
        .toList();
    this.projectAnalyses = List.copyOf(projectAnalyses);
    this.listener = listener;
    this.audit = audit;
    this.fileStage = fileStage;
  }

  /**
   * The same scan, also finding training entry points and their evaluations (with row counts)
   * for the audit report: {@link ScanResult#entryPoints()}. Costs a summary pass over the
   * project's methods and a walk of each file's calls.
   */
  public Scanner withAudit() {
    return new Scanner(model, rules, projectAnalyses, listener, true, fileStage);
  }

  /** The same scan, passing each file's findings through {@code stage}. */
  public Scanner withFileStage(FileStage stage) {
    return new Scanner(model, rules, projectAnalyses, listener, audit, stage);
  }

  public Scanner(ApiModel model, List<Rule> rules) {
    this(model, rules, List.of(), ScanListener.NONE);
  }

  /**
   * Scans and returns sorted findings and notifications. Never throws for anything in the input:
   * problems with files, rules or analyses come back as notifications. The work runs on threads
   * with a {@linkplain #WORKER_STACK_BYTES large stack}, never on the caller's, so deeply nested
   * code cannot overflow the caller's stack.
   */
  public ScanResult scan(ScanRequest request) {
    return onLargeStack(() -> run(request));
  }

  private ScanResult run(ScanRequest request) {
    Discovery discovery = new Discovery(new Discovery.Options(request.baseDirectory(),
        request.includes(), request.excludes(), true));
    Discovery.Result found = discovery.discover(request.paths());
    listener.discovered(found.files().size());
    List<Notification> notes = new ArrayList<>(found.notifications());

    ExecutorService pool = Executors.newFixedThreadPool(request.jobs(), workerThreads());
    try {
      PhaseLog.Mark phase = PhaseLog.start();
      SourceParser parser = new SourceParser();
      List<SourceParser.Outcome> outcomes = parallel(pool, found.files(), parser::parse,
          (file, e) -> new SourceParser.Outcome(Optional.empty(), List.of(fileFailure(
              "notification.parse-crash", file.uri(), e.getClass().getSimpleName()))));
      List<ParsedSource> parsed = new ArrayList<>();
      for (SourceParser.Outcome o : outcomes) {
        notes.addAll(o.notifications());
        o.parsed().ifPresent(parsed::add);
      }
      List<CompilationUnit> units = parsed.stream().map(ParsedSource::unit).toList();
      phase = PhaseLog.lap("parse", phase);
      ProjectIndex index = indexProject(pool, units);
      phase = PhaseLog.lap("index", phase);
      ProjectFacts facts = new ProjectFacts();
      List<ProjectAnalysis> analyses = new ArrayList<>(projectAnalyses);
      if (audit) {
        analyses.add(new RowCountSummaries());
      }
      List<FileContext> contexts =
          runProjectAnalyses(pool, analyses, parsed, index, facts, request, notes);
      phase = PhaseLog.lap("project analyses, in all", phase);
      List<Integer> order = IntStream.range(0, parsed.size()).boxed().toList();
      List<FileOutcome> perFile = parallel(pool, order,
          i -> checkFile(contexts.get(i) != null ? contexts.get(i).withFreshAnalyses()
              : new FileContext(parsed.get(i), index, facts, request.settings())),
          (i, e) -> new FileOutcome(List.of(), List.of(fileFailure("notification.file-analysis-failed",
              parsed.get(i).file().uri(), describe(e))), List.of(), lineCount(parsed.get(i).text())));
      phase = PhaseLog.lap("rules per file", phase);
      List<Finding> findings = new ArrayList<>();
      List<CallableSummary> callables = new ArrayList<>();
      Map<String, String> sources = new TreeMap<>();
      Map<String, NotebookLayout> notebooks = new TreeMap<>();
      long lines = 0;
      for (int i = 0; i < parsed.size(); i++) {
        FileOutcome fo = perFile.get(i);
        ParsedSource source = parsed.get(i);
        findings.addAll(fo.findings());
        notes.addAll(fo.notifications());
        callables.addAll(fo.callables());
        if (source.lineMap() instanceof NotebookLayout layout) {
          notebooks.put(source.file().uri(), layout);
        }
        if (!fo.findings().isEmpty()) {
          sources.put(source.file().uri(), source.lineMap() instanceof NotebookLayout layout
              ? layout.reportedText() : source.text());
        }
        lines += fo.lines();
      }
      findings.sort(Finding.ORDER);
      notes.sort(Notification.ORDER);
      List<TrainingEntryPoint> entryPoints = audit ? EntryPointAnalysis.link(callables) : List.of();
      return new ScanResult(findings, notes, rules.stream().map(Rule::descriptor).toList(),
          found.files().size(), parsed.size(), lines, sources, notebooks, entryPoints);
    } finally {
      pool.shutdownNow();
    }
  }

  /** {@link ProjectIndex#build}, with each unit's part done on the pool. */
  private ProjectIndex indexProject(ExecutorService pool, List<CompilationUnit> units) {
    Set<String> typeNames = new HashSet<>();
    Workers workers = onPool(pool);
    workers.map(units, ProjectIndex::declaredTypeNames).forEach(typeNames::addAll);
    return ProjectIndex.of(model, workers.map(units,
        unit -> ProjectIndex.declaredTypes(model, unit, typeNames)), typeNames);
  }

  /**
   * Runs the project analyses and returns the contexts they used, one per parsed file (null
   * where a context could not be made), so that rules reuse their type facts and graphs.
   */
  private List<FileContext> runProjectAnalyses(ExecutorService pool, List<ProjectAnalysis> analyses,
      List<ParsedSource> parsed, ProjectIndex index, ProjectFacts facts, ScanRequest request,
      List<Notification> notes) {
    PhaseLog.Mark contextsStart = PhaseLog.start();
    List<FileContext> contexts = parallel(pool, parsed, p -> {
      FileContext context = new FileContext(p, index, facts, request.settings());
      context.graphs(); // built here in parallel, before analyses that visit every file in turn
      return context;
    }, (p, e) -> null);
    PhaseLog.lap("contexts and graphs", contextsStart);
    if (analyses.isEmpty()) {
      return contexts;
    }
    List<FileContext> usable = contexts.stream().filter(Objects::nonNull).toList();
    Workers workers = onPool(pool);
    for (ProjectAnalysis pa : analyses) {
      try {
        PhaseLog.Mark analysisStart = PhaseLog.start();
        pa.compute(usable, index, facts, workers);
        PhaseLog.lap("  " + pa.getClass().getSimpleName(), analysisStart);
      } catch (RuntimeException | Error e) {
        notes.add(new Notification(Severity.ERROR, Message.of("notification.project-analysis-failed",
            pa.getClass().getSimpleName(), describe(e)), Optional.empty(), true));
      }
    }
    return contexts;
  }

  /**
   * Workers for project analyses on the scan's pool. Called from the scan thread, never from a
   * pool thread, so waiting for the items cannot starve the pool.
   */
  private static Workers onPool(ExecutorService pool) {
    return new Workers() {
      @Override
      public <I, O> List<O> map(List<I> inputs, Function<I, O> work) {
        if (inputs.size() < 2) {
          return Workers.SEQUENTIAL.map(inputs, work);
        }
        List<Future<O>> futures = new ArrayList<>(inputs.size());
        for (I input : inputs) {
          futures.add(pool.submit(() -> work.apply(input)));
        }
        List<O> out = new ArrayList<>(inputs.size());
        Throwable first = null;
        for (Future<O> f : futures) {
          try {
            out.add(f.get());
          } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("scan interrupted", e);
          } catch (ExecutionException e) {
            if (first == null) {
              first = e.getCause();
            }
            out.add(null);
          }
        }
        if (first instanceof RuntimeException r) {
          throw r;
        }
        if (first instanceof Error err) {
          throw err;
        }
        if (first != null) {
          throw new IllegalStateException(first);
        }
        return out;
      }
    };
  }

  private record FileOutcome(List<Finding> findings, List<Notification> notifications,
      List<CallableSummary> callables, long lines) {}

  /**
   * Runs every rule on one file. A rule that throws (or whose analysis throws) loses its own
   * findings for this file and becomes a notification naming rule and file; the other rules'
   * findings stay. Findings are located and fingerprinted rule by rule, inside the same guard.
   */
  private FileOutcome checkFile(FileContext file) {
    List<Finding> findings = new ArrayList<>();
    List<Notification> notes = new ArrayList<>();
    for (Rule rule : rules) {
      List<FindingReporter.Report> fromRule = new ArrayList<>();
      try {
        rule.check(file, fromRule::add);
        findings.addAll(toFindings(file, fromRule));
      } catch (RuntimeException | Error e) {
        notes.add(new Notification(Severity.ERROR,
            Message.of("notification.rule-failed", rule.descriptor().id(), file.uri(), describe(e)),
            Optional.of(new Location(file.uri(), new SourceRange(1, 1, 1, 1))), true));
      }
    }
    try {
      findings = new ArrayList<>(fileStage.apply(file, findings));
    } catch (RuntimeException | StackOverflowError e) {
      notes.add(fileFailure("notification.file-stage-failed", file.uri(), describe(e)));
    }
    List<CallableSummary> callables = List.of();
    if (audit) {
      try {
        callables = EntryPointAnalysis.summarize(file);
      } catch (RuntimeException | StackOverflowError e) {
        notes.add(new Notification(Severity.WARNING,
            Message.of("notification.audit-failed", file.uri(), describe(e)),
            Optional.of(new Location(file.uri(), new dev.plumbline.finding.SourceRange(1, 1, 1, 1))),
            false));
      }
    }
    listener.fileDone(file.uri());
    return new FileOutcome(findings, notes, callables, lineCount(file.source().text()));
  }

  /** As {@code text.lines().count()}, without making a string of each line. */
  static long lineCount(String text) {
    long count = 0;
    int n = text.length();
    int i = 0;
    while (i < n) {
      count++;
      while (i < n && text.charAt(i) != '\n' && text.charAt(i) != '\r') {
        i++;
      }
      if (i < n) {
        i += text.charAt(i) == '\r' && i + 1 < n && text.charAt(i + 1) == '\n' ? 2 : 1;
      }
    }
    return count;
  }

  private static Notification fileFailure(String key, String uri, String detail) {
    return new Notification(Severity.ERROR, Message.of(key, uri, detail),
        Optional.of(new Location(uri, new SourceRange(1, 1, 1, 1))), true);
  }

  /** Locates and fingerprints reports, in a deterministic order, dropping exact duplicates. */
  private static List<Finding> toFindings(FileContext file, List<FindingReporter.Report> reports) {
    if (reports.isEmpty()) {
      return List.of();
    }
    List<FindingReporter.Report> sorted = new ArrayList<>(reports);
    sorted.sort(Comparator
        .comparing((FindingReporter.Report r) -> file.locationOf(r.node()))
        .thenComparing(r -> r.rule().id())
        .thenComparing(r -> r.message().key())
        .thenComparing(r -> String.join("\u0000", r.message().arguments())));
    Fingerprints fingerprints = new Fingerprints();
    List<Finding> out = new ArrayList<>();
    FindingReporter.Report previous = null;
    for (FindingReporter.Report r : sorted) {
      if (previous != null && previous.node() == r.node() && previous.rule().id().equals(r.rule().id())
          && previous.message().equals(r.message())) {
        continue; // two paths to the same defect: report it once
      }
      previous = r;
      List<RelatedLocation> related = r.related().stream()
          .map(rel -> new RelatedLocation(file.locationOf(rel.node()), rel.message()))
          .toList();
      out.add(new Finding(r.rule().id(), r.severity().orElse(r.rule().defaultSeverity()),
          file.locationOf(r.node()), r.message(), related, r.fixHint(), r.fix(),
          fingerprints.next(r.rule().id(), file.uri(), r.node()), Optional.empty(), r.involved()));
    }
    return out;
  }

  private static String describe(Throwable e) {
    String msg = e.getMessage();
    return e.getClass().getSimpleName() + (msg == null ? "" : ": " + firstLine(msg));
  }

  private static String firstLine(String s) {
    int nl = s.indexOf('\n');
    return nl < 0 ? s : s.substring(0, nl);
  }

  /**
   * Applies {@code work} to every input on the pool and returns the results in input order, so
   * later stages never see thread scheduling. A work item that throws is answered by
   * {@code onFailure} instead: one file's failure never ends the scan.
   */
  private static <I, O> List<O> parallel(ExecutorService pool, List<I> inputs, Function<I, O> work,
      BiFunction<I, Throwable, O> onFailure) {
    List<Future<O>> futures = new ArrayList<>();
    for (I input : inputs) {
      futures.add(pool.submit(() -> {
        try {
          return work.apply(input);
        } catch (RuntimeException | Error e) {
          return onFailure.apply(input, e);
        }
      }));
    }
    List<O> out = new ArrayList<>();
    for (Future<O> f : futures) {
      out.add(await(f));
    }
    return out;
  }

  private static <O> O await(Future<O> f) {
    try {
      return f.get();
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException("scan interrupted", e);
    } catch (ExecutionException e) {
      // Work items answer their own failures; reaching here is a bug in the engine itself.
      throw new IllegalStateException("internal error in a scan worker", e.getCause());
    }
  }

  /** Runs {@code work} on a fresh thread with a large stack and waits for it. */
  private static <O> O onLargeStack(Callable<O> work) {
    FutureTask<O> task = new FutureTask<>(work);
    Thread thread = new Thread(null, task, "plumbline-scan", WORKER_STACK_BYTES);
    thread.setDaemon(true);
    thread.start();
    try {
      return task.get();
    } catch (InterruptedException e) {
      thread.interrupt();
      Thread.currentThread().interrupt();
      throw new IllegalStateException("scan interrupted", e);
    } catch (ExecutionException e) {
      Throwable cause = e.getCause();
      if (cause instanceof RuntimeException r) {
        throw r;
      }
      if (cause instanceof Error err) {
        throw err;
      }
      throw new IllegalStateException("internal error in the scan", cause);
    }
  }

  private static ThreadFactory workerThreads() {
    AtomicInteger n = new AtomicInteger();
    return r -> {
      Thread t = new Thread(null, r, "plumbline-worker-" + n.incrementAndGet(), WORKER_STACK_BYTES);
      t.setDaemon(true);
      return t;
    };
  }
}
