package dev.plumbline.analysis.shape;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class ShapeAnalysisTest {
  private static final String ND4J = "import org.nd4j.linalg.api.ndarray.INDArray;\n"
      + "import org.nd4j.linalg.factory.Nd4j;\n";

  @Test
  void dump() {
    String s = ShapeTestFiles.shapes(ND4J + """
        class T {
          INDArray m(INDArray x, int hidden) {
            long b = x.size(0);
            INDArray w = Nd4j.rand(16, hidden);
            INDArray y = x.reshape(b, -1);
            INDArray z = Nd4j.zeros(b, 16).mmul(w);
            INDArray q = Nd4j.rand(3, 4).mmul(Nd4j.rand(5, 2));
            return z.add(Nd4j.ones(hidden));
          }
        }
        """);
    System.out.println(s);
  }
}
