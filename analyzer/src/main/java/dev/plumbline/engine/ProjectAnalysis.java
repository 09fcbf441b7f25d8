package dev.plumbline.engine;

import dev.plumbline.types.ProjectIndex;
import java.util.List;

/**
 * An analysis over the whole project that runs once, after parsing and before per-file rules,
 * and publishes its results into {@link ProjectFacts} (for example summaries of project methods
 * so that data passed through a helper is still tracked). Must be deterministic: its output may
 * not depend on thread scheduling or on the order of {@code files} beyond their given sort order.
 */
public interface ProjectAnalysis {
  /**
   * Computes the analysis. {@code workers} may run independent items in parallel; the result
   * must be the same for any {@code workers}.
   */
  void compute(List<FileContext> files, ProjectIndex index, ProjectFacts out, Workers workers);

  /** Computes the analysis on the calling thread alone. */
  default void compute(List<FileContext> files, ProjectIndex index, ProjectFacts out) {
    compute(files, index, out, Workers.SEQUENTIAL);
  }
}
