package dev.plumbline.analysis.shape;

import dev.plumbline.analysis.shape.ShapeError.Kind;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;

/**
 * The transfer functions of the shape analysis: what each tensor operation does to shapes, per
 * framework. Public so that the differential test in {@code library-checks} can hold every
 * claim made here against the real ND4J and DJL on the same inputs.
 *
 * <p>Every rule below was decided by running the libraries (ND4J 1.0.0-M2.1 with nd4j-native,
 * DJL 0.36.0 with the PyTorch engine, on the CPU) over a generated table of shapes; the table
 * and the resulting semantics are in {@code docs/shape-semantics.md}. Where the libraries do
 * something irregular (ND4J matrix products of vectors, row/column operations on 1-by-1 or
 * rank-3 arrays) the functions answer {@link ShapeOutcome.Status#UNDECIDED} rather than encode
 * a guess. Sizes are three-valued ({@link Dim#equalTo}, {@link Dim#isOne}): an operation is
 * claimed to fail only when the sizes that make it fail are certain.
 */
public final class ShapeSemantics {

  private ShapeSemantics() {}

  /** How a matrix product treats its operands. */
  public enum Product {
    /** ND4J {@code mmul}: matrices only, with a dot product for a row times a column. */
    MMUL,
    /** NumPy {@code matmul} (DJL {@code matMul}): vectors promoted, batch axes broadcast. */
    MATMUL,
    /** DJL {@code dot} on the PyTorch engine: two vectors or two matrices. */
    DOT
  }

  /** Which vector a row- or column-vector operation expects. */
  public enum VectorAxis { ROW, COLUMN }

  /** Basic indexing that drops axes. */
  public enum Index {
    /** ND4J {@code getRow(i)}. */
    ROW,
    /** ND4J {@code getColumn(i)}. */
    COLUMN,
    /** DJL {@code get(i, j, ...)}: drops one leading axis per index. */
    LEADING
  }

  // ------------------------------------------------------------------ element-wise

  /** {@code a.op(b)} for add, sub, mul, div; {@code inPlace} for addi and friends (result in a). */
  public static ShapeOutcome elementwise(Framework fw, TensorShape a, TensorShape b, boolean inPlace) {
    ShapeOutcome copy = fw == Framework.ND4J ? nd4jElementwise(a, b) : broadcast(a, b);
    if (!inPlace || copy.fails()) {
      return copy;
    }
    Truth same = copy.result().sameAs(a);
    if (same.isTrue()) {
      return new ShapeOutcome(copy.status(), a, null);
    }
    if (same.isFalse()) {
      return ShapeOutcome.fails(new ShapeError(Kind.IN_PLACE, null, null, -1, copy.result()));
    }
    return ShapeOutcome.undecided(a);
  }

  /**
   * NumPy broadcasting (DJL follows it exactly): align from the last axis; sizes must be equal
   * or one of them 1; missing leading axes count as 1.
   */
  public static ShapeOutcome broadcast(TensorShape a, TensorShape b) {
    if (a.rank() == 0) {
      return ShapeOutcome.succeeds(b);
    }
    if (b.rank() == 0) {
      return ShapeOutcome.succeeds(a);
    }
    if (!a.rankKnown() || !b.rankKnown()) {
      return ShapeOutcome.unknown();
    }
    int ra = a.rank();
    int rb = b.rank();
    int n = Math.max(ra, rb);
    Dim[] out = new Dim[n];
    boolean decided = true;
    for (int i = 1; i <= n; i++) {
      int axis = n - i;
      if (i > ra) {
        out[axis] = b.dim(rb - i);
        continue;
      }
      if (i > rb) {
        out[axis] = a.dim(ra - i);
        continue;
      }
      Dim da = a.dim(ra - i);
      Dim db = b.dim(rb - i);
      Truth equal = da.equalTo(db);
      if (equal.isTrue()) {
        out[axis] = da;
      } else if (da.isOne().isTrue()) {
        out[axis] = db;
      } else if (db.isOne().isTrue()) {
        out[axis] = da;
      } else if (equal.isFalse() && da.isOne().isFalse() && db.isOne().isFalse()) {
        return ShapeOutcome.fails(ShapeError.at(Kind.BROADCAST, da, db, axis));
      } else {
        decided = false;
        // If it succeeds the sizes are equal unless one is 1; only "neither can be 1" pins it.
        out[axis] = da.isOne().isFalse() && db.isOne().isFalse() ? (da.known() ? da : db) : Dim.UNKNOWN;
      }
    }
    TensorShape result = TensorShape.of(Arrays.asList(out));
    return decided ? ShapeOutcome.succeeds(result) : ShapeOutcome.undecided(result);
  }

