package dev.plumbline.gate;

/**
 * A configuration or baseline file that cannot be used: its message is one line, starting
 * with the file and, where known, the line ({@code plumbline.yaml:7: unknown key 'severty'}).
 */
public final class ConfigException extends Exception {
  private static final long serialVersionUID = 1L;

  public ConfigException(String file, int line, String message) {
    super(file + (line > 0 ? ":" + line : "") + ": " + message);
  }
}
