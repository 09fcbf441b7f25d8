package dev.plumbline.analysis.entrypoints;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.CallableDeclaration;
import com.github.javaparser.ast.body.MethodDeclaration;
import com.github.javaparser.ast.body.TypeDeclaration;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.expr.ObjectCreationExpr;
import dev.plumbline.analysis.provenance.DataValue;
import dev.plumbline.analysis.provenance.Lineage;
import dev.plumbline.analysis.provenance.ProvenanceAnalysis;
import dev.plumbline.analysis.provenance.ProvenanceFacts;
import dev.plumbline.analysis.provenance.Role;
import dev.plumbline.analysis.rowcount.RowCountAnalysis;
import dev.plumbline.analysis.rowcount.RowCountFacts;
import dev.plumbline.engine.FileContext;
import dev.plumbline.finding.Location;
import dev.plumbline.model.ApiMethod;
import dev.plumbline.model.Effect;
import dev.plumbline.model.TypeRole;
import dev.plumbline.parse.NotebookSource;
import dev.plumbline.parse.Subtrees;
import dev.plumbline.types.ProjectIndex;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.Deque;
import java.util.HashMap;
import java.util.HashSet;
import java.util.IdentityHashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalLong;
import java.util.Set;
import java.util.TreeSet;

/**
 * Training entry points and the evaluations they reach, for the audit report.
 *
 * <p>Per file, {@link #summarize} records for each method and constructor the training calls
 * ({@code Effect.TRAIN}) and evaluation calls ({@code Effect.EVALUATE}) it makes itself (in its
 * body and its lambdas, not in nested classes) and the project methods it calls, resolved by
 * receiver type, name and arity. Each evaluation carries the rows its data may hold (provenance
 * analysis) and their number when known (row-count analysis).
 *
 * <p>Across files, {@link #link} marks which callables reach training and evaluation through
 * project calls, and takes as entry points those that reach both and are a {@code main} (or a
 * notebook's cells) or have no caller that also reaches both. Calls through interfaces,
 * reflection or callbacks are not followed, so an entry point may reach less than it runs; it
 * never reaches code it cannot call.
 */
public final class EntryPointAnalysis {
  private EntryPointAnalysis() {}

  /** The training-related summary of every method and constructor of the file with a name. */
  public static List<CallableSummary> summarize(FileContext file) {
    ProvenanceFacts provenance = file.analysis(ProvenanceAnalysis.KEY);
    RowCountFacts rows = file.analysis(RowCountAnalysis.KEY);
    Map<MethodCallExpr, ProvenanceFacts.Use> uses = new IdentityHashMap<>();
    for (ProvenanceFacts.Use u : provenance.uses()) {
      uses.put(u.call(), u);
    }
    List<CallableSummary> out = new ArrayList<>();
    for (CallableDeclaration<?> c : Subtrees.findAll(file.source().unit(), CallableDeclaration.class)) {
      String owner = ownerOf(c);
      if (owner == null || (c instanceof MethodDeclaration m && m.getBody().isEmpty())) {
        continue;
      }
      List<Location> trains = new ArrayList<>();
      List<Evaluation> evaluations = new ArrayList<>();
      Set<String> calls = new TreeSet<>();
      for (MethodCallExpr call : Subtrees.findAll(c, MethodCallExpr.class)) {
        if (nearestCallable(call) != c) {
          continue; // inside a nested or anonymous class: its own callable
        }
        var api = file.types().apiMethod(call);
        if (api.isPresent() && api.get().effect() == Effect.TRAIN) {
          trains.add(file.locationOf(call));
        } else if (api.isPresent() && api.get().effect() == Effect.EVALUATE) {
          evaluations.add(evaluation(file, call, api.get(), uses.get(call), provenance, rows));
        } else if (api.isEmpty()) {
          file.types().projectMethod(call).ifPresent(pm -> calls.add(keyOf(pm)));
        }
      }
      String name = displayName(file, c, owner);
      out.add(new CallableSummary(owner + " " + signature(c), name, file.locationOf(nameNode(c)),
          file.locationOf(c), isMain(file, c), trains, evaluations, List.copyOf(calls)));
    }
    return out;
  }

