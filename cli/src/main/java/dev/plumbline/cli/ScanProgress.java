package dev.plumbline.cli;

import dev.plumbline.engine.Scanner;
import java.io.PrintStream;
import java.io.PrintWriter;
import java.util.function.LongSupplier;
import me.tongfei.progressbar.ConsoleProgressBarConsumer;
import me.tongfei.progressbar.ProgressBar;
import me.tongfei.progressbar.ProgressBarBuilder;
import me.tongfei.progressbar.ProgressBarStyle;

/**
 * Progress of a scan on standard error, shown only once the scan has run for
 * {@link #QUIET_MILLIS}: short scans print nothing. On a terminal it draws a progress bar (the
 * progressbar library, jline underneath); elsewhere (CI logs, files) it prints a plain line with
 * the count of files done, at most once per {@link #LINE_EVERY_MILLIS}, and a last line at the
 * end. Callbacks come from the scan's worker threads, hence the synchronization.
 */
final class ScanProgress implements Scanner.ScanListener, AutoCloseable {
  static final long QUIET_MILLIS = 2_000;
  static final long LINE_EVERY_MILLIS = 5_000;

  private final boolean terminal;
  private final PrintStream rawErr;
  private final PrintWriter err;
  private final LongSupplier clock;
  private long start;
  private long total;
  private long done;
  private long lastLine;
  private boolean printedLine;
  private long doneAtLastLine = -1;
  private ProgressBar bar;

  /**
   * @param terminal whether standard error is a terminal
   * @param rawErr standard error as a stream, for the progress bar
   * @param err standard error for plain lines
   * @param clock milliseconds, monotonic
   */
  ScanProgress(boolean terminal, PrintStream rawErr, PrintWriter err, LongSupplier clock) {
    this.terminal = terminal;
    this.rawErr = rawErr;
    this.err = err;
    this.clock = clock;
    this.start = clock.getAsLong();
  }

  @Override
  public synchronized void discovered(int files) {
    total = files;
  }

  @Override
  public synchronized void fileDone(String uri) {
    done++;
    long now = clock.getAsLong();
    if (now - start < QUIET_MILLIS) {
      return;
    }
    if (terminal) {
      if (bar == null) {
        bar = new ProgressBarBuilder()
            .setTaskName("plumbline")
            .setInitialMax(total)
            .setUnit(" files", 1)
            .setStyle(ProgressBarStyle.ASCII)
            .setUpdateIntervalMillis(250)
            .setConsumer(new ConsoleProgressBarConsumer(rawErr))
            .build();
      }
      bar.stepTo(done);
    } else if (!printedLine || now - lastLine >= LINE_EVERY_MILLIS) {
      line();
      lastLine = now;
      printedLine = true;
    }
  }

  private void line() {
    doneAtLastLine = done;
    err.println("plumbline: " + done + " of " + total + " files analyzed");
    err.flush();
  }

  @Override
  public synchronized void close() {
    if (bar != null) {
      bar.stepTo(done);
      bar.close();
      bar = null;
    } else if (printedLine && done != doneAtLastLine) {
      line(); // the final count, unless the last line already said it
    }
  }
}
