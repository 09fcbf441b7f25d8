package dev.plumbline.analysis.shape;

/** Three-valued answer to a question about symbolic sizes: certainly, certainly not, or unknown. */
public enum Truth {
  TRUE,
  FALSE,
  UNKNOWN;

  public static Truth of(boolean b) {
    return b ? TRUE : FALSE;
  }

  public Truth not() {
    return this == TRUE ? FALSE : this == FALSE ? TRUE : UNKNOWN;
  }

  public Truth and(Truth other) {
    if (this == FALSE || other == FALSE) {
      return FALSE;
    }
    return this == TRUE && other == TRUE ? TRUE : UNKNOWN;
  }

  public Truth or(Truth other) {
    if (this == TRUE || other == TRUE) {
      return TRUE;
    }
    return this == FALSE && other == FALSE ? FALSE : UNKNOWN;
  }

  public boolean isTrue() {
    return this == TRUE;
  }

  public boolean isFalse() {
    return this == FALSE;
  }
}
