package corpus.memory.escape;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;

/** A sub-manager per iteration only helps when it is closed. */
class SubManagerPerIteration {
  float sampleMeans(NDManager manager, int rounds) {
    float sum = 0f;
    for (int round = 0; round < rounds; round++) {
      NDManager roundManager = manager.newSubManager(); // expect: memory.scope-escape
      NDArray sample = roundManager.randomUniform(0f, 1f, new Shape(1000));
      sum += sample.mean(new int[] {0}).getFloat();
    }
    return sum / rounds;
  }

  float sampleMeansClosed(NDManager manager, int rounds) {
    float sum = 0f;
    for (int round = 0; round < rounds; round++) {
      NDManager roundManager = manager.newSubManager(); // clean: memory.scope-escape
      try {
        NDArray sample = roundManager.randomUniform(0f, 1f, new Shape(1000));
        sum += sample.mean(new int[] {0}).getFloat();
      } finally {
        roundManager.close();
      }
    }
    return sum / rounds;
  }
}
