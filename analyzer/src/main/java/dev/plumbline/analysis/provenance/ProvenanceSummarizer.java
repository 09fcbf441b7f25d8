package dev.plumbline.analysis.provenance;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.CallableDeclaration;
import com.github.javaparser.ast.body.FieldDeclaration;
import com.github.javaparser.ast.body.TypeDeclaration;
import com.github.javaparser.ast.body.VariableDeclarator;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.expr.SimpleName;
import dev.plumbline.engine.AnalysisSettings;
import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.ProjectAnalysis;
import dev.plumbline.engine.ProjectFacts;
import dev.plumbline.engine.Workers;
import dev.plumbline.flow.ControlFlowGraph;
import dev.plumbline.parse.Subtrees;
import dev.plumbline.types.ProjectIndex;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Deque;
import java.util.EnumSet;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;

/**
 * Computes {@link ProvenanceSummaries} for the whole project before files are checked: for each
 * project method, what it does with the rows of each parameter (fits a preprocessor on them,
 * splits, trains on, evaluates on, shuffles them) and which rows it returns; for each field,
 * which rows it may hold.
 *
 * <p>Method summaries are computed bottom-up over the strongly connected components of the call
 * graph (callees first), by running {@link ProvenanceAnalysis} in {@link ProvenanceAnalysis.Mode#SUMMARY}
 * mode. A recursive component is iterated at most {@value #ROUNDS_PER_COMPONENT} times; if it has
 * not settled by then its last summaries stand (they may miss uses, which only makes the rules say
 * less). Field summaries depend on method summaries and the other way round, so after a pass the
 * methods that read a field whose summary changed (or call a method whose summary changed) are
 * summarized again, until field summaries settle, at most {@value #FIELD_ROUNDS} passes.
 *
 * <p>Components are grouped in levels (a component calls only components of lower levels); the
 * components of one level are summarized in parallel, since none reads another's summaries.
 * Deterministic: each summary depends only on lower levels and the fields of the previous pass,
 * and field writes are gathered in the files' sorted order and source order within a file.
 */
public final class ProvenanceSummarizer implements ProjectAnalysis {
  static final int ROUNDS_PER_COMPONENT = 4;
  static final int FIELD_ROUNDS = 3;

  /** A project method to summarize; identity equality (declarations compare structurally). */
  private static final class Method {
    private final FileContext file;
    private final CallableDeclaration<?> declaration;
    private final ControlFlowGraph graph;
    private final int order;
    /** The field writes found when this method was last summarized; its summarizing thread's. */
    private List<ProvenanceFacts.FieldWrite> writes = List.of();
    /**
     * The fields whose summaries its last summary rests on; null when unknown (its analysis did
     * not converge), and then any field it names counts.
     */
    private Set<Node> fieldSummariesRead;
    /**
     * The facts of its last solution when that was a report's in all but name (no parameter read
     * as the caller's rows), with the summaries it read; null otherwise.
     */
    private ProvenanceFacts reportFacts;
    private SummaryReads.Snapshot reportReads;

    Method(FileContext file, CallableDeclaration<?> declaration, ControlFlowGraph graph, int order) {
      this.file = file;
      this.declaration = declaration;
      this.graph = graph;
      this.order = order;
    }

    FileContext file() {
      return file;
    }

    CallableDeclaration<?> declaration() {
      return declaration;
    }

    ControlFlowGraph graph() {
      return graph;
    }
  }

