package dev.plumbline.analysis.scope;

import java.util.Set;

/**
 * What a project method does with graphs and scopes, as seen by its callers.
 *
 * @param returns kind of the returned value, or null when the method returns nothing tracked
 * @param outsideRecording graph status of the result when called outside gradient recording,
 *     with every tensor parameter detached
 * @param insideRecording the same when called under gradient recording
 * @param graphFrom parameter positions whose graph the result carries (an attached argument
 *     gives an attached result)
 * @param scopesFrom parameter positions whose manager owns the result (for a manager parameter:
 *     the result is created through it)
 * @param recordsGradients whether a call opens gradient recording or runs a backward pass (a
 *     training step)
 */
public record HelperSummary(TensorValue.Kind returns, Set<Graph> outsideRecording,
    Set<Graph> insideRecording, Set<Integer> graphFrom, Set<Integer> scopesFrom,
    boolean recordsGradients) {

  public HelperSummary {
    outsideRecording = Set.copyOf(outsideRecording);
    insideRecording = Set.copyOf(insideRecording);
    graphFrom = Set.copyOf(graphFrom);
    scopesFrom = Set.copyOf(scopesFrom);
  }

  static HelperSummary trainingStepOnly(boolean recordsGradients) {
    return new HelperSummary(null, Set.of(), Set.of(), Set.of(), Set.of(), recordsGradients);
  }
}
