package dev.plumbline.fix;

import dev.plumbline.finding.Edit;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.OptionalInt;

/**
 * Applies edits to a text. Each edit is all or nothing: an edit that overlaps one accepted
 * before it, or names a position outside the text, is skipped whole and the text is left as
 * that edit found it. Edits are considered in the order given, so callers pass them in a
 * deterministic order (findings' report order).
 */
public final class EditApplier {
  static final Comparator<Edit.Replacement> BY_START = Comparator
      .comparingInt(Edit.Replacement::startLine)
      .thenComparingInt(Edit.Replacement::startColumn)
      .thenComparingInt(Edit.Replacement::endLine)
      .thenComparingInt(Edit.Replacement::endColumn);

  /** Why an edit was not applied. */
  public enum Skip { OVERLAPS_ANOTHER_FIX, OUTSIDE_TEXT }

  /** The outcome: the new text, and for each input edit whether it was applied. */
  public record Result(String text, List<Edit> applied, List<Skipped> skipped) {
    public Result {
      applied = List.copyOf(applied);
      skipped = List.copyOf(skipped);
    }
  }

  public record Skipped(Edit edit, Skip reason) {}

  private EditApplier() {}

  public static Result apply(String text, List<Edit> edits) {
    TextLines lines = new TextLines(text);
    List<int[]> taken = new ArrayList<>();
    List<int[]> spans = new ArrayList<>();
    List<String> inserts = new ArrayList<>();
    List<Edit> applied = new ArrayList<>();
    List<Skipped> skipped = new ArrayList<>();
    for (Edit edit : edits) {
      List<int[]> mine = new ArrayList<>();
      boolean inside = true;
      for (Edit.Replacement r : edit.replacements()) {
        OptionalInt start = lines.offset(r.startLine(), r.startColumn());
        OptionalInt end = lines.offset(r.endLine(), r.endColumn());
        if (start.isEmpty() || end.isEmpty() || end.getAsInt() < start.getAsInt()) {
          inside = false;
          break;
        }
        mine.add(new int[] {start.getAsInt(), end.getAsInt()});
      }
      if (!inside) {
        skipped.add(new Skipped(edit, Skip.OUTSIDE_TEXT));
        continue;
      }
      boolean clash = false;
      for (int i = 0; i < mine.size() && !clash; i++) {
        for (int j = 0; j < mine.size() && !clash; j++) {
          clash = i != j && clashes(mine.get(i), mine.get(j));
        }
        for (int[] other : taken) {
          clash |= clashes(mine.get(i), other);
        }
      }
      if (clash) {
        skipped.add(new Skipped(edit, Skip.OVERLAPS_ANOTHER_FIX));
        continue;
      }
      taken.addAll(mine);
      spans.addAll(mine);
      for (Edit.Replacement r : edit.replacements()) {
        inserts.add(r.text());
      }
      applied.add(edit);
    }
    // Apply from the end so earlier offsets stay valid.
    Integer[] order = new Integer[spans.size()];
    for (int i = 0; i < order.length; i++) {
      order[i] = i;
    }
    java.util.Arrays.sort(order, Comparator.comparingInt((Integer i) -> spans.get(i)[0]).reversed());
    StringBuilder out = new StringBuilder(text);
    for (int i : order) {
      out.replace(spans.get(i)[0], spans.get(i)[1], inserts.get(i));
    }
    return new Result(out.toString(), applied, skipped);
  }

  /** Two replacements of the same edit or of different edits that touch the same text. */
  static boolean overlap(Edit.Replacement a, Edit.Replacement b) {
    return compare(b.startLine(), b.startColumn(), a.endLine(), a.endColumn()) < 0
        && compare(a.startLine(), a.startColumn(), b.endLine(), b.endColumn()) < 0
        || samePoint(a, b);
  }

  private static boolean samePoint(Edit.Replacement a, Edit.Replacement b) {
    return a.startLine() == b.startLine() && a.startColumn() == b.startColumn()
        && (a.isInsertion() || b.isInsertion());
  }

  private static int compare(int l1, int c1, int l2, int c2) {
    return l1 != l2 ? Integer.compare(l1, l2) : Integer.compare(c1, c2);
  }

  /**
   * Spans clash when they share a character, or when both start at the same offset and one is
   * an insertion (the order of the two insertions would be a guess).
   */
  private static boolean clashes(int[] a, int[] b) {
    boolean share = a[0] < b[1] && b[0] < a[1];
    boolean samePoint = a[0] == b[0] && (a[0] == a[1] || b[0] == b[1]);
    return share || samePoint;
  }
}
