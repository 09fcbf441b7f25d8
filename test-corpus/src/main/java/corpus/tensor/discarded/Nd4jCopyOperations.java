package corpus.tensor.discarded;

import java.util.List;
import org.nd4j.linalg.api.ndarray.INDArray;

/** ND4J operations that return a new array, called for an effect they do not have. */
class Nd4jCopyOperations {
  INDArray center(INDArray features, INDArray mean) {
    features.sub(mean); // expect: tensor.discarded-result
    return features;
  }

  INDArray centerInPlace(INDArray features, INDArray mean) {
    features.subi(mean); // clean: tensor.discarded-result
    return features;
  }

  INDArray flatten(INDArray images, int batch) {
    images.reshape(batch, 28 * 28); // expect: tensor.discarded-result
    return images;
  }

  INDArray flattenAssigned(INDArray images, int batch) {
    INDArray flat = images.reshape(batch, 28 * 28); // clean: tensor.discarded-result
    return flat;
  }

  INDArray project(INDArray weights, INDArray inputs) {
    weights.transpose(); // expect: tensor.discarded-result
    return inputs.mmul(weights);
  }

  void accumulate(INDArray total, INDArray update) {
    total.add(update); // expect: tensor.discarded-result
  }

  void accumulateInPlace(INDArray total, INDArray update) {
    total.addi(update); // clean: tensor.discarded-result
  }

  void scaleGradient(INDArray gradient, double learningRate) {
    gradient.dup().muli(learningRate); // expect: tensor.discarded-result
  }

  void scaleGradientInPlace(INDArray gradient, double learningRate) {
    gradient.muli(learningRate); // clean: tensor.discarded-result
  }

  void collect(List<INDArray> sums, INDArray a, INDArray b) {
    sums.add(a.add(b)); // clean: tensor.discarded-result
  }

  INDArray sum(INDArray a, INDArray b) {
    return a.add(b); // clean: tensor.discarded-result
  }
}
