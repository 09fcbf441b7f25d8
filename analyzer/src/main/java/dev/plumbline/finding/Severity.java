package dev.plumbline.finding;

import java.util.Locale;
import java.util.Optional;

/** How serious a finding is; ordered from least to most severe. Names match SARIF levels. */
public enum Severity {
  NOTE, WARNING, ERROR;

  /** SARIF 2.1.0 {@code result.level} / {@code reportingConfiguration.level} value. */
  public String sarifLevel() {
    return name().toLowerCase(Locale.ROOT);
  }

  public String label() {
    return sarifLevel();
  }

  public boolean atLeast(Severity other) {
    return compareTo(other) >= 0;
  }

  public static Optional<Severity> parse(String text) {
    for (Severity s : values()) {
      if (s.sarifLevel().equals(text)) {
        return Optional.of(s);
      }
    }
    return Optional.empty();
  }

  /** One step less severe, for findings the analysis is less sure of. */
  public Severity weaker() {
    return this == ERROR ? WARNING : NOTE;
  }
}
