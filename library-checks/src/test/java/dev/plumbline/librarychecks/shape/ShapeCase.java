package dev.plumbline.librarychecks.shape;

import ai.djl.ndarray.NDManager;
import dev.plumbline.analysis.shape.Dim;
import dev.plumbline.analysis.shape.Framework;
import dev.plumbline.analysis.shape.ShapeOutcome;
import dev.plumbline.analysis.shape.TensorShape;
import java.util.List;
import java.util.function.Function;

/**
 * One generated case: an operation of one framework on concrete input shapes, with the real
 * call to run and the static transfer function to compare.
 *
 * @param table the table the case is shown in (e.g. "element-wise add, copy")
 * @param framework whose operation it is
 * @param row row label in the table (usually the first input's shape)
 * @param column column label (second input, target shape, axes)
 * @param inputs concrete input shapes
 * @param real runs the real operation and returns the result shape; throws when the library does
 * @param inferred the static answer, given the inputs as abstract shapes and a mapping from a
 *     literal size argument to its abstract value (a constant, or the symbol standing for it)
 */
record ShapeCase(
    String table,
    Framework framework,
    String row,
    String column,
    List<long[]> inputs,
    RealOp real,
    StaticOp inferred) {

  @FunctionalInterface
  interface RealOp {
    long[] run(NDManager manager, List<long[]> inputs);
  }

  @FunctionalInterface
  interface StaticOp {
    ShapeOutcome infer(List<TensorShape> inputs, Function<Long, Dim> size);
  }

  String describe() {
    return framework + " " + table + " " + row + " " + column;
  }
}
