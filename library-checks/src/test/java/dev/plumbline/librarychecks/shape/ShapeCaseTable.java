package dev.plumbline.librarychecks.shape;

import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDArrays;
import ai.djl.ndarray.NDList;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;
import dev.plumbline.analysis.shape.Dim;
import dev.plumbline.analysis.shape.Framework;
import dev.plumbline.analysis.shape.ShapeOutcome;
import dev.plumbline.analysis.shape.ShapeSemantics;
import dev.plumbline.analysis.shape.TensorShape;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.function.BiFunction;
import java.util.stream.Collectors;
import org.nd4j.linalg.api.buffer.DataType;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/**
 * The generated table of cases: every operation family the shape analysis models, over small
 * shapes chosen so that sizes 1, equal sizes and unequal sizes meet in every position (scalars,
 * vectors, rows, columns, square and non-square matrices, rank-3 arrays).
 */
final class ShapeCaseTable {

  /** Shapes for binary operations: every pair is a case. */
  static final long[][] PAIR_SHAPES = {
      {}, {1}, {3}, {4}, {1, 4}, {4, 1}, {3, 1}, {1, 3}, {3, 4}, {4, 3}, {4, 4}, {1, 1},
      {2, 3, 4}, {2, 1, 4}, {3, 4, 1}};

  /** Shapes for unary operations. */
  static final long[][] UNARY_SHAPES = {
      {}, {1}, {4}, {1, 4}, {4, 1}, {3, 4}, {4, 4}, {2, 3, 4}, {2, 1, 4}, {1, 3, 4}};

  /** Shapes for concatenation and stacking. */
  static final long[][] JOIN_SHAPES = {{}, {3}, {4}, {1, 4}, {3, 4}, {4, 4}, {3, 1}, {2, 3, 4}};

  static final long[][] RESHAPE_TARGETS = {
      {-1}, {12}, {24}, {3, 4}, {4, 3}, {-1, 4}, {4, -1}, {-1, -1}, {2, -1, 2}, {6, 2}, {5, -1},
      {1, -1}, {-1, 1}, {2, 2, 3}, {}, {4}, {16}, {2, 2}};

  static final int[][] PERMUTATIONS = {
      {0}, {-1}, {0, 1}, {1, 0}, {0, 0}, {1, -2}, {0, 2, 1}, {2, 1, 0}, {1, 2, 0}, {0, 1, 1},
      {3, 0, 1}, {0, 1, 2, 3}};

  static final int[][] REDUCE_AXES = {{0}, {1}, {2}, {-1}, {0, 1}, {1, 0}, {0, 0}, {3}};

  private ShapeCaseTable() {}

  static List<ShapeCase> all() {
    List<ShapeCase> out = new ArrayList<>();
    elementwise(out);
    products(out);
    reshapes(out);
    permutations(out);
    reductions(out);
    vectorOps(out);
    joins(out);
    indexing(out);
    creation(out);
    return out;
  }

  // ------------------------------------------------------------------ element-wise

  private static void elementwise(List<ShapeCase> out) {
    for (boolean inPlace : new boolean[] {false, true}) {
      for (String op : List.of("add", "mul")) {
        String name = op + (inPlace ? "i" : "");
        String table = "element-wise " + name + (inPlace ? " (in place)" : " (copy)");
        for (long[] a : PAIR_SHAPES) {
          for (long[] b : PAIR_SHAPES) {
            for (Framework fw : Framework.values()) {
              out.add(new ShapeCase(table, fw, label(a), label(b), List.of(a, b),
                  (m, in) -> fw == Framework.ND4J ? shape(nd4jElementwise(name, nd(in.get(0)), nd(in.get(1))))
                      : shape(djlElementwise(name, dj(m, in.get(0)), dj(m, in.get(1)))),
                  (s, size) -> ShapeSemantics.elementwise(fw, s.get(0), s.get(1), inPlace)));
            }
          }
        }
      }
    }
  }

  private static INDArray nd4jElementwise(String op, INDArray a, INDArray b) {
    return switch (op) {
      case "add" -> a.add(b);
      case "mul" -> a.mul(b);
      case "addi" -> a.addi(b);
      default -> a.muli(b);
    };
  }

  private static NDArray djlElementwise(String op, NDArray a, NDArray b) {
    return switch (op) {
      case "add" -> a.add(b);
      case "mul" -> a.mul(b);
      case "addi" -> a.addi(b);
      default -> a.muli(b);
    };
  }

