package dev.plumbline.analysis.shape;

import java.util.Optional;

/**
 * Whose semantics an operation follows. ND4J and DJL (PyTorch engine) broadcast, multiply and
 * reduce differently; each difference the analysis relies on was measured on the real
 * libraries (module {@code library-checks}, table in {@code docs/shape-semantics.md}).
 */
public enum Framework {
  ND4J,
  DJL;

  /** From the {@code framework} field of an API model type ({@code nd4j}, {@code dl4j}, {@code djl}). */
  public static Optional<Framework> fromModel(String framework) {
    if (framework == null) {
      return Optional.empty();
    }
    return switch (framework) {
      case "nd4j", "dl4j" -> Optional.of(ND4J);
      case "djl" -> Optional.of(DJL);
      default -> Optional.empty();
    };
  }
}
