package dev.plumbline.finding;

import java.util.List;

/**
 * A machine-applicable repair: replacements of source ranges in the finding's file.
 * {@code safe} marks fixes that keep the program's meaning apart from removing the defect.
 */
public record Edit(Message description, List<Replacement> replacements, boolean safe) {
  /** Replace the text in {@code range} (end-inclusive) with {@code text}. */
  public record Replacement(SourceRange range, String text) {}

  public Edit {
    replacements = List.copyOf(replacements);
  }
}
