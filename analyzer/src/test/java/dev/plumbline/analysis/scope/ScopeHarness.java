package dev.plumbline.analysis.scope;

import dev.plumbline.discover.SourceFile;
import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.ProjectFacts;
import dev.plumbline.flow.AstText;
import dev.plumbline.flow.CfgNode;
import dev.plumbline.flow.ControlFlowGraph;
import dev.plumbline.flow.FlowResult;
import dev.plumbline.model.ApiModel;
import dev.plumbline.parse.LineMap;
import dev.plumbline.parse.ParsedSource;
import dev.plumbline.parse.SourceParser;
import dev.plumbline.types.ProjectIndex;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Collectors;

/** Analyzes Java snippets the way a scan does (summaries first), for tests and dumps. */
final class ScopeHarness {
  private static final ApiModel MODEL = ApiModel.loadDefault();

  private ScopeHarness() {}

  /** The file context of the last source, after project summaries over all sources. */
  static FileContext context(String... sources) {
    List<ParsedSource> parsed = new ArrayList<>();
    for (int i = 0; i < sources.length; i++) {
      SourceFile f = new SourceFile(Path.of("T" + i + ".java"), "T" + i + ".java");
      parsed.add(new SourceParser().parseText(f, sources[i], LineMap.IDENTITY, List.of()).parsed()
          .orElseThrow(() -> new IllegalArgumentException("snippet does not parse")));
    }
    ProjectIndex index = ProjectIndex.build(MODEL, parsed.stream().map(ParsedSource::unit).toList());
    ProjectFacts facts = new ProjectFacts();
    List<FileContext> contexts = parsed.stream().map(p -> new FileContext(p, index, facts)).toList();
    new ScopeSummaryAnalysis().compute(contexts, index, facts);
    return new FileContext(parsed.get(parsed.size() - 1), index, facts);
  }

  static ScopeFacts facts(String... sources) {
    return context(sources).analysis(ScopeAnalysis.KEY);
  }

  /** One line per evaluating node of the first method: line, code, and the state after it. */
  static String stateDump(FileContext file) {
    ControlFlowGraph g = file.graphs().get(0);
    FlowResult<ScopeState> r = ScopeAnalysis.solve(file, g).orElseThrow();
    StringBuilder out = new StringBuilder();
    for (CfgNode n : g.nodes()) {
      if (n.kind() == CfgNode.Kind.EVAL || n.kind() == CfgNode.Kind.FOREACH_NEXT) {
        ScopeState before = r.before(n);
        if (before == null) {
          continue;
        }
        ScopeState after = new ScopeAnalysis(file, g, ScopeAnalysis.EntryContext.NORMAL,
            file.projectFacts().get(ScopeSummaries.class)).transfer(n, before);
        out.append("L").append(n.ast().getBegin().map(p -> p.line).orElse(0)).append(' ')
            .append(AstText.abbreviate(n.ast())).append("  ").append(after).append('\n');
      }
    }
    return out.toString();
  }

  static String factsDump(ScopeFacts f) {
    StringBuilder out = new StringBuilder();
    for (ScopeFacts.Store s : f.stores()) {
      out.append("store ").append(s.kind()).append(" L").append(line(s.at())).append(' ')
          .append(s.holder().name()).append(" <- ").append(s.value()).append(' ').append(s.data())
          .append(" loops").append(s.loops().stream().map(l -> "L" + line(l)).collect(Collectors.toList()))
          .append('\n');
    }
    for (ScopeFacts.Allocation a : f.allocations()) {
      out.append("alloc L").append(line(a.call())).append(' ').append(AstText.abbreviate(a.call())).append(' ')
          .append(a.data()).append(f.released(a.call()) ? " released" : "").append(f.kept(a.call()) ? " kept" : "")
          .append('\n');
    }
    for (ScopeFacts.Opening o : f.openings()) {
      out.append("open ").append(o.scope()).append(" loops")
          .append(o.loops().stream().map(l -> "L" + line(l)).collect(Collectors.toList()))
          .append(f.closedAnywhere(o.scope()) ? " closed" : "").append(f.handedOff(o.scope()) ? " handed-off" : "")
          .append('\n');
    }
    for (ScopeFacts.DiscardedResult d : f.discardedResults()) {
      out.append("discard ").append(d.kind()).append(" L").append(line(d.call())).append(' ')
          .append(AstText.abbreviate(d.call())).append(' ').append(d.receiverData()).append('\n');
    }
    for (ScopeFacts.GraphOperation g : f.graphOperations()) {
      out.append("graph-op L").append(line(g.call())).append(' ').append(AstText.abbreviate(g.call())).append('\n');
    }
    return out.toString();
  }

  static int line(com.github.javaparser.ast.Node n) {
    return n.getBegin().map(p -> p.line).orElse(0);
  }
}
