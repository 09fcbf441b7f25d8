package dev.plumbline.engine;

import dev.plumbline.finding.Message;
import java.text.MessageFormat;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.MissingResourceException;
import java.util.Optional;
import java.util.ResourceBundle;

/**
 * Renders {@link Message}s from property bundles. Keys are looked up in each bundle in order;
 * a missing key renders as the key and its arguments, so a gap in wording never crashes a scan
 * (a test checks that every key the code uses is present).
 */
public final class MessageCatalog {
  private final List<ResourceBundle> bundles;

  public MessageCatalog(List<ResourceBundle> bundles) {
    this.bundles = List.copyOf(bundles);
  }

  /** The analyzer's own bundle (tool notifications) plus the given ones. */
  public static MessageCatalog withCore(List<ResourceBundle> ruleBundles) {
    List<ResourceBundle> all = new ArrayList<>();
    all.add(ResourceBundle.getBundle("dev.plumbline.notifications", Locale.ROOT));
    all.addAll(ruleBundles);
    return new MessageCatalog(all);
  }

  public Optional<String> pattern(String key) {
    for (ResourceBundle b : bundles) {
      try {
        return Optional.of(b.getString(key));
      } catch (MissingResourceException ignored) {
        // try the next bundle
      }
    }
    return Optional.empty();
  }

  public boolean has(String key) {
    return pattern(key).isPresent();
  }

  public String render(Message m) {
    Optional<String> p = pattern(m.key());
    if (p.isEmpty()) {
      return m.key() + (m.arguments().isEmpty() ? "" : " " + m.arguments());
    }
    MessageFormat format = new MessageFormat(p.get(), Locale.ROOT);
    return format.format(m.arguments().toArray());
  }

  /** Text of a plain key with no arguments, or empty. */
  public String text(String key) {
    return pattern(key).map(s -> new MessageFormat(s, Locale.ROOT).format(new Object[0])).orElse("");
  }
}
