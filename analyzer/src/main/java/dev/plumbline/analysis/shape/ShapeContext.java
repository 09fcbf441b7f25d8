package dev.plumbline.analysis.shape;

import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.body.CallableDeclaration;
import dev.plumbline.engine.FileContext;
import dev.plumbline.flow.CfgBuilder;
import dev.plumbline.flow.ControlFlowGraph;
import dev.plumbline.model.ApiModel;
import dev.plumbline.types.ExpressionTypes;
import dev.plumbline.types.ProjectIndex;
import dev.plumbline.types.SymbolTable;
import dev.plumbline.types.TypeResolver;
import java.util.ArrayDeque;
import java.util.Deque;
import java.util.HashMap;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;

/**
 * What one file's shape analysis shares across its graphs: the file, type facts for the units
 * that hold helper methods, the graphs and results of helpers already evaluated, and the stack
 * of helpers being evaluated (to stop recursion). Lives and dies with the file's analysis; no
 * static caches.
 */
final class ShapeContext {
  final FileContext file;
  final ApiModel model;
  final ProjectIndex project;
  final boolean inTestCode;
  private final Map<CompilationUnit, ExpressionTypes> typesByUnit = new IdentityHashMap<>();
  private final Map<CallableDeclaration<?>, ControlFlowGraph> graphs = new IdentityHashMap<>();
  final Map<HelperCalls.Key, ShapeValue> helperResults = new HashMap<>();
  final Map<CallableDeclaration<?>, HelperCalls.Summary> helperSummaries = new IdentityHashMap<>();
  final Deque<CallableDeclaration<?>> evaluating = new ArrayDeque<>();
  /** Local arrays written into from a lambda or a class body inside their scope, by declaration. */
  final Map<com.github.javaparser.ast.Node, Boolean> storedFromNestedCode = new IdentityHashMap<>();
  /** Field initializers being evaluated, to stop cycles between constants. */
  final java.util.Set<com.github.javaparser.ast.Node> evaluatingFields =
      java.util.Collections.newSetFromMap(new IdentityHashMap<>());

  ShapeContext(FileContext file) {
    this.file = file;
    this.model = file.model();
    this.project = file.project();
    this.inTestCode = isTestPath(file.uri());
    typesByUnit.put(file.source().unit(), file.types());
  }

  /** Whether a report path is test code by the usual build layout ({@code src/test/...}). */
  static boolean isTestPath(String uri) {
    String u = "/" + uri.replace('\\', '/');
    return u.contains("/src/test/") || u.contains("/src/testFixtures/");
  }

  /** Type facts for the unit declaring {@code node} (this file's, or another project file's). */
  ExpressionTypes typesFor(com.github.javaparser.ast.Node node) {
    CompilationUnit unit = node.findCompilationUnit().orElse(null);
    if (unit == null) {
      return null;
    }
    return typesByUnit.computeIfAbsent(unit,
        u -> new ExpressionTypes(new SymbolTable(u, new TypeResolver(u, model)), project));
  }

  ControlFlowGraph graphOf(CallableDeclaration<?> callable) {
    return graphs.computeIfAbsent(callable, CfgBuilder::of);
  }

  List<CallableDeclaration<?>> stack() {
    return List.copyOf(evaluating);
  }
}
