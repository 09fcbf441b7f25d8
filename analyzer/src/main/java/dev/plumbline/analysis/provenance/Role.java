package dev.plumbline.analysis.provenance;

/** Which rows of a data lineage a value holds. */
public enum Role {
  /** All rows: the data before any split. */
  WHOLE,
  TRAIN,
  VALIDATION,
  TEST,
  /** A held-out part whose purpose (validation or test) the code does not say. */
  HELD_OUT,
  /**
   * Only while summarizing a project method: whatever rows the caller's argument holds. Replaced
   * by the argument's own roles when the summary is applied at a call site; never published in
   * facts that rules read.
   */
  ARGUMENT
}