  /**
   * ND4J element-wise copy operations: NumPy broadcasting, except that a rank-1 vector (longer
   * than 1) against an array of higher rank only works when the array's last size equals the
   * vector's length; a last size of 1 fails (measured: {@code [3] + [4, 1]} and
   * {@code [4, 1] + [3]} fail where NumPy gives {@code [4, 3]}).
   */
  private static ShapeOutcome nd4jElementwise(TensorShape a, TensorShape b) {
    if (a.rank() == 0) {
      return ShapeOutcome.succeeds(b);
    }
    if (b.rank() == 0) {
      return ShapeOutcome.succeeds(a);
    }
    if (!a.rankKnown() || !b.rankKnown()) {
      return ShapeOutcome.unknown();
    }
    if (a.rank() == 1 && b.rank() >= 2) {
      return nd4jVectorAgainstArray(a, b);
    }
    if (b.rank() == 1 && a.rank() >= 2) {
      return nd4jVectorAgainstArray(b, a);
    }
    return broadcast(a, b);
  }

  private static ShapeOutcome nd4jVectorAgainstArray(TensorShape vector, TensorShape array) {
    Dim length = vector.dim(0);
    if (length.isOne().isTrue()) {
      return broadcast(vector, array);
    }
    Dim last = array.dim(-1);
    Truth equal = length.equalTo(last);
    if (equal.isTrue()) {
      return ShapeOutcome.succeeds(array);
    }
    if (last.isOne().isTrue() && length.isOne().isFalse()) {
      return ShapeOutcome.fails(ShapeError.at(Kind.VECTOR_AGAINST_ARRAY, length, last, array.rank() - 1));
    }
    if (equal.isFalse() && length.isOne().isFalse() && last.isOne().isFalse()) {
      return ShapeOutcome.fails(ShapeError.at(Kind.BROADCAST, length, last, array.rank() - 1));
    }
    return ShapeOutcome.undecided(array);
  }

  // ------------------------------------------------------------------ products

  public static ShapeOutcome product(Framework fw, Product kind, TensorShape a, TensorShape b) {
    return switch (kind) {
      case MMUL -> mmul(a, b);
      case MATMUL -> matmul(a, b);
      case DOT -> dot(a, b);
    };
  }

  /**
   * ND4J {@code mmul}: both operands must be matrices for a decided answer; rank 0 or rank 3 and
   * above fail. A 1-by-n row times an m-by-1 column gives {@code [1, 1]} whatever n and m are
   * (measured); vectors of rank 1 behave irregularly and are left undecided.
   */
  private static ShapeOutcome mmul(TensorShape a, TensorShape b) {
    if (badMmulRank(a) || badMmulRank(b)) {
      return ShapeOutcome.fails(ShapeError.of(Kind.PRODUCT_RANK));
    }
    if (a.rank() != 2 || b.rank() != 2) {
      return ShapeOutcome.unknown();
    }
    Dim rows = a.dim(0);
    Dim inner = a.dim(1);
    Dim innerRight = b.dim(0);
    Dim cols = b.dim(1);
    Truth rowTimesColumn = rows.isOne().and(cols.isOne());
    if (rowTimesColumn.isTrue()) {
      return ShapeOutcome.succeeds(TensorShape.ofConstants(1, 1));
    }
    Truth equal = inner.equalTo(innerRight);
    TensorShape result = TensorShape.of(rows, cols);
    if (equal.isTrue()) {
      return ShapeOutcome.succeeds(result);
    }
    if (equal.isFalse() && rowTimesColumn.isFalse()) {
      return ShapeOutcome.fails(ShapeError.of(Kind.INNER_SIZE, inner, innerRight));
    }
    return ShapeOutcome.undecided(result);
  }

