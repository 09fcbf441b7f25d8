package dev.plumbline.bench;

import java.util.List;

/** The JVM options {@code bin/plumbline} starts the tool with; the benchmark measures the same. */
final class Launcher {
  static final List<String> JVM_OPTIONS = List.of();

  private Launcher() {}
}