  @Override
  public void compute(List<FileContext> files, ProjectIndex index, ProjectFacts out,
      Workers workers) {
    ProvenanceSummaries summaries = new ProvenanceSummaries();
    out.put(ProvenanceSummaries.class, summaries);
    List<Method> methods = methods(files);
    summaries.prepare(methods.stream().map(Method::declaration).toList());
    CallGraph callGraph = new CallGraph(methods, workers);
    List<List<List<Method>>> levels = callGraph.levels();
    List<FileFields> fields = workers.map(files,
        f -> new FileFields(f, Subtrees.findAll(f.source().unit(), FieldDeclaration.class)));
    Set<Node> changedFields = null; // null: first round, summarize everything
    for (int round = 0; round < FIELD_ROUNDS; round++) {
      Set<Method> changedMethods = Collections.newSetFromMap(new IdentityHashMap<>());
      for (List<List<Method>> level : levels) {
        List<List<Method>> due = new ArrayList<>();
        for (List<Method> component : level) {
          if (changedFields == null || affected(component, changedFields, changedMethods, callGraph)) {
            due.add(component);
          }
        }
        // Components of one level call none of each other, so they are summarized in parallel;
        // components sharing a file go to one worker, as a file context serves one thread.
        for (List<Method> changed : workers.map(byFiles(due),
            unit -> summarizeAll(unit, summaries, callGraph))) {
          changedMethods.addAll(changed);
        }
      }
      changedFields = updateFields(fields, methods, summaries, workers);
      if (changedFields.isEmpty()) {
        break;
      }
    }
    summaries.keepReports(reportsStillValid(methods, summaries));
  }

  /**
   * The methods whose last solution a report would repeat exactly: every summary it read is the
   * final one (a recursive component left unsettled, or fields still changing after the last
   * pass, fail this), so the per-file analysis need not solve them again.
   */
  private static Map<ControlFlowGraph, ProvenanceFacts> reportsStillValid(List<Method> methods,
      ProvenanceSummaries summaries) {
    Map<ControlFlowGraph, ProvenanceFacts> valid = new IdentityHashMap<>();
    for (Method m : methods) {
      if (m.reportFacts != null && m.reportReads.stillHold(summaries)) {
        valid.put(m.graph(), m.reportFacts);
      }
      m.reportFacts = null;
      m.reportReads = null;
    }
    return valid;
  }

  /** Summarizes components in order; returns the methods whose summary changed. */
  private static List<Method> summarizeAll(List<List<Method>> components,
      ProvenanceSummaries summaries, CallGraph callGraph) {
    List<Method> changedMethods = new ArrayList<>();
    for (List<Method> component : components) {
      for (Method m : component) {
        if (summaries.method(m.declaration()) == null) {
          summaries.put(m.declaration(), ProvenanceSummaries.MethodSummary.PENDING);
        }
      }
      boolean recursive = component.size() > 1
          || callGraph.callees(component.get(0)).contains(component.get(0));
      for (int i = 0; i < ROUNDS_PER_COMPONENT; i++) {
        boolean changed = false;
        for (Method m : component) {
          if (summarize(m, summaries)) {
            changed = true;
            if (!changedMethods.contains(m)) {
              changedMethods.add(m);
            }
          }
        }
        if (!changed || !recursive) {
          break;
        }
      }
    }
    return changedMethods;
  }

  /**
   * Groups components into work units so that no file has methods in two units; units and the
   * components in each keep the given order.
   */
  private static List<List<List<Method>>> byFiles(List<List<Method>> components) {
    List<List<List<Method>>> units = new ArrayList<>();
    Map<FileContext, Integer> unitOf = new IdentityHashMap<>();
    for (List<Method> component : components) {
      TreeSet<Integer> joined = new TreeSet<>();
      for (Method m : component) {
        Integer u = unitOf.get(m.file());
        if (u != null) {
          joined.add(u);
        }
      }
      int target;
      if (joined.isEmpty()) {
        target = units.size();
        units.add(new ArrayList<>());
      } else {
        target = joined.first();
        for (int u : joined.tailSet(target, false)) {
          units.get(target).addAll(units.get(u));
          units.set(u, List.of());
          for (List<Method> moved : units.get(target)) {
            for (Method m : moved) {
              unitOf.put(m.file(), target);
            }
          }
        }
      }
      units.get(target).add(component);
      for (Method m : component) {
        unitOf.put(m.file(), target);
      }
    }
    units.removeIf(List::isEmpty);
    return units;
  }

