package dev.plumbline.fix;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumbline.finding.Edit;
import dev.plumbline.finding.Message;
import java.util.List;
import org.junit.jupiter.api.Test;

class EditApplierTest {
  private static Edit edit(Edit.Replacement... r) {
    return new Edit(Message.of("test"), List.of(r), true);
  }

  @Test
  void replacementsInsertionsAndLineDeletions() {
    String text = "alpha\nbeta\ngamma\n";
    EditApplier.Result r = EditApplier.apply(text, List.of(
        edit(new Edit.Replacement(1, 1, 1, 6, "ALPHA")),
        edit(Edit.Replacement.insertion(3, 1, "inserted\n")),
        edit(new Edit.Replacement(2, 1, 3, 1, ""))));
    assertEquals("ALPHA\ninserted\ngamma\n", r.text());
    assertEquals(3, r.applied().size());
  }

  @Test
  void anEditThatOverlapsAnAcceptedOneIsSkippedWhole() {
    String text = "one two three\n";
    Edit first = edit(new Edit.Replacement(1, 5, 1, 8, "2"));
    Edit clashing = edit(new Edit.Replacement(1, 1, 1, 4, "1"), new Edit.Replacement(1, 7, 1, 10, "x"));
    EditApplier.Result r = EditApplier.apply(text, List.of(first, clashing));
    assertEquals("one 2 three\n", r.text(), "the clashing edit's first part is not applied either");
    assertEquals(List.of(first), r.applied());
    assertEquals(EditApplier.Skip.OVERLAPS_ANOTHER_FIX, r.skipped().get(0).reason());
  }

  @Test
  void twoInsertionsAtOnePointClashButAdjacentReplacementsDoNot() {
    String text = "ab\n";
    EditApplier.Result same = EditApplier.apply(text, List.of(
        edit(Edit.Replacement.insertion(1, 2, "x")), edit(Edit.Replacement.insertion(1, 2, "y"))));
    assertEquals("axb\n", same.text());
    assertEquals(1, same.skipped().size());
    EditApplier.Result adjacent = EditApplier.apply(text, List.of(
        edit(new Edit.Replacement(1, 1, 1, 2, "A")), edit(new Edit.Replacement(1, 2, 1, 3, "B"))));
    assertEquals("AB\n", adjacent.text());
  }

  @Test
  void positionsOutsideTheTextAreRefused() {
    EditApplier.Result r = EditApplier.apply("short\n", List.of(edit(new Edit.Replacement(5, 1, 5, 2, "x"))));
    assertEquals("short\n", r.text());
    assertEquals(EditApplier.Skip.OUTSIDE_TEXT, r.skipped().get(0).reason());
  }

  @Test
  void crlfLinesCountTheirTerminatorAsOneLineBreak() {
    String text = "a\r\nb\r\nc";
    TextLines lines = new TextLines(text);
    assertEquals(3, lines.count());
    assertEquals("\r\n", lines.terminator(1));
    assertEquals("", lines.terminator(3));
    assertEquals("a\r\nc", EditApplier.apply(text, List.of(edit(new Edit.Replacement(2, 1, 3, 1, "")))).text());
    assertTrue(lines.offset(1, 4).isPresent(), "a position may end just past the terminator");
    assertTrue(lines.offset(1, 5).isEmpty());
  }
}
