package dev.plumbline.bench;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
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
 *   <li>the same, with the initial heap at 25% of the memory, the JVM's default maximum
 *       (measured 2026-12-04, from 3%). The parallel collector makes a full collection whenever
 *       the old generation's committed space runs short, before it grows it; every full
 *       collection marks and moves all the trees parsed so far, so their cost grew with the
 *       project: on the 800,000-line project three to five of them, 3.3 to 5.9 s of each scan
 *       (GC log), and in a warm JVM the benchmark's 4x scan had either none or one of 3.3 to
 *       4.5 s, depending on how much heap the previous iteration had left committed. With the
 *       whole heap committed from the start a scan makes none below the maximum heap. Committed
 *       pages that nothing has touched are not resident, so the cost is the promoted garbage
 *       that is no longer collected on the way: cold runs, alternated, three each, same SARIF:
 *       800,000 lines 21.1 to 24.8 s wall against 27.4 to 31.0 s, 1,486 to 1,490 MiB resident
 *       against 1,309 to 1,328 MiB; 200,000 lines 6.9 to 7.3 s against 7.2 to 8.1 s, 538 to 540
 *       MiB against 515 to 521 MiB. The maximum heap stays the JVM's default (see
 *       {@code LauncherTest}); the larger growth steps still matter where the maximum heap is
 *       above the initial one, as when a user sets {@code -Xmx} in {@code PLUMBLINE_JAVA_OPTS}.
 * </ul>
 *
 * <p>Only the quick (C1) compiler: a scan is one run of seconds to minutes, and on few cores the
 * optimizing compiler's threads take the CPU the scan needs. Cold runs on 2 cores, same SARIF:
 * the 200,000-line project 19.4 to 19.8 s wall and 34 to 36 s CPU with both compilers, 14.8 to
 * 14.9 s and 23.3 to 23.6 s with C1 alone; the 800,000-line project 53.9 s against 52.0 s
 * (serial collector, earlier code).
 */
final class Launcher {
  /** The options on every machine. */
  static final List<String> BASE_OPTIONS = List.of("-XX:+UseParallelGC", "-Xmn128m",
      "-XX:MaxTenuringThreshold=0", "-XX:InitialRAMPercentage=25",
      "-XX:TenuredGenerationSizeIncrement=100", "-XX:TieredStopAtLevel=1");

  /**
   * Added where the Linux kernel hands out transparent huge pages on request ({@code madvise})
   * or always: the heap is then backed by 2 MiB pages, so the first touch of the old generation
   * faults a 512th as often and the collector's and the analyses' walks over a large heap miss
   * the address cache less. Cold runs on 2 cores, alternated, same SARIF (2026-12-05, kernel
   * setting {@code madvise}, three and four of each): the 800,000-line project 20.2 to 21.6 s
   * wall against 23.3 to 24.7 s, 1,503 to 1,525 MiB resident against 1,485 to 1,493 MiB; the
   * 200,000-line project 6.8 to 7.3 s against 7.2 to 7.8 s, 541 to 545 MiB against 537 to 538
   * MiB. Elsewhere (setting {@code never}, no such file, another system) the JVM would print a
   * warning on every run, so the option is left out there.
   */
  static final String HUGE_PAGES = "-XX:+UseTransparentHugePages";

  /** The kernel's setting; the one in brackets is in force, as in {@code always [madvise] never}. */
  static final Path HUGE_PAGE_SETTING = Path.of("/sys/kernel/mm/transparent_hugepage/enabled");

  static final List<String> JVM_OPTIONS = options(readSetting(HUGE_PAGE_SETTING));

  private Launcher() {}

  /** The options for a kernel whose huge-page setting reads {@code setting} (empty: none). */
  static List<String> options(String setting) {
    List<String> out = new ArrayList<>(BASE_OPTIONS);
    if (offersHugePagesOnRequest(setting)) {
      out.add(HUGE_PAGES);
    }
    return List.copyOf(out);
  }

  static boolean offersHugePagesOnRequest(String setting) {
    return setting.contains("[always]") || setting.contains("[madvise]");
  }

  static String readSetting(Path file) {
    try {
      return Files.readString(file, StandardCharsets.US_ASCII);
    } catch (IOException | RuntimeException e) {
      return "";
    }
  }
}
