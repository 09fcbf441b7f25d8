package dev.plumbline.engine;

import java.lang.management.GarbageCollectorMXBean;
import java.lang.management.ManagementFactory;

/**
 * Wall time and garbage-collection time of each stage of a scan, printed to standard error when
 * the JVM runs with {@code -Dplumbline.phases=true}: a developer's view of where a scan spends its
 * time (DEVELOPERS.md, section Benchmark), off by default and free when off.
 */
final class PhaseLog {
  private static final boolean ON = Boolean.getBoolean("plumbline.phases");

  /** A point in time: wall clock and total collection time so far. */
  record Mark(long nanos, long gcMillis) {}

  private PhaseLog() {}

  static Mark start() {
    return ON ? new Mark(System.nanoTime(), gcMillis()) : null;
  }

  /** Prints the stage that began at {@code since}; returns the start of the next one. */
  static Mark lap(String stage, Mark since) {
    if (!ON) {
      return null;
    }
    Mark now = start();
    System.err.printf("plumbline phase %-28s %6d ms, of which collecting garbage %5d ms%n", stage,
        (now.nanos() - since.nanos()) / 1_000_000, now.gcMillis() - since.gcMillis());
    return now;
  }

  private static long gcMillis() {
    long total = 0;
    for (GarbageCollectorMXBean gc : ManagementFactory.getGarbageCollectorMXBeans()) {
      total += Math.max(0, gc.getCollectionTime());
    }
    return total;
  }
}
