package corpus.memory.escape;

import static dev.plumbline.librarychecks.Evidence.findings;
import static dev.plumbline.librarychecks.Evidence.lineOf;
import static dev.plumbline.librarychecks.Evidence.liveArrays;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import ai.djl.Model;
import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;
import ai.djl.training.EasyTrain;
import ai.djl.training.Trainer;
import ai.djl.training.dataset.ArrayDataset;
import ai.djl.training.dataset.Batch;
import dev.plumbline.librarychecks.Evidence;
import org.junit.jupiter.api.Test;
import org.nd4j.linalg.api.memory.MemoryWorkspace;
import org.nd4j.linalg.factory.Nd4j;

/**
 * Runs golden-corpus code that {@code memory.scope-escape} flags, and its clean counterpart, and
 * prints how much each leaves allocated as the number of iterations grows.
 */
class ScopeEscapeEvidenceTest {
  private static final int[] ITERATIONS = {2, 4, 8, 16};

  /**
   * Batches that are never closed keep their arrays in the trainer's manager until the iteration
   * over the data set ends (DJL's data iterable then closes them all); closed batches do not.
   * Measured inside the loop, which mirrors {@code EasyTrainUnclosedBatch.fit} and {@code fitClosing}.
   */
  @Test
  void unclosedBatchesPileUpUntilTheEpochEndsWhileClosedOnesDoNot() throws Exception {
    String file = "corpus/memory/escape/EasyTrainUnclosedBatch.java";
    int line = lineOf(file, "for (Batch batch : trainer.iterateDataset(train)) { // expect");
    assertTrue(findings(file).contains(line + " memory.scope-escape"));
    int batches = ITERATIONS[ITERATIONS.length - 1];
    int[] flagged = new int[batches];
    int[] fixed = new int[batches];
    for (boolean close : new boolean[] {false, true}) {
      try (NDManager data = NDManager.newBaseManager(); Model model = Model.newInstance("evidence");
          Trainer trainer = Evidence.linearTrainer(model)) {
        ArrayDataset set = Evidence.dataset(data, batches);
        int before = liveArrays(trainer.getManager());
        int i = 0;
        for (Batch batch : trainer.iterateDataset(set)) {
          EasyTrain.trainBatch(trainer, batch);
          trainer.step();
          if (close) {
            batch.close();
          }
          (close ? fixed : flagged)[i++] = liveArrays(trainer.getManager()) - before;
        }
        int after = liveArrays(trainer.getManager()) - before;
        System.out.printf("%s: arrays added once the epoch has ended: %d%n", close ? "closed" : "unclosed", after);
      }
    }
    System.out.println("arrays added to the trainer's manager, during one epoch");
    System.out.printf("%8s %30s %30s%n", "batch", "no batch.close() [flagged]", "batch.close() [fixed]");
    for (int i = 0; i < batches; i++) {
      System.out.printf("%8d %30d %30d%n", i + 1, flagged[i], fixed[i]);
    }
    for (int i = 1; i < batches; i++) {
      assertTrue(flagged[i] > flagged[i - 1], "every unclosed batch adds arrays");
      assertEquals(fixed[0], fixed[i], "closed batches leave nothing behind");
    }
  }

  /** Operations on an array passed in put their results in its manager, one per step. */
  @Test
  void resultsOfOperationsOnAnOuterArrayPileUpInItsManager() {
    String file = "corpus/memory/escape/DecayOfParameterTensor.java";
    assertTrue(findings(file).contains(lineOf(file, "NDArray shrink = weights.mul(rate); // expect") + " memory.scope-escape"));
    DecayOfParameterTensor decay = new DecayOfParameterTensor();
    int[] flagged = new int[ITERATIONS.length];
    int[] fixed = new int[ITERATIONS.length];
    for (int i = 0; i < ITERATIONS.length; i++) {
      try (NDManager manager = NDManager.newBaseManager()) {
        NDArray weights = manager.ones(new Shape(64));
        int before = liveArrays(manager);
        decay.decay(weights, 0.01f, ITERATIONS[i]);
        flagged[i] = liveArrays(manager) - before;
      }
      try (NDManager manager = NDManager.newBaseManager()) {
        NDArray weights = manager.ones(new Shape(64));
        int before = liveArrays(manager);
        decay.decayInStepManager(weights, manager, 0.01f, ITERATIONS[i]);
        fixed[i] = liveArrays(manager) - before;
      }
    }
    print("arrays added to the weights' manager", "steps", "weights.mul(rate) [flagged]",
        "per-step sub-manager [fixed]", flagged, fixed);
    assertGrowsAndStaysFlat(flagged, fixed);
  }

  /** An ND4J workspace whose scope spans the loop grows every round; one scope per round does not. */
  @Test
  void aWorkspaceOpenAcrossTheLoopGrowsWhileOnePerRoundIsReused() {
    String file = "corpus/memory/escape/WorkspaceAroundLoop.java";
    assertTrue(findings(file).contains(lineOf(file, "INDArray sample = Nd4j.rand(64, 64); // expect") + " memory.scope-escape"));
    WorkspaceAroundLoop scoring = new WorkspaceAroundLoop();
    long[] flagged = new long[ITERATIONS.length];
    long[] fixed = new long[ITERATIONS.length];
    for (int i = 0; i < ITERATIONS.length; i++) {
      scoring.scoreOneScope(ITERATIONS[i]);
      flagged[i] = lastCycleBytes("SCORE");
      scoring.scorePerRound(ITERATIONS[i]);
      fixed[i] = lastCycleBytes("SCORE");
      Nd4j.getWorkspaceManager().destroyAllWorkspacesForCurrentThread();
    }
    System.out.printf("bytes allocated in workspace 'SCORE' during its last open scope%n");
    System.out.printf("%8s %28s %26s%n", "rounds", "one scope around the loop", "one scope per round");
    for (int i = 0; i < ITERATIONS.length; i++) {
      System.out.printf("%8d %28d %26d%n", ITERATIONS[i], flagged[i], fixed[i]);
    }
    for (int i = 1; i < ITERATIONS.length; i++) {
      assertEquals(flagged[0] * ITERATIONS[i] / ITERATIONS[0], flagged[i], "grows in proportion to the rounds");
      assertEquals(fixed[0], fixed[i], "stays at one round's worth");
    }
  }

  private static long lastCycleBytes(String id) {
    MemoryWorkspace ws = Nd4j.getWorkspaceManager().getWorkspaceForCurrentThread(id);
    return ws.getLastCycleAllocations();
  }

  private static void print(String title, String unit, String flaggedLabel, String fixedLabel, int[] flagged,
      int[] fixed) {
    System.out.println(title);
    System.out.printf("%8s %30s %30s%n", unit, flaggedLabel, fixedLabel);
    for (int i = 0; i < ITERATIONS.length; i++) {
      System.out.printf("%8d %30d %30d%n", ITERATIONS[i], flagged[i], fixed[i]);
    }
  }

  private static void assertGrowsAndStaysFlat(int[] flagged, int[] fixed) {
    for (int i = 1; i < ITERATIONS.length; i++) {
      assertTrue(flagged[i] - flagged[i - 1] >= ITERATIONS[i] - ITERATIONS[i - 1],
          "the flagged code keeps at least one more array per iteration");
      assertEquals(fixed[0], fixed[i], "the fixed code keeps the same number whatever the iteration count");
    }
  }
}
