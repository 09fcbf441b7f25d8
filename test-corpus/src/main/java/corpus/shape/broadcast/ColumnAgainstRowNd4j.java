package corpus.shape.broadcast;

import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/** ND4J broadcasts a column against a row (it refuses a rank-1 vector against a column). */
class ColumnAgainstRowNd4j {
  INDArray gate(int batch) {
    INDArray perExample = Nd4j.rand(batch, 1);
    INDArray perFeature = Nd4j.rand(1, 16);
    return perExample.add(perFeature); // expect: shape.implicit-broadcast
  }

  INDArray scale(int batch) {
    INDArray perExample = Nd4j.rand(batch, 1);
    INDArray features = Nd4j.rand(batch, 16);
    return features.mul(perExample); // clean: shape.implicit-broadcast
  }

  INDArray outer() {
    INDArray left = Nd4j.rand(4, 1);
    INDArray right = Nd4j.rand(2, 1, 4);
    return left.mul(right); // expect: shape.implicit-broadcast
  }

  INDArray bias(int batch) {
    INDArray hidden = Nd4j.rand(batch, 16);
    return hidden.add(Nd4j.rand(1, 16)); // clean: shape.implicit-broadcast
  }

  INDArray shift(INDArray hidden) {
    return hidden.add(1.0); // clean: shape.implicit-broadcast
  }

  INDArray unknownShapes(INDArray a, INDArray b) {
    return a.add(b); // clean: shape.implicit-broadcast
  }

  INDArray viaHelper(int batch) {
    return column(batch).add(Nd4j.rand(1, 8)); // expect: shape.implicit-broadcast
  }

  private INDArray column(int rows) {
    return Nd4j.rand(rows, 1);
  }
}
