package dev.plumbline.report.audit;

/**
 * The Wilson score interval for a binomial proportion (Wilson 1927, J. Amer. Statist. Assoc.
 * 22:209-212): the set of proportions p that a two-sided score test at level alpha does not
 * reject for k successes in n trials, i.e. the roots of {@code (k/n - p)^2 = z^2 p (1 - p) / n}.
 *
 * <p>Closed form, with {@code q = k/n}:
 * <pre>
 *   centre     = (q + z^2 / 2n) / (1 + z^2 / n)
 *   half-width = z / (1 + z^2 / n) * sqrt(q (1 - q) / n + z^2 / 4n^2)
 * </pre>
 * Unlike the normal-approximation (Wald) interval it stays inside [0, 1] and does not collapse
 * to a point at 0 or n successes, which is why it is used here for accuracies measured on small
 * test sets.
 *
 * @param lower lower limit, in [0, 1]
 * @param upper upper limit, in [0, 1]
 */
public record WilsonInterval(double lower, double upper) {

  /** The 0.975 quantile of the standard normal distribution, for 95% two-sided intervals. */
  public static final double Z_95 = 1.959963984540054;

  /** The 95% interval for {@code successes} out of {@code trials}. */
  public static WilsonInterval of95(long successes, long trials) {
    return of(successes, trials, Z_95);
  }

  /** The interval for {@code successes} out of {@code trials} at normal quantile {@code z}. */
  public static WilsonInterval of(long successes, long trials, double z) {
    if (trials <= 0 || successes < 0 || successes > trials) {
      throw new IllegalArgumentException("need 0 <= successes <= trials and trials > 0: "
          + successes + " of " + trials);
    }
    return ofProportion((double) successes / trials, trials, z);
  }

  /** The interval for an observed proportion {@code q} measured on {@code trials} examples. */
  public static WilsonInterval ofProportion(double q, long trials, double z) {
    if (trials <= 0 || !(q >= 0 && q <= 1) || !(z > 0)) {
      throw new IllegalArgumentException("need 0 <= q <= 1, trials > 0, z > 0: " + q + ", "
          + trials + ", " + z);
    }
    double n = trials;
    double z2 = z * z;
    double denominator = 1 + z2 / n;
    double centre = (q + z2 / (2 * n)) / denominator;
    double half = z / denominator * Math.sqrt(q * (1 - q) / n + z2 / (4 * n * n));
    return new WilsonInterval(Math.max(0, centre - half), Math.min(1, centre + half));
  }

  /**
   * Half the width of the 95% interval of an accuracy {@code accuracy} measured on
   * {@code trials} examples: the "plus or minus" a reader should attach to the number.
   */
  public static double halfWidth95(double accuracy, long trials) {
    WilsonInterval i = ofProportion(accuracy, trials, Z_95);
    return (i.upper - i.lower) / 2;
  }

  public double width() {
    return upper - lower;
  }
}
