package dev.plumbline.discover;

import dev.plumbline.finding.Message;
import dev.plumbline.finding.Notification;
import dev.plumbline.finding.Severity;
import java.io.IOException;
import java.nio.file.FileSystemLoopException;
import java.nio.file.FileSystems;
import java.nio.file.FileVisitOption;
import java.nio.file.FileVisitResult;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.PathMatcher;
import java.nio.file.SimpleFileVisitor;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.TreeMap;

/**
 * Finds the files to scan under the given paths: Java sources (and notebooks), sorted by their
 * report name, skipping build output and version-control folders. Symbolic links are followed;
 * a link loop or an unreadable folder becomes a notification, never an exception.
 *
 * <p>Globs are matched against the report name (relative, forward slashes) with
 * {@link java.nio.file.FileSystem#getPathMatcher} glob syntax, e.g. {@code **}{@code /generated/**}.
 */
public final class Discovery {
  /** Folder names never entered: build output and version control. */
  public static final Set<String> SKIPPED_FOLDERS = Set.of("target", "build", ".git", ".hg", ".svn");

  /** What to look for. An empty include list means every supported file. */
  public record Options(Path baseDirectory, List<String> includes, List<String> excludes,
      boolean notebooks) {
    public Options {
      includes = List.copyOf(includes);
      excludes = List.copyOf(excludes);
    }
  }

  /** The files found, in report order, and the problems met while looking. */
  public record Result(List<SourceFile> files, List<Notification> notifications) {}

  private final Options options;
  private final List<PathMatcher> includes = new ArrayList<>();
  private final List<PathMatcher> excludes = new ArrayList<>();

  public Discovery(Options options) {
    this.options = options;
    for (String g : options.includes()) {
      includes.add(FileSystems.getDefault().getPathMatcher("glob:" + g));
    }
    for (String g : options.excludes()) {
      excludes.add(FileSystems.getDefault().getPathMatcher("glob:" + g));
    }
  }

  public Result discover(List<Path> roots) {
    TreeMap<String, SourceFile> found = new TreeMap<>();
    List<Notification> notes = new ArrayList<>();
    for (Path root : roots) {
      Path absolute = root.toAbsolutePath().normalize();
      if (Files.isRegularFile(absolute)) {
        consider(absolute, absolute.getParent(), found, true);
        continue;
      }
      try {
        Files.walkFileTree(absolute, EnumSet.of(FileVisitOption.FOLLOW_LINKS), Integer.MAX_VALUE,
            new SimpleFileVisitor<>() {
              @Override
              public FileVisitResult preVisitDirectory(Path dir, BasicFileAttributes attrs) {
                Path name = dir.getFileName();
                if (!dir.equals(absolute) && name != null && SKIPPED_FOLDERS.contains(name.toString())) {
                  return FileVisitResult.SKIP_SUBTREE;
                }
                return FileVisitResult.CONTINUE;
              }

              @Override
              public FileVisitResult visitFile(Path file, BasicFileAttributes attrs) {
                if (attrs.isRegularFile()) {
                  consider(file, absolute, found, false);
                } else if (attrs.isSymbolicLink() && wanted(file, uriOf(file, absolute), false)) {
                  // Links are followed, so a link seen as a link points nowhere readable.
                  notes.add(new Notification(Severity.WARNING, Message.of("notification.unreadable-path",
                      uriOf(file, absolute), "broken symbolic link"), Optional.empty(), true));
                }
                return FileVisitResult.CONTINUE;
              }

              @Override
              public FileVisitResult visitFileFailed(Path file, IOException e) {
                String uri = uriOf(file, absolute);
                String key = e instanceof FileSystemLoopException
                    ? "notification.link-loop" : "notification.unreadable-path";
                notes.add(new Notification(Severity.WARNING,
                    Message.of(key, uri, String.valueOf(e.getMessage())), Optional.empty(), true));
                return FileVisitResult.CONTINUE;
              }
            });
      } catch (IOException e) {
        notes.add(new Notification(Severity.ERROR,
            Message.of("notification.unreadable-path", root.toString(), String.valueOf(e.getMessage())),
            Optional.empty(), true));
      }
    }
    return new Result(List.copyOf(found.values()), notes);
  }

  private void consider(Path file, Path root, TreeMap<String, SourceFile> found, boolean explicit) {
    String uri = uriOf(file, root);
    if (wanted(file, uri, explicit)) {
      found.putIfAbsent(uri, new SourceFile(file, uri));
    }
  }

  /** A supported file kind that the include and exclude globs let through. */
  private boolean wanted(Path file, String uri, boolean explicit) {
    String name = file.getFileName().toString();
    boolean supported = name.endsWith(".java") || (options.notebooks() && name.endsWith(".ipynb"));
    if (!supported) {
      return false;
    }
    if (!explicit && !includes.isEmpty() && includes.stream().noneMatch(m -> m.matches(Path.of(uri)))) {
      return false;
    }
    return excludes.stream().noneMatch(m -> m.matches(Path.of(uri)));
  }

  /** Report name: relative to the base directory when inside it, else to the scanned root. */
  private String uriOf(Path file, Path root) {
    Path base = options.baseDirectory().toAbsolutePath().normalize();
    Path normalized = file.toAbsolutePath().normalize();
    Path relative;
    if (normalized.startsWith(base)) {
      relative = base.relativize(normalized);
    } else {
      Path rootParent = root.getParent() == null ? root : root.getParent();
      relative = rootParent.relativize(normalized);
    }
    String uri = relative.toString().replace('\\', '/');
    return uri.isEmpty() ? normalized.getFileName().toString() : uri;
  }
}
