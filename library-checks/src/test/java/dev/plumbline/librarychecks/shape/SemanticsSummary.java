package dev.plumbline.librarychecks.shape;

/**
 * The semantics in words, read off the measured tables the document prints below them. Each
 * statement is checked case by case by the differential test (a statement the tables
 * contradicted would make the test fail), so this text can only go stale by omission.
 */
final class SemanticsSummary {
  private SemanticsSummary() {}

  static final String TEXT = """
      ## What the measurements say

      **Element-wise copy operations.** DJL (PyTorch) follows NumPy broadcasting exactly: shapes
      align from the last axis; sizes must be equal or one of them 1; missing leading axes count
      as 1. ND4J broadcasts the same way between arrays of rank 2 and above (a `[4, 1]` column
      and a `[1, 4]` row give `[4, 4]`, `[4, 1]` and `[2, 1, 4]` give `[2, 4, 4]`), but a rank-1
      vector longer than 1 against an array of higher rank only works when the array's last size
      equals the vector's length: `[3] + [4, 1]`, `[4, 1] + [3]`, `[3] + [3, 1]` and
      `[3] + [1, 1]` all fail in ND4J, while DJL gives `[4, 3]`, `[4, 3]`, `[3, 3]` and `[1, 3]`.
      A scalar combines with anything in both libraries.

      **In-place operations** (`addi`, `muli`) compute the same broadcast and then fail in both
      libraries unless the result has exactly the receiver's shape: `[1, 16].addi([32, 16])`
      fails, `[32, 16].addi([1, 16])` works.

      **Matrix products.** ND4J `mmul` accepts rank 2 only for a decided answer (rank 0 and rank 3
      fail): `[a, b] x [b, c]` gives `[a, c]`, different inner sizes fail, except that a `[1, n]`
      row times an `[m, 1]` column is computed as a dot product and gives `[1, 1]` whatever n and m
      are. With a rank-1 operand ND4J is irregular (`[3] x [4]` gives `[1, 1]`), so the analysis
      leaves those undecided. DJL `matMul` is NumPy `matmul`: vectors are promoted and removed
      again, batch axes broadcast. DJL `dot` on the PyTorch engine takes two vectors of equal
      length (giving a scalar) or two matrices, and fails on every other pair of ranks.

      **Reshape.** Both libraries accept one `-1` (two fail), infer it only when the other sizes
      divide the element count, and accept an empty shape only for one element. ND4J writes the
      inferred size back into the `long[]` passed to `reshape`; the test passes copies.

      **Permute and transpose.** `permute` (ND4J) and `transpose(axes)` (DJL) need each axis
      exactly once; ND4J refuses negative axes, DJL counts them from the end. `transpose()`
      reverses all axes in both; ND4J refuses arrays of rank below 2, DJL returns them unchanged.

      **Reductions.** Without kept dimensions the reduced axes disappear, with them they become 1;
      `sum()` over everything gives a scalar. DJL refuses a repeated axis; ND4J accepts it on some
      shapes and fails on others, and fails on a negative axis for some column-shaped arrays
      (`[4, 1].sum(-1)`), so both are left undecided. DJL's PyTorch engine refuses `mean` (and
      `max`) over more than one axis ("Only 1 axis is support!"); other engines may not, so the
      analysis leaves those undecided too.

      **ND4J row and column vector operations.** On a matrix whose size along the vector is not
      1, `addRowVector` takes `[m]` or `[1, m]` and `addColumnVector` `[n]` or `[n, 1]`, a single
      element or a scalar always works, anything else fails; in-place forms behave the same. On
      1-by-1 matrices, vectors and rank-3 arrays the results are irregular and left undecided.

      **Joining.** Concatenation needs equal ranks and equal sizes outside the joined axis in both
      libraries (negative axes count from the end), except that ND4J treats a scalar as a
      one-element vector there. Stacking needs equal shapes and inserts the new axis. ND4J
      `hstack` joins vectors end to end and matrices side by side and refuses other ranks;
      `vstack` stacks equal vectors as rows and matrices on top of each other.

      **Indexing.** ND4J `getRow(i)` on `[a, b]` gives `[b]`; `getColumn(j)` gives `[a]`, but a
      column vector `[a, 1]` comes back whole; both refuse arrays that are not matrices. DJL
      `get(i, j, ...)` drops one leading axis per index and refuses a scalar.

      **Networks** (DL4J, measured in `NetworkWidthsTest`). In a `list()` configuration DL4J
      replaces each layer's written `nIn` with the previous layer's `nOut` when it builds, so a
      stale `nIn` there is not an error (unless `overrideNinUponBuild(false)`); in a
      `graphBuilder()` graph the written widths are kept and a mismatch fails at the first forward
      pass. Features whose width differs from the first layer's `nIn` and labels whose width
      differs from the output layer's `nOut` fail in `fit` and `output`, for dense and recurrent
      networks alike.

      """;
}
