package dev.plumbline.librarychecks.shape;

/** The semantics in words, as read off the measured tables below them in the document. */
final class SemanticsSummary {
  private SemanticsSummary() {}

  static final String TEXT = """
      ## What the measurements say

      (to be written from the measurement)

      """;
}
