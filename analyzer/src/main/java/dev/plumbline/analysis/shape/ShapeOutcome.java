package dev.plumbline.analysis.shape;

/**
 * What the analysis knows about one operation on given shapes.
 *
 * <p>{@link Status#SUCCEEDS} and {@link Status#FAILS} are claims the differential test holds
 * against the real libraries; {@link Status#UNDECIDED} claims nothing about success. In every
 * status but {@code FAILS}, {@link #result} is the shape the operation has <em>if</em> it
 * succeeds (possibly partly unknown): code after the operation only runs when it succeeded, so
 * the analysis continues with that shape.
 */
public record ShapeOutcome(Status status, TensorShape result, ShapeError error) {

  public enum Status { SUCCEEDS, FAILS, UNDECIDED }

  public static ShapeOutcome succeeds(TensorShape result) {
    return new ShapeOutcome(Status.SUCCEEDS, result, null);
  }

  public static ShapeOutcome fails(ShapeError error) {
    return new ShapeOutcome(Status.FAILS, TensorShape.unknown(), error);
  }

  /** Success unknown; {@code ifSucceeds} is the shape when it does. */
  public static ShapeOutcome undecided(TensorShape ifSucceeds) {
    return new ShapeOutcome(Status.UNDECIDED, ifSucceeds, null);
  }

  public static ShapeOutcome unknown() {
    return undecided(TensorShape.unknown());
  }

  public boolean fails() {
    return status == Status.FAILS;
  }

  public boolean succeeds() {
    return status == Status.SUCCEEDS;
  }
}
