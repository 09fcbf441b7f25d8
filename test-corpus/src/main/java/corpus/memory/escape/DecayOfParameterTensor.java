package corpus.memory.escape;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDManager;

/**
 * A hand-written update on an array passed in: every operation puts its result in the manager
 * of its first operand, which lives outside this method.
 */
class DecayOfParameterTensor {
  void decay(NDArray weights, float rate, int steps) {
    for (int step = 0; step < steps; step++) {
      NDArray shrink = weights.mul(rate); // expect: memory.scope-escape
      weights.subi(shrink);
    }
  }

  void decayInPlace(NDArray weights, float rate, int steps) {
    for (int step = 0; step < steps; step++) {
      weights.muli(1f - rate); // clean: memory.scope-escape
    }
  }

  void decayInStepManager(NDArray weights, NDManager manager, float rate, int steps) {
    for (int step = 0; step < steps; step++) {
      try (NDManager stepManager = manager.newSubManager()) {
        weights.tempAttach(stepManager);
        NDArray shrink = weights.mul(rate); // clean: memory.scope-escape
        weights.subi(shrink);
      }
    }
  }
}
