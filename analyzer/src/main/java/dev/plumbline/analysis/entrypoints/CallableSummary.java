package dev.plumbline.analysis.entrypoints;

import dev.plumbline.finding.Location;
import java.util.List;

/**
 * What one method or constructor of the project does towards training, for linking into
 * training entry points across files. Holds no syntax tree.
 *
 * @param key owner type and signature, unique in the project, e.g. {@code a.B void main(String[])}
 * @param name readable name, e.g. {@code B.main(String[])}
 * @param location the declaration's name
 * @param extent the whole declaration, for deciding which findings lie inside it
 * @param isMain a {@code public static void main(String[])}, or the cells of a notebook
 * @param trainCalls calls that train a model
 * @param evaluations calls that evaluate a model
 * @param calls keys of the project methods it calls
 */
public record CallableSummary(String key, String name, Location location, Location extent,
    boolean isMain, List<Location> trainCalls, List<Evaluation> evaluations, List<String> calls) {

  public CallableSummary {
    trainCalls = List.copyOf(trainCalls);
    evaluations = List.copyOf(evaluations);
    calls = List.copyOf(calls);
  }
}
