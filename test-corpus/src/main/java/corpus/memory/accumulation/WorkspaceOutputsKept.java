package corpus.memory.accumulation;

import java.util.ArrayList;
import java.util.List;
import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
import org.nd4j.linalg.api.memory.MemoryWorkspace;
import org.nd4j.linalg.api.memory.conf.WorkspaceConfiguration;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
import org.nd4j.linalg.factory.Nd4j;

/** ND4J workspace per iteration: arrays made inside it are overwritten by the next iteration. */
class WorkspaceOutputsKept {
  private static final WorkspaceConfiguration LOOP = WorkspaceConfiguration.builder().build();

  List<INDArray> centeredBatches(DataSetIterator batches) {
    List<INDArray> centered = new ArrayList<>();
    while (batches.hasNext()) {
      DataSet batch = batches.next();
      try (MemoryWorkspace ws = Nd4j.getWorkspaceManager().getAndActivateWorkspace(LOOP, "CENTER")) {
        INDArray features = batch.getFeatures();
        INDArray shifted = features.sub(features.mean(0));
        centered.add(shifted); // expect: memory.graph-accumulation
      }
    }
    return centered;
  }

  List<INDArray> centeredBatchesDetached(DataSetIterator batches) {
    List<INDArray> centered = new ArrayList<>();
    while (batches.hasNext()) {
      DataSet batch = batches.next();
      try (MemoryWorkspace ws = Nd4j.getWorkspaceManager().getAndActivateWorkspace(LOOP, "CENTER")) {
        INDArray features = batch.getFeatures();
        INDArray shifted = features.sub(features.mean(0));
        centered.add(shifted.detach()); // clean: memory.graph-accumulation
      }
    }
    return centered;
  }

  List<INDArray> centeredBatchesCopiedOut(DataSetIterator batches) {
    List<INDArray> centered = new ArrayList<>();
    while (batches.hasNext()) {
      DataSet batch = batches.next();
      try (MemoryWorkspace ws = Nd4j.getWorkspaceManager().getAndActivateWorkspace(LOOP, "CENTER")) {
        INDArray features = batch.getFeatures();
        INDArray shifted = features.sub(features.mean(0));
        try (MemoryWorkspace outside = Nd4j.getWorkspaceManager().scopeOutOfWorkspaces()) {
          centered.add(shifted.dup()); // clean: memory.graph-accumulation
        }
      }
    }
    return centered;
  }

  List<INDArray> predictions(MultiLayerNetwork network, DataSetIterator batches) {
    List<INDArray> outputs = new ArrayList<>();
    while (batches.hasNext()) {
      try (MemoryWorkspace ws = Nd4j.getWorkspaceManager().getAndActivateWorkspace(LOOP, "PREDICT")) {
        // DL4J returns network outputs detached from any workspace.
        outputs.add(network.output(batches.next().getFeatures())); // clean: memory.graph-accumulation
      }
    }
    return outputs;
  }
}
