package dev.plumbline.report.audit;

/**
 * How precisely an accuracy measured on {@code rows} examples can be known: the 95% Wilson
 * half-width at a middling (50%) and a high (90%) accuracy, and a plain judgement.
 *
 * <p>Thresholds are common practice, with no published source: under about 1,000 examples the
 * interval is several points wide, too wide to tell apart models a few points apart; from about
 * 10,000 it is under one point at any accuracy and barely visible next to the number.
 *
 * @param rows examples evaluated on
 * @param halfWidthAtHalf half-width (as a proportion) of the interval around an accuracy of 0.5,
 *     the widest case
 * @param halfWidthAtNinety half-width around an accuracy of 0.9
 */
public record TestSetPrecision(long rows, double halfWidthAtHalf, double halfWidthAtNinety) {
  /** Below this many examples the interval is worrying (common practice). */
  public static final long WORRYING_BELOW = 1_000;
  /** From this many examples the interval is barely visible (common practice). */
  public static final long NARROW_FROM = 10_000;

  public enum Judgement {
    /** Too few examples to tell apart models a few points apart. */
    TOO_SMALL,
    /** Separates models several points apart, not one or two. */
    MODERATE,
    /** The interval is barely visible next to the number. */
    NARROW
  }

  public static TestSetPrecision of(long rows) {
    return new TestSetPrecision(rows, WilsonInterval.halfWidth95(0.5, rows),
        WilsonInterval.halfWidth95(0.9, rows));
  }

  public Judgement judgement() {
    return rows < WORRYING_BELOW ? Judgement.TOO_SMALL
        : rows < NARROW_FROM ? Judgement.MODERATE : Judgement.NARROW;
  }
}
