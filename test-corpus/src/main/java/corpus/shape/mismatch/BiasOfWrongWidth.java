package corpus.shape.mismatch;

import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/** Adding a bias row to a batch of activations. */
class BiasOfWrongWidth {
  INDArray addBias(int batch) {
    INDArray hidden = Nd4j.rand(batch, 16);
    INDArray bias = Nd4j.rand(1, 8);
    return hidden.add(bias); // expect: shape.mismatch
  }

  INDArray addBiasRow(int batch) {
    INDArray hidden = Nd4j.rand(batch, 16);
    INDArray bias = Nd4j.rand(1, 16);
    return hidden.add(bias); // clean: shape.mismatch
  }

  INDArray addBiasVector(int batch) {
    INDArray hidden = Nd4j.rand(batch, 16);
    return hidden.addRowVector(Nd4j.rand(16)); // clean: shape.mismatch
  }

  /** ND4J refuses a rank-1 vector against a column (DJL would broadcast it to [32, 32]). */
  INDArray residual() {
    INDArray predictions = Nd4j.rand(32, 1);
    INDArray targets = Nd4j.rand(32);
    return predictions.sub(targets); // expect: shape.mismatch
  }

  /** In place, the receiver must hold the result: a [1, 16] row cannot take a batch. */
  void accumulate() {
    INDArray total = Nd4j.zeros(1, 16);
    total.addi(Nd4j.rand(32, 16)); // expect: shape.mismatch
  }

  void accumulateRows() {
    INDArray total = Nd4j.zeros(32, 16);
    total.addi(Nd4j.rand(1, 16)); // clean: shape.mismatch
  }
}
