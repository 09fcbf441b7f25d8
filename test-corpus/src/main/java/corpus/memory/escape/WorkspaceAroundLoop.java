package corpus.memory.escape;

import java.util.ArrayList;
import java.util.List;
import org.nd4j.linalg.api.memory.MemoryWorkspace;
import org.nd4j.linalg.api.memory.conf.WorkspaceConfiguration;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/** ND4J workspaces: the scope must be entered once per iteration for its memory to be reused. */
class WorkspaceAroundLoop {
  private static final WorkspaceConfiguration CONFIG = WorkspaceConfiguration.builder().build();

  double scoreOneScope(int rounds) {
    double score = 0;
    try (MemoryWorkspace ws = Nd4j.getWorkspaceManager().getAndActivateWorkspace(CONFIG, "SCORE")) {
      for (int round = 0; round < rounds; round++) {
        INDArray sample = Nd4j.rand(64, 64); // expect: memory.scope-escape
        score += sample.mmul(sample).sumNumber().doubleValue();
      }
    }
    return score;
  }

  double scoreExplicitActivation(int rounds) {
    double score = 0;
    MemoryWorkspace ws = Nd4j.getWorkspaceManager().getAndActivateWorkspace(CONFIG, "SCORE");
    for (int round = 0; round < rounds; round++) {
      INDArray sample = Nd4j.zeros(64, 64); // expect: memory.scope-escape
      score += sample.sumNumber().doubleValue();
    }
    ws.close();
    return score;
  }

  double scorePerRound(int rounds) {
    double score = 0;
    for (int round = 0; round < rounds; round++) {
      try (MemoryWorkspace ws = Nd4j.getWorkspaceManager().getAndActivateWorkspace(CONFIG, "SCORE")) {
        INDArray sample = Nd4j.rand(64, 64); // clean: memory.scope-escape
        score += sample.mmul(sample).sumNumber().doubleValue(); // clean: memory.scope-escape
      }
    }
    return score;
  }

  double scoreOnHeap(int rounds) {
    double score = 0;
    for (int round = 0; round < rounds; round++) {
      INDArray sample = Nd4j.rand(64, 64); // clean: memory.scope-escape
      score += sample.sumNumber().doubleValue();
    }
    return score;
  }

  List<INDArray> samplesCopiedOut(int rounds) {
    List<INDArray> kept = new ArrayList<>();
    try (MemoryWorkspace ws = Nd4j.getWorkspaceManager().getAndActivateWorkspace(CONFIG, "SAMPLE")) {
      for (int round = 0; round < rounds; round++) {
        try (MemoryWorkspace outside = Nd4j.getWorkspaceManager().scopeOutOfWorkspaces()) {
          kept.add(Nd4j.rand(8, 8)); // clean: memory.scope-escape
        }
      }
    }
    return kept;
  }
}