  /** Whether a component must be summarized again after some fields' summaries changed. */
  private static boolean affected(List<Method> component, Set<Node> changedFields,
      Set<Method> changedMethods, CallGraph callGraph) {
    Set<String> changedNames = null;
    for (Method m : component) {
      for (Method callee : callGraph.callees(m)) {
        if (changedMethods.contains(callee)) {
          return true;
        }
      }
      if (m.fieldSummariesRead != null) {
        for (Node field : m.fieldSummariesRead) {
          if (changedFields.contains(field)) {
            return true;
          }
        }
        continue;
      }
      if (changedNames == null) {
        changedNames = new TreeSet<>();
        for (Node field : changedFields) {
          changedNames.add(((VariableDeclarator) field).getNameAsString());
        }
      }
      Set<String> names = changedNames;
      // Rare (its analysis did not converge): any name of a changed field it mentions counts.
      if (Subtrees.findFirst(m.declaration(), SimpleName.class, n -> names.contains(n.getIdentifier())).isPresent()) {
        return true;
      }
    }
    return false;
  }

  private static List<Method> methods(List<FileContext> files) {
    List<Method> out = new ArrayList<>();
    for (FileContext file : files) {
      for (ControlFlowGraph g : file.graphs()) {
        if (g.callable() instanceof CallableDeclaration<?> c
            && c.getParentNode().orElse(null) instanceof TypeDeclaration<?>) {
          out.add(new Method(file, c, g, out.size()));
        }
      }
    }
    return out;
  }

  /** Summarizes one method; returns whether its summary changed. */
  private static boolean summarize(Method m, ProvenanceSummaries summaries) {
    ProvenanceFacts facts = new ProvenanceFacts();
    ProvenanceAnalysis solved =
        ProvenanceAnalysis.analyzeGraph(m.file(), m.graph(), ProvenanceAnalysis.Mode.SUMMARY, facts);
    boolean converged = solved != null;
    // Kept until the end of the summaries, for every method: an empty set takes no table.
    m.fieldSummariesRead = !converged ? null
        : facts.fieldSummariesRead().isEmpty() ? Set.of() : facts.fieldSummariesRead();
    SummaryReads.Snapshot reads =
        converged && !solved.readCallerRows ? solved.summariesRead.snapshot() : null;
    m.reportFacts = reads != null ? facts.frozen() : null;
    m.reportReads = reads;
    if (!converged) {
      // No fixed point: callers treat its result as unknown rows and know none of its uses.
      return summaries.put(m.declaration(), new ProvenanceSummaries.MethodSummary(null, List.of(), true));
    }
    // This method's writes replace the ones it made when last summarized.
    m.writes = List.copyOf(facts.fieldWrites());
    String owner = m.declaration().findAncestor(TypeDeclaration.class)
        .map(t -> t.getNameAsString() + ".").orElse("");
    String where = " in " + owner + m.declaration().getNameAsString();
    List<ProvenanceSummaries.ParamUse> uses = new ArrayList<>();
    for (ProvenanceFacts.Fit f : facts.fits()) {
      param(f.data()).ifPresent(i -> addUse(uses, new ProvenanceSummaries.ParamUse(i,
          ProvenanceSummaries.Use.FIT, f.preprocessorName() + (f.via() == null ? where : ""),
          f.learns(), false, null, null)));
    }
    for (ProvenanceFacts.Split s : facts.splits()) {
      param(s.data()).ifPresent(i -> addUse(uses, new ProvenanceSummaries.ParamUse(i,
          ProvenanceSummaries.Use.SPLIT, ProvenanceAnalysis.shortText(s.call()), false, s.random(),
          null, null)));
    }
    for (ProvenanceFacts.Train t : facts.trains()) {
      param(t.data()).ifPresent(i -> addUse(uses, new ProvenanceSummaries.ParamUse(i,
          ProvenanceSummaries.Use.TRAIN, t.model() + (t.via() == null ? where : ""), false, false,
          null, null)));
    }
    for (ProvenanceFacts.Evaluation e : facts.evaluations()) {
      param(e.data()).ifPresent(i -> addUse(uses, new ProvenanceSummaries.ParamUse(i,
          ProvenanceSummaries.Use.EVALUATE, ProvenanceAnalysis.shortText(e.call()), false, false,
          null, e.kind())));
    }
    for (ProvenanceFacts.Shuffle s : facts.shuffles()) {
      param(s.data()).ifPresent(i -> addUse(uses, new ProvenanceSummaries.ParamUse(i,
          ProvenanceSummaries.Use.SHUFFLE, ProvenanceAnalysis.shortText(s.call()), false, false,
          s.seeding() == ProvenanceFacts.Seeding.BY_GENERATOR_ARGUMENT ? null : s.seeding(), null)));
    }
    DataValue returned = null;
    for (ProvenanceFacts.Returned r : facts.returns()) {
      if (r.value() != null) {
        returned = returned == null ? r.value() : returned.join(r.value());
      }
    }
    return summaries.put(m.declaration(), new ProvenanceSummaries.MethodSummary(
        returnSummary(m.declaration(), returned), uses, true));
  }

