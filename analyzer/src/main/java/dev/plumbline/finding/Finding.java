package dev.plumbline.finding;

import java.util.Comparator;
import java.util.List;
import java.util.Optional;

/**
 * One defect reported by a rule.
 *
 * @param ruleId stable rule id, e.g. {@code leak.preprocessing-before-split}
 * @param severity effective severity after configuration
 * @param location the harmful call
 * @param message what is wrong, naming the values involved
 * @param related where the data or shape came from
 * @param fixHint how to repair it
 * @param fix an exact edit, when the repair is mechanical
 * @param fingerprint stable across unrelated edits above the finding; see {@code Fingerprints}
 * @param suppression the justification when a suppression matched, else empty
 * @param involved what the analyses inferred about the values involved (data roles, shapes),
 *     as bundle messages, for reports that show them
 */
public record Finding(
    String ruleId,
    Severity severity,
    Location location,
    Message message,
    List<RelatedLocation> related,
    Message fixHint,
    Optional<Edit> fix,
    String fingerprint,
    Optional<String> suppression,
    List<Message> involved) {

  /** Report order: file, position, rule, then message arguments; total and deterministic. */
  public static final Comparator<Finding> ORDER = Comparator
      .comparing(Finding::location)
      .thenComparing(Finding::ruleId)
      .thenComparing(f -> f.message().key())
      .thenComparing(f -> String.join("\u0000", f.message().arguments()))
      .thenComparing(Finding::fingerprint);

  public Finding {
    related = List.copyOf(related);
    involved = List.copyOf(involved);
  }

  /** A finding with nothing inferred to show about the values involved. */
  public Finding(String ruleId, Severity severity, Location location, Message message,
      List<RelatedLocation> related, Message fixHint, Optional<Edit> fix, String fingerprint,
      Optional<String> suppression) {
    this(ruleId, severity, location, message, related, fixHint, fix, fingerprint, suppression, List.of());
  }

  public boolean isSuppressed() {
    return suppression.isPresent();
  }

  public Finding withSeverity(Severity s) {
    return new Finding(ruleId, s, location, message, related, fixHint, fix, fingerprint, suppression,
        involved);
  }

  public Finding withSuppression(String justification) {
    return new Finding(ruleId, severity, location, message, related, fixHint, fix, fingerprint,
        Optional.of(justification), involved);
  }
}
