package dev.plumbline.analysis.rowcount;

import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.body.CallableDeclaration;
import com.github.javaparser.ast.body.MethodDeclaration;
import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.ProjectAnalysis;
import dev.plumbline.engine.ProjectFacts;
import dev.plumbline.engine.Workers;
import dev.plumbline.parse.Subtrees;
import dev.plumbline.types.ProjectIndex;
import java.util.Collections;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Summaries of the project's own methods for the row-count analysis: a method whose every
 * {@code return} gives the same size returns "n rows" (a constant) or "as many as argument i"
 * (its value, or its rows). Computed on demand with memoization; a method reached again while
 * its own summary is being computed (recursion) gets no summary.
 */
public final class RowCountSummaries implements ProjectAnalysis {

  /** The published summaries, keyed by declaration identity; read-only. */
  public record Published(Map<CallableDeclaration<?>, Count> returned) {
    public Optional<Count> of(CallableDeclaration<?> method) {
      return Optional.ofNullable(returned.get(method));
    }
  }

  @Override
  public void compute(List<FileContext> files, ProjectIndex index, ProjectFacts out,
      Workers workers) {
    Computer computer = new Computer(files);
    for (FileContext file : files) {
      for (MethodDeclaration m : Subtrees.findAll(file.source().unit(), MethodDeclaration.class)) {
        if (m.getBody().isPresent()) {
          computer.summary(m);
        }
      }
    }
    out.put(Published.class, new Published(Collections.unmodifiableMap(computer.done)));
  }

  /** Demand-driven summaries over the first file contexts; single-threaded. */
  static final class Computer implements RowCountAnalysis.Summaries {
    private final Map<CompilationUnit, FileContext> byUnit = new IdentityHashMap<>();
    private final Map<CallableDeclaration<?>, Count> done = new IdentityHashMap<>();
    private final Map<CallableDeclaration<?>, Boolean> visited = new IdentityHashMap<>();

    Computer(List<FileContext> files) {
      for (FileContext f : files) {
        byUnit.put(f.source().unit(), f);
      }
    }

    @Override
    public Optional<Count> returnedSize(CallableDeclaration<?> method) {
      return summary(method);
    }

    Optional<Count> summary(CallableDeclaration<?> method) {
      if (visited.put(method, Boolean.TRUE) != null) {
        return Optional.ofNullable(done.get(method)); // done, or in progress: a cycle
      }
      FileContext file = method.findCompilationUnit().map(byUnit::get).orElse(null);
      if (file == null) {
        return Optional.empty();
      }
      Optional<Count> result = RowCountAnalysis.returnedSize(file, method, this);
      result.ifPresent(c -> done.put(method, c));
      return result;
    }
  }
}
