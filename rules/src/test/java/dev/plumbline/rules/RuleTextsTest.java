package dev.plumbline.rules;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumbline.engine.MessageCatalog;
import dev.plumbline.engine.Rule;
import java.io.IOException;
import java.io.InputStream;
import java.util.ArrayList;
import java.util.List;
import java.util.Properties;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/** Every rule has its texts, and every message key named in rule sources exists in the bundle. */
class RuleTextsTest {
  private final MessageCatalog messages = BuiltInRules.messages();

  @Test
  void everyRuleHasItsTexts() {
    List<String> missing = new ArrayList<>();
    for (Rule r : BuiltInRules.all()) {
      for (String part : List.of("short", "full", "why", "fix")) {
        String key = "rule." + r.descriptor().id() + "." + part;
        if (messages.text(key).isBlank()) {
          missing.add(key);
        }
      }
      if (!messages.has(r.descriptor().id())) {
        missing.add(r.descriptor().id() + " (main message)");
      }
    }
    assertTrue(missing.isEmpty(), () -> "missing texts: " + missing);
  }

  @Test
  void everyBundleEntryDocumentsItsArguments() throws IOException {
    Properties p = new Properties();
    try (InputStream in = getClass().getResourceAsStream("/dev/plumbline/rules/messages.properties")) {
      p.load(in);
    }
    Pattern arg = Pattern.compile("\\{(\\d+)}");
    List<String> bad = new ArrayList<>();
    for (String key : p.stringPropertyNames()) {
      Matcher m = arg.matcher(p.getProperty(key));
      while (m.find()) {
        if (Integer.parseInt(m.group(1)) > 9) {
          bad.add(key);
        }
      }
      try {
        new java.text.MessageFormat(p.getProperty(key), java.util.Locale.ROOT);
      } catch (IllegalArgumentException e) {
        bad.add(key + " (not a valid MessageFormat pattern: " + e.getMessage() + ")");
      }
      if (p.getProperty(key).contains("'") && !p.getProperty(key).contains("''")) {
        bad.add(key + " (single quote must be doubled for MessageFormat)");
      }
    }
    assertTrue(bad.isEmpty(), () -> "bad entries: " + bad);
  }
}
