package dev.plumbline.engine;

/**
 * A small, declarative query over the shared analyses of one file. A rule reads facts from
 * {@link FileContext#analysis} and reports; if it starts walking trees or tracking state, that
 * code belongs in an analysis.
 *
 * <p>Implementations must be stateless and thread-safe: one instance checks many files at once.
 */
public interface Rule {
  RuleDescriptor descriptor();

  void check(FileContext file, FindingReporter reporter);
}
