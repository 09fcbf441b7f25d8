package dev.plumbline.finding;

import java.util.List;

/**
 * A message as a key into a bundle plus its arguments. Tests compare keys and arguments, never
 * English text; reports render the text from the bundle.
 */
public record Message(String key, List<String> arguments) {
  public Message {
    arguments = List.copyOf(arguments);
  }

  public static Message of(String key, Object... arguments) {
    return new Message(key, java.util.Arrays.stream(arguments).map(String::valueOf).toList());
  }
}
