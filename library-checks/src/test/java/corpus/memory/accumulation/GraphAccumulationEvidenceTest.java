package corpus.memory.accumulation;

import static dev.plumbline.librarychecks.Evidence.findings;
import static dev.plumbline.librarychecks.Evidence.lineOf;
import static dev.plumbline.librarychecks.Evidence.liveArrays;
import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import ai.djl.Model;
import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;
import ai.djl.pytorch.engine.PtNDArray;
import ai.djl.pytorch.jni.JniUtils;
import ai.djl.training.GradientCollector;
import ai.djl.training.Trainer;
import ai.djl.training.dataset.ArrayDataset;
import ai.djl.training.dataset.Batch;
import dev.plumbline.librarychecks.Evidence;
import java.util.ArrayList;
import java.util.List;
import org.deeplearning4j.datasets.iterator.utilty.ListDataSetIterator;
import org.junit.jupiter.api.Test;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.factory.Nd4j;

/**
 * Runs golden-corpus code that {@code memory.graph-accumulation} flags, and its clean
 * counterpart, on DJL (PyTorch CPU) and ND4J (CPU), and prints what each keeps alive.
 */
class GraphAccumulationEvidenceTest {

  /** The running tensor total keeps one more array per batch alive; the running float keeps none. */
  @Test
  void runningTensorTotalKeepsAnArrayPerBatchWhileAFloatTotalStaysFlat() throws Exception {
    String file = "corpus/memory/accumulation/ManualLoopRunningTotal.java";
    assertTrue(findings(file).contains(lineOf(file, "totalLoss = totalLoss.add(loss)") + " memory.graph-accumulation"));
    assertTrue(findings(file).stream().noneMatch(f -> f.startsWith(lineOf(file, "totalLoss += loss.getFloat()") + " ")));

    ManualLoopRunningTotal loop = new ManualLoopRunningTotal();
    int[] batchCounts = {2, 4, 8, 16};
    int[] flagged = new int[batchCounts.length];
    int[] fixed = new int[batchCounts.length];
    for (int i = 0; i < batchCounts.length; i++) {
      try (NDManager data = NDManager.newBaseManager(); Model model = Model.newInstance("evidence");
          Trainer trainer = Evidence.linearTrainer(model)) {
        ArrayDataset set = Evidence.dataset(data, batchCounts[i]);
        try (NDManager totals = NDManager.newBaseManager()) {
          loop.epochWithTensorTotal(trainer, set, totals);
          flagged[i] = liveArrays(totals);
        }
        try (NDManager totals = NDManager.newBaseManager()) {
          loop.epochWithFloatTotal(trainer, set);
          fixed[i] = liveArrays(totals);
        }
      }
    }
    System.out.printf("arrays left in the totals' manager after one epoch%n");
    System.out.printf("%8s %28s %22s%n", "batches", "totalLoss.add(loss) [flagged]", "+= getFloat() [fixed]");
    for (int i = 0; i < batchCounts.length; i++) {
      System.out.printf("%8d %28d %22d%n", batchCounts[i], flagged[i], fixed[i]);
    }
    for (int i = 1; i < batchCounts.length; i++) {
      assertTrue(flagged[i] - flagged[i - 1] >= batchCounts[i] - batchCounts[i - 1],
          "the flagged loop keeps at least one more array per batch");
      assertEquals(fixed[0], fixed[i], "the fixed loop keeps the same number of arrays however many batches");
    }
  }

  /** The tensor total built under gradient recording is itself a graph node; a float is not. */
  @Test
  void aTotalBuiltUnderRecordingChainsEveryBatchIntoItsGraph() throws Exception {
    try (NDManager manager = NDManager.newBaseManager(); Model model = Model.newInstance("evidence");
        Trainer trainer = Evidence.linearTrainer(model)) {
      ArrayDataset set = Evidence.dataset(manager, 3);
      NDArray total = manager.zeros(new Shape());
      List<String> gradientFunctions = new ArrayList<>();
      for (Batch batch : trainer.iterateDataset(set)) {
        try (GradientCollector collector = trainer.newGradientCollector()) {
          NDArray loss = trainer.getLoss().evaluate(batch.getLabels(), trainer.forward(batch.getData()));
          collector.backward(loss);
          total = total.add(loss);
          gradientFunctions.add(JniUtils.getGradientFunctionNames((PtNDArray) total));
        }
        trainer.step();
        batch.close();
      }
      System.out.println("gradient function of the running total after each batch: " + gradientFunctions);
      assertEquals(List.of("AddBackward0", "AddBackward0", "AddBackward0"), gradientFunctions);
    }
  }

