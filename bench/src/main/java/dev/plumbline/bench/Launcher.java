package dev.plumbline.bench;

import java.util.List;

/**
 * The JVM options {@code bin/plumbline} starts the tool with; the benchmark measures the same.
 * Keep the two in step.
 *
 * <p>The serial collector: a scan keeps every tree until the end and makes much short-lived
 * garbage besides. With the default G1 collector the heap grew to about 1.7 GiB resident on the
 * 200,000-line project while the live data stayed near 300 MiB; the serial collector held the
 * same scan to about 0.6 GiB and used less CPU (measured with GNU time on 2 cores).
 */
final class Launcher {
  static final List<String> JVM_OPTIONS = List.of("-XX:+UseSerialGC");

  private Launcher() {}
}
