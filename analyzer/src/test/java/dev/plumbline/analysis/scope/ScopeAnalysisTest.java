package dev.plumbline.analysis.scope;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.github.javaparser.ast.body.MethodDeclaration;
import dev.plumbline.engine.FileContext;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;

/** The scope analysis on small snippets: a per-statement dump, published facts, and summaries. */
class ScopeAnalysisTest {
  private static final String IMPORTS = """
      import ai.djl.ndarray.*;
      import ai.djl.ndarray.types.Shape;
      import ai.djl.nn.Block;
      import ai.djl.training.*;
      import ai.djl.training.dataset.*;
      import java.util.*;
      import org.nd4j.linalg.api.memory.MemoryWorkspace;
      import org.nd4j.linalg.api.ndarray.INDArray;
      import org.nd4j.linalg.factory.Nd4j;
      """;

  private static String cls(String body) {
    return IMPORTS + "class T {\n" + body + "\n}\n";
  }

  @Test
  void perStatementDumpOfATrainingLoop() {
    FileContext file = ScopeHarness.context(cls("""
          void train(Trainer trainer, Dataset data, NDManager manager) throws Exception {
            NDArray total = manager.zeros(new Shape());
            for (Batch batch : trainer.iterateDataset(data)) {
              try (GradientCollector gc = trainer.newGradientCollector()) {
                NDArray loss = trainer.getLoss().evaluate(batch.getLabels(), trainer.forward(batch.getData()));
                gc.backward(loss);
                total = total.add(loss);
              }
              NDArray after = total.mul(2f);
              batch.close();
            }
          }"""));
    assertEquals("""
        L12 NDArray total = manager.zeros(new Shape());  {total=tensor(DETACHED) in{manager:manager} new[12:19]}
        L13 trainer.iterateDataset(data)  {total=tensor(DETACHED) in{manager:manager} new[12:19]}
        L13 for (Batch batch : trainer.iterateDataset(data))  {total=tensor(ATTACHED|DETACHED) in{manager:manager} new[12:19, 17:15], batch=handle in{batch:batch}, gc=handle in{autograd:gc}, loss=tensor(ATTACHED) in{batch:batch} new[15:22], after=tensor(DETACHED) in{manager:manager} new[19:21]}
        L14 GradientCollector gc = trainer.newGradientCollector()  {total=tensor(ATTACHED|DETACHED) in{manager:manager} new[12:19, 17:15], batch=handle in{batch:batch}, gc=handle in{autograd:gc}, loss=tensor(ATTACHED) in{batch:batch} new[15:22], after=tensor(DETACHED) in{manager:manager} new[19:21]}
        L15 NDArray loss = trainer.getLoss().evaluate(batch.getLabels...  {total=tensor(ATTACHED|DETACHED) in{manager:manager} new[12:19, 17:15], batch=handle in{batch:batch}, gc=handle in{autograd:gc}, loss=tensor(ATTACHED) in{batch:batch} new[15:22], after=tensor(DETACHED) in{manager:manager} new[19:21]}
        L16 gc.backward(loss);  {total=tensor(ATTACHED|DETACHED) in{manager:manager} new[12:19, 17:15], batch=handle in{batch:batch}, gc=handle in{autograd:gc}, loss=tensor(ATTACHED) in{batch:batch} new[15:22], after=tensor(DETACHED) in{manager:manager} new[19:21]}
        L17 total = total.add(loss);  {total=tensor(ATTACHED) in{manager:manager} new[17:15], batch=handle in{batch:batch}, gc=handle in{autograd:gc}, loss=tensor(ATTACHED) in{batch:batch} new[15:22], after=tensor(DETACHED) in{manager:manager} new[19:21]}
        L19 NDArray after = total.mul(2f);  {total=tensor(ATTACHED) in{manager:manager} new[17:15], batch=handle in{batch:batch}, gc=handle in{autograd:gc}, loss=tensor(ATTACHED) in{batch:batch} new[15:22], after=tensor(DETACHED) in{manager:manager} new[19:21]}
        L20 batch.close();  {total=tensor(ATTACHED) in{manager:manager} new[17:15], batch=handle in{batch:batch}, gc=handle in{autograd:gc}, loss=tensor(ATTACHED) in{batch:batch} new[15:22], after=tensor(DETACHED) in{manager:manager} new[19:21]}
        """, ScopeHarness.stateDump(file));
  }