  private static boolean badMmulRank(TensorShape s) {
    return s.rankKnown() && (s.rank() == 0 || s.rank() >= 3);
  }

  /** NumPy {@code matmul}, which DJL's PyTorch engine follows. */
  private static ShapeOutcome matmul(TensorShape a, TensorShape b) {
    if (a.rank() == 0 || b.rank() == 0) {
      return ShapeOutcome.fails(ShapeError.of(Kind.PRODUCT_RANK));
    }
    if (!a.rankKnown() || !b.rankKnown()) {
      return ShapeOutcome.unknown();
    }
    boolean vectorLeft = a.rank() == 1;
    boolean vectorRight = b.rank() == 1;
    Dim inner = a.dim(-1);
    Dim innerRight = vectorRight ? b.dim(0) : b.dim(-2);
    Truth equal = inner.equalTo(innerRight);
    if (equal.isFalse()) {
      return ShapeOutcome.fails(ShapeError.of(Kind.INNER_SIZE, inner, innerRight));
    }
    TensorShape batchA = TensorShape.of(a.rank() > 2 ? a.dims().subList(0, a.rank() - 2) : List.of());
    TensorShape batchB = TensorShape.of(b.rank() > 2 ? b.dims().subList(0, b.rank() - 2) : List.of());
    ShapeOutcome batch = broadcastBatch(batchA, batchB);
    if (batch.fails()) {
      return batch;
    }
    List<Dim> out = new ArrayList<>(batch.result().rankKnown() ? batch.result().dims() : List.of());
    if (!batch.result().rankKnown()) {
      return ShapeOutcome.unknown();
    }
    if (!vectorLeft) {
      out.add(a.dim(-2));
    }
    if (!vectorRight) {
      out.add(b.dim(-1));
    }
    TensorShape result = TensorShape.of(out);
    return equal.isTrue() && batch.succeeds() ? ShapeOutcome.succeeds(result) : ShapeOutcome.undecided(result);
  }

  private static ShapeOutcome broadcastBatch(TensorShape a, TensorShape b) {
    if (a.rank() == 0 && b.rank() == 0) {
      return ShapeOutcome.succeeds(a);
    }
    return broadcast(a, b);
  }

  /** DJL {@code dot} on the PyTorch engine: vector-vector or matrix-matrix only (measured). */
  private static ShapeOutcome dot(TensorShape a, TensorShape b) {
    if (!a.rankKnown() || !b.rankKnown()) {
      return ShapeOutcome.unknown();
    }
    if (a.rank() == 1 && b.rank() == 1) {
      Truth equal = a.dim(0).equalTo(b.dim(0));
      if (equal.isFalse()) {
        return ShapeOutcome.fails(ShapeError.of(Kind.INNER_SIZE, a.dim(0), b.dim(0)));
      }
      return equal.isTrue() ? ShapeOutcome.succeeds(TensorShape.of()) : ShapeOutcome.undecided(TensorShape.of());
    }
    if (a.rank() == 2 && b.rank() == 2) {
      return matmul(a, b);
    }
    return ShapeOutcome.fails(ShapeError.of(Kind.PRODUCT_RANK));
  }

  // ------------------------------------------------------------------ reshape, permute, transpose

