package dev.plumbline.parse;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonToken;
import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * Reads the cells of a Jupyter notebook (nbformat 4) and where each source line sits in the
 * notebook file. A streaming read, so every source line keeps the line of the file it was
 * written on: Jupyter stores a cell's source as a list of strings, one per line, one per file
 * line; when a cell's source is a single string, all its lines share that string's file line.
 *
 * <p>Only facts are read: the kernel language and the cells. Outputs and attachments are skipped.
 */
public final class NotebookReader {

  /** One source line of a cell: its text without the line break, and the notebook file line. */
  public record SourceLine(String text, int fileLine) {}

  /**
   * A cell of the notebook.
   *
   * @param number position among all cells, from 1, as a reader counts them top to bottom
   * @param type {@code code}, {@code markdown} or {@code raw}
   */
  public record Cell(int number, String type, List<SourceLine> lines) {
    public Cell {
      lines = List.copyOf(lines);
    }

    public boolean isCode() {
      return "code".equals(type);
    }
  }

  /**
   * What the notebook says about itself.
   *
   * @param formatMajor nbformat major version (4 for current notebooks, 0 if absent)
   * @param language kernel language from {@code metadata.kernelspec.language} or
   *     {@code metadata.language_info.name}, lower case, empty if neither is given
   */
  public record Notebook(int formatMajor, String language, List<Cell> cells) {
    public Notebook {
      cells = List.copyOf(cells);
    }

    public boolean isJava() {
      return language.equals("java");
    }
  }

  private NotebookReader() {}

  /** Reads a notebook; throws {@link IOException} on text that is not a JSON object. */
  public static Notebook read(String json) throws IOException {
    try (JsonParser p = new JsonFactory().createParser(json)) {
      if (p.nextToken() != JsonToken.START_OBJECT) {
        throw new IOException("a notebook is a JSON object");
      }
      int format = 0;
      String kernelLanguage = null;
      String infoName = null;
      List<Cell> cells = new ArrayList<>();
      while (p.nextToken() == JsonToken.FIELD_NAME) {
        String field = p.currentName();
        JsonToken value = p.nextToken();
        switch (field) {
          case "nbformat" -> format = value == JsonToken.VALUE_NUMBER_INT ? p.getIntValue() : 0;
          case "cells" -> readCells(p, value, cells);
          case "metadata" -> {
            String[] languages = readMetadata(p, value);
            kernelLanguage = languages[0];
            infoName = languages[1];
          }
          default -> p.skipChildren();
        }
      }
      String language = kernelLanguage != null ? kernelLanguage : infoName != null ? infoName : "";
      return new Notebook(format, language.toLowerCase(Locale.ROOT), cells);
    }
  }

  private static void readCells(JsonParser p, JsonToken value, List<Cell> out) throws IOException {
    if (value != JsonToken.START_ARRAY) {
      p.skipChildren();
      return;
    }
    while (p.nextToken() != JsonToken.END_ARRAY) {
      if (p.currentToken() != JsonToken.START_OBJECT) {
        p.skipChildren();
        continue;
      }
      String type = "";
      List<SourceLine> lines = new ArrayList<>();
      while (p.nextToken() == JsonToken.FIELD_NAME) {
        String field = p.currentName();
        JsonToken v = p.nextToken();
        if (field.equals("cell_type") && v == JsonToken.VALUE_STRING) {
          type = p.getText();
        } else if (field.equals("source")) {
          lines = readSource(p, v);
        } else {
          p.skipChildren();
        }
      }
      out.add(new Cell(out.size() + 1, type, lines));
    }
  }

  /** A source given as one string or as a list of strings, split into lines. */
  private static List<SourceLine> readSource(JsonParser p, JsonToken v) throws IOException {
    List<SourceLine> lines = new ArrayList<>();
    StringBuilder pending = null;
    int pendingLine = 0;
    List<String> pieces = new ArrayList<>();
    List<Integer> pieceLines = new ArrayList<>();
    if (v == JsonToken.VALUE_STRING) {
      pieces.add(p.getText());
      pieceLines.add(tokenLine(p));
    } else if (v == JsonToken.START_ARRAY) {
      while (p.nextToken() != JsonToken.END_ARRAY) {
        if (p.currentToken() == JsonToken.VALUE_STRING) {
          pieces.add(p.getText());
          pieceLines.add(tokenLine(p));
        } else {
          p.skipChildren();
        }
      }
    } else {
      p.skipChildren();
      return lines;
    }
    // A line may be split across pieces; it keeps the file line of the piece where it starts.
    for (int i = 0; i < pieces.size(); i++) {
      String piece = pieces.get(i);
      int start = 0;
      while (start < piece.length()) {
        int nl = piece.indexOf('\n', start);
        String part = nl < 0 ? piece.substring(start) : piece.substring(start, nl);
        if (pending == null) {
          pending = new StringBuilder();
          pendingLine = pieceLines.get(i);
        }
        pending.append(part);
        if (nl < 0) {
          break;
        }
        lines.add(new SourceLine(stripCarriageReturn(pending.toString()), pendingLine));
        pending = null;
        start = nl + 1;
      }
    }
    if (pending != null && pending.length() > 0) {
      lines.add(new SourceLine(stripCarriageReturn(pending.toString()), pendingLine));
    }
    return lines;
  }

  private static String stripCarriageReturn(String s) {
    return s.endsWith("\r") ? s.substring(0, s.length() - 1) : s;
  }

  private static int tokenLine(JsonParser p) {
    return Math.max(1, p.currentTokenLocation().getLineNr());
  }

  /** {kernelspec.language, language_info.name}, each null when absent. */
  private static String[] readMetadata(JsonParser p, JsonToken value) throws IOException {
    String[] out = new String[2];
    if (value != JsonToken.START_OBJECT) {
      p.skipChildren();
      return out;
    }
    while (p.nextToken() == JsonToken.FIELD_NAME) {
      String field = p.currentName();
      JsonToken v = p.nextToken();
      if (field.equals("kernelspec") || field.equals("language_info")) {
        String key = field.equals("kernelspec") ? "language" : "name";
        Optional<String> found = stringField(p, v, key);
        out[field.equals("kernelspec") ? 0 : 1] = found.orElse(null);
      } else {
        p.skipChildren();
      }
    }
    return out;
  }

  private static Optional<String> stringField(JsonParser p, JsonToken v, String key) throws IOException {
    if (v != JsonToken.START_OBJECT) {
      p.skipChildren();
      return Optional.empty();
    }
    String found = null;
    while (p.nextToken() == JsonToken.FIELD_NAME) {
      String field = p.currentName();
      JsonToken inner = p.nextToken();
      if (field.equals(key) && inner == JsonToken.VALUE_STRING) {
        found = p.getText();
      } else {
        p.skipChildren();
      }
    }
    return Optional.ofNullable(found);
  }
}