  // ------------------------------------------------------------------ matrix products

  private static void products(List<ShapeCase> out) {
    for (long[] a : PAIR_SHAPES) {
      for (long[] b : PAIR_SHAPES) {
        out.add(new ShapeCase("matrix product mmul / matMul", Framework.ND4J, label(a), label(b), List.of(a, b),
            (m, in) -> shape(nd(in.get(0)).mmul(nd(in.get(1)))),
            (s, size) -> ShapeSemantics.product(Framework.ND4J, ShapeSemantics.Product.MMUL, s.get(0), s.get(1))));
        out.add(new ShapeCase("matrix product mmul / matMul", Framework.DJL, label(a), label(b), List.of(a, b),
            (m, in) -> shape(dj(m, in.get(0)).matMul(dj(m, in.get(1)))),
            (s, size) -> ShapeSemantics.product(Framework.DJL, ShapeSemantics.Product.MATMUL, s.get(0), s.get(1))));
        out.add(new ShapeCase("DJL dot", Framework.DJL, label(a), label(b), List.of(a, b),
            (m, in) -> shape(dj(m, in.get(0)).dot(dj(m, in.get(1)))),
            (s, size) -> ShapeSemantics.product(Framework.DJL, ShapeSemantics.Product.DOT, s.get(0), s.get(1))));
      }
    }
  }

  // ------------------------------------------------------------------ reshape, permute, transpose

  private static void reshapes(List<ShapeCase> out) {
    for (long[] a : UNARY_SHAPES) {
      for (long[] t : RESHAPE_TARGETS) {
        for (Framework fw : Framework.values()) {
          out.add(new ShapeCase("reshape", fw, label(a), label(t), List.of(a),
              // ND4J writes the inferred size back into the argument array: always pass a copy.
              (m, in) -> fw == Framework.ND4J ? shape(nd(in.get(0)).reshape(t.clone()))
                  : shape(dj(m, in.get(0)).reshape(t.clone())),
              (s, size) -> ShapeSemantics.reshape(fw, s.get(0),
                  Arrays.stream(t).mapToObj(size::apply).toList())));
        }
      }
    }
  }

  private static void permutations(List<ShapeCase> out) {
    for (long[] a : UNARY_SHAPES) {
      for (int[] p : PERMUTATIONS) {
        List<Integer> axes = Arrays.stream(p).boxed().toList();
        out.add(new ShapeCase("permute / transpose(axes)", Framework.ND4J, label(a), Arrays.toString(p), List.of(a),
            (m, in) -> shape(nd(in.get(0)).permute(p.clone())),
            (s, size) -> ShapeSemantics.permute(Framework.ND4J, s.get(0), axes)));
        out.add(new ShapeCase("permute / transpose(axes)", Framework.DJL, label(a), Arrays.toString(p), List.of(a),
            (m, in) -> shape(dj(m, in.get(0)).transpose(p.clone())),
            (s, size) -> ShapeSemantics.permute(Framework.DJL, s.get(0), axes)));
      }
      out.add(new ShapeCase("transpose()", Framework.ND4J, label(a), "transpose()", List.of(a),
          (m, in) -> shape(nd(in.get(0)).transpose()),
          (s, size) -> ShapeSemantics.transpose(Framework.ND4J, s.get(0))));
      out.add(new ShapeCase("transpose()", Framework.DJL, label(a), "transpose()", List.of(a),
          (m, in) -> shape(dj(m, in.get(0)).transpose()),
          (s, size) -> ShapeSemantics.transpose(Framework.DJL, s.get(0))));
    }
  }

  // ------------------------------------------------------------------ reductions