  /**
   * Reshape to {@code target}, where a size of exactly {@code -1} is inferred. A target size that
   * is unknown might be {@code -1}, so only the known sizes count; zero or negative sizes other
   * than {@code -1} are left undecided.
   */
  public static ShapeOutcome reshape(Framework fw, TensorShape source, List<Dim> target) {
    int inferred = -1;
    int inferredCount = 0;
    boolean allKnown = true;
    Dim known = Dim.of(1);
    for (int i = 0; i < target.size(); i++) {
      Dim d = target.get(i);
      if (d.is(-1)) {
        inferred = i;
        inferredCount++;
      } else if (!d.known()) {
        allKnown = false;
      } else if (d.isConstant() && d.constant().getAsLong() <= 0) {
        return ShapeOutcome.unknown();
      } else {
        known = known.times(d);
      }
    }
    if (inferredCount > 1) {
      return ShapeOutcome.fails(ShapeError.of(Kind.TWO_INFERRED));
    }
    List<Dim> out = new ArrayList<>(target);
    if (inferred >= 0) {
      out.set(inferred, Dim.UNKNOWN);
    }
    if (!allKnown) {
      return ShapeOutcome.undecided(TensorShape.of(out));
    }
    Dim count = source.elementCount();
    if (target.isEmpty()) {
      // Both libraries accept an empty shape exactly when there is one element (ND4J says so
      // with its own message: "without shape arguments").
      return decide(count.equalTo(Dim.of(1)), TensorShape.of(), fw == Framework.ND4J
          ? ShapeError.of(Kind.EMPTY_RESHAPE) : ShapeError.of(Kind.ELEMENT_COUNT, count, Dim.of(1)));
    }
    if (inferred < 0) {
      return decide(count.equalTo(known), TensorShape.of(out), ShapeError.of(Kind.ELEMENT_COUNT, count, known));
    }
    java.util.Optional<Dim> quotient = count.exactQuotient(known);
    if (quotient.isPresent()) {
      out.set(inferred, quotient.get());
      return ShapeOutcome.succeeds(TensorShape.of(out));
    }
    if (count.divisibleBy(known).isFalse()) {
      return ShapeOutcome.fails(ShapeError.of(Kind.NOT_DIVISIBLE, count, known));
    }
    return ShapeOutcome.undecided(TensorShape.of(out));
  }

  private static ShapeOutcome decide(Truth ok, TensorShape result, ShapeError error) {
    if (ok.isTrue()) {
      return ShapeOutcome.succeeds(result);
    }
    return ok.isFalse() ? ShapeOutcome.fails(error) : ShapeOutcome.undecided(result);
  }

  /**
   * Permute ({@code permute} in ND4J, {@code transpose(int...)} in DJL). ND4J refuses negative
   * axes; DJL counts them from the end. {@code axes} entries of null are unknown.
   */
  public static ShapeOutcome permute(Framework fw, TensorShape source, List<Integer> axes) {
    if (!source.rankKnown() || axes.stream().anyMatch(java.util.Objects::isNull)) {
      return ShapeOutcome.undecided(TensorShape.ofRank(axes.size()));
    }
    int r = source.rank();
    if (axes.size() != r) {
      return ShapeOutcome.fails(ShapeError.of(Kind.PERMUTATION));
    }
    List<Dim> out = new ArrayList<>();
    boolean[] seen = new boolean[r];
    for (int axis : axes) {
      int a = axis;
      if (a < 0 && fw == Framework.DJL) {
        a += r;
      }
      if (a < 0 || a >= r) {
        return ShapeOutcome.fails(ShapeError.at(Kind.AXIS_RANGE, null, null, axis));
      }
      if (seen[a]) {
        return ShapeOutcome.fails(ShapeError.at(Kind.DUPLICATE_AXIS, null, null, axis));
      }
      seen[a] = true;
      out.add(source.dim(a));
    }
    return ShapeOutcome.succeeds(TensorShape.of(out));
  }

  /** {@code transpose()}: reverses the axes; ND4J refuses arrays of rank below 2 (measured). */
  public static ShapeOutcome transpose(Framework fw, TensorShape source) {
    if (!source.rankKnown()) {
      return ShapeOutcome.unknown();
    }
    if (fw == Framework.ND4J && source.rank() < 2) {
      return ShapeOutcome.fails(ShapeError.of(Kind.NOT_A_MATRIX));
    }
    List<Dim> out = new ArrayList<>(source.dims());
    Collections.reverse(out);
    return ShapeOutcome.succeeds(TensorShape.of(out));
  }

  // ------------------------------------------------------------------ reductions

  /** A reduction every engine computes over any number of axes ({@code sum}). */
  public static ShapeOutcome reduce(Framework fw, TensorShape source, List<Integer> axes, boolean keepDims) {
    return reduce(fw, source, axes, keepDims, false);
  }

