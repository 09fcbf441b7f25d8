package dev.plumbline.finding;

import java.util.Comparator;
import java.util.Optional;

/**
 * A message about the tool's own run: a file that could not be read or parsed, a rule that
 * failed on a file. Becomes a SARIF {@code toolExecutionNotification}.
 *
 * @param incomplete whether part of the input went unanalyzed (exit code 3)
 */
public record Notification(
    Severity level, Message message, Optional<Location> location, boolean incomplete) {

  public static final Comparator<Notification> ORDER = Comparator
      .comparing((Notification n) -> n.location().map(Location::uri).orElse(""))
      .thenComparing(n -> n.location().map(l -> l.range().startLine()).orElse(0))
      .thenComparing(n -> n.message().key())
      .thenComparing(n -> String.join("\u0000", n.message().arguments()));
}