  private static void reductions(List<ShapeCase> out) {
    for (long[] a : UNARY_SHAPES) {
      for (String op : List.of("sum", "mean")) {
        for (int[] axes : REDUCE_AXES) {
          for (boolean keep : new boolean[] {false, true}) {
            List<Integer> axisList = Arrays.stream(axes).boxed().toList();
            String column = op + Arrays.toString(axes) + (keep ? " keep" : "");
            String table = "reductions " + op;
            out.add(new ShapeCase(table, Framework.ND4J, label(a), column, List.of(a),
                (m, in) -> {
                  INDArray x = nd(in.get(0));
                  return shape(op.equals("sum") ? (keep ? x.sum(true, axes.clone()) : x.sum(axes.clone()))
                      : (keep ? x.mean(true, axes.clone()) : x.mean(axes.clone())));
                },
                (s, size) -> ShapeSemantics.reduce(Framework.ND4J, s.get(0), axisList, keep)));
            out.add(new ShapeCase(table, Framework.DJL, label(a), column, List.of(a),
                (m, in) -> {
                  NDArray x = dj(m, in.get(0));
                  return shape(op.equals("sum") ? (keep ? x.sum(axes.clone(), true) : x.sum(axes.clone()))
                      : (keep ? x.mean(axes.clone(), true) : x.mean(axes.clone())));
                },
                (s, size) -> ShapeSemantics.reduce(Framework.DJL, s.get(0), axisList, keep, op.equals("mean"))));
          }
        }
        String column = op + "()";
        out.add(new ShapeCase("reductions " + op, Framework.ND4J, label(a), column, List.of(a),
            (m, in) -> shape(op.equals("sum") ? nd(in.get(0)).sum() : nd(in.get(0)).mean()),
            (s, size) -> ShapeSemantics.reduce(Framework.ND4J, s.get(0), null, false)));
        out.add(new ShapeCase("reductions " + op, Framework.DJL, label(a), column, List.of(a),
            (m, in) -> shape(op.equals("sum") ? dj(m, in.get(0)).sum() : dj(m, in.get(0)).mean()),
            (s, size) -> ShapeSemantics.reduce(Framework.DJL, s.get(0), null, false)));
      }
    }
  }

  // ------------------------------------------------------------------ ND4J row and column vectors

  private static void vectorOps(List<ShapeCase> out) {
    for (String op : List.of("addRowVector", "addiRowVector", "addColumnVector", "addiColumnVector")) {
      ShapeSemantics.VectorAxis along = op.contains("Row") ? ShapeSemantics.VectorAxis.ROW
          : ShapeSemantics.VectorAxis.COLUMN;
      for (long[] a : PAIR_SHAPES) {
        for (long[] b : PAIR_SHAPES) {
          out.add(new ShapeCase("ND4J " + op, Framework.ND4J, label(a), label(b), List.of(a, b),
              (m, in) -> {
                INDArray x = nd(in.get(0));
                INDArray v = nd(in.get(1));
                return shape(switch (op) {
                  case "addRowVector" -> x.addRowVector(v);
                  case "addiRowVector" -> x.addiRowVector(v);
                  case "addColumnVector" -> x.addColumnVector(v);
                  default -> x.addiColumnVector(v);
                });
              },
              (s, size) -> ShapeSemantics.vectorOp(s.get(0), s.get(1), along)));
        }
      }
    }
  }

  // ------------------------------------------------------------------ concatenation and stacking

  private static void joins(List<ShapeCase> out) {
    for (long[] a : JOIN_SHAPES) {
      for (long[] b : JOIN_SHAPES) {
        for (int axis : new int[] {-1, 0, 1, 2}) {
          out.add(new ShapeCase("concat axis " + axis, Framework.ND4J, label(a), label(b), List.of(a, b),
              (m, in) -> shape(Nd4j.concat(axis, nd(in.get(0)), nd(in.get(1)))),
              (s, size) -> ShapeSemantics.concat(Framework.ND4J, s, axis)));
          out.add(new ShapeCase("concat axis " + axis, Framework.DJL, label(a), label(b), List.of(a, b),
              (m, in) -> shape(dj(m, in.get(0)).concat(dj(m, in.get(1)), axis)),
              (s, size) -> ShapeSemantics.concat(Framework.DJL, s, axis)));
        }
        for (int axis : new int[] {-1, 0, 1}) {
          out.add(new ShapeCase("stack axis " + axis, Framework.ND4J, label(a), label(b), List.of(a, b),
              (m, in) -> shape(Nd4j.stack(axis, nd(in.get(0)), nd(in.get(1)))),
              (s, size) -> ShapeSemantics.stack(Framework.ND4J, s, axis)));
          out.add(new ShapeCase("stack axis " + axis, Framework.DJL, label(a), label(b), List.of(a, b),
              (m, in) -> shape(NDArrays.stack(new NDList(dj(m, in.get(0)), dj(m, in.get(1))), axis)),
              (s, size) -> ShapeSemantics.stack(Framework.DJL, s, axis)));
        }
        out.add(new ShapeCase("ND4J hstack", Framework.ND4J, label(a), label(b), List.of(a, b),
            (m, in) -> shape(Nd4j.hstack(nd(in.get(0)), nd(in.get(1)))),
            (s, size) -> ShapeSemantics.hstack(s)));
        out.add(new ShapeCase("ND4J vstack", Framework.ND4J, label(a), label(b), List.of(a, b),
            (m, in) -> shape(Nd4j.vstack(nd(in.get(0)), nd(in.get(1)))),
            (s, size) -> ShapeSemantics.vstack(s)));
      }
    }
  }

