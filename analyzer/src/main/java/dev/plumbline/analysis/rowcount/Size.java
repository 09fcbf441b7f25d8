package dev.plumbline.analysis.rowcount;

/**
 * What the row-count analysis knows about one value: an integer's value or a data value's number
 * of rows ({@link Rows}), or the two parts of a train/test split ({@link Parts}). Immutable;
 * values that are equal join to themselves and unequal ones to "unknown" (absent).
 */
public sealed interface Size {

  /** An integer's value, or the number of rows (examples) of a data set, iterator or array. */
  record Rows(Count count) implements Size {}

  /** A split holder: how many rows the training part and the test part hold. */
  record Parts(Count train, Count test) implements Size {}
}
