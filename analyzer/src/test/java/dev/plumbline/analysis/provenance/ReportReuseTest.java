package dev.plumbline.analysis.provenance;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.github.javaparser.ast.body.MethodDeclaration;
import com.github.javaparser.ast.body.VariableDeclarator;
import dev.plumbline.discover.SourceFile;
import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.ProjectFacts;
import dev.plumbline.flow.ControlFlowGraph;
import dev.plumbline.model.ApiModel;
import dev.plumbline.parse.LineMap;
import dev.plumbline.parse.ParsedSource;
import dev.plumbline.parse.SourceParser;
import dev.plumbline.types.ProjectIndex;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Set;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * The per-file analysis takes a method's facts from the summarizer instead of solving it again
 * ({@link ProvenanceSummaries#takeReportOf}) only where that changes nothing. The reference is the
 * report-mode solution of every graph.
 */
class ReportReuseTest {
  private static final ApiModel MODEL = ApiModel.loadDefault();

  private record Project(List<FileContext> contexts, ProvenanceSummaries summaries) {}

  private static Project summarize(List<ParsedSource> parsed) {
    ProjectIndex index = ProjectIndex.build(MODEL, parsed.stream().map(ParsedSource::unit).toList());
    ProjectFacts facts = new ProjectFacts();
    List<FileContext> contexts = parsed.stream().map(p -> new FileContext(p, index, facts)).toList();
    new ProvenanceSummarizer().compute(contexts, index, facts);
    return new Project(contexts, facts.get(ProvenanceSummaries.class));
  }

  private static ParsedSource parse(String name, String text) {
    return new SourceParser().parseText(new SourceFile(Path.of(name), name), text, LineMap.IDENTITY,
        List.of()).parsed().orElseThrow();
  }

  /** Every graph solved in report mode, none taken from the summarizer. */
  private static ProvenanceFacts solvedAfresh(FileContext file) {
    ProvenanceFacts facts = new ProvenanceFacts();
    for (ControlFlowGraph g : file.graphs()) {
      ProvenanceAnalysis.analyzeGraph(file, g, ProvenanceAnalysis.Mode.REPORT, facts);
    }
    return facts;
  }

  private static void assertSameFacts(ProvenanceFacts expected, ProvenanceFacts actual, String where) {
    assertEquals(expected.partBindings(), actual.partBindings(), where);
    assertEquals(expected.fits(), actual.fits(), where);
    assertEquals(expected.uses(), actual.uses(), where);
    assertEquals(expected.splits(), actual.splits(), where);
    assertEquals(expected.statisticUses(), actual.statisticUses(), where);
    assertEquals(expected.trains(), actual.trains(), where);
    assertEquals(expected.evaluations(), actual.evaluations(), where);
    assertEquals(expected.shuffles(), actual.shuffles(), where);
    assertEquals(expected.fieldWrites(), actual.fieldWrites(), where);
    assertEquals(expected.returns(), actual.returns(), where);
    assertEquals(expected.fieldSummariesRead(), actual.fieldSummariesRead(), where);
  }

  @Test
  void theCorpusFactsAreTheSameWithAndWithoutReuse() throws IOException {
    List<Path> files = new ArrayList<>();
    for (String root : List.of("../test-corpus/src/main/java", "../test-corpus/demo-project")) {
      try (Stream<Path> walk = Files.walk(Path.of(root))) {
        walk.filter(p -> p.toString().endsWith(".java")).sorted().forEach(files::add);
      }
    }
    List<ParsedSource> parsed = new ArrayList<>();
    for (Path f : files) {
      parsed.add(parse(f.toString(), Files.readString(f, StandardCharsets.UTF_8)));
    }
    Project project = summarize(parsed);
    int reused = 0;
    int graphs = 0;
    int factsReused = 0;
    for (FileContext file : project.contexts()) {
      for (ControlFlowGraph g : file.graphs()) {
        graphs++;
        ProvenanceFacts known = project.summaries().peekReportOf(g);
        if (known != null) {
          reused++;
          factsReused += known.fits().size() + known.splits().size() + known.uses().size()
              + known.evaluations().size() + known.partBindings().size() + known.returns().size();
        }
      }
      ProvenanceFacts withReuse = ProvenanceAnalysis.analyzeFile(file.withFreshAnalyses());
      ProvenanceFacts afresh = solvedAfresh(file.withFreshAnalyses());
      assertSameFacts(afresh, withReuse, file.uri());
      for (ControlFlowGraph g : file.graphs()) {
        assertNull(project.summaries().peekReportOf(g), "handed out once");
      }
      // Once taken, a second analysis of the file solves again, to the same facts.
      assertSameFacts(afresh, ProvenanceAnalysis.analyzeFile(file.withFreshAnalyses()), file.uri());
    }
    // The comparison means something only if reuse happens, and on methods with facts.
    assertTrue(reused > graphs / 5, reused + " of " + graphs + " graphs reused");
    assertTrue(factsReused > 50, "facts in reused graphs: " + factsReused);
  }

  @Test
  void aMethodReadingItsCallersRowsIsSolvedAgainAndOneThatDoesNotIsNot() {
    ParsedSource source = parse("Trainer.java", """
        import org.nd4j.linalg.dataset.DataSet;
        import org.nd4j.linalg.dataset.SplitTestAndTrain;
        import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;
        class Trainer {
          void prepare(DataSet all) {
            NormalizerStandardize norm = new NormalizerStandardize();
            norm.fit(all);
            SplitTestAndTrain parts = all.splitTestAndTrain(0.8);
          }
          void own(String path) {
            DataSet all = new DataSet();
            NormalizerStandardize norm = new NormalizerStandardize();
            norm.fit(all);
            SplitTestAndTrain parts = all.splitTestAndTrain(0.8);
          }
        }
        """);
    Project project = summarize(List.of(source));
    FileContext file = project.contexts().get(0);
    for (ControlFlowGraph g : file.graphs()) {
      String name = ((MethodDeclaration) g.callable()).getNameAsString();
      if (name.equals("prepare")) {
        assertNull(project.summaries().peekReportOf(g), name);
      } else {
        ProvenanceFacts known = project.summaries().peekReportOf(g);
        assertNotNull(known, name);
        assertEquals(1, known.fits().size());
        assertEquals(1, known.splits().size());
      }
    }
  }

  @Test
  void aSummaryThatChangedAfterItWasReadVoidsTheSolution() {
    ParsedSource source = parse("Holder.java", """
        import org.nd4j.linalg.dataset.DataSet;
        class Holder {
          private DataSet rows;
          void keep() {}
        }
        """);
    Project project = summarize(List.of(source));
    VariableDeclarator field = source.unit().findFirst(VariableDeclarator.class).orElseThrow();
    MethodDeclaration method = source.unit().findFirst(MethodDeclaration.class).orElseThrow();
    ProvenanceSummaries now = project.summaries();
    ProvenanceSummaries.FieldSummary before = new ProvenanceSummaries.FieldSummary(
        EnumSet.of(Role.TRAIN), Set.of(), Set.of(), Set.of());
    ProvenanceSummaries.FieldSummary after = new ProvenanceSummaries.FieldSummary(
        EnumSet.of(Role.TEST), Set.of(), Set.of(), Set.of());

    SummaryReads reads = new SummaryReads();
    reads.field(field, now.field(field));
    reads.method(method, now.method(method));
    assertTrue(reads.stillHold(now), "read what is there");

    now.putField(field, before);
    SummaryReads stale = new SummaryReads();
    stale.field(field, now.field(field));
    now.putField(field, after);
    assertFalse(stale.stillHold(now), "the field's summary changed after the read");

    SummaryReads changing = new SummaryReads();
    changing.field(field, before);
    changing.field(field, after);
    assertFalse(changing.stillHold(now), "two reads saw two summaries");

    SummaryReads methodRead = new SummaryReads();
    methodRead.method(method, ProvenanceSummaries.MethodSummary.PENDING);
    assertFalse(methodRead.stillHold(now), "read while its cycle was being solved");
  }
}