  // ------------------------------------------------------------------ indexing and creation

  private static void indexing(List<ShapeCase> out) {
    for (long[] a : UNARY_SHAPES) {
      out.add(new ShapeCase("indexing", Framework.ND4J, label(a), "getRow(0)", List.of(a),
          (m, in) -> shape(nd(in.get(0)).getRow(0)),
          (s, size) -> ShapeSemantics.index(Framework.ND4J, ShapeSemantics.Index.ROW, s.get(0), List.of(0L))));
      out.add(new ShapeCase("indexing", Framework.ND4J, label(a), "getColumn(0)", List.of(a),
          (m, in) -> shape(nd(in.get(0)).getColumn(0)),
          (s, size) -> ShapeSemantics.index(Framework.ND4J, ShapeSemantics.Index.COLUMN, s.get(0), List.of(0L))));
      out.add(new ShapeCase("indexing", Framework.DJL, label(a), "get(0)", List.of(a),
          (m, in) -> shape(dj(m, in.get(0)).get(0)),
          (s, size) -> ShapeSemantics.index(Framework.DJL, ShapeSemantics.Index.LEADING, s.get(0), List.of(0L))));
      out.add(new ShapeCase("indexing", Framework.DJL, label(a), "get(0, 0)", List.of(a),
          (m, in) -> shape(dj(m, in.get(0)).get(0, 0)),
          (s, size) -> ShapeSemantics.index(Framework.DJL, ShapeSemantics.Index.LEADING, s.get(0), List.of(0L, 0L))));
    }
  }

  private static void creation(List<ShapeCase> out) {
    BiFunction<long[], java.util.function.Function<Long, Dim>, ShapeOutcome> created = (dims, size) ->
        ShapeOutcome.succeeds(TensorShape.of(Arrays.stream(dims).mapToObj(size::apply).toList()));
    for (long[] a : new long[][] {{}, {1}, {3}, {2, 3}, {2, 3, 4}}) {
      int[] ints = Arrays.stream(a).mapToInt(x -> (int) x).toArray();
      out.add(new ShapeCase("creation", Framework.ND4J, label(a), "Nd4j.create(int...)", List.of(),
          (m, in) -> shape(Nd4j.create(ints.clone())), (s, size) -> created.apply(a, size)));
      out.add(new ShapeCase("creation", Framework.ND4J, label(a), "Nd4j.zeros(long...)", List.of(),
          (m, in) -> shape(Nd4j.zeros(a.clone())), (s, size) -> created.apply(a, size)));
      out.add(new ShapeCase("creation", Framework.ND4J, label(a), "Nd4j.ones(int...)", List.of(),
          (m, in) -> shape(Nd4j.ones(ints.clone())), (s, size) -> created.apply(a, size)));
      out.add(new ShapeCase("creation", Framework.ND4J, label(a), "Nd4j.rand(long...)", List.of(),
          (m, in) -> shape(Nd4j.rand(a.clone())), (s, size) -> created.apply(a, size)));
      out.add(new ShapeCase("creation", Framework.DJL, label(a), "manager.zeros(new Shape(...))", List.of(),
          (m, in) -> m.zeros(new Shape(a)).getShape().getShape(), (s, size) -> created.apply(a, size)));
      out.add(new ShapeCase("creation", Framework.DJL, label(a), "manager.randomUniform(0, 1, new Shape(...))",
          List.of(), (m, in) -> m.randomUniform(0, 1, new Shape(a)).getShape().getShape(),
          (s, size) -> created.apply(a, size)));
    }
  }

  // ------------------------------------------------------------------ helpers

  static String label(long[] shape) {
    return Arrays.stream(shape).mapToObj(Long::toString).collect(Collectors.joining(", ", "[", "]"));
  }

  private static INDArray nd(long[] shape) {
    return shape.length == 0 ? Nd4j.scalar(1.0) : Nd4j.rand(DataType.DOUBLE, shape.clone()).addi(1.0);
  }

  private static NDArray dj(NDManager manager, long[] shape) {
    return manager.ones(new Shape(shape));
  }

  private static long[] shape(INDArray a) {
    return a.shape();
  }

  private static long[] shape(NDArray a) {
    return a.getShape().getShape();
  }
}
