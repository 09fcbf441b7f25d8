package dev.plumbline.fix;

import java.util.ArrayList;
import java.util.List;

/**
 * A unified diff of two texts, line by line, in the layout {@code diff -u} and {@code patch}
 * use: {@code ---}/{@code +++} headers, {@code @@ -a,b +c,d @@} hunks with three lines of
 * context, and the {@code \ No newline at end of file} marker.
 *
 * <p>Lines are compared with Myers' O(ND) greedy algorithm ("An O(ND) Difference Algorithm and
 * Its Variations", Algorithmica 1986) after trimming the common prefix and suffix; fixes change
 * few lines, so D stays small. A carriage return stays part of its line, so a changed line
 * terminator shows as a changed line.
 */
public final class UnifiedDiff {
  public static final int CONTEXT = 3;
  private static final String NO_NEWLINE = "\n\\ No newline at end of file";

  private enum Kind { SAME, REMOVED, ADDED }

  private record Op(Kind kind, int oldIndex, int newIndex) {}

  private UnifiedDiff() {}

  /** The diff, or "" when the texts are equal. */
  public static String of(String oldName, String newName, String oldText, String newText) {
    if (oldText.equals(newText)) {
      return "";
    }
    List<String> a = split(oldText);
    List<String> b = split(newText);
    List<Op> ops = diff(a, b);
    StringBuilder out = new StringBuilder();
    out.append("--- ").append(oldName).append('\n');
    out.append("+++ ").append(newName).append('\n');
    int i = 0;
    while (i < ops.size()) {
      if (ops.get(i).kind() == Kind.SAME) {
        i++;
        continue;
      }
      int from = Math.max(0, i - CONTEXT);
      int to = i;
      // Extend the hunk while changes are within 2 * CONTEXT lines of each other.
      while (true) {
        int nextChange = to;
        while (nextChange < ops.size() && ops.get(nextChange).kind() != Kind.SAME) {
          nextChange++;
        }
        int sameRun = nextChange;
        while (sameRun < ops.size() && ops.get(sameRun).kind() == Kind.SAME) {
          sameRun++;
        }
        if (sameRun < ops.size() && sameRun - nextChange <= 2 * CONTEXT) {
          to = sameRun;
        } else {
          to = Math.min(ops.size(), nextChange + CONTEXT);
          break;
        }
      }
      hunk(out, ops.subList(from, to), a, b);
      i = to;
    }
    return out.toString();
  }

  private static void hunk(StringBuilder out, List<Op> ops, List<String> a, List<String> b) {
    int oldStart = -1;
    int newStart = -1;
    int oldCount = 0;
    int newCount = 0;
    for (Op op : ops) {
      if (op.kind() != Kind.ADDED) {
        oldStart = oldStart < 0 ? op.oldIndex() : oldStart;
        oldCount++;
      }
      if (op.kind() != Kind.REMOVED) {
        newStart = newStart < 0 ? op.newIndex() : newStart;
        newCount++;
      }
    }
    // An empty side names the line before it, as diff -u does.
    int oldLine = oldCount == 0 ? firstIndex(ops, true) : oldStart + 1;
    int newLine = newCount == 0 ? firstIndex(ops, false) : newStart + 1;
    out.append("@@ -").append(range(oldLine, oldCount)).append(" +").append(range(newLine, newCount))
        .append(" @@\n");
    for (Op op : ops) {
      switch (op.kind()) {
        case SAME -> out.append(' ').append(a.get(op.oldIndex())).append('\n');
        case REMOVED -> out.append('-').append(a.get(op.oldIndex())).append('\n');
        case ADDED -> out.append('+').append(b.get(op.newIndex())).append('\n');
      }
    }
  }

  /** For an empty side: the count of lines on that side before the hunk's position. */
  private static int firstIndex(List<Op> ops, boolean oldSide) {
    Op first = ops.get(0);
    return oldSide ? first.oldIndex() : first.newIndex();
  }

  private static String range(int start, int count) {
    return count == 1 ? String.valueOf(start) : start + "," + count;
  }

  /**
   * Lines split on {@code \n}. A final line without terminator carries the marker line with it,
   * so it differs from the same text with a terminator and prints the marker where it belongs.
   */
  static List<String> split(String text) {
    List<String> lines = new ArrayList<>();
    int start = 0;
    for (int i = 0; i < text.length(); i++) {
      if (text.charAt(i) == '\n') {
        lines.add(text.substring(start, i));
        start = i + 1;
      }
    }
    if (start < text.length()) {
      lines.add(text.substring(start) + NO_NEWLINE);
    }
    return lines;
  }

  private static List<Op> diff(List<String> a, List<String> b) {
    int prefix = 0;
    while (prefix < a.size() && prefix < b.size() && a.get(prefix).equals(b.get(prefix))) {
      prefix++;
    }
    int suffix = 0;
    while (suffix < a.size() - prefix && suffix < b.size() - prefix
        && a.get(a.size() - 1 - suffix).equals(b.get(b.size() - 1 - suffix))) {
      suffix++;
    }
    List<Op> ops = new ArrayList<>();
    for (int i = 0; i < prefix; i++) {
      ops.add(new Op(Kind.SAME, i, i));
    }
    ops.addAll(myers(a.subList(prefix, a.size() - suffix), b.subList(prefix, b.size() - suffix), prefix));
    for (int i = suffix; i > 0; i--) {
      ops.add(new Op(Kind.SAME, a.size() - i, b.size() - i));
    }
    return ops;
  }

  private static List<Op> myers(List<String> a, List<String> b, int base) {
    int n = a.size();
    int m = b.size();
    int max = n + m;
    int offset = max + 1;
    int[] v = new int[2 * max + 3];
    List<int[]> trace = new ArrayList<>();
    int found = -1;
    for (int d = 0; d <= max && found < 0; d++) {
      trace.add(v.clone());
      for (int k = -d; k <= d; k += 2) {
        int x = (k == -d || (k != d && v[offset + k - 1] < v[offset + k + 1]))
            ? v[offset + k + 1] : v[offset + k - 1] + 1;
        int y = x - k;
        while (x < n && y < m && a.get(x).equals(b.get(y))) {
          x++;
          y++;
        }
        v[offset + k] = x;
        if (x >= n && y >= m) {
          found = d;
          break;
        }
      }
    }
    List<Op> reversed = new ArrayList<>();
    int x = n;
    int y = m;
    for (int d = found; d >= 0; d--) {
      int[] vd = trace.get(d);
      int k = x - y;
      int prevK = (k == -d || (k != d && vd[offset + k - 1] < vd[offset + k + 1])) ? k + 1 : k - 1;
      int prevX = vd[offset + prevK];
      int prevY = prevX - prevK;
      while (x > prevX && y > prevY) {
        reversed.add(new Op(Kind.SAME, base + x - 1, base + y - 1));
        x--;
        y--;
      }
      if (d > 0) {
        if (x == prevX) {
          reversed.add(new Op(Kind.ADDED, base + x, base + y - 1));
        } else {
          reversed.add(new Op(Kind.REMOVED, base + x - 1, base + y));
        }
      }
      x = prevX;
      y = prevY;
    }
    List<Op> ops = new ArrayList<>(reversed.size());
    for (int i = reversed.size() - 1; i >= 0; i--) {
      ops.add(reversed.get(i));
    }
    return ops;
  }
}
