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
    Snapshot kept = snapshot();
    return kept != null && kept.stillHold(now);
  }

  private static final Snapshot NOTHING_READ = new Snapshot(new Node[0], new Object[0], 0);

  /** The reads, compactly, to check later; null if a summary changed while it was read. */
  Snapshot snapshot() {
    if (changedWhileRead) {
      return null;
    }
    int m = methods == null ? 0 : methods.size();
    int f = fields == null ? 0 : fields.size();
    if (m + f == 0) {
      return NOTHING_READ;
    }
    Node[] keys = new Node[m + f];
    Object[] read = new Object[m + f];
    int i = 0;
    if (methods != null) {
      for (Map.Entry<Node, ProvenanceSummaries.MethodSummary> e : methods.entrySet()) {
        keys[i] = e.getKey();
        read[i++] = e.getValue();
      }
    }
    if (fields != null) {
      for (Map.Entry<Node, ProvenanceSummaries.FieldSummary> e : fields.entrySet()) {
        keys[i] = e.getKey();
        read[i++] = e.getValue();
      }
    }
    return new Snapshot(keys, read, m);
  }

  /**
   * Reads kept compactly: the first {@code methodCount} keys are method declarations, the rest
   * field declarators, each with the summary read.
   */
  record Snapshot(Node[] keys, Object[] read, int methodCount) {
    boolean stillHold(ProvenanceSummaries now) {
      for (int i = 0; i < keys.length; i++) {
        Object current = i < methodCount ? now.method(keys[i]) : now.field(keys[i]);
        if (!Objects.equals(current, read[i])) {
          return false;
        }
      }
      return true;
    }
  }
}
