package dev.plumbline.analysis.shape;

/**
 * Why an operation certainly fails, with the sizes that disagree.
 *
 * @param kind what went wrong
 * @param left the size the operation needed or found first (may be null)
 * @param right the size it got (may be null)
 * @param axis the axis involved, or -1
 * @param shape a shape the message needs (the broadcast result of a failed in-place operation), or null
 */
public record ShapeError(Kind kind, Dim left, Dim right, int axis, TensorShape shape) {

  public enum Kind {
    /** Matrix product: the left operand's last size differs from the right operand's contracted size. */
    INNER_SIZE,
    /** Matrix product of operands whose ranks the operation does not accept. */
    PRODUCT_RANK,
    /** Element-wise: two sizes at one axis differ and neither is 1. */
    BROADCAST,
    /** ND4J element-wise: a rank-1 vector against an array whose last size is not the vector's length. */
    VECTOR_AGAINST_ARRAY,
    /** In-place element-wise: the broadcast result is larger than the receiver that must hold it. */
    IN_PLACE,
    /** Reshape: the new sizes hold a different number of elements. */
    ELEMENT_COUNT,
    /** Reshape with a size of -1: the other sizes do not divide the number of elements. */
    NOT_DIVISIBLE,
    /** Reshape: more than one size is -1. */
    TWO_INFERRED,
    /** An axis argument outside the operand's rank. */
    AXIS_RANGE,
    /** Permute: the axes are not a permutation of the operand's axes. */
    PERMUTATION,
    /** An axis listed twice where the library refuses it. */
    DUPLICATE_AXIS,
    /** Concatenation of operands of different rank. */
    CONCAT_RANK,
    /** Concatenation: a size other than the joined axis differs. */
    CONCAT_SIZE,
    /** Stacking operands of different shape. */
    STACK_SHAPE,
    /** Row- or column-vector operation with a vector of the wrong length or shape. */
    VECTOR_LENGTH,
    /** An operation that needs a matrix (rank 2) got another rank. */
    NOT_A_MATRIX,
    /** ND4J reshape with no sizes. */
    EMPTY_RESHAPE
  }

  public static ShapeError of(Kind kind) {
    return new ShapeError(kind, null, null, -1, null);
  }

  public static ShapeError of(Kind kind, Dim left, Dim right) {
    return new ShapeError(kind, left, right, -1, null);
  }

  public static ShapeError at(Kind kind, Dim left, Dim right, int axis) {
    return new ShapeError(kind, left, right, axis, null);
  }
}