  /** Arrays kept from a batch that is closed are released: reading them fails; kept values read fine. */
  @Test
  void predictionsKeptFromClosedBatchesCannotBeReadWhileTheirValuesCan() throws Exception {
    String file = "corpus/memory/accumulation/EasyTrainStyleLoop.java";
    assertTrue(findings(file).contains(lineOf(file, "predictions.add(scores);") + " memory.graph-accumulation"));
    EasyTrainStyleLoop loop = new EasyTrainStyleLoop();
    try (NDManager manager = NDManager.newBaseManager(); Model model = Model.newInstance("evidence");
        Trainer trainer = Evidence.linearTrainer(model)) {
      ArrayDataset set = Evidence.dataset(manager, 3);
      List<NDArray> kept = loop.epochKeepingPredictions(trainer, set);
      IllegalStateException e = assertThrows(IllegalStateException.class, () -> kept.get(0).toFloatArray());
      List<float[]> values = loop.epochKeepingValues(trainer, set);
      System.out.printf("kept arrays: %d, reading the first fails with: %s%n", kept.size(), e.getMessage());
      System.out.printf("kept values: %d, first row: %s%n", values.size(), java.util.Arrays.toString(values.get(0)));
      assertEquals(Evidence.BATCH_SIZE, values.get(0).length);
    }
  }

  /** ND4J: arrays kept from a workspace opened per iteration are overwritten by later iterations. */
  @Test
  void arraysKeptFromAPerIterationWorkspaceAreOverwritten() {
    String file = "corpus/memory/accumulation/WorkspaceOutputsKept.java";
    assertTrue(findings(file).contains(lineOf(file, "centered.add(shifted);") + " memory.graph-accumulation"));
    List<DataSet> batches = new ArrayList<>();
    List<INDArray> expected = new ArrayList<>();
    for (int b = 0; b < 4; b++) {
      INDArray features = Nd4j.linspace(1, 8, 8).reshape(4, 2).mul(b + 1);
      batches.add(new DataSet(features, Nd4j.zeros(4, 1)));
      expected.add(features.sub(features.mean(0)));
    }
    WorkspaceOutputsKept centering = new WorkspaceOutputsKept();
    List<INDArray> kept = centering.centeredBatches(new ListDataSetIterator<>(batches, 1));
    List<INDArray> detached = centering.centeredBatchesDetached(new ListDataSetIterator<>(batches, 1));
    System.out.println("expected first batch, centered: " + expected.get(0).toString().replace('\n', ' '));
    System.out.println("kept from the workspace [flagged]: " + kept.get(0).toString().replace('\n', ' '));
    System.out.println("kept as detach() [fixed]:        " + detached.get(0).toString().replace('\n', ' '));
    // Reading the kept array either fails (ND4J notices the closed workspace) or gives other values.
    String outcome;
    try {
      double[][] read = kept.get(0).toDoubleMatrix();
      assertFalse(java.util.Arrays.deepEquals(expected.get(0).toDoubleMatrix(), read),
          "the kept workspace array no longer holds its batch");
      outcome = "reads other values: " + java.util.Arrays.deepToString(read);
    } catch (RuntimeException e) {
      assertTrue(e.getMessage().contains("workspace"), e.getMessage());
      outcome = "fails: " + e.getMessage();
    }
    System.out.println("using the kept workspace array " + outcome);
    for (int b = 0; b < expected.size(); b++) {
      assertArrayEquals(expected.get(b).toDoubleMatrix(), detached.get(b).toDoubleMatrix());
    }
  }

  /** {@code state.stopGradient();} as a statement leaves the state attached to its graph. */
  @Test
  void aDiscardedStopGradientLeavesTheReceiverAttached() {
    try (NDManager manager = NDManager.newBaseManager()) {
      NDArray weight = manager.ones(new Shape(2));
      weight.setRequiresGradient(true);
      try (GradientCollector collector = manager.getEngine().newGradientCollector()) {
        NDArray hidden = weight.mul(manager.ones(new Shape(2)));
        String before = JniUtils.getGradientFunctionNames((PtNDArray) hidden);
        NDArray copy = hidden.stopGradient();
        String after = JniUtils.getGradientFunctionNames((PtNDArray) hidden);
        System.out.printf("graph of 'hidden' before: %s, after a discarded stopGradient(): %s%n", before, after);
        assertEquals("MulBackward0", before);
        assertEquals(before, after);
        assertTrue(copy != hidden);
        collector.backward(hidden.sum());
      }
    }
  }
}