  @Test
  void aCollectorFromAnyCallRecordsUntilItIsClosed() {
    ScopeFacts facts = ScopeHarness.facts(cls("""
          void train(Trainer trainer, NDList x, NDList y, List<NDArray> kept, int n) {
            for (int i = 0; i < n; i++) {
              GradientCollector gc = ai.djl.engine.Engine.getInstance().newGradientCollector();
              NDArray loss = trainer.getLoss().evaluate(y, trainer.forward(x));
              gc.backward(loss);
              gc.close();
              kept.add(loss);
              kept.add(trainer.getLoss().evaluate(y, trainer.forward(x)));
            }
          }"""));
    assertEquals(2, facts.stores().size(), ScopeHarness.factsDump(facts));
    assertTrue(facts.stores().get(0).data().certainlyAttached(), "computed while the collector was open");
    assertFalse(facts.stores().get(1).data().mayBeAttached(), "computed after it was closed");
  }

  @Test
  void storesNameTheLoopsTheirHolderSurvives() {
    ScopeFacts facts = ScopeHarness.facts(cls("""
          void train(Trainer trainer, Dataset data) throws Exception {
            List<NDArray> kept = new ArrayList<>();
            for (Batch batch : trainer.iterateDataset(data)) {
              List<NDArray> local = new ArrayList<>();
              NDArray last = null;
              try (GradientCollector gc = trainer.newGradientCollector()) {
                NDArray loss = trainer.getLoss().evaluate(batch.getLabels(), trainer.forward(batch.getData()));
                kept.add(loss);
                local.add(loss);
                last = loss;
                gc.backward(loss);
              }
              batch.close();
            }
          }"""));
    assertEquals(1, facts.stores().size(), ScopeHarness.factsDump(facts));
    ScopeFacts.Store s = facts.stores().get(0);
    assertEquals("kept", s.holder().name());
    assertEquals(ScopeFacts.StoreKind.COLLECT, s.kind());
    assertTrue(s.data().certainlyAttached());
    assertEquals(1, s.loops().size());
    assertTrue(facts.traits(s.loops().get(0)).recordsGradients());
    assertTrue(facts.livesOneIteration(s.data().scopes().iterator().next(), s.loops().get(0)),
        "the batch's manager is opened and closed in each iteration");
  }

  @Test
  void resultsComputedOutsideRecordingAreDetached() {
    ScopeFacts facts = ScopeHarness.facts(cls("""
          NDArray total;
          void evaluate(Trainer trainer, NDList inputs, NDList labels, int n) {
            for (int i = 0; i < n; i++) {
              NDArray loss = trainer.getLoss().evaluate(labels, trainer.forward(inputs));
              total = total.add(loss);
            }
          }"""));
    assertEquals(1, facts.stores().size());
    assertFalse(facts.stores().get(0).data().mayBeAttached(), ScopeHarness.factsDump(facts));
  }

  @Test
  void aStateDetachedBeforeItIsFedBackDoesNotChainGraphs() {
    ScopeFacts facts = ScopeHarness.facts(cls("""
          Block cell;
          void train(Trainer trainer, Dataset data, NDManager manager) throws Exception {
            NDArray hidden = manager.zeros(new Shape(1, 4));
            for (Batch batch : trainer.iterateDataset(data)) {
              hidden = hidden.stopGradient();
              try (GradientCollector gc = trainer.newGradientCollector()) {
                hidden = cell.forward(new ParameterStore(), new NDList(batch.getData().head(), hidden), true).head();
                gc.backward(hidden.sum());
              }
              batch.close();
            }
          }"""));
    ScopeFacts.Store fedBack = facts.stores().stream()
        .filter(s -> s.value().toString().startsWith("cell.forward")).findFirst().orElseThrow();
    assertTrue(fedBack.data().certainlyAttached());
    assertFalse(fedBack.chainsGraph(), "the previous value was detached: " + fedBack.previous());
    assertNull(fedBack.operand(), "a state fed back through a call has no added operand");
  }

  @Test
  void helperSummariesSayWhenAResultIsAttachedAndWhoseManagerOwnsIt() {
    FileContext file = ScopeHarness.context(cls("""
          Trainer trainer;
          NDArray loss(NDList x, NDList y) {
            return trainer.getLoss().evaluate(y, trainer.forward(x));
          }
          NDArray step(NDList x, NDList y) {
            try (GradientCollector gc = trainer.newGradientCollector()) {
              NDArray l = trainer.getLoss().evaluate(y, trainer.forward(x));
              gc.backward(l);
              return l;
            }
          }
          NDArray scaled(NDArray a, float f) {
            return a.mul(f);
          }
          NDArray noise(NDManager m) {
            return m.randomNormal(new Shape(3));
          }
          float value(NDList x, NDList y) {
            return loss(x, y).getFloat();
          }"""));
    ScopeSummaries summaries = file.projectFacts().get(ScopeSummaries.class);
    assertNotNull(summaries);
    HelperSummary loss = summaries.of(method(file, "loss"));
    assertEquals(Graph.DETACHED_ONLY, loss.outsideRecording());
    assertEquals(Graph.ATTACHED_ONLY, loss.insideRecording());
    assertFalse(loss.recordsGradients());
    HelperSummary step = summaries.of(method(file, "step"));
    assertEquals(Graph.ATTACHED_ONLY, step.outsideRecording());
    assertTrue(step.recordsGradients());
    HelperSummary scaled = summaries.of(method(file, "scaled"));
    assertEquals(Set.of(0), scaled.graphFrom());
    assertEquals(Set.of(0), scaled.scopesFrom());
    assertEquals(Set.of(0), summaries.of(method(file, "noise")).scopesFrom());
    assertNull(summaries.of(method(file, "value")), "returns nothing tracked and trains nothing");
  }

