package dev.plumbline.engine;

import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

/**
 * Project-wide facts that per-file analyses consult, such as summaries of the project's own
 * methods. Computed by {@link ProjectAnalysis} implementations after parsing and before files
 * are analyzed; read-only afterwards.
 */
public final class ProjectFacts {
  private final Map<Class<?>, Object> facts = new ConcurrentHashMap<>();

  public <T> void put(Class<T> type, T value) {
    facts.put(type, value);
  }

  public <T> T get(Class<T> type) {
    return type.cast(facts.get(type));
  }

  public static ProjectFacts none() {
    return new ProjectFacts();
  }
}
