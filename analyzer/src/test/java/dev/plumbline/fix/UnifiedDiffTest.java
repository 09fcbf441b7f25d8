package dev.plumbline.fix;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/**
 * Hunks checked by hand against the layout of GNU {@code diff -u}, plus a round trip: applying
 * the printed hunks to the old text gives the new text, for many random edits.
 */
class UnifiedDiffTest {

  @Test
  void equalTextsHaveNoDiff() {
    assertEquals("", UnifiedDiff.of("a", "b", "x\ny\n", "x\ny\n"));
  }

  @Test
  void oneChangedLineWithThreeLinesOfContext() {
    String old = "1\n2\n3\n4\n5\n6\n7\n8\n9\n";
    String neu = "1\n2\n3\n4\nfive\n6\n7\n8\n9\n";
    assertEquals("""
        --- a/f
        +++ b/f
        @@ -2,7 +2,7 @@
         2
         3
         4
        -5
        +five
         6
         7
         8
        """, UnifiedDiff.of("a/f", "b/f", old, neu));
  }

  @Test
  void distantChangesMakeTwoHunksAndCloseOnesOne() {
    StringBuilder old = new StringBuilder();
    for (int i = 1; i <= 20; i++) {
      old.append(i).append('\n');
    }
    String neu = old.toString().replace("2\n3\n", "2\nthree\n").replace("18\n", "");
    assertEquals("""
        --- a
        +++ b
        @@ -1,6 +1,6 @@
         1
         2
        -3
        +three
         4
         5
         6
        @@ -15,6 +15,5 @@
         15
         16
         17
        -18
         19
         20
        """, UnifiedDiff.of("a", "b", old.toString(), neu));
    String close = old.toString().replace("5\n", "five\n").replace("9\n", "nine\n");
    assertEquals(1, countHunks(UnifiedDiff.of("a", "b", old.toString(), close)));
  }

  @Test
  void insertionIntoEmptyTextAndMissingFinalNewline() {
    assertEquals("""
        --- a
        +++ b
        @@ -0,0 +1 @@
        +x
        """, UnifiedDiff.of("a", "b", "", "x\n"));
    assertEquals("""
        --- a
        +++ b
        @@ -1,2 +1,2 @@
         a
        -b
        \\ No newline at end of file
        +b
        """, UnifiedDiff.of("a", "b", "a\nb", "a\nb\n"));
  }

  @Test
  void printedHunksRebuildTheNewText() {
    Random random = new Random(20240611);
    for (int round = 0; round < 300; round++) {
      List<String> lines = new ArrayList<>();
      int n = random.nextInt(40);
      for (int i = 0; i < n; i++) {
        lines.add("line " + random.nextInt(8));
      }
      List<String> changed = new ArrayList<>(lines);
      int edits = random.nextInt(6);
      for (int e = 0; e < edits; e++) {
        int at = changed.isEmpty() ? 0 : random.nextInt(changed.size() + 1);
        switch (random.nextInt(3)) {
          case 0 -> changed.add(at, "new " + random.nextInt(5));
          case 1 -> {
            if (at < changed.size()) {
              changed.remove(at);
            }
          }
          default -> {
            if (at < changed.size()) {
              changed.set(at, "changed " + random.nextInt(5));
            }
          }
        }
      }
      String old = join(lines, random.nextBoolean());
      String neu = join(changed, random.nextBoolean());
      String diff = UnifiedDiff.of("a", "b", old, neu);
      assertEquals(neu, patch(old, diff), () -> "diff of\n" + old + "\nto\n" + neu + "\n" + diff);
    }
  }

  private static String join(List<String> lines, boolean finalNewline) {
    String s = String.join("\n", lines);
    return lines.isEmpty() ? "" : finalNewline ? s + "\n" : s;
  }

  private static int countHunks(String diff) {
    return (int) diff.lines().filter(l -> l.startsWith("@@")).count();
  }

  /** A minimal patch: applies hunks in order, checking every context and removed line. */
  private static String patch(String old, String diff) {
    if (diff.isEmpty()) {
      return old;
    }
    List<String> a = UnifiedDiff.split(old);
    List<String> out = new ArrayList<>();
    List<String> d = diff.lines().toList();
    Pattern header = Pattern.compile("@@ -(\\d+)(?:,(\\d+))? \\+(\\d+)(?:,(\\d+))? @@");
    int next = 0;
    for (int i = 2; i < d.size(); i++) {
      Matcher m = header.matcher(d.get(i));
      if (!m.matches()) {
        throw new AssertionError("expected a hunk header: " + d.get(i));
      }
      int start = Integer.parseInt(m.group(1));
      int count = m.group(2) == null ? 1 : Integer.parseInt(m.group(2));
      int from = count == 0 ? start : start - 1;
      while (next < from) {
        out.add(a.get(next++));
      }
      while (i + 1 < d.size() && !d.get(i + 1).startsWith("@@")) {
        String line = d.get(++i);
        String text = line.substring(1);
        if (i + 1 < d.size() && d.get(i + 1).startsWith("\\")) {
          text += "\n" + d.get(++i);
        }
        switch (line.charAt(0)) {
          case ' ' -> {
            assertEquals(a.get(next++), text);
            out.add(text);
          }
          case '-' -> assertEquals(a.get(next++), text);
          case '+' -> out.add(text);
          default -> throw new AssertionError("bad diff line: " + line);
        }
      }
    }
    while (next < a.size()) {
      out.add(a.get(next++));
    }
    StringBuilder sb = new StringBuilder();
    for (String line : out) {
      if (line.endsWith("\n\\ No newline at end of file")) {
        sb.append(line, 0, line.length() - "\n\\ No newline at end of file".length());
      } else {
        sb.append(line).append('\n');
      }
    }
    return sb.toString();
  }
}
