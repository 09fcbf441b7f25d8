package dev.plumbline.engine;

import dev.plumbline.finding.Severity;
import java.util.List;
import java.util.regex.Pattern;

/**
 * A rule's identity and defaults. Its texts (short and full description, why it matters, how to
 * fix, example) live in the message bundle under {@code rule.<id>.*} so there is one place to
 * edit wording; see {@link MessageCatalog}.
 *
 * @param id stable public id in {@code area.kebab-name} form
 * @param defaultSeverity severity when neither configuration nor the rule's own certainty lowers it
 * @param tags SARIF tags, e.g. {@code leakage}, {@code correctness}
 */
public record RuleDescriptor(String id, Severity defaultSeverity, List<String> tags) {
  private static final Pattern ID = Pattern.compile("[a-z]+\\.[a-z]+(-[a-z0-9]+)*");

  public RuleDescriptor {
    if (!ID.matcher(id).matches()) {
      throw new IllegalArgumentException("rule id must be area.kebab-name: " + id);
    }
    tags = List.copyOf(tags);
  }

  public String area() {
    return id.substring(0, id.indexOf('.'));
  }
}