  @Test
  void allocationsUnderALongLivedScopeAndTheirReleases() {
    ScopeFacts facts = ScopeHarness.facts(cls("""
          float run(NDManager manager, int n) {
            float sum = 0;
            for (int i = 0; i < n; i++) {
              NDArray kept = manager.ones(new Shape(2));
              NDArray closed = manager.ones(new Shape(2));
              NDArray handedOver = manager.ones(new Shape(2));
              sum += kept.getFloat(0) + closed.getFloat(0);
              closed.close();
              consume(handedOver);
            }
            return sum;
          }
          void consume(NDArray a) {}"""));
    List<ScopeFacts.Allocation> allocations = facts.allocations();
    assertEquals(3, allocations.size(), ScopeHarness.factsDump(facts));
    assertFalse(facts.released(allocations.get(0).call()) || facts.kept(allocations.get(0).call()));
    assertTrue(facts.released(allocations.get(1).call()));
    assertTrue(facts.kept(allocations.get(2).call()), "a project method may keep or close it");
    Scope owner = allocations.get(0).data().scopes().iterator().next();
    assertEquals(Scope.Kind.MANAGER, owner.kind());
    assertFalse(owner.opened(), "a parameter's manager is not opened here");
    assertFalse(facts.opensWithin(owner, allocations.get(0).loops().get(0)));
  }

  @Test
  void nd4jArraysBelongToTheWorkspaceOpenWhereTheyAreMade() {
    ScopeFacts facts = ScopeHarness.facts(cls("""
          void run(org.nd4j.linalg.api.memory.conf.WorkspaceConfiguration c, int n) {
            INDArray heap = Nd4j.rand(2, 2);
            for (int i = 0; i < n; i++) {
              try (MemoryWorkspace ws = Nd4j.getWorkspaceManager().getAndActivateWorkspace(c, "W")) {
                INDArray inside = heap.mul(2.0);
                try (MemoryWorkspace out = Nd4j.getWorkspaceManager().scopeOutOfWorkspaces()) {
                  INDArray copy = inside.dup();
                }
              }
            }
          }"""));
    assertEquals(1, facts.allocations().size(), ScopeHarness.factsDump(facts));
    ScopeFacts.Allocation inside = facts.allocations().get(0);
    assertEquals("heap.mul(2.0)", inside.call().toString());
    Scope ws = inside.data().scopes().iterator().next();
    assertEquals(Scope.Kind.WORKSPACE, ws.kind());
    assertTrue(facts.livesOneIteration(ws, inside.loops().get(0)));
  }

  @Test
  void discardedResultsOnlyForCopyOperationsOnTensors() {
    ScopeFacts facts = ScopeHarness.facts(cls("""
          void run(INDArray x, INDArray y, NDArray a, org.nd4j.autodiff.samediff.SDVariable v,
              org.nd4j.autodiff.samediff.SDVariable w, Object unknown) {
            x.add(y);
            x.addi(y);
            x.dup().addi(y);
            a.stopGradient();
            a.toType(ai.djl.ndarray.types.DataType.FLOAT32, false);
            v.add(w);
            x.getDouble(0);
          }"""));
    assertEquals(List.of("x.add(y) COPY", "x.dup().addi(y) TEMPORARY", "a.stopGradient() DETACH",
            "a.toType(ai.djl.ndarray.types.DataType.FLOAT32, false) COPY"),
        facts.discardedResults().stream().map(d -> d.call() + " " + d.kind()).toList());
    assertEquals("addi", facts.discardedResults().get(0).inPlaceVariant());
  }

  private static MethodDeclaration method(FileContext file, String name) {
    return file.source().unit().findFirst(MethodDeclaration.class, m -> m.getNameAsString().equals(name))
        .orElseThrow();
  }
}