  private static void addUse(List<ProvenanceSummaries.ParamUse> uses, ProvenanceSummaries.ParamUse use) {
    for (ProvenanceSummaries.ParamUse u : uses) {
      if (u.index() == use.index() && u.use() == use.use() && u.learns() == use.learns()
          && u.random() == use.random() && u.seeding() == use.seeding()
          && u.evaluationKind() == use.evaluationKind()) {
        return; // the first in source order describes it
      }
    }
    uses.add(use);
  }

  /** The parameter whose own rows (role ARGUMENT) a fact is about, if exactly one. */
  private static Optional<Integer> param(DataValue data) {
    if (data == null || data.kind() != DataValue.Kind.DATA || !data.holds(Role.ARGUMENT)) {
      return Optional.empty();
    }
    Integer found = null;
    for (Lineage l : data.lineages().stream().sorted(Lineage.BY_POSITION).toList()) {
      Optional<Integer> i = ProvenanceAnalysis.parameterIndex(l.site());
      if (i.isPresent()) {
        if (found != null && !found.equals(i.get())) {
          return Optional.empty();
        }
        found = i.get();
      }
    }
    return Optional.ofNullable(found);
  }

  private static ProvenanceSummaries.ReturnSummary returnSummary(CallableDeclaration<?> decl,
      DataValue v) {
    if (v == null || v.kind() == DataValue.Kind.MIXED || v.kind() == DataValue.Kind.STATISTIC
        || v.kind() == DataValue.Kind.PENDING) {
      return null;
    }
    TreeSet<Integer> fromParams = new TreeSet<>();
    boolean own = false;
    Set<Node> fields = DataValue.identitySet(List.of());
    for (Lineage l : v.lineages()) {
      Optional<Integer> i = ProvenanceAnalysis.parameterIndex(l.site());
      if (i.isPresent() && l.site().getParentNode().orElse(null) == decl) {
        fromParams.add(i.get());
      } else if (l.isField()) {
        fields.add(l.site());
      } else {
        own = true;
      }
    }
    return new ProvenanceSummaries.ReturnSummary(v.kind(), v.roles(), v.guessed(), fromParams, own,
        fields, v.parts(), v.isTimeOrdered());
  }

  /** A file's field declarations, looked up once for every pass. */
  private record FileFields(FileContext file, List<FieldDeclaration> declarations) {}

  /**
   * Recomputes what each field may hold from every write and initializer; returns the
   * declarators of the fields whose summary changed. A write of untracked rows or of a caller's
   * argument counts as whatever the field's name says, else whole rows.
   */

