package corpus.memory.accumulation;

import org.nd4j.autodiff.samediff.SDVariable;
import org.nd4j.autodiff.samediff.SameDiff;
import org.nd4j.linalg.api.buffer.DataType;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;

/** SameDiff: operations defined inside the loop that runs the graph are added every iteration. */
class SameDiffOpsInTrainingLoop {
  void trainGrowingGraph(SameDiff sd, SDVariable input, DataSetIterator batches) {
    while (batches.hasNext()) {
      DataSet batch = batches.next();
      SDVariable scaled = input.mul(2.0); // expect: memory.graph-accumulation
      sd.fit(batch);
    }
  }

  void trainFixedGraph(SameDiff sd, DataSetIterator batches) {
    SDVariable input = sd.placeHolder("input", DataType.FLOAT, -1, 4);
    SDVariable scaled = input.mul(2.0); // clean: memory.graph-accumulation
    while (batches.hasNext()) {
      sd.fit(batches.next());
    }
  }
}
