package dev.plumbline.gate;

import dev.plumbline.finding.Severity;
import java.io.IOException;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.FileSystems;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeMap;
import javax.lang.model.SourceVersion;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.constructor.SafeConstructor;
import org.yaml.snakeyaml.error.MarkedYAMLException;
import org.yaml.snakeyaml.error.YAMLException;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;
import org.yaml.snakeyaml.nodes.Tag;

/**
 * Reads and validates a configuration file (YAML; JSON works too, being a subset). The file is
 * read as a node tree so that every error names its line; the first error stops the load. The
 * format is described in {@code docs/configuration.md}.
 */
public final class ConfigLoader {
  /** The only format version this release reads. */
  public static final int VERSION = 1;
  static final long MAX_BYTES = 1024 * 1024;

  private static final List<String> TOP_KEYS =
      List.of("version", "fail-on", "include", "exclude", "rules", "test-data-names");
  private static final List<String> RULE_KEYS = List.of("enabled", "severity");
  private static final List<String> SEVERITIES = List.of("error", "warning", "note");

  private final String name;
  private final Set<String> knownRules;

  private ConfigLoader(String name, Set<String> knownRules) {
    this.name = name;
    this.knownRules = knownRules;
  }

  /**
   * Loads {@code file}. {@code displayName} is how errors name it (the path as the user gave
   * it); {@code knownRules} are the rule ids a {@code rules} entry may name.
   */
  public static GateConfig load(Path file, String displayName, Set<String> knownRules)
      throws ConfigException {
    String text;
    try {
      if (Files.size(file) > MAX_BYTES) {
        throw new ConfigException(displayName, 0, "larger than " + MAX_BYTES + " bytes; is this the right file?");
      }
      text = Files.readString(file, StandardCharsets.UTF_8);
    } catch (java.nio.charset.MalformedInputException e) {
      throw new ConfigException(displayName, 0, "not valid UTF-8");
    } catch (IOException e) {
      throw new ConfigException(displayName, 0, "cannot read: " + e.getMessage());
    }
    return parse(text, displayName, knownRules);
  }

  /** Parses configuration text; {@code displayName} names it in errors. */
  public static GateConfig parse(String text, String displayName, Set<String> knownRules)
      throws ConfigException {
    return new ConfigLoader(displayName, knownRules).read(text);
  }

  private GateConfig read(String text) throws ConfigException {
    LoaderOptions options = new LoaderOptions();
    options.setAllowDuplicateKeys(false);
    options.setMaxAliasesForCollections(20);
    Node root;
    try {
      root = new Yaml(new SafeConstructor(options)).compose(new StringReader(text));
    } catch (MarkedYAMLException e) {
      int line = e.getProblemMark() == null ? 0 : e.getProblemMark().getLine() + 1;
      throw new ConfigException(name, line, "not valid YAML: " + oneLine(e.getProblem()));
    } catch (YAMLException e) {
      throw new ConfigException(name, 0, "not valid YAML: " + oneLine(e.getMessage()));
    }
    if (root == null || isNull(root)) {
      return GateConfig.EMPTY;
    }
    Map<String, Node> top = mapping(root, "the configuration", TOP_KEYS);
    if (top.containsKey("version")) {
      Node v = top.get("version");
      if (!(v instanceof ScalarNode s) || !String.valueOf(VERSION).equals(s.getValue())) {
        throw error(v, "unsupported version " + describe(v) + "; this plumbline reads version " + VERSION);
      }
    }
    Optional<FailLevel> failOn = Optional.empty();
    if (top.containsKey("fail-on")) {
      Node v = top.get("fail-on");
      String s = scalar(v, "fail-on");
      failOn = FailLevel.parse(s);
      if (failOn.isEmpty()) {
        throw error(v, "fail-on must be one of error, warning, note, none; got " + describe(v));
      }
    }
    List<String> include = globs(top.get("include"), "include");
    List<String> exclude = globs(top.get("exclude"), "exclude");
    Set<String> names = new LinkedHashSet<>();
    for (ScalarNode n : strings(top.get("test-data-names"), "test-data-names")) {
      if (!SourceVersion.isIdentifier(n.getValue()) || SourceVersion.isKeyword(n.getValue())) {
        throw error(n, "test-data-names: '" + n.getValue() + "' is not a Java identifier");
      }
      names.add(n.getValue());
    }
    Map<String, GateConfig.RuleSetting> rules = new TreeMap<>();
    if (top.containsKey("rules") && !isNull(top.get("rules"))) {
      Node rulesNode = top.get("rules");
      if (!(rulesNode instanceof MappingNode m)) {
        throw error(rulesNode, "rules must be a mapping from rule id to settings");
      }
      Map<String, Node> seen = new HashMap<>();
      for (NodeTuple t : m.getValue()) {
        String id = key(t, seen);
        if (!knownRules.contains(id)) {
          throw error(t.getKeyNode(), "unknown rule '" + id + "' ('plumbline rules' lists them)");
        }
        rules.put(id, ruleSetting(id, t.getValueNode()));
      }
    }
    return new GateConfig(failOn, include, exclude, rules, names);
  }

