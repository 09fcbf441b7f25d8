package dev.plumbline.report.html;

/**
 * Escaping for text that goes into HTML. Everything that comes from scanned code (identifiers,
 * string literals, paths, messages built from them) passes through here before it reaches the
 * page; it is only ever placed in element text or in double-quoted attribute values, never in
 * script, style or URL contexts.
 */
public final class Html {
  private Html() {}

  /** Escapes for element text and double-quoted attribute values alike. */
  public static String escape(String s) {
    if (s == null) {
      return "";
    }
    StringBuilder sb = new StringBuilder(s.length() + 16);
    for (int i = 0; i < s.length(); i++) {
      char c = s.charAt(i);
      switch (c) {
        case '&' -> sb.append("&amp;");
        case '<' -> sb.append("&lt;");
        case '>' -> sb.append("&gt;");
        case '"' -> sb.append("&quot;");
        case '\'' -> sb.append("&#39;");
        default -> {
          if (c < 0x20 && c != '\n' && c != '\t' && c != '\r') {
            sb.append("&#xFFFD;"); // control characters are not allowed in HTML text
          } else {
            sb.append(c);
          }
        }
      }
    }
    return sb.toString();
  }

  /** An id fragment made of safe characters only, for anchors derived from scanned names. */
  public static String id(String s) {
    StringBuilder sb = new StringBuilder();
    for (char c : s.toCharArray()) {
      sb.append(Character.isLetterOrDigit(c) && c < 128 ? c : '-');
    }
    return sb.toString();
  }
}
