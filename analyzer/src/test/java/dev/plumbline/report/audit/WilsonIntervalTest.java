package dev.plumbline.report.audit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The Wilson interval against published worked values and against an independent computation.
 *
 * <p>Source of the worked values: R. G. Newcombe, "Two-sided confidence intervals for the single
 * proportion: comparison of seven methods", Statistics in Medicine 17 (1998) 857-872, Table I,
 * method 3 (score interval without continuity correction), printed to four decimals. The four
 * rows below are quoted from memory of that table; the paper itself could not be consulted
 * here. Two independent public test suites quote the same four rows as "Newcombe (1998) Table I"
 * with identical digits, which is the corroboration available; the numeric cross-check below
 * (roots of the score equation found by bisection) is independent of both.
 */
class WilsonIntervalTest {

  private static double round4(double x) {
    return Math.round(x * 10_000) / 10_000.0;
  }

  private static void assertTable(long k, long n, double lower, double upper) {
    WilsonInterval w = WilsonInterval.of95(k, n);
    assertEquals(lower, round4(w.lower()), 0.0, k + "/" + n + " lower");
    assertEquals(upper, round4(w.upper()), 0.0, k + "/" + n + " upper");
  }

  @Test
  void newcombe1998TableIRow81of263() {
    assertTable(81, 263, 0.2553, 0.3662); // Newcombe 1998, Table I, method 3
  }

  @Test
  void newcombe1998TableIRow15of148() {
    assertTable(15, 148, 0.0624, 0.1605); // Newcombe 1998, Table I, method 3
  }

  @Test
  void newcombe1998TableIRow0of20() {
    assertTable(0, 20, 0.0, 0.1611); // Newcombe 1998, Table I, method 3
  }

  @Test
  void newcombe1998TableIRow1of29() {
    assertTable(1, 29, 0.0061, 0.1718); // Newcombe 1998, Table I, method 3
  }

  /**
   * Independent check: the limits are the two roots of the score equation
   * {@code (q - p)^2 = z^2 p (1 - p) / n} (Wilson 1927), found here by bisection on each side of
   * q instead of by the closed form.
   */
  @Test
  void closedFormAgreesWithRootsOfTheScoreEquation() {
    long[][] cases = {{0, 1}, {1, 2}, {7, 10}, {81, 263}, {380, 400}, {9_500, 10_000}, {400, 400}};
    for (long[] c : cases) {
      long k = c[0];
      long n = c[1];
      double q = (double) k / n;
      double z = WilsonInterval.Z_95;
      WilsonInterval w = WilsonInterval.of95(k, n);
      double lower = k == 0 ? 0 : bisect(q, n, z, 0, q);
      double upper = k == n ? 1 : bisect(q, n, z, q, 1);
      assertEquals(lower, w.lower(), 1e-9, k + "/" + n + " lower");
      assertEquals(upper, w.upper(), 1e-9, k + "/" + n + " upper");
    }
  }

  /**
   * Root of f(p) = (q - p)^2 - z^2 p (1 - p) / n in [lo, hi]. f is positive at 0 and 1 and not
   * positive at q, so on [0, q] it falls through the lower root and on [q, 1] rises through the
   * upper one; {@code rising} says which side is searched.
   */
  private static double bisect(double q, long n, double z, double lo, double hi) {
    boolean rising = lo >= q;
    for (int i = 0; i < 200; i++) {
      double mid = (lo + hi) / 2;
      boolean positive = score(q, n, z, mid) > 0;
      if (positive == rising) {
        hi = mid;
      } else {
        lo = mid;
      }
    }
    return (lo + hi) / 2;
  }

  private static double score(double q, long n, double z, double p) {
    return (q - p) * (q - p) - z * z * p * (1 - p) / n;
  }

  @Test
  void halfWidthShrinksLikeOneOverRootN() {
    double at400 = WilsonInterval.halfWidth95(0.5, 400);
    double at1600 = WilsonInterval.halfWidth95(0.5, 1600);
    // Near q = 0.5 the interval is close to q +- z sqrt(q(1-q)/n): 0.049 at n = 400.
    assertEquals(0.049, at400, 0.001);
    assertEquals(2.0, at400 / at1600, 0.01);
    assertTrue(WilsonInterval.halfWidth95(0.9, 400) < at400, "narrower away from one half");
  }

  @Test
  void rejectsImpossibleCounts() {
    assertThrows(IllegalArgumentException.class, () -> WilsonInterval.of95(3, 2));
    assertThrows(IllegalArgumentException.class, () -> WilsonInterval.of95(0, 0));
    assertThrows(IllegalArgumentException.class, () -> WilsonInterval.ofProportion(1.5, 10, 1.96));
  }
}