  private static Set<Node> updateFields(List<FileFields> files, List<Method> methods,
      ProvenanceSummaries summaries, Workers workers) {
    Map<Node, List<ProvenanceFacts.FieldWrite>> writes = new IdentityHashMap<>();
    for (Method m : methods) {
      for (ProvenanceFacts.FieldWrite w : m.writes) {
        writes.computeIfAbsent(w.field(), k -> new ArrayList<>()).add(w);
      }
    }
    // Each file's fields are summarized by one worker; summaries are recorded in file order.
    List<List<Map.Entry<VariableDeclarator, ProvenanceSummaries.FieldSummary>>> perFile =
        workers.map(files, file -> fieldSummaries(file, writes));
    Set<Node> changed = DataValue.identitySet(List.of());
    for (List<Map.Entry<VariableDeclarator, ProvenanceSummaries.FieldSummary>> fields : perFile) {
      for (Map.Entry<VariableDeclarator, ProvenanceSummaries.FieldSummary> e : fields) {
        if (summaries.putField(e.getKey(), e.getValue())) {
          changed.add(e.getKey());
        }
      }
    }
    return changed;
  }

  private static List<Map.Entry<VariableDeclarator, ProvenanceSummaries.FieldSummary>> fieldSummaries(
      FileFields fields, Map<Node, List<ProvenanceFacts.FieldWrite>> writes) {
    FileContext file = fields.file();
    List<Map.Entry<VariableDeclarator, ProvenanceSummaries.FieldSummary>> out = new ArrayList<>();
    for (FieldDeclaration fd : fields.declarations()) {
      for (VariableDeclarator d : fd.getVariables()) {
        List<DataValue> values = new ArrayList<>();
        List<Node> sites = new ArrayList<>();
        if (d.getInitializer().isPresent()) {
          values.add(ProvenanceAnalysis.initializerValue(file, d));
          sites.add(d);
        }
        for (ProvenanceFacts.FieldWrite w : writes.getOrDefault(d, List.of())) {
          values.add(w.value());
          sites.add(w.at());
        }
        if (values.isEmpty()) {
          continue;
        }
        ProvenanceSummaries.FieldSummary s = fieldSummary(d, values, sites, file.settings());
        if (s != null) {
          out.add(Map.entry(d, s));
        }
      }
    }
    return out;
  }

  private static ProvenanceSummaries.FieldSummary fieldSummary(VariableDeclarator d,
      List<DataValue> values, List<Node> sites, AnalysisSettings settings) {
    EnumSet<Role> roles = EnumSet.noneOf(Role.class);
    Set<Role> evidenced = EnumSet.noneOf(Role.class);
    Set<Role> guessedOnly = EnumSet.noneOf(Role.class);
    Set<Node> origins = DataValue.identitySet(List.of());
    Set<Node> timeOrdered = DataValue.identitySet(List.of());
    for (int i = 0; i < values.size(); i++) {
      DataValue v = values.get(i);
      if (v == null || v.kind() != DataValue.Kind.DATA || v.holds(Role.ARGUMENT)) {
        Optional<Role> named = DataNames.heldOutRole(List.of(d.getNameAsString()), settings);
        roles.add(named.orElse(Role.WHOLE));
        named.ifPresent(r -> {
          guessedOnly.add(r);
          origins.add(d);
        });
        continue;
      }
      roles.addAll(v.roles());
      for (Role r : v.roles()) {
        if (v.evidenced(r)) {
          evidenced.add(r);
        } else {
          guessedOnly.add(r);
        }
      }
      if (!v.onlyWhole()) {
        origins.add(sites.get(i));
      }
      if (v.isTimeOrdered()) {
        timeOrdered.add(sites.get(i));
      }
    }
    guessedOnly.removeAll(evidenced);
    return new ProvenanceSummaries.FieldSummary(roles, guessedOnly, origins, timeOrdered);
  }

  /** The project call graph and its strongly connected components (Tarjan), callees first. */
  private static final class CallGraph {
    private final List<Method> methods;
    private final Map<Node, Method> byDeclaration = new IdentityHashMap<>();
    private final Map<Method, List<Method>> callees = new IdentityHashMap<>();

    CallGraph(List<Method> methods, Workers workers) {
      this.methods = methods;
      for (Method m : methods) {
        byDeclaration.put(m.declaration(), m);
      }
      // Methods come file by file; each file's calls are resolved by one worker.
      List<List<Method>> runs = Workers.runsByFile(methods, Method::file);
      List<List<List<Method>>> resolved = workers.map(runs, run -> run.stream().map(this::resolve).toList());
      for (int r = 0; r < runs.size(); r++) {
        for (int i = 0; i < runs.get(r).size(); i++) {
          callees.put(runs.get(r).get(i), resolved.get(r).get(i));
        }
      }
    }

