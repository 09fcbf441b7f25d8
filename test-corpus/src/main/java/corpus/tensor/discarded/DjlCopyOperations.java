package corpus.tensor.discarded;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.types.DataType;

/** DJL operations that return a new array: the receiver is never changed by them. */
class DjlCopyOperations {
  NDArray sharpen(NDArray logits, float temperature) {
    logits.div(temperature); // expect: tensor.discarded-result
    return logits;
  }

  NDArray sharpenInPlace(NDArray logits, float temperature) {
    logits.divi(temperature); // clean: tensor.discarded-result
    return logits;
  }

  NDArray asFloats(NDArray counts) {
    counts.toType(DataType.FLOAT32, false); // expect: tensor.discarded-result
    return counts;
  }

  NDArray asFloatsAssigned(NDArray counts) {
    return counts.toType(DataType.FLOAT32, false); // clean: tensor.discarded-result
  }

  NDArray freeze(NDArray embedding) {
    embedding.stopGradient(); // expect: tensor.discarded-result
    return embedding;
  }

  float norm(NDArray v) {
    return v.mul(v).sum().getFloat(); // clean: tensor.discarded-result
  }

  void reshapeForHead(NDArray features, long batch) {
    features.reshape(batch, -1); // expect: tensor.discarded-result
  }
}
