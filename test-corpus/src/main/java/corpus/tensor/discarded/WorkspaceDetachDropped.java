package corpus.tensor.discarded;

import org.nd4j.linalg.api.memory.MemoryWorkspace;
import org.nd4j.linalg.api.memory.conf.WorkspaceConfiguration;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/** ND4J detach() returns a heap copy; the array it is called on stays in the workspace. */
class WorkspaceDetachDropped {
  private static final WorkspaceConfiguration CONFIG = WorkspaceConfiguration.builder().build();
  private INDArray lastScores;

  void score(INDArray inputs) {
    try (MemoryWorkspace ws = Nd4j.getWorkspaceManager().getAndActivateWorkspace(CONFIG, "SCORE")) {
      INDArray scores = inputs.mul(2.0);
      scores.detach(); // expect: tensor.discarded-result
      lastScores = scores; // expect: memory.graph-accumulation
    }
  }

  void scoreKeepingCopy(INDArray inputs) {
    try (MemoryWorkspace ws = Nd4j.getWorkspaceManager().getAndActivateWorkspace(CONFIG, "SCORE")) {
      INDArray scores = inputs.mul(2.0);
      scores = scores.detach(); // clean: tensor.discarded-result
      lastScores = scores; // clean: memory.graph-accumulation
    }
  }

  INDArray last() {
    return lastScores;
  }
}
