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
 *
 * <p>Only the quick (C1) compiler: a scan is one run of seconds to minutes, and on few cores the
 * optimizing compiler's threads take the CPU the scan needs. Cold runs on 2 cores, same SARIF:
 * the 200,000-line project 19.4 to 19.8 s wall and 34 to 36 s CPU with both compilers, 14.8 to
 * 14.9 s and 23.3 to 23.6 s with C1 alone; the 800,000-line project 53.9 s against 52.0 s.
 */
final class Launcher {
  static final List<String> JVM_OPTIONS = List.of("-XX:+UseSerialGC", "-XX:TieredStopAtLevel=1");

  private Launcher() {}
}
