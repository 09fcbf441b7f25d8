package dev.plumbline.analysis.rowcount;

import com.github.javaparser.ast.expr.MethodCallExpr;
import java.util.IdentityHashMap;
import java.util.Map;
import java.util.OptionalLong;

/**
 * What the row-count analysis publishes for one file: for each evaluation call whose data size
 * is known on every path, the number of rows (examples) it evaluates on.
 */
public final class RowCountFacts {
  private final Map<MethodCallExpr, Long> evaluatedRows = new IdentityHashMap<>();

  void recordEvaluation(MethodCallExpr call, long rows) {
    evaluatedRows.put(call, rows);
  }

  /** Rows the evaluation call measures on, when statically known. */
  public OptionalLong evaluatedRows(MethodCallExpr call) {
    Long rows = evaluatedRows.get(call);
    return rows == null ? OptionalLong.empty() : OptionalLong.of(rows);
  }
}
