package dev.plumbline.analysis.rowcount;

/**
 * A whole number known without running the code: a constant, or "what argument {@code i} of the
 * enclosing method holds" (its value for an integer parameter, its number of rows for a data
 * parameter), which a caller substitutes. Immutable.
 */
public record Count(long constant, int parameter) {

  public static Count exact(long value) {
    return new Count(value, -1);
  }

  public static Count ofParameter(int index) {
    return new Count(0, index);
  }

  public boolean isExact() {
    return parameter < 0;
  }

  @Override
  public String toString() {
    return isExact() ? Long.toString(constant) : "arg" + parameter;
  }
}
