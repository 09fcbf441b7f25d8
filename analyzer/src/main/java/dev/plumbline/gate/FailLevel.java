package dev.plumbline.gate;

import dev.plumbline.finding.Severity;
import java.util.Locale;
import java.util.Optional;

/** The least severity that fails a scan, or {@link #NONE} for a scan that never fails on findings. */
public enum FailLevel {
  ERROR(Severity.ERROR), WARNING(Severity.WARNING), NOTE(Severity.NOTE), NONE(null);

  /** Used when neither the command line nor the configuration says. */
  public static final FailLevel DEFAULT = WARNING;

  private final Severity threshold;

  FailLevel(Severity threshold) {
    this.threshold = threshold;
  }

  public Optional<Severity> threshold() {
    return Optional.ofNullable(threshold);
  }

  /** Whether a finding of this severity fails the scan. */
  public boolean fails(Severity s) {
    return threshold != null && s.atLeast(threshold);
  }

  /** As written in options and configuration: {@code error}, {@code warning}, {@code note}, {@code none}. */
  public String label() {
    return name().toLowerCase(Locale.ROOT);
  }

  public static Optional<FailLevel> parse(String text) {
    for (FailLevel l : values()) {
      if (l.label().equals(text)) {
        return Optional.of(l);
      }
    }
    return Optional.empty();
  }
}
