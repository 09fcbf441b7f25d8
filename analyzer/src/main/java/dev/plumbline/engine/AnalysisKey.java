package dev.plumbline.engine;

import java.util.function.Function;

/**
 * Names a per-file analysis and how to compute it. {@link FileContext} computes each key at most
 * once per file, the first time a rule asks, and shares the result between rules.
 */
public final class AnalysisKey<T> {
  private final String name;
  private final Function<FileContext, T> compute;

  private AnalysisKey(String name, Function<FileContext, T> compute) {
    this.name = name;
    this.compute = compute;
  }

  public static <T> AnalysisKey<T> of(String name, Function<FileContext, T> compute) {
    return new AnalysisKey<>(name, compute);
  }

  public String name() {
    return name;
  }

  T compute(FileContext file) {
    return compute.apply(file);
  }

  @Override
  public String toString() {
    return name;
  }
}
