package corpus.memory.escape;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;

/** Data augmentation noise drawn every step: in the base manager, or in a manager per step. */
class NoiseUnderBaseManager {
  float noisyEnergy(int steps) {
    float energy = 0f;
    try (NDManager manager = NDManager.newBaseManager()) {
      NDArray signal = manager.ones(new Shape(256));
      for (int step = 0; step < steps; step++) {
        NDArray noise = manager.randomNormal(new Shape(256)); // expect: memory.scope-escape
        energy += signal.add(noise).square().sum().getFloat();
      }
    }
    return energy;
  }

  float noisyEnergyPerStepManager(int steps) {
    float energy = 0f;
    try (NDManager manager = NDManager.newBaseManager()) {
      NDArray signal = manager.ones(new Shape(256));
      for (int step = 0; step < steps; step++) {
        try (NDManager stepManager = manager.newSubManager()) {
          NDArray noise = stepManager.randomNormal(new Shape(256)); // clean: memory.scope-escape
          signal.tempAttach(stepManager);
          energy += signal.add(noise).sum().getFloat(); // clean: memory.scope-escape
        }
      }
    }
    return energy;
  }

  float noisyEnergyClosingEach(int steps) {
    float energy = 0f;
    try (NDManager manager = NDManager.newBaseManager()) {
      for (int step = 0; step < steps; step++) {
        NDArray noise = manager.randomNormal(new Shape(256)); // clean: memory.scope-escape
        energy += noise.getFloat(0);
        noise.close();
      }
    }
    return energy;
  }
}
