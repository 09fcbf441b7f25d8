package dev.plumbline.librarychecks;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;
import org.junit.jupiter.api.Test;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/**
 * Both libraries load their native code from the test classpath and run on the CPU without a
 * network. Also a first measured difference between them: ND4J refuses to add a [3] row to a
 * [3, 1] column, while DJL (PyTorch) broadcasts the pair to [3, 3].
 */
class LibrariesRunOfflineTest {

  @Test
  void nd4jRunsOnTheCpu() {
    INDArray m = Nd4j.create(2, 3);
    assertArrayEquals(new long[] {2, 3}, m.add(Nd4j.create(3)).shape());
    assertThrows(RuntimeException.class, () -> Nd4j.create(3).add(Nd4j.create(3, 1)));
  }

  @Test
  void djlRunsOnTheCpu() {
    try (NDManager manager = NDManager.newBaseManager()) {
      assertEquals("PyTorch", manager.getEngine().getEngineName());
      NDArray sum = manager.zeros(new Shape(3)).add(manager.zeros(new Shape(3, 1)));
      assertEquals(new Shape(3, 3), sum.getShape());
    }
  }
}
