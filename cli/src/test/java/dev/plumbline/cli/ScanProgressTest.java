package dev.plumbline.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.util.concurrent.atomic.AtomicLong;
import org.junit.jupiter.api.Test;

/** Progress on standard error: silent for short scans, plain counted lines off a terminal. */
class ScanProgressTest {
  private final AtomicLong now = new AtomicLong(1_000);
  private final StringWriter lines = new StringWriter();
  private final ByteArrayOutputStream raw = new ByteArrayOutputStream();

  private ScanProgress progress(boolean terminal) {
    return new ScanProgress(terminal, new PrintStream(raw, true, StandardCharsets.UTF_8),
        new PrintWriter(lines, true), now::get);
  }

  @Test
  void shortScanPrintsNothing() {
    try (ScanProgress p = progress(false)) {
      p.discovered(3);
      for (int i = 0; i < 3; i++) {
        now.addAndGet(500);
        p.fileDone("F" + i + ".java");
      }
    }
    assertEquals("", lines.toString());
    assertEquals(0, raw.size());
  }

  @Test
  void longScanOffATerminalPrintsPlainCountedLines() {
    try (ScanProgress p = progress(false)) {
      p.discovered(40);
      for (int i = 0; i < 40; i++) {
        now.addAndGet(300); // 12 s in all
        p.fileDone("F" + i + ".java");
      }
    }
    String out = lines.toString();
    assertTrue(out.startsWith("plumbline: 7 of 40 files analyzed"), out); // first after 2 s
    assertTrue(out.strip().endsWith("plumbline: 40 of 40 files analyzed"), out);
    assertFalse(out.contains("\r") || out.contains("\u001b"), "no terminal control characters");
    assertTrue(out.lines().count() <= 4, "at most one line per 5 s plus the last: " + out);
    assertEquals(0, raw.size());
  }

  @Test
  void longScanOnATerminalDrawsABar() {
    try (ScanProgress p = progress(true)) {
      p.discovered(10);
      for (int i = 0; i < 10; i++) {
        now.addAndGet(400);
        p.fileDone("F" + i + ".java");
      }
    }
    String bar = raw.toString(StandardCharsets.UTF_8);
    assertTrue(bar.contains("plumbline") && bar.contains("10/10"), bar);
    assertEquals("", lines.toString(), "no plain lines on a terminal");
  }
}
