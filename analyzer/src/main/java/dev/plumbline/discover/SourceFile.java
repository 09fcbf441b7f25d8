package dev.plumbline.discover;

import java.nio.file.Path;

/**
 * A file chosen for scanning.
 *
 * @param path where to read it
 * @param uri its name in reports: relative to the scan's base directory, forward slashes
 */
public record SourceFile(Path path, String uri) implements Comparable<SourceFile> {
  @Override
  public int compareTo(SourceFile o) {
    return uri.compareTo(o.uri);
  }

  public boolean isNotebook() {
    return uri.endsWith(".ipynb");
  }
}
