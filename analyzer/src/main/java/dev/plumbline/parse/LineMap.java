package dev.plumbline.parse;

/**
 * Maps a line of the analyzed text to a line of the reported file. Java sources map to
 * themselves; a notebook's joined cells map back to the notebook.
 */
public interface LineMap {
  LineMap IDENTITY = line -> line;

  int reportedLine(int analyzedLine);
}
