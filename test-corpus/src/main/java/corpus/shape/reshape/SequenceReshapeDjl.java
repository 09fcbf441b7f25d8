package corpus.shape.reshape;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;
import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
import org.nd4j.linalg.api.ndarray.INDArray;

/** DJL: windows of a signal reshaped to [batch, steps, features]. */
class SequenceReshapeDjl {
  NDArray encode(NDArray signal, long steps, long features, NDArray projection) {
    NDArray windows = signal.reshape(-1, steps, features); // expect: shape.unchecked-reshape
    return windows.matMul(projection);
  }

  NDArray encodeChecked(NDArray signal, long steps, long features, NDArray projection) {
    NDArray windows = signal.reshape(-1, steps, features); // clean: shape.unchecked-reshape
    if (windows.getShape().get(2) != features) {
      throw new IllegalStateException("bad window shape " + windows.getShape());
    }
    return windows.matMul(projection);
  }

  NDArray join(NDArray left, NDArray right, long batch) {
    NDArray flat = right.reshape(new Shape(batch, -1)); // expect: shape.unchecked-reshape
    return left.concat(flat, 1);
  }

  NDArray regroupProven(NDManager manager) {
    NDArray readings = manager.zeros(new Shape(8, 6));
    NDArray groups = readings.reshape(-1, 3); // clean: shape.unchecked-reshape
    return groups.matMul(manager.ones(new Shape(3, 1)));
  }

  void train(MultiLayerNetwork net, INDArray raw, INDArray labels, long examples) {
    net.fit(raw.reshape(examples, -1), labels); // expect: shape.unchecked-reshape
  }
}
