package corpus.memory.escape;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDList;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;

/**
 * A hand-written update step for the weights of a pollen-count regressor. The caller gives the
 * manager of one step; the update moves each gradient into it on purpose, so the temporaries
 * land there and the caller frees them when it closes the step.
 */
class GradientsIntoCallersManager {
  void update(NDList weights, float rate, NDManager stepManager) {
    for (int i = 0; i < weights.size(); i++) {
      NDArray weight = weights.get(i);
      NDArray gradient = weight.getGradient();
      gradient.attach(stepManager);
      weight.subi(gradient.mul(rate)); // clean: memory.scope-escape
    }
  }

  void updateTemporarily(NDList weights, float rate, NDManager stepManager) {
    for (int i = 0; i < weights.size(); i++) {
      NDArray gradient = weights.get(i).getGradient();
      gradient.tempAttach(stepManager);
      weights.get(i).subi(gradient.mul(rate)); // clean: memory.scope-escape
    }
  }

  /** The manager is opened here, before the loop: the temporaries pile up in it. */
  void updateIntoOwnManager(NDList weights, float rate, int rounds) {
    try (NDManager kept = NDManager.newBaseManager()) {
      NDArray gradient = weights.head().getGradient();
      for (int round = 0; round < rounds; round++) {
        gradient.attach(kept);
        NDArray step = gradient.mul(rate); // expect: memory.scope-escape
        weights.head().subi(step);
      }
    }
  }

  /** Nothing is moved into the caller's manager here: the noise just piles up in it. */
  float jitter(NDManager manager, int rounds) {
    float total = 0f;
    for (int round = 0; round < rounds; round++) {
      NDArray noise = manager.randomNormal(new Shape(16)); // expect: memory.scope-escape
      total += noise.sum().getFloat();
    }
    return total;
  }
}
