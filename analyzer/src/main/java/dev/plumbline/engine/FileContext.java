package dev.plumbline.engine;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.CallableDeclaration;
import com.github.javaparser.ast.body.InitializerDeclaration;
import com.github.javaparser.ast.expr.LambdaExpr;
import dev.plumbline.finding.Location;
import dev.plumbline.finding.SourceRange;
import dev.plumbline.flow.CfgBuilder;
import dev.plumbline.flow.ControlFlowGraph;
import dev.plumbline.model.ApiModel;
import dev.plumbline.parse.ParsedSource;
import dev.plumbline.parse.Subtrees;
import dev.plumbline.types.ExpressionTypes;
import dev.plumbline.types.ProjectIndex;
import dev.plumbline.types.SymbolTable;
import dev.plumbline.types.TypeResolver;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Everything known about one file during a scan: its tree, type facts, control-flow graphs and
 * the analyses computed on demand. Owned by one thread for the duration of the file's analysis;
 * results are memoized here (not in static caches) and dropped with the context.
 */
public final class FileContext {
  private final ParsedSource source;
  private final ProjectIndex project;
  private final ProjectFacts projectFacts;
  private final ExpressionTypes types;
  private final AnalysisSettings settings;
  private final Map<AnalysisKey<?>, Object> analyses = new HashMap<>();
  private List<ControlFlowGraph> graphs;

  public FileContext(ParsedSource source, ProjectIndex project, ProjectFacts projectFacts) {
    this(source, project, projectFacts, AnalysisSettings.DEFAULTS);
  }

  public FileContext(ParsedSource source, ProjectIndex project, ProjectFacts projectFacts,
      AnalysisSettings settings) {
    this.source = source;
    this.settings = settings;
    this.project = project;
    this.projectFacts = projectFacts;
    TypeResolver resolver = new TypeResolver(source.unit(), project.model(), project::hasType);
    this.types = new ExpressionTypes(new SymbolTable(source.unit(), resolver), project);
  }

  private FileContext(FileContext from) {
    this.source = from.source;
    this.settings = from.settings;
    this.project = from.project;
    this.projectFacts = from.projectFacts;
    this.types = from.types;
    this.graphs = from.graphs;
  }

  /**
   * A context for the same file that keeps its type facts and control-flow graphs, which do not
   * depend on project facts, and computes every analysis afresh: an analysis computed while the
   * project analyses were still filling the project facts may rest on partial facts.
   */
  public FileContext withFreshAnalyses() {
    return new FileContext(this);
  }

  public ParsedSource source() {
    return source;
  }

  public String uri() {
    return source.file().uri();
  }

  public ApiModel model() {
    return project.model();
  }

  public ProjectIndex project() {
    return project;
  }

  /** Project-wide facts computed before any file is analyzed (method summaries). */
  public ProjectFacts projectFacts() {
    return projectFacts;
  }

  /** The user's configuration as analyses may read it (test-data names, ...). */
  public AnalysisSettings settings() {
    return settings;
  }

  public ExpressionTypes types() {
    return types;
  }

  /** The analysis result for this file, computed on first request. */
  @SuppressWarnings("unchecked")
  public <T> T analysis(AnalysisKey<T> key) {
    Object result = analyses.get(key);
    if (result == null) {
      result = key.compute(this);
      analyses.put(key, result);
    }
    return (T) result;
  }

  /**
   * Control-flow graphs of every callable body in the file, in source order: methods,
   * constructors, initializers and block or expression lambdas.
   */
  public List<ControlFlowGraph> graphs() {
    if (graphs == null) {
      List<ControlFlowGraph> out = new ArrayList<>();
      Subtrees.walk(source.unit(), node -> {
        if (node instanceof CallableDeclaration<?> c) {
          out.add(CfgBuilder.of(c));
        } else if (node instanceof InitializerDeclaration i) {
          out.add(CfgBuilder.of(i));
        } else if (node instanceof LambdaExpr l) {
          out.add(CfgBuilder.of(l));
        }
      });
      graphs = Collections.unmodifiableList(out);
    }
    return graphs;
  }

  /** The report location of a node, with notebook lines mapped back. */
  public Location locationOf(Node node) {
    SourceRange r = SourceRange.of(node);
    int start = source.lineMap().reportedLine(r.startLine());
    int end = source.lineMap().reportedLine(r.endLine());
    return new Location(uri(), new SourceRange(start, r.startColumn(), end, r.endColumn()));
  }
}
