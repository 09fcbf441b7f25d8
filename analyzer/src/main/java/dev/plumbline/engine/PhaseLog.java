package dev.plumbline.engine;

import java.lang.management.GarbageCollectorMXBean;
import java.lang.management.ManagementFactory;

/**
 * Wall time, process CPU time and garbage-collection time of each stage of a scan, printed to
 * standard error when
 * the JVM runs with {@code -Dplumbline.phases=true}: a developer's view of where a scan spends its
 * time (DEVELOPERS.md, section Benchmark), off by default and free when off. CPU time over wall
 * time says how many cores a stage kept busy (collector and compiler threads included).
 */
final class PhaseLog {
  private static final boolean ON = Boolean.getBoolean("plumbline.phases");

  /** A point in time: wall clock, the process's CPU time and total collection time so far. */
  record Mark(long nanos, long cpuNanos, long gcMillis) {}

  private PhaseLog() {}

  static Mark start() {
    return ON ? new Mark(System.nanoTime(), cpuNanos(), gcMillis()) : null;
  }

  /** Prints the stage that began at {@code since}; returns the start of the next one. */
  static Mark lap(String stage, Mark since) {
    if (!ON) {
      return null;
    }
    Mark now = start();
    long wall = now.nanos() - since.nanos();
    System.err.printf("plumbline phase %-28s %6d ms, of which collecting garbage %5d ms; %4.1f cores busy%n",
        stage, wall / 1_000_000, now.gcMillis() - since.gcMillis(),
        wall == 0 ? 0.0 : (double) (now.cpuNanos() - since.cpuNanos()) / wall);
    return now;
  }

  private static long cpuNanos() {
    return ManagementFactory.getOperatingSystemMXBean()
        instanceof com.sun.management.OperatingSystemMXBean os ? os.getProcessCpuTime() : 0;
  }

  private static long gcMillis() {
    long total = 0;
    for (GarbageCollectorMXBean gc : ManagementFactory.getGarbageCollectorMXBeans()) {
      total += Math.max(0, gc.getCollectionTime());
    }
    return total;
  }
}
