package dev.plumbline.gate;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import dev.plumbline.engine.MessageCatalog;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.finding.Finding;
import java.io.IOException;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Pattern;

/**
 * Accepted findings recorded at one point in time, so that a later scan reports only what is
 * new. The file is JSON (format in {@code docs/configuration.md}); entries are matched by
 * fingerprint and rule id, one entry per finding, so a second instance of a recorded defect is
 * new and an entry whose finding is gone (stale) matches nothing.
 */
public final class Baseline {
  public static final String FORMAT = "plumbline-baseline";
  public static final int VERSION = 1;
  private static final Pattern FINGERPRINT = Pattern.compile("[0-9a-f]{16}");

  /**
   * One accepted finding. Only {@code fingerprint} and {@code rule} are used for matching; the
   * rest is there for the people who review the file.
   */
  public record Entry(String fingerprint, String rule, String file, int line, String message) {}

  /** What filtering against the baseline did. */
  public record Outcome(ScanResult result, BaselineSummary summary) {}

  private final List<Entry> entries;

  private Baseline(List<Entry> entries) {
    this.entries = List.copyOf(entries);
  }

  public List<Entry> entries() {
    return entries;
  }

  /** The active (unsuppressed) findings of a scan, in report order. */
  public static Baseline of(ScanResult result, MessageCatalog messages) {
    List<Entry> out = new ArrayList<>();
    for (Finding f : result.findings()) {
      if (!f.isSuppressed()) {
        out.add(new Entry(f.fingerprint(), f.ruleId(), f.location().uri(),
            f.location().range().startLine(), messages.render(f.message())));
      }
    }
    out.sort(Comparator.comparing(Entry::file).thenComparingInt(Entry::line)
        .thenComparing(Entry::rule).thenComparing(Entry::fingerprint));
    return new Baseline(out);
  }

  /**
   * Removes known findings from {@code result}. Suppressed findings are left alone: they are
   * already accepted in the code.
   */
  public Outcome filter(ScanResult result, String displayName) {
    Map<String, Integer> remaining = new HashMap<>();
    for (Entry e : entries) {
      remaining.merge(e.rule() + "\n" + e.fingerprint(), 1, Integer::sum);
    }
    List<Finding> kept = new ArrayList<>();
    int known = 0;
    for (Finding f : result.findings()) {
      String key = f.ruleId() + "\n" + f.fingerprint();
      int left = remaining.getOrDefault(key, 0);
      if (!f.isSuppressed() && left > 0) {
        remaining.put(key, left - 1);
        known++;
      } else {
        kept.add(f);
      }
    }
    int stale = remaining.values().stream().mapToInt(Integer::intValue).sum();
    return new Outcome(result.withFindings(kept), new BaselineSummary(displayName, known, stale));
  }

  /** The file's text: sorted entries, no timestamps, so the same findings give the same bytes. */
  public String render() {
    StringWriter w = new StringWriter();
    try (JsonGenerator g = new JsonFactory().createGenerator(w)) {
      g.setPrettyPrinter(new DefaultPrettyPrinter());
      g.writeStartObject();
      g.writeStringField("format", FORMAT);
      g.writeNumberField("version", VERSION);
      g.writeArrayFieldStart("entries");
      for (Entry e : entries) {
        g.writeStartObject();
        g.writeStringField("fingerprint", e.fingerprint());
        g.writeStringField("rule", e.rule());
        g.writeStringField("file", e.file());
        g.writeNumberField("line", e.line());
        g.writeStringField("message", e.message());
        g.writeEndObject();
      }
      g.writeEndArray();
      g.writeEndObject();
    } catch (IOException e) {
      throw new IllegalStateException("writing JSON to memory failed", e);
    }
    return w + "\n";
  }

  public static Baseline load(Path file, String displayName) throws ConfigException {
    String text;
    try {
      text = Files.readString(file, StandardCharsets.UTF_8);
    } catch (IOException e) {
      throw new ConfigException(displayName, 0, "cannot read baseline: " + e.getMessage());
    }
    return parse(text, displayName);
  }

