package dev.plumbline.analysis.provenance;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.plumbline.discover.SourceFile;
import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.ProjectFacts;
import dev.plumbline.flow.AstText;
import dev.plumbline.flow.CfgNode;
import dev.plumbline.flow.ControlFlowGraph;
import dev.plumbline.flow.FlowResult;
import dev.plumbline.flow.ForwardSolver;
import dev.plumbline.model.ApiModel;
import dev.plumbline.parse.LineMap;
import dev.plumbline.parse.ParsedSource;
import dev.plumbline.parse.SourceParser;
import dev.plumbline.types.ProjectIndex;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Golden per-statement dumps of the provenance analysis: the store before each node of the first
 * file's methods, after the project's summaries are computed from all given files. Lines read
 * "id KIND Lline code {variable=KIND[roles][lineages]}".
 */
class ProvenanceDumpTest {
  private static final ApiModel MODEL = ApiModel.loadDefault();

  static String dump(String... sources) {
    SourceParser parser = new SourceParser();
    List<ParsedSource> parsed = new ArrayList<>();
    for (int i = 0; i < sources.length; i++) {
      SourceFile file = new SourceFile(Path.of("F" + i + ".java"), "F" + i + ".java");
      parsed.add(parser.parseText(file, sources[i], LineMap.IDENTITY, List.of()).parsed().orElseThrow());
    }
    ProjectIndex index = ProjectIndex.build(MODEL, parsed.stream().map(ParsedSource::unit).toList());
    ProjectFacts facts = new ProjectFacts();
    List<FileContext> contexts = parsed.stream().map(p -> new FileContext(p, index, facts)).toList();
    new ProvenanceSummarizer().compute(contexts, index, facts);
    FileContext first = new FileContext(parsed.get(0), index, facts);
    StringBuilder out = new StringBuilder();
    for (ControlFlowGraph g : first.graphs()) {
      out.append("== ").append(AstText.abbreviate(g.callable()).replaceAll("\\{.*", "").trim()).append('\n');
      FlowResult<ProvenanceState> result =
          ForwardSolver.solve(g, new ProvenanceAnalysis(first, g, ProvenanceAnalysis.Mode.REPORT));
      for (CfgNode n : g.nodes()) {
        if (n.kind() != CfgNode.Kind.EVAL && n.kind() != CfgNode.Kind.EXIT) {
          continue;
        }
        out.append(n.id()).append(' ').append(n.kind());
        if (n.kind() == CfgNode.Kind.EVAL) {
          out.append(" L").append(n.ast().getBegin().map(p -> p.line).orElse(0))
              .append(' ').append(AstText.abbreviate(n.ast()));
        }
        out.append(' ').append(result.before(n)).append('\n');
      }
    }
    return out.toString();
  }

  @Test
  void helperReturningTheTestPartAndAFieldHoldingIt() {
    String user = """
        import org.nd4j.linalg.dataset.DataSet;
        class User {
          private DataSet kept;
          void load(DataSet all) {
            DataSet t = Parts.testOf(all);
            kept = t;
          }
          void use() {
            DataSet copy = kept.copy();
          }
        }
        """;
    String helper = """
        import org.nd4j.linalg.dataset.DataSet;
        class Parts {
          static DataSet testOf(DataSet rows) {
            return rows.splitTestAndTrain(0.8).getTest();
          }
        }
        """;
    assertEquals("""
        == void load(DataSet all)
        1 EVAL L5 DataSet t = Parts.testOf(all); {}
        2 EVAL L6 kept = t; {t=DATA[TEST][all@4:13]}
        3 EXIT {kept=DATA[TEST][all@4:13], t=DATA[TEST][all@4:13]}
        == void use()
        1 EVAL L9 DataSet copy = kept.copy(); {}
        2 EXIT {copy=DATA[TEST][this.kept@3:19]}
        """, dump(user, helper));
  }

  @Test
  void collectionsTernariesAndNamedSources() {
    String source = """
        import java.util.ArrayList;
        import java.util.List;
        import org.nd4j.linalg.dataset.DataSet;
        import org.nd4j.linalg.dataset.SplitTestAndTrain;
        import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
        class C {
          void run(DataSet all, DataSetIterator source, boolean quick) {
            SplitTestAndTrain s = all.splitTestAndTrain(0.8);
            List<DataSet> pool = new ArrayList<>();
            pool.add(s.getTrain());
            pool.add(quick ? s.getTest() : s.getTrain());
            DataSet first = pool.get(0);
            DataSetIterator holdoutBatches = source;
            DataSet validationRows = source.next();
          }
        }
        """;
    // Names only label rows that enter from an unknown source: an alias of a parameter and rows
    // read from it keep the parameter's (whole) rows whatever the variable is called.
    assertEquals("""
        == void run(DataSet all, DataSetIterator source, boolean qui...
        1 EVAL L8 SplitTestAndTrain s = all.splitTestAndTrain(0.8); {}
        2 EVAL L9 List<DataSet> pool = new ArrayList<>(); {s=SPLIT_HOLDER[WHOLE][all@7:12]}
        3 EVAL L10 pool.add(s.getTrain()); {s=SPLIT_HOLDER[WHOLE][all@7:12]}
        4 EVAL L11 pool.add(quick ? s.getTest() : s.getTrain()); \
        {s=SPLIT_HOLDER[WHOLE][all@7:12], pool=DATA[TRAIN][all@7:12]}
        5 EVAL L12 DataSet first = pool.get(0); \
        {s=SPLIT_HOLDER[WHOLE][all@7:12], pool=DATA[TRAIN, TEST][all@7:12]}
        6 EVAL L13 DataSetIterator holdoutBatches = source; \
        {s=SPLIT_HOLDER[WHOLE][all@7:12], pool=DATA[TRAIN, TEST][all@7:12], \
        first=DATA[TRAIN, TEST][all@7:12]}
        7 EVAL L14 DataSet validationRows = source.next(); \
        {s=SPLIT_HOLDER[WHOLE][all@7:12], pool=DATA[TRAIN, TEST][all@7:12], \
        first=DATA[TRAIN, TEST][all@7:12], holdoutBatches=DATA[WHOLE][source@7:25]}
        8 EXIT {s=SPLIT_HOLDER[WHOLE][all@7:12], pool=DATA[TRAIN, TEST][all@7:12], \
        first=DATA[TRAIN, TEST][all@7:12], holdoutBatches=DATA[WHOLE][source@7:25], \
        validationRows=DATA[WHOLE][source@7:25]}
        """, dump(source));
  }
}