    private List<Method> resolve(Method m) {
      List<Method> out = new ArrayList<>();
      for (MethodCallExpr call : Subtrees.findAll(m.declaration(), MethodCallExpr.class)) {
        m.file().types().projectMethod(call)
            .map(pm -> byDeclaration.get(pm.declaration()))
            .filter(callee -> !out.contains(callee))
            .ifPresent(out::add);
      }
      return out;
    }

    /**
     * The components grouped by level, callees first: a component's level is one more than the
     * highest level of a component it calls, so components of one level call none of each other.
     */
    List<List<List<Method>>> levels() {
      List<List<Method>> components = componentsCalleesFirst();
      Map<Method, Integer> levelOf = new IdentityHashMap<>();
      List<List<List<Method>>> levels = new ArrayList<>();
      for (List<Method> component : components) {
        int level = 0;
        for (Method m : component) {
          for (Method callee : callees.get(m)) {
            Integer l = levelOf.get(callee);
            if (l != null) {
              level = Math.max(level, l + 1); // null: the component itself, not yet placed
            }
          }
        }
        for (Method m : component) {
          levelOf.put(m, level);
        }
        while (levels.size() <= level) {
          levels.add(new ArrayList<>());
        }
        levels.get(level).add(component);
      }
      return levels;
    }

    List<Method> callees(Method m) {
      return callees.get(m);
    }

    List<List<Method>> componentsCalleesFirst() {
      Map<Method, Integer> indexOf = new IdentityHashMap<>();
      Map<Method, Integer> low = new IdentityHashMap<>();
      Deque<Method> stack = new ArrayDeque<>();
      Set<Method> onStack = Collections.newSetFromMap(new IdentityHashMap<>());
      List<List<Method>> out = new ArrayList<>();
      int[] counter = {0};
      for (Method m : methods) {
        if (!indexOf.containsKey(m)) {
          strongConnect(m, indexOf, low, stack, onStack, out, counter);
        }
      }
      return out; // Tarjan emits a component only after all components it reaches
    }

    /** Iterative Tarjan, so that deep call chains cannot overflow the stack. */
    private void strongConnect(Method root, Map<Method, Integer> indexOf, Map<Method, Integer> low,
        Deque<Method> stack, Set<Method> onStack, List<List<Method>> out, int[] counter) {
      Deque<Object[]> work = new ArrayDeque<>();
      work.push(new Object[] {root, 0});
      indexOf.put(root, counter[0]);
      low.put(root, counter[0]++);
      stack.push(root);
      onStack.add(root);
      while (!work.isEmpty()) {
        Object[] frame = work.peek();
        Method v = (Method) frame[0];
        int next = (Integer) frame[1];
        List<Method> succ = callees.get(v);
        if (next < succ.size()) {
          frame[1] = next + 1;
          Method w = succ.get(next);
          if (!indexOf.containsKey(w)) {
            indexOf.put(w, counter[0]);
            low.put(w, counter[0]++);
            stack.push(w);
            onStack.add(w);
            work.push(new Object[] {w, 0});
          } else if (onStack.contains(w)) {
            low.put(v, Math.min(low.get(v), indexOf.get(w)));
          }
          continue;
        }
        work.pop();
        if (!work.isEmpty()) {
          Method parent = (Method) work.peek()[0];
          low.put(parent, Math.min(low.get(parent), low.get(v)));
        }
        if (low.get(v).equals(indexOf.get(v))) {
          List<Method> component = new ArrayList<>();
          Method w;
          do {
            w = stack.pop();
            onStack.remove(w);
            component.add(w);
          } while (w != v);
          component.sort((x, y) -> Integer.compare(x.order, y.order));
          out.add(component);
        }
      }
    }
  }

}
