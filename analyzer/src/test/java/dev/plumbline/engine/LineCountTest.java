package dev.plumbline.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/** The reference is {@link String#lines()}: the count of lines a scan reports must match it. */
class LineCountTest {

  @Test
  void countsLinesAsStringLinesDoes() {
    for (String text : List.of("", "a", "\n", "\r", "\r\n", "a\n", "a\nb", "a\r\nb\r\n", "\n\n",
        "\r\r\n\n", "a\rb\rc", "x\n\r")) {
      assertEquals(text.lines().count(), Scanner.lineCount(text), text.replace("\r", "\\r").replace("\n", "\\n"));
    }
  }

  @Test
  void countsRandomTextsAsStringLinesDoes() {
    Random random = new Random(4122026);
    char[] alphabet = {'a', ' ', '\t', '\n', '\r', 'é'};
    for (int t = 0; t < 5000; t++) {
      char[] text = new char[random.nextInt(40)];
      for (int i = 0; i < text.length; i++) {
        text[i] = alphabet[random.nextInt(alphabet.length)];
      }
      String s = new String(text);
      assertEquals(s.lines().count(), Scanner.lineCount(s));
    }
  }
}
