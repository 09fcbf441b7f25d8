package dev.plumbline.bench;

import java.util.List;

/**
 * The JVM options {@code bin/plumbline} starts the tool with; the benchmark measures the same.
 * {@code LauncherTest} checks that the two stay in step.
 *
 * <p>The collector: a scan keeps every tree until the end (a few hundred MiB at 200,000 lines)
 * and makes much short-lived garbage besides, so each young collection copies newly parsed trees
 * into the old generation. Cold runs of the 200,000-line project on 2 cores (GNU time, GC log,
 * same SARIF), measured 2026-12-02:
 * <ul>
 *   <li>G1 (the default): about 1.7 GiB resident for 300 MiB of live data (earlier measurement);
 *   <li>serial: 11.7 to 12.5 s wall, 2.4 to 2.8 s of collection pauses (48 to 52 young, one
 *       full), 550 to 650 MiB resident;
 *   <li>parallel with a fixed 128 MiB young generation, an initial heap of 3% of the
 *       memory (737 MiB here; the numbers below were measured with a fixed {@code -Xms768m}, which
 *       on a small machine would raise the maximum heap above the default quarter of the
 *       memory, see {@code LauncherTest}) and the old
 *       generation growing in steps of 100%: 7.9 to 9.9 s wall, 0.8 to 1.0 s of pauses (68 to 72
 *       young, no full collection), 500 to 580 MiB resident. On the 800,000-line project 39.0 s
 *       wall and 1.45 GiB resident against 41.9 s and 2.4 GiB with the serial collector (8.3 s of
 *       pauses against 13.1 s). Without the larger growth steps it needed four full collections
 *       (6.3 s) there; with adaptive sizing switched off the heap never grew and the scan only
 *       collected. The young generation is fixed because the default lets it grow with the heap,
 *       and every page of it is touched.
 *   <li>the same, with objects that survive one young collection moved to the old generation at
 *       once ({@code -XX:MaxTenuringThreshold=0}) instead of being copied between the survivor
 *       spaces first: most survivors are parsed trees, which live to the end anyway. Cold runs
 *       of the 200,000-line project after the parse got cheaper (commit 1d35246), two each:
 *       553 and 653 ms of pauses in 43 collections against 860 and 879 ms in 62; 7.1 to 8.8 s
 *       wall against 9.5 to 9.9 s; 573 MiB resident against 509 MiB.
 * </ul>
 *
 * <p>Only the quick (C1) compiler: a scan is one run of seconds to minutes, and on few cores the
 * optimizing compiler's threads take the CPU the scan needs. Cold runs on 2 cores, same SARIF:
 * the 200,000-line project 19.4 to 19.8 s wall and 34 to 36 s CPU with both compilers, 14.8 to
 * 14.9 s and 23.3 to 23.6 s with C1 alone; the 800,000-line project 53.9 s against 52.0 s
 * (serial collector, earlier code).
 */
final class Launcher {
  static final List<String> JVM_OPTIONS = List.of("-XX:+UseParallelGC", "-Xmn128m",
      "-XX:MaxTenuringThreshold=0", "-XX:InitialRAMPercentage=3",
      "-XX:TenuredGenerationSizeIncrement=100", "-XX:TieredStopAtLevel=1");

  private Launcher() {}
}