  public static Baseline parse(String text, String displayName) throws ConfigException {
    try (JsonParser p = new JsonFactory().enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION)
        .createParser(text)) {
      return new Reader(p, displayName).read();
    } catch (JsonProcessingException e) {
      int line = e.getLocation() == null ? 0 : e.getLocation().getLineNr();
      throw new ConfigException(displayName, line, "not valid JSON: " + e.getOriginalMessage()
          .lines().findFirst().orElse(""));
    } catch (IOException e) {
      throw new ConfigException(displayName, 0, "cannot read baseline: " + e.getMessage());
    }
  }

  /** A streaming read, so every error can name its line. */
  private static final class Reader {
    private final JsonParser p;
    private final String name;

    Reader(JsonParser p, String name) {
      this.p = p;
      this.name = name;
    }

    Baseline read() throws IOException, ConfigException {
      expect(p.nextToken(), JsonToken.START_OBJECT, "a baseline is a JSON object");
      String format = null;
      Integer version = null;
      List<Entry> entries = null;
      while (p.nextToken() == JsonToken.FIELD_NAME) {
        String field = p.currentName();
        JsonToken value = p.nextToken();
        switch (field) {
          case "format" -> {
            expect(value, JsonToken.VALUE_STRING, "format must be \"" + FORMAT + "\"");
            format = p.getText();
            if (!FORMAT.equals(format)) {
              throw error("format must be \"" + FORMAT + "\"; got \"" + format + "\"");
            }
          }
          case "version" -> {
            expect(value, JsonToken.VALUE_NUMBER_INT, "version must be " + VERSION);
            version = p.getIntValue();
            if (version != VERSION) {
              throw error("unsupported baseline version " + version + "; this plumbline reads version " + VERSION);
            }
          }
          case "entries" -> entries = entries(value);
          default -> throw error("unknown key '" + field + "' (known: format, version, entries)");
        }
      }
      if (format == null || version == null || entries == null) {
        throw new ConfigException(name, 0, "not a plumbline baseline: format, version and entries are required");
      }
      return new Baseline(entries);
    }

    private List<Entry> entries(JsonToken start) throws IOException, ConfigException {
      expect(start, JsonToken.START_ARRAY, "entries must be a list");
      List<Entry> out = new ArrayList<>();
      while (p.nextToken() == JsonToken.START_OBJECT) {
        int entryLine = line();
        String fingerprint = null;
        String rule = null;
        String file = "";
        int lineNumber = 0;
        String message = "";
        while (p.nextToken() == JsonToken.FIELD_NAME) {
          String field = p.currentName();
          JsonToken value = p.nextToken();
          switch (field) {
            case "fingerprint" -> {
              expect(value, JsonToken.VALUE_STRING, "fingerprint must be 16 hex digits");
              fingerprint = p.getText();
              if (!FINGERPRINT.matcher(fingerprint).matches()) {
                throw error("fingerprint must be 16 lower-case hex digits; got \"" + fingerprint + "\"");
              }
            }
            case "rule" -> {
              expect(value, JsonToken.VALUE_STRING, "rule must be a rule id");
              rule = p.getText();
            }
            case "file" -> {
              expect(value, JsonToken.VALUE_STRING, "file must be a string");
              file = p.getText();
            }
            case "line" -> {
              expect(value, JsonToken.VALUE_NUMBER_INT, "line must be a number");
              lineNumber = p.getIntValue();
            }
            case "message" -> {
              expect(value, JsonToken.VALUE_STRING, "message must be a string");
              message = p.getText();
            }
            default -> throw error("unknown key '" + field
                + "' in an entry (known: fingerprint, rule, file, line, message)");
          }
        }
        if (fingerprint == null || rule == null) {
          throw new ConfigException(name, entryLine, "an entry needs a fingerprint and a rule");
        }
        out.add(new Entry(fingerprint, rule, file, lineNumber, message));
      }
      expect(p.currentToken(), JsonToken.END_ARRAY, "entries must hold only objects");
      return out;
    }

    private void expect(JsonToken actual, JsonToken wanted, String message) throws ConfigException {
      if (actual != wanted) {
        throw error(message);
      }
    }

    private ConfigException error(String message) {
      return new ConfigException(name, line(), message);
    }

    private int line() {
      return p.currentLocation() == null ? 0 : p.currentLocation().getLineNr();
    }
  }
}