  private static Evaluation evaluation(FileContext file, MethodCallExpr call, ApiMethod method,
      ProvenanceFacts.Use use, ProvenanceFacts provenance, RowCountFacts rows) {
    int dataArg = method.intAttribute("dataArg", 0);
    String data = dataArg < call.getArguments().size() ? shortText(call.getArgument(dataArg)) : "";
    List<String> roles = new ArrayList<>();
    Set<Location> sources = new TreeSet<>();
    if (use != null && use.data().kind() == DataValue.Kind.DATA) {
      List<ProvenanceFacts.Split> splits = provenance.splitsOf(use.graph(), use.data().lineages());
      // Data entering a method starts out as "whole"; that says something only if the method
      // splits it. Otherwise which rows it holds is unknown here.
      use.data().roles().stream()
          .filter(r -> r != Role.WHOLE || !splits.isEmpty())
          .forEach(r -> roles.add(r.name()));
      for (Lineage l : use.data().lineages()) {
        sources.add(file.locationOf(l.site()));
      }
      for (ProvenanceFacts.Split s : splits) {
        sources.add(file.locationOf(s.call()));
      }
    }
    OptionalLong n = rows.evaluatedRows(call);
    boolean accuracy = file.project().hasRole(method.returns(), TypeRole.EVALUATION);
    return new Evaluation(file.locationOf(call), shortText(call), method.signature(), data, roles,
        List.copyOf(sources), n, accuracy);
  }

  /**
   * Entry points of the whole project, in report order (by location). {@code summaries} may come
   * from any number of files in any order.
   */
  public static List<TrainingEntryPoint> link(List<CallableSummary> summaries) {
    Map<String, CallableSummary> byKey = new LinkedHashMap<>();
    List<CallableSummary> sorted = new ArrayList<>(summaries);
    sorted.sort(Comparator.comparing(CallableSummary::location).thenComparing(CallableSummary::key));
    for (CallableSummary s : sorted) {
      byKey.putIfAbsent(s.key(), s); // a duplicate type name keeps the first, as the index does
    }
    Set<String> reachesTraining = closure(byKey, s -> !s.trainCalls().isEmpty());
    Set<String> reachesEvaluation = closure(byKey, s -> !s.evaluations().isEmpty());
    Set<String> both = new HashSet<>(reachesTraining);
    both.retainAll(reachesEvaluation);
    Set<String> calledByBoth = new HashSet<>();
    for (String k : both) {
      calledByBoth.addAll(byKey.get(k).calls());
    }
    List<TrainingEntryPoint> out = new ArrayList<>();
    for (CallableSummary s : byKey.values()) {
      if (!both.contains(s.key()) || (!s.isMain() && calledByBoth.contains(s.key()))) {
        continue;
      }
      List<Location> scope = new ArrayList<>();
      List<Evaluation> evaluations = new ArrayList<>();
      int trains = 0;
      for (CallableSummary reached : reachable(byKey, s)) {
        scope.add(reached.extent());
        evaluations.addAll(reached.evaluations());
        trains += reached.trainCalls().size();
      }
      evaluations.sort(Comparator.comparing(Evaluation::location));
      out.add(new TrainingEntryPoint(s.name(), s.location(), scope, trains, evaluations));
    }
    return out;
  }

  /** Keys of callables that satisfy {@code direct} themselves or call one that does. */
  private static Set<String> closure(Map<String, CallableSummary> byKey,
      java.util.function.Predicate<CallableSummary> direct) {
    Map<String, List<String>> callers = new HashMap<>();
    for (CallableSummary s : byKey.values()) {
      for (String callee : s.calls()) {
        callers.computeIfAbsent(callee, k -> new ArrayList<>()).add(s.key());
      }
    }
    Set<String> out = new HashSet<>();
    Deque<String> work = new ArrayDeque<>();
    for (CallableSummary s : byKey.values()) {
      if (direct.test(s) && out.add(s.key())) {
        work.add(s.key());
      }
    }
    while (!work.isEmpty()) {
      for (String caller : callers.getOrDefault(work.poll(), List.of())) {
        if (out.add(caller)) {
          work.add(caller);
        }
      }
    }
    return out;
  }

