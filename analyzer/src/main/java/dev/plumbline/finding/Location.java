package dev.plumbline.finding;

import java.util.Comparator;

/**
 * A place in a scanned file. {@code uri} is relative to the scan root, with forward slashes, as
 * SARIF's {@code artifactLocation.uri} with {@code uriBaseId} expects.
 */
public record Location(String uri, SourceRange range) implements Comparable<Location> {
  private static final Comparator<Location> ORDER =
      Comparator.comparing(Location::uri).thenComparing(Location::range);

  @Override
  public int compareTo(Location o) {
    return ORDER.compare(this, o);
  }

  /** {@code path:line:col}, the compiler diagnostic prefix. */
  public String display() {
    return uri + ":" + range.startLine() + ":" + range.startColumn();
  }
}
