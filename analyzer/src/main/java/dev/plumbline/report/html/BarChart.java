package dev.plumbline.report.html;

import java.util.Locale;
import java.util.Map;

/**
 * A horizontal bar chart drawn as inline SVG: one bar per label, longest first as given. Labels
 * are escaped text; the drawing needs no script and no external resource.
 */
public final class BarChart {
  private static final int LABEL_WIDTH = 300;
  private static final int BAR_WIDTH = 320;
  private static final int ROW = 24;

  private BarChart() {}

  /**
   * @param title accessible title of the chart
   * @param counts label to count, in display order
   * @param cssClass class of the bars, for colour
   */
  public static String svg(String title, Map<String, Integer> counts, String cssClass) {
    int max = counts.values().stream().mapToInt(Integer::intValue).max().orElse(1);
    int height = Math.max(1, counts.size()) * ROW + 8;
    int width = LABEL_WIDTH + BAR_WIDTH + 60;
    StringBuilder sb = new StringBuilder();
    sb.append("<svg class=\"chart\" role=\"img\" xmlns=\"http://www.w3.org/2000/svg\" width=\"")
        .append(width).append("\" height=\"").append(height).append("\" viewBox=\"0 0 ")
        .append(width).append(' ').append(height).append("\"><title>").append(Html.escape(title))
        .append("</title>");
    int y = 4;
    for (Map.Entry<String, Integer> e : counts.entrySet()) {
      int w = Math.max(2, (int) Math.round((double) BAR_WIDTH * e.getValue() / max));
      String label = e.getKey().length() > 44 ? "\u2026" + e.getKey().substring(e.getKey().length() - 43)
          : e.getKey();
      sb.append("<g class=\"bar-row\"><text x=\"").append(LABEL_WIDTH - 8).append("\" y=\"").append(y + 16)
          .append("\" text-anchor=\"end\">").append(Html.escape(label)).append("</text>")
          .append("<rect class=\"").append(cssClass).append("\" x=\"").append(LABEL_WIDTH).append("\" y=\"")
          .append(y + 3).append("\" width=\"").append(w).append("\" height=\"").append(ROW - 8)
          .append("\"><title>").append(Html.escape(e.getKey() + ": " + e.getValue())).append("</title></rect>")
          .append("<text x=\"").append(LABEL_WIDTH + w + 6).append("\" y=\"").append(y + 16).append("\">")
          .append(String.format(Locale.ROOT, "%d", e.getValue())).append("</text></g>");
      y += ROW;
    }
    return sb.append("</svg>").toString();
  }
}