  /** The callable and every project callable it reaches, in a stable order. */
  private static List<CallableSummary> reachable(Map<String, CallableSummary> byKey, CallableSummary from) {
    List<CallableSummary> out = new ArrayList<>();
    Set<String> seen = new HashSet<>();
    Deque<CallableSummary> work = new ArrayDeque<>();
    work.add(from);
    seen.add(from.key());
    while (!work.isEmpty()) {
      CallableSummary s = work.poll();
      out.add(s);
      for (String callee : s.calls()) {
        CallableSummary next = byKey.get(callee);
        if (next != null && seen.add(callee)) {
          work.add(next);
        }
      }
    }
    return out;
  }

  // ------------------------------------------------------------------ names

  private static String keyOf(ProjectIndex.ProjectMethod pm) {
    return pm.ownerType() + " " + signature(pm.declaration());
  }

  private static String signature(CallableDeclaration<?> c) {
    return c.getDeclarationAsString(false, false, false);
  }

  /** The qualified name of the type that declares {@code c} directly, or null (anonymous, local). */
  private static String ownerOf(CallableDeclaration<?> c) {
    Node parent = c.getParentNode().orElse(null);
    return parent instanceof TypeDeclaration<?> t ? t.getFullyQualifiedName().orElse(null) : null;
  }

  private static Node nearestCallable(Node n) {
    Node current = n.getParentNode().orElse(null);
    while (current != null) {
      if (current instanceof CallableDeclaration<?> || current instanceof TypeDeclaration<?>
          || (current instanceof ObjectCreationExpr oce && oce.getAnonymousClassBody().isPresent())) {
        return current;
      }
      current = current.getParentNode().orElse(null);
    }
    return null;
  }

  private static Node nameNode(CallableDeclaration<?> c) {
    return c.getName();
  }

  private static boolean isNotebookCells(FileContext file, CallableDeclaration<?> c) {
    return file.source().file().isNotebook() && c instanceof MethodDeclaration m
        && m.getNameAsString().equals(NotebookSource.CELLS_METHOD) && ownerOf(c) != null
        && ownerOf(c).equals(NotebookSource.className(file.uri()));
  }

  private static boolean isMain(FileContext file, CallableDeclaration<?> c) {
    if (isNotebookCells(file, c)) {
      return true;
    }
    return c instanceof MethodDeclaration m && m.getNameAsString().equals("main") && m.isStatic()
        && m.isPublic() && m.getType().isVoidType() && m.getParameters().size() == 1
        && (m.getParameter(0).getTypeAsString().equals("String[]")
            || (m.getParameter(0).isVarArgs() && m.getParameter(0).getTypeAsString().equals("String")));
  }

  private static String displayName(FileContext file, CallableDeclaration<?> c, String owner) {
    if (isNotebookCells(file, c)) {
      return "cells of " + file.uri();
    }
    String simpleOwner = owner.substring(owner.lastIndexOf('.') + 1);
    StringBuilder sb = new StringBuilder(simpleOwner).append('.').append(c.getNameAsString()).append('(');
    for (int i = 0; i < c.getParameters().size(); i++) {
      sb.append(i == 0 ? "" : ", ").append(c.getParameter(i).getTypeAsString())
          .append(c.getParameter(i).isVarArgs() ? "..." : "");
    }
    return sb.append(')').toString();
  }

  private static String shortText(Node n) {
    String s = n.toString().replaceAll("\\s+", " ").trim();
    return s.length() <= 72 ? s : s.substring(0, 69) + "...";
  }
}
