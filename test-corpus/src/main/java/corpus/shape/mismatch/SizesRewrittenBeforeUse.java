package corpus.shape.mismatch;

import java.util.Arrays;
import java.util.function.IntConsumer;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/**
 * Greenhouse sensor grids whose sizes are kept in an array that is changed before the grid is
 * made: the grid has the sizes the array holds when it is used, not when it was written.
 */
class SizesRewrittenBeforeUse {
  INDArray widenedGrid() {
    long[] grid = {8, 3};
    grid[1] = 4;
    return Nd4j.zeros(grid).mmul(Nd4j.zeros(4, 5)); // clean: shape.mismatch
  }

  INDArray wrongWidth() {
    long[] grid = {8, 3};
    grid[1] = 6;
    return Nd4j.zeros(grid).mmul(Nd4j.zeros(4, 5)); // expect: shape.mismatch
  }

  INDArray grownByCounting() {
    long[] grid = {8, 3};
    grid[1]++;
    return Nd4j.zeros(grid).mmul(Nd4j.zeros(4, 5)); // clean: shape.mismatch
  }

  INDArray filledByLibrary() {
    long[] grid = {8, 3};
    Arrays.fill(grid, 4);
    return Nd4j.zeros(grid).mmul(Nd4j.zeros(4, 5)); // clean: shape.mismatch
  }

  INDArray filledByHelper() {
    long[] grid = {8, 3};
    useSensorsPerRow(grid);
    return Nd4j.zeros(grid).mmul(Nd4j.zeros(4, 5)); // clean: shape.mismatch
  }

  INDArray filledLater(IntConsumer onReading) {
    long[] grid = {8, 3};
    IntConsumer widen = sensors -> grid[1] = sensors;
    widen.accept(4);
    return Nd4j.zeros(grid).mmul(Nd4j.zeros(4, 5)); // clean: shape.mismatch
  }

  /** Printing the sizes does not change them. */
  INDArray printedFirst() {
    long[] grid = {8, 3};
    System.out.println("grid " + Arrays.toString(grid));
    return Nd4j.zeros(grid).mmul(Nd4j.zeros(4, 5)); // expect: shape.mismatch
  }

  private static void useSensorsPerRow(long[] grid) {
    grid[1] = 4;
  }
}