  /** Either a mapping {@code {enabled, severity}} or a scalar {@code off|error|warning|note}. */
  private GateConfig.RuleSetting ruleSetting(String id, Node value) throws ConfigException {
    if (value instanceof ScalarNode s && !isNull(s)) {
      String v = s.getValue();
      if ("off".equals(v)) {
        return new GateConfig.RuleSetting(false, Optional.empty());
      }
      if (SEVERITIES.contains(v)) {
        return new GateConfig.RuleSetting(true, Severity.parse(v));
      }
      throw error(s, "rules." + id + " must be off, error, warning, note or a mapping with enabled and severity; got "
          + describe(s));
    }
    Map<String, Node> settings = mapping(value, "rules." + id, RULE_KEYS);
    boolean enabled = true;
    if (settings.containsKey("enabled")) {
      Node e = settings.get("enabled");
      String v = scalar(e, "rules." + id + ".enabled");
      if (!"true".equals(v) && !"false".equals(v)) {
        throw error(e, "rules." + id + ".enabled must be true or false; got " + describe(e));
      }
      enabled = "true".equals(v);
    }
    Optional<Severity> severity = Optional.empty();
    if (settings.containsKey("severity")) {
      Node sv = settings.get("severity");
      String v = scalar(sv, "rules." + id + ".severity");
      severity = Severity.parse(v);
      if (severity.isEmpty()) {
        throw error(sv, "rules." + id + ".severity must be error, warning or note; got " + describe(sv));
      }
    }
    return new GateConfig.RuleSetting(enabled, severity);
  }

  private Map<String, Node> mapping(Node node, String what, List<String> allowed) throws ConfigException {
    if (!(node instanceof MappingNode m)) {
      throw error(node, what + " must be a mapping of " + String.join(", ", allowed));
    }
    Map<String, Node> out = new HashMap<>();
    Map<String, Node> seen = new HashMap<>();
    for (NodeTuple t : m.getValue()) {
      String k = key(t, seen);
      if (!allowed.contains(k)) {
        throw error(t.getKeyNode(), "unknown key '" + k + "' in " + what + " (known: "
            + String.join(", ", allowed) + ")");
      }
      out.put(k, t.getValueNode());
    }
    return out;
  }

  private String key(NodeTuple t, Map<String, Node> seen) throws ConfigException {
    if (!(t.getKeyNode() instanceof ScalarNode k)) {
      throw error(t.getKeyNode(), "keys must be plain names");
    }
    Node first = seen.putIfAbsent(k.getValue(), k);
    if (first != null) {
      throw error(k, "key '" + k.getValue() + "' appears twice (first at line " + line(first) + ")");
    }
    return k.getValue();
  }

  private List<String> globs(Node node, String what) throws ConfigException {
    List<String> out = new ArrayList<>();
    for (ScalarNode n : strings(node, what)) {
      try {
        FileSystems.getDefault().getPathMatcher("glob:" + n.getValue());
      } catch (IllegalArgumentException e) {
        throw error(n, what + ": bad glob '" + n.getValue() + "': " + oneLine(e.getMessage()));
      }
      out.add(n.getValue());
    }
    return out;
  }

  /** A list of non-empty strings; absent or null means empty. */
  private List<ScalarNode> strings(Node node, String what) throws ConfigException {
    if (node == null || isNull(node)) {
      return List.of();
    }
    if (!(node instanceof SequenceNode seq)) {
      throw error(node, what + " must be a list, e.g. [\"a\", \"b\"]");
    }
    List<ScalarNode> out = new ArrayList<>();
    for (Node item : seq.getValue()) {
      if (!(item instanceof ScalarNode s) || isNull(s) || s.getValue().isBlank()) {
        throw error(item, what + " entries must be non-empty strings");
      }
      out.add(s);
    }
    return out;
  }

  private String scalar(Node node, String what) throws ConfigException {
    if (!(node instanceof ScalarNode s) || isNull(s)) {
      throw error(node, what + " needs a single value");
    }
    return s.getValue();
  }

  private static boolean isNull(Node node) {
    return node instanceof ScalarNode s && Tag.NULL.equals(s.getTag());
  }

  private static String describe(Node node) {
    if (node instanceof ScalarNode s) {
      return isNull(s) ? "nothing" : "'" + s.getValue() + "'";
    }
    return node instanceof SequenceNode ? "a list" : "a mapping";
  }

  private ConfigException error(Node node, String message) {
    return new ConfigException(name, line(node), message);
  }

  private static int line(Node node) {
    return node.getStartMark() == null ? 0 : node.getStartMark().getLine() + 1;
  }

  private static String oneLine(String s) {
    if (s == null) {
      return "unknown problem";
    }
    String t = s.strip();
    int nl = t.indexOf('\n');
    return nl < 0 ? t : t.substring(0, nl);
  }
}
