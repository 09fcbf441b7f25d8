package dev.plumbline.librarychecks;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import ai.djl.Model;
import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDList;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;
import ai.djl.pytorch.jni.JniUtils;
import ai.djl.training.GradientCollector;
import ai.djl.training.Trainer;
import ai.djl.training.dataset.ArrayDataset;
import ai.djl.training.dataset.Batch;
import org.junit.jupiter.api.Test;
import org.nd4j.linalg.api.memory.MemoryWorkspace;
import org.nd4j.linalg.api.memory.conf.WorkspaceConfiguration;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/**
 * The library behaviour the scope analysis ({@code dev.plumbline.analysis.scope}) assumes,
 * measured on the real libraries: where results of operations live, where gradients are
 * recorded, and which ND4J calls leave a workspace.
 */
class ScopeSemanticsTest {

  @Test
  void djlPutsAnOperationsResultInTheManagerOfItsFirstOperand() {
    try (NDManager first = NDManager.newBaseManager(); NDManager second = NDManager.newBaseManager()) {
      NDArray a = first.ones(new Shape(2));
      NDArray b = second.ones(new Shape(2));
      assertSame(first, a.add(b).getManager());
      assertSame(second, b.add(a).getManager());
      assertSame(first, a.stopGradient().getManager());
      assertSame(first, a.reshape(2, 1).getManager());
    }
  }

  @Test
  void djlRecordsGradientsOnlyInsideAGradientCollector() throws Exception {
    try (NDManager data = NDManager.newBaseManager(); Model model = Model.newInstance("semantics");
        Trainer trainer = Evidence.linearTrainer(model)) {
      ArrayDataset set = Evidence.dataset(data, 1);
      assertFalse(JniUtils.isGradMode(), "grad mode is off outside a collector");
      for (Batch batch : trainer.iterateDataset(set)) {
        try (GradientCollector collector = trainer.newGradientCollector()) {
          assertTrue(JniUtils.isGradMode(), "grad mode is on inside a collector");
          NDList predictions = trainer.forward(batch.getData());
          NDArray loss = trainer.getLoss().evaluate(batch.getLabels(), predictions);
          // A forward pass and its loss land in the manager of their input: the batch's.
          assertSame(batch.getManager(), predictions.head().getManager());
          assertSame(batch.getManager(), loss.getManager());
          collector.backward(loss);
        }
        assertFalse(JniUtils.isGradMode(), "closing the collector turns grad mode off");
        batch.close();
      }
    }
  }

  @Test
  void everyBatchOwnsAFreshManager() throws Exception {
    try (NDManager data = NDManager.newBaseManager(); Model model = Model.newInstance("semantics");
        Trainer trainer = Evidence.linearTrainer(model)) {
      NDManager previous = null;
      for (Batch batch : trainer.iterateDataset(Evidence.dataset(data, 3))) {
        assertNotSame(previous, batch.getManager());
        previous = batch.getManager();
        batch.close();
        assertFalse(previous.isOpen(), "closing a batch closes its manager");
      }
    }
  }

  @Test
  void nd4jArraysLiveInTheWorkspaceOpenWhereTheyAreCreated() {
    WorkspaceConfiguration config = WorkspaceConfiguration.builder().build();
    INDArray heap = Nd4j.rand(2, 2);
    assertFalse(heap.isAttached(), "outside any workspace: a heap array");
    try (MemoryWorkspace ws = Nd4j.getWorkspaceManager().getAndActivateWorkspace(config, "SEMANTICS")) {
      INDArray inside = Nd4j.rand(2, 2);
      assertTrue(inside.isAttached());
      assertTrue(heap.mul(2).isAttached(), "a result lives where it is computed, not with its operand");
      assertFalse(inside.detach().isAttached(), "detach() returns a heap copy");
      assertTrue(inside.isAttached(), "and leaves its receiver in the workspace");
      try (MemoryWorkspace outside = Nd4j.getWorkspaceManager().scopeOutOfWorkspaces()) {
        assertFalse(inside.dup().isAttached(), "dup() outside the workspaces makes a heap copy");
      }
    }
    Nd4j.getWorkspaceManager().destroyAllWorkspacesForCurrentThread();
  }

  @Test
  void aDjlBinaryOperationDoesNotChangeItsReceiver() {
    try (NDManager manager = NDManager.newBaseManager()) {
      NDArray x = manager.ones(new Shape(3));
      x.add(1f);
      assertEquals(3f, x.sum().getFloat(), "x.add(1) leaves x as it was");
      x.addi(1f);
      assertEquals(6f, x.sum().getFloat(), "x.addi(1) writes into x");
    }
  }
}