  /**
   * Reduction along {@code axes} (null: over everything, as {@code sum()}). Without kept
   * dimensions the axes disappear; with them they become 1. Measured irregularities are left
   * undecided: ND4J with a repeated axis or a negative axis (it fails on some shapes and not on
   * others), and, when {@code engineMayRefuseAxes}, a DJL reduction over several axes (the
   * PyTorch engine refuses {@code mean} and {@code max} over more than one axis; other engines
   * may not). DJL refuses a repeated axis.
   */
  public static ShapeOutcome reduce(Framework fw, TensorShape source, List<Integer> axes, boolean keepDims,
      boolean engineMayRefuseAxes) {
    if (axes == null) {
      return keepDims ? ShapeOutcome.unknown() : ShapeOutcome.succeeds(TensorShape.of());
    }
    if (axes.isEmpty() || axes.stream().anyMatch(java.util.Objects::isNull)) {
      return ShapeOutcome.unknown();
    }
    if (!source.rankKnown()) {
      return ShapeOutcome.unknown();
    }
    int r = source.rank();
    boolean[] reduced = new boolean[Math.max(r, 1)];
    boolean decided = true;
    for (int axis : axes) {
      int a = axis;
      boolean valid;
      if (fw == Framework.ND4J) {
        valid = r == 0 ? a == 0 : a >= -r && a < r;
      } else {
        valid = r == 0 ? a == 0 || a == -1 : a >= -r && a < r;
      }
      if (!valid) {
        return ShapeOutcome.fails(ShapeError.at(Kind.AXIS_RANGE, null, null, axis));
      }
      if (a < 0) {
        a += Math.max(r, 1);
        decided &= fw == Framework.DJL;
      }
      if (reduced[a]) {
        if (fw == Framework.DJL) {
          return ShapeOutcome.fails(ShapeError.at(Kind.DUPLICATE_AXIS, null, null, axis));
        }
        decided = false;
      }
      reduced[a] = true;
    }
    decided &= !(engineMayRefuseAxes && axes.size() > 1);
    if (r == 0) {
      return decided ? ShapeOutcome.succeeds(TensorShape.of()) : ShapeOutcome.undecided(TensorShape.of());
    }
    List<Dim> out = new ArrayList<>();
    for (int i = 0; i < r; i++) {
      if (!reduced[i]) {
        out.add(source.dim(i));
      } else if (keepDims) {
        out.add(Dim.of(1));
      }
    }
    TensorShape result = TensorShape.of(out);
    return decided ? ShapeOutcome.succeeds(result) : ShapeOutcome.undecided(result);
  }

  /** Axes a reduction removes (normalized, sorted), or null when unknown; for rules about them. */
  public static List<Integer> normalizedAxes(TensorShape source, List<Integer> axes) {
    if (axes == null) {
      return null;
    }
    if (!source.rankKnown() || axes.stream().anyMatch(java.util.Objects::isNull)) {
      return null;
    }
    java.util.TreeSet<Integer> out = new java.util.TreeSet<>();
    for (int a : axes) {
      out.add(a < 0 ? a + source.rank() : a);
    }
    return List.copyOf(out);
  }

  // ------------------------------------------------------------------ ND4J row and column vectors

  /**
   * ND4J {@code addRowVector}/{@code addColumnVector} and their in-place forms, on a matrix whose
   * size along the vector is known not to be 1. A row vector must have the matrix's column count
   * (as {@code [m]} or {@code [1, m]}), a column vector its row count ({@code [n]} or
   * {@code [n, 1]}); a single element or a scalar always works. Other cases (rank 3, 1-by-1
   * matrices) are irregular in ND4J and left undecided.
   */
  public static ShapeOutcome vectorOp(TensorShape matrix, TensorShape vector, VectorAxis along) {
    if (matrix.rank() != 2) {
      return ShapeOutcome.unknown();
    }
    Dim needed = along == VectorAxis.ROW ? matrix.dim(1) : matrix.dim(0);
    if (!needed.isOne().isFalse()) {
      return ShapeOutcome.unknown();
    }
    if (!vector.rankKnown()) {
      return ShapeOutcome.undecided(matrix);
    }
    switch (vector.rank()) {
      case 0:
        return ShapeOutcome.succeeds(matrix);
      case 1:
        return vectorLength(matrix, needed, vector.dim(0));
      case 2: {
        Dim length = along == VectorAxis.ROW ? vector.dim(1) : vector.dim(0);
        Dim other = along == VectorAxis.ROW ? vector.dim(0) : vector.dim(1);
        if (other.isOne().isFalse()) {
          return ShapeOutcome.fails(ShapeError.of(Kind.VECTOR_LENGTH, needed, length));
        }
        if (other.isOne().isTrue()) {
          return vectorLength(matrix, needed, length);
        }
        return ShapeOutcome.undecided(matrix);
      }
      default:
        return ShapeOutcome.fails(ShapeError.of(Kind.VECTOR_LENGTH, needed, Dim.UNKNOWN));
    }
  }

