package dev.plumbline.report;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.plumbline.fix.TextLines;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

/** Lines are numbered exactly as {@link String#lines()} numbers them (the JDK is the reference). */
class ExcerptsTest {
  @Test
  void numbersLinesLikeTheJdk() {
    List<String> texts = List.of("", "a", "a\n", "a\nb", "a\r\nb\r\n", "a\rb\rc", "\n\n", "\r\n\r\n",
        "x\r\r\ny\n\rz", "only one line without terminator", "\tindented\n\n  spaces\n", "\n");
    for (String text : texts) {
      List<String> expected = text.lines().toList();
      for (int n = -1; n <= expected.size() + 2; n++) {
        Optional<String> want = n >= 1 && n <= expected.size() ? Optional.of(expected.get(n - 1))
            : Optional.empty();
        assertEquals(want, Excerpts.line(new TextLines(text), n), "line " + n + " of " + text.replace("\r", "\\r")
            .replace("\n", "\\n"));
      }
    }
  }
}
