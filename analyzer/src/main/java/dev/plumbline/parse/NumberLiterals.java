package dev.plumbline.parse;

import com.github.javaparser.ast.expr.DoubleLiteralExpr;
import com.github.javaparser.ast.expr.IntegerLiteralExpr;
import com.github.javaparser.ast.expr.LongLiteralExpr;

/**
 * The values of number literals, as JavaParser's {@code asNumber} and {@code asDouble} give them.
 * Those first strip underscores with {@code String.replaceAll}, which compiles a regular
 * expression on every call; the analyses read the same literals on every pass over a method,
 * which made that compiling a visible part of their cost. Plain literals (decimal digits only,
 * short enough not to overflow) are read here directly; any other is left to JavaParser.
 */
public final class NumberLiterals {
  private NumberLiterals() {}

  /** As {@link IntegerLiteralExpr#asNumber()}. */
  public static Number value(IntegerLiteralExpr literal) {
    String v = literal.getValue();
    if (isPlainDecimal(v, v.length(), 9)) {
      return Integer.parseInt(v);
    }
    return literal.asNumber();
  }

  /** As {@link LongLiteralExpr#asNumber()}. */
  public static Number value(LongLiteralExpr literal) {
    String v = literal.getValue();
    int digits = v.length() - 1;
    if (digits >= 1 && (v.charAt(digits) == 'L' || v.charAt(digits) == 'l')
        && isPlainDecimal(v, digits, 18)) {
      return Long.parseLong(v, 0, digits, 10);
    }
    return literal.asNumber();
  }

  /** As {@link DoubleLiteralExpr#asDouble()}. */
  public static double value(DoubleLiteralExpr literal) {
    String v = literal.getValue();
    return v.indexOf('_') < 0 ? Double.parseDouble(v) : literal.asDouble();
  }

  /**
   * Whether the first {@code length} characters are decimal digits, at most {@code maxDigits} of
   * them, without a leading zero (which would make the literal octal) unless it is {@code 0}.
   */
  private static boolean isPlainDecimal(String v, int length, int maxDigits) {
    if (length < 1 || length > maxDigits || (v.charAt(0) == '0' && length > 1)) {
      return false;
    }
    for (int i = 0; i < length; i++) {
      char c = v.charAt(i);
      if (c < '0' || c > '9') {
        return false;
      }
    }
    return true;
  }
}
