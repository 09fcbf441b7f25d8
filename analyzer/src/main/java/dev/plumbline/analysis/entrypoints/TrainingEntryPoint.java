package dev.plumbline.analysis.entrypoints;

import dev.plumbline.finding.Location;
import java.util.List;

/**
 * A place where a run starts that trains and evaluates: a {@code main}, a notebook, or a method
 * that trains and evaluates and is not itself part of a larger such run.
 *
 * @param name readable name
 * @param location its declaration
 * @param scope the extents of the entry point and of every project method it reaches; a finding
 *     inside one of them is part of this run
 * @param trainCalls number of training calls reached
 * @param evaluations the evaluation calls reached, in report order
 */
public record TrainingEntryPoint(String name, Location location, List<Location> scope,
    int trainCalls, List<Evaluation> evaluations) {

  public TrainingEntryPoint {
    scope = List.copyOf(scope);
    evaluations = List.copyOf(evaluations);
  }

  /** Whether {@code at} lies inside the entry point or a method it reaches. */
  public boolean covers(Location at) {
    for (Location l : scope) {
      if (l.uri().equals(at.uri()) && contains(l, at)) {
        return true;
      }
    }
    return false;
  }

  private static boolean contains(Location outer, Location inner) {
    var o = outer.range();
    var i = inner.range();
    boolean startsAfter = i.startLine() > o.startLine()
        || (i.startLine() == o.startLine() && i.startColumn() >= o.startColumn());
    boolean endsBefore = i.startLine() < o.endLine()
        || (i.startLine() == o.endLine() && i.startColumn() <= o.endColumn());
    return startsAfter && endsBefore;
  }
}