  private static ShapeOutcome vectorLength(TensorShape matrix, Dim needed, Dim length) {
    Truth equal = length.equalTo(needed);
    if (equal.isTrue() || length.isOne().isTrue()) {
      return ShapeOutcome.succeeds(matrix);
    }
    if (equal.isFalse() && length.isOne().isFalse()) {
      return ShapeOutcome.fails(ShapeError.of(Kind.VECTOR_LENGTH, needed, length));
    }
    return ShapeOutcome.undecided(matrix);
  }

  // ------------------------------------------------------------------ joining

  /**
   * Concatenation along {@code axis} (negative counts from the end in both libraries). ND4J
   * treats a scalar as a one-element vector here (measured), so scalars are left undecided.
   */
  public static ShapeOutcome concat(Framework fw, List<TensorShape> inputs, int axis) {
    if (inputs.isEmpty() || fw == Framework.ND4J && inputs.stream().anyMatch(s -> s.rank() == 0)) {
      return ShapeOutcome.unknown();
    }
    int rank = -1;
    for (TensorShape s : inputs) {
      if (s.rankKnown()) {
        if (rank >= 0 && s.rank() != rank) {
          return ShapeOutcome.fails(ShapeError.of(Kind.CONCAT_RANK, Dim.of(rank), Dim.of(s.rank())));
        }
        rank = s.rank();
      }
    }
    if (rank <= 0 || inputs.stream().anyMatch(s -> !s.rankKnown())) {
      return ShapeOutcome.unknown();
    }
    int a = axis < 0 ? axis + rank : axis;
    if (a < 0 || a >= rank) {
      return ShapeOutcome.fails(ShapeError.at(Kind.AXIS_RANGE, null, null, axis));
    }
    boolean decided = true;
    List<Dim> out = new ArrayList<>();
    for (int i = 0; i < rank; i++) {
      if (i == a) {
        Dim sum = Dim.of(0);
        for (TensorShape s : inputs) {
          sum = sum.plus(s.dim(i));
        }
        out.add(sum);
        continue;
      }
      Dim first = inputs.get(0).dim(i);
      Dim chosen = first;
      for (TensorShape s : inputs.subList(1, inputs.size())) {
        Truth equal = first.equalTo(s.dim(i));
        if (equal.isFalse()) {
          return ShapeOutcome.fails(ShapeError.at(Kind.CONCAT_SIZE, first, s.dim(i), i));
        }
        if (!equal.isTrue()) {
          decided = false;
          if (!chosen.known()) {
            chosen = s.dim(i);
          }
        }
      }
      out.add(chosen);
    }
    TensorShape result = TensorShape.of(out);
    return decided ? ShapeOutcome.succeeds(result) : ShapeOutcome.undecided(result);
  }

  /** Stacking equal shapes along a new axis (range {@code -(rank+1)..rank}). */
  public static ShapeOutcome stack(Framework fw, List<TensorShape> inputs, int axis) {
    if (inputs.isEmpty() || inputs.stream().anyMatch(s -> !s.rankKnown())) {
      return ShapeOutcome.unknown();
    }
    TensorShape first = inputs.get(0);
    Truth same = Truth.TRUE;
    for (TensorShape s : inputs.subList(1, inputs.size())) {
      Truth t = first.sameAs(s);
      if (t.isFalse()) {
        return ShapeOutcome.fails(ShapeError.of(Kind.STACK_SHAPE));
      }
      same = same.and(t);
    }
    int r = first.rank();
    int a = axis < 0 ? axis + r + 1 : axis;
    if (a < 0 || a > r) {
      return ShapeOutcome.fails(ShapeError.at(Kind.AXIS_RANGE, null, null, axis));
    }
    List<Dim> out = new ArrayList<>(first.dims());
    out.add(a, Dim.of(inputs.size()));
    TensorShape result = TensorShape.of(out);
    return same.isTrue() ? ShapeOutcome.succeeds(result) : ShapeOutcome.undecided(result);
  }

