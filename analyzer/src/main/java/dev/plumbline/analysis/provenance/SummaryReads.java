package dev.plumbline.analysis.provenance;

import com.github.javaparser.ast.Node;
import java.util.Collections;
import java.util.IdentityHashMap;
import java.util.Map;
import java.util.Objects;
import java.util.Set;

/**
 * The project summaries one solution of a graph read, as it read them. They are its only input
 * besides the graph and the file's type facts, so the solution is repeated exactly while every
 * summary it read still equals what it read. Summaries compare by value with nodes by identity
 * ({@link ProvenanceSummaries}), so equal summaries are indistinguishable to the analysis.
 */
final class SummaryReads {
  /** Method declaration to the summary read (null: none); created on first read. */
  private Map<Node, ProvenanceSummaries.MethodSummary> methods;
  /** Field declarator to the summary read (null: none); created on first read. */
  private Map<Node, ProvenanceSummaries.FieldSummary> fields;
  /** A summary read twice differed between the reads: it changed during the solution. */
  private boolean changedWhileRead;

  ProvenanceSummaries.MethodSummary method(Node declaration, ProvenanceSummaries.MethodSummary read) {
    if (methods == null) {
      methods = new IdentityHashMap<>();
    }
    note(methods, declaration, read);
    return read;
  }

  ProvenanceSummaries.FieldSummary field(Node declarator, ProvenanceSummaries.FieldSummary read) {
    if (fields == null) {
      fields = new IdentityHashMap<>();
    }
    note(fields, declarator, read);
    return read;
  }

  private <S> void note(Map<Node, S> reads, Node key, S read) {
    if (!reads.containsKey(key)) {
      reads.put(key, read);
    } else if (!Objects.equals(reads.get(key), read)) {
      changedWhileRead = true;
    }
  }

  /** The field declarators whose summaries were read. */
  Set<Node> fieldsRead() {
    return fields == null ? Set.of() : Collections.unmodifiableSet(fields.keySet());
  }

  /** Whether every summary read is still what {@code now} holds. */
  boolean stillHold(ProvenanceSummaries now) {
    if (changedWhileRead) {
      return false;
    }
    if (methods != null) {
      for (Map.Entry<Node, ProvenanceSummaries.MethodSummary> e : methods.entrySet()) {
        if (!Objects.equals(now.method(e.getKey()), e.getValue())) {
          return false;
        }
      }
    }
    if (fields != null) {
      for (Map.Entry<Node, ProvenanceSummaries.FieldSummary> e : fields.entrySet()) {
        if (!Objects.equals(now.field(e.getKey()), e.getValue())) {
          return false;
        }
      }
    }
    return true;
  }
}
