package corpus.memory.escape;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDList;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;
import ai.djl.training.Trainer;
import java.util.ArrayList;
import java.util.List;

/** Repeated evaluation on inputs created once: outputs land in the inputs' manager. */
class EvaluationOnFixedInputs {
  float monitor(Trainer trainer, NDManager manager, int checks) {
    NDArray probe = manager.randomNormal(new Shape(16, 8));
    float last = 0f;
    for (int check = 0; check < checks; check++) {
      trainer.step();
      NDArray output = trainer.evaluate(new NDList(probe)).singletonOrThrow(); // expect: memory.scope-escape
      last = output.mean().getFloat();
    }
    return last;
  }

  float monitorClosingOutputs(Trainer trainer, NDManager manager, int checks) {
    NDArray probe = manager.randomNormal(new Shape(16, 8));
    float last = 0f;
    for (int check = 0; check < checks; check++) {
      trainer.step();
      NDList outputs = trainer.evaluate(new NDList(probe)); // clean: memory.scope-escape
      last = outputs.head().getFloat(0, 0);
      outputs.close();
    }
    return last;
  }

  List<NDArray> snapshots(NDManager manager, int count) {
    List<NDArray> kept = new ArrayList<>();
    for (int i = 0; i < count; i++) {
      kept.add(manager.create(new float[] {i, i * 2f})); // clean: memory.scope-escape
    }
    return kept;
  }
}
