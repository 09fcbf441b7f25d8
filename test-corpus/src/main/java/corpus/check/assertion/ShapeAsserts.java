package corpus.check.assertion;

import ai.djl.ndarray.NDArray;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.factory.Nd4j;

/** Asserts used as input validation in training code: off unless the JVM runs with -ea. */
public class ShapeAsserts {
  private static final int WIDTH = 12;

  public INDArray embed(INDArray tokens) {
    assert tokens.size(1) == WIDTH : "tokens must have 12 columns"; // expect: check.assert-validation
    return tokens.mmul(Nd4j.rand(WIDTH, 4));
  }

  public INDArray project(INDArray features) {
    assert features.rank() == 2; // expect: check.assert-validation
    return features;
  }

  public NDArray window(NDArray signal) {
    assert signal.getShape().get(1) == 3; // expect: check.assert-validation
    return signal;
  }

  public void fitBatch(DataSet batch) {
    assert batch.numExamples() > 0 : "empty batch"; // expect: check.assert-validation
  }

  public double loss(INDArray errors) {
    assert !Double.isNaN(errors.sumNumber().doubleValue()); // expect: check.assert-validation
    return errors.sumNumber().doubleValue();
  }

  public void schedule(int epochs, double learningRate) {
    assert learningRate > 0 && epochs > 0; // expect: check.assert-validation
  }

  /** A loader helper whose width the analysis does not know. */
  public INDArray loadUnknown(INDArray raw) {
    INDArray features = normalize(raw);
    assert features.size(1) == WIDTH; // expect: check.assert-validation
    return features;
  }

  private INDArray normalize(INDArray raw) {
    return raw.div(raw.max(0));
  }
}
