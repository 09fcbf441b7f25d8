package dev.plumbline.engine;

import java.util.ArrayList;
import java.util.List;
import java.util.function.Function;

/**
 * Runs independent work items of a project analysis, possibly on several threads, and answers
 * in input order, so that what an analysis computes never depends on thread scheduling.
 *
 * <p>The caller chooses items so that no two of them touch the same {@link FileContext}: a
 * context memoizes its type facts and analyses without locks.
 */
public interface Workers {

  /**
   * Applies {@code work} to every input and returns the results in input order. If items throw,
   * the exception of the first such item in input order is rethrown after all items finished.
   */
  <I, O> List<O> map(List<I> inputs, Function<I, O> work);

  /**
   * Splits {@code items} into runs of consecutive items of the same file (compared by identity),
   * in order: each run can be one work item, since a file context serves one thread.
   */
  static <T> List<List<T>> runsByFile(List<T> items, Function<T, FileContext> fileOf) {
    List<List<T>> runs = new ArrayList<>();
    FileContext current = null;
    for (T item : items) {
      FileContext file = fileOf.apply(item);
      if (runs.isEmpty() || file != current) {
        runs.add(new ArrayList<>());
        current = file;
      }
      runs.get(runs.size() - 1).add(item);
    }
    return runs;
  }

  /** Runs every item on the calling thread, in order. */
  Workers SEQUENTIAL = new Workers() {
    @Override
    public <I, O> List<O> map(List<I> inputs, Function<I, O> work) {
      List<O> out = new ArrayList<>(inputs.size());
      for (I input : inputs) {
        out.add(work.apply(input));
      }
      return out;
    }
  };
}
