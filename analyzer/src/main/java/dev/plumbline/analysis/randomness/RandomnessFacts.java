package dev.plumbline.analysis.randomness;

import com.github.javaparser.ast.Node;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

/** Unseeded random draws that feed data order, splits or model initialization, for one file. */
public final class RandomnessFacts {

  public enum Kind {
    /** A shuffle with no seed: the library seeds it from the clock. */
    CLOCK_SHUFFLE,
    /** A shuffle or split driven by a generator created without a seed and never seeded. */
    UNSEEDED_GENERATOR,
    /** A network configuration built without a seed (the builder's default seed is the clock). */
    CONFIGURATION_WITHOUT_SEED,
    /** A split or shuffled sampling drawn from a framework-wide generator the project never seeds. */
    UNSEEDED_FRAMEWORK_GENERATOR
  }

  /**
   * A random draw at {@code at}; {@code source} is where the unseeded generator or builder is
   * created (may equal {@code at}); {@code subject} names what is drawn (data, builder).
   */
  public record Draw(Node at, Kind kind, Node source, String subject, String via) {}

  private final List<Draw> draws = new ArrayList<>();

  void add(Draw d) {
    draws.add(d);
  }

  public List<Draw> draws() {
    return Collections.unmodifiableList(draws);
  }
}