  /** ND4J {@code hstack}: vectors join end to end, matrices side by side; other ranks fail. */
  public static ShapeOutcome hstack(List<TensorShape> inputs) {
    if (inputs.isEmpty() || inputs.stream().anyMatch(s -> !s.rankKnown())) {
      return ShapeOutcome.unknown();
    }
    for (TensorShape s : inputs) {
      if (s.rank() == 0 || s.rank() > 2) {
        return ShapeOutcome.fails(ShapeError.of(Kind.NOT_A_MATRIX));
      }
    }
    int r = inputs.get(0).rank();
    for (TensorShape s : inputs) {
      if (s.rank() != r) {
        return ShapeOutcome.fails(ShapeError.of(Kind.CONCAT_RANK, Dim.of(r), Dim.of(s.rank())));
      }
    }
    return concat(Framework.ND4J, inputs, r == 1 ? 0 : 1);
  }

  /** ND4J {@code vstack}: matrices on top of each other; equal-length vectors become rows. */
  public static ShapeOutcome vstack(List<TensorShape> inputs) {
    if (inputs.isEmpty() || inputs.stream().anyMatch(s -> !s.rankKnown())) {
      return ShapeOutcome.unknown();
    }
    if (inputs.stream().allMatch(s -> s.rank() == 2)) {
      return concat(Framework.ND4J, inputs, 0);
    }
    if (inputs.stream().allMatch(s -> s.rank() == 1)) {
      ShapeOutcome stacked = stack(Framework.ND4J, inputs, 0);
      return stacked;
    }
    return ShapeOutcome.unknown();
  }

  // ------------------------------------------------------------------ indexing

  /**
   * Basic indexing with constant indices ({@code null} entries are unknown). An index is only
   * certainly in range when it is a constant below a constant size; otherwise success is
   * undecided, but the shape if it succeeds is still known.
   */
  public static ShapeOutcome index(Framework fw, Index kind, TensorShape source, List<Long> indices) {
    if (!source.rankKnown()) {
      return ShapeOutcome.unknown();
    }
    switch (kind) {
      case ROW, COLUMN -> {
        if (source.rank() != 2) {
          return ShapeOutcome.fails(ShapeError.of(Kind.NOT_A_MATRIX));
        }
        Dim rows = source.dim(0);
        Dim cols = source.dim(1);
        TensorShape result;
        if (kind == Index.ROW) {
          result = TensorShape.of(cols);
        } else if (cols.isOne().isFalse()) {
          result = TensorShape.of(rows);
        } else if (cols.isOne().isTrue() && rows.isOne().isFalse()) {
          result = TensorShape.of(rows, cols);
        } else {
          return ShapeOutcome.unknown();
        }
        boolean inRange = inRange(indices.get(0), kind == Index.ROW ? rows : cols);
        return inRange ? ShapeOutcome.succeeds(result) : ShapeOutcome.undecided(result);
      }
      default -> {
        int k = indices.size();
        if (source.rank() < k || source.rank() == 0) {
          return ShapeOutcome.fails(ShapeError.of(Kind.AXIS_RANGE));
        }
        boolean inRange = true;
        for (int i = 0; i < k; i++) {
          inRange &= inRange(indices.get(i), source.dim(i));
        }
        TensorShape result = TensorShape.of(source.dims().subList(k, source.rank()));
        return inRange ? ShapeOutcome.succeeds(result) : ShapeOutcome.undecided(result);
      }
    }
  }

  private static boolean inRange(Long index, Dim size) {
    return index != null && index >= 0 && size.isConstant() && index < size.constant().getAsLong();
  }
}
