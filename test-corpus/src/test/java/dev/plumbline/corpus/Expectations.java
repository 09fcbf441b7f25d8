package dev.plumbline.corpus;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

/**
 * Expectations written next to the code they describe, as trailing comments ({@code //}, or
 * {@code /* ... *}{@code /} where the line's line comment is itself under test):
 * <ul>
 *   <li>{@code // expect: rule.id} (several separated by commas): the rule must report on this line;
 *   <li>{@code // clean: rule.id}: a look-alike the rule must stay silent on (counted for coverage);
 *   <li>{@code // expect-miss: rule.id (why)}: a known miss; the rule does not report here yet.
 * </ul>
 * In a notebook ({@code .ipynb}) the mark sits in the code line inside the JSON string, so its
 * line is the notebook file's line, which is the line findings in notebooks report.
 */
final class Expectations {
  enum Kind { EXPECT, CLEAN, MISS }

  record Mark(String uri, int line, String ruleId, Kind kind) {}

  private static final Pattern MARK =
      Pattern.compile("(?://|/\\*)\\s*(expect|clean|expect-miss):\\s*([a-z]+\\.[a-z0-9-]+(?:\\s*,\\s*[a-z]+\\.[a-z0-9-]+)*)");

  private Expectations() {}

  /** All marks in the Java files and notebooks under {@code root}; uris relative to {@code base}. */
  static List<Mark> read(Path base, Path root) {
    List<Mark> marks = new ArrayList<>();
    try (Stream<Path> files = Files.walk(root)) {
      for (Path file : files.filter(p -> p.toString().endsWith(".java") || p.toString().endsWith(".ipynb")).sorted().toList()) {
        String uri = base.relativize(file).toString().replace('\\', '/');
        List<String> lines = Files.readAllLines(file, StandardCharsets.UTF_8);
        for (int i = 0; i < lines.size(); i++) {
          Matcher m = MARK.matcher(lines.get(i));
          while (m.find()) {
            Kind kind = switch (m.group(1)) {
              case "expect" -> Kind.EXPECT;
              case "clean" -> Kind.CLEAN;
              default -> Kind.MISS;
            };
            for (String id : m.group(2).split(",")) {
              marks.add(new Mark(uri, i + 1, id.trim(), kind));
            }
          }
        }
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return marks;
  }
}
