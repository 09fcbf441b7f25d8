package dev.plumbline.parse;

import java.util.concurrent.ConcurrentHashMap;

/**
 * One string per distinct text, for the names and literals of the trees of one scan: JavaParser
 * makes a new string for every token, so a name used a thousand times is held a thousand times
 * by the trees that a scan keeps until its end. Safe from any thread. Holds at most
 * {@link #LIMIT} texts and a text of at most {@link #MAX_LENGTH} characters; past either, a text
 * is returned as it is, so an odd input (a file of a million distinct names, a huge string
 * literal) costs no more than before.
 */
final class SharedStrings {
  static final int LIMIT = 1 << 18;
  static final int MAX_LENGTH = 64;

  private final ConcurrentHashMap<String, String> texts = new ConcurrentHashMap<>();

  /** An equal string, the same instance for every equal text while this table has room. */
  String shared(String text) {
    if (text.length() > MAX_LENGTH) {
      return text;
    }
    String known = texts.get(text);
    if (known != null) {
      return known;
    }
    if (texts.size() >= LIMIT) {
      return text;
    }
    known = texts.putIfAbsent(text, text);
    return known != null ? known : text;
  }
}
