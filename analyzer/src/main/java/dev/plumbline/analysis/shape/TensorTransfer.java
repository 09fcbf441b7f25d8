package dev.plumbline.analysis.shape;

import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.expr.ObjectCreationExpr;
import dev.plumbline.analysis.shape.ShapeFacts.OpKind;
import dev.plumbline.analysis.shape.ShapeValue.Tensor;
import dev.plumbline.model.ApiMethod;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Set;

/**
 * Transfer of library calls that make, reshape, combine or query tensors, driven by the API
 * model: the method's {@code Effect} picks the operation and its attributes say where the sizes,
 * axes and flags are ({@code shapeArg}, {@code axesArg}, {@code keepDims}, {@code inPlace},
 * {@code product}, ...). The shapes come from {@link ShapeSemantics}.
 */
final class TensorTransfer {
  /** Returned when the call is not one this class models (the caller then treats it as opaque). */
  static final ShapeValue NOT_HANDLED = new ShapeValue.Int(Dim.UNKNOWN);

  private final ShapeEvaluator ev;

  TensorTransfer(ShapeEvaluator ev) {
    this.ev = ev;
  }

  ShapeValue call(MethodCallExpr call, ApiMethod m, ShapeValue receiver, List<ShapeValue> args) {
    Framework fw = framework(m);
    Expression scope = call.getScope().orElse(null);
    switch (m.effect()) {
      case CREATE:
        return create(call, m, args, fw);
      case RESHAPE:
        return reshape(call, m, tensor(receiver, scope, fw), args, fw);
      case PERMUTE:
        return permute(call, m, tensor(receiver, scope, fw), args, fw);
      case TRANSPOSE: {
        Tensor t = tensor(receiver, scope, fw);
        ShapeOutcome out = ShapeSemantics.transpose(fw, t.shape());
        record(call, OpKind.TRANSPOSE, fw, List.of(scope), List.of(t), out, false, null, false);
        return fresh(call, out, fw).withUnchecked(t.uncheckedReshapes());
      }
      case MATMUL:
        return product(call, m, tensor(receiver, scope, fw), args, fw);
      case REDUCE:
        return reduce(call, m, tensor(receiver, scope, fw), args, fw);
      case ELEMENTWISE:
        return elementwise(call, m, tensor(receiver, scope, fw), args, fw);
      case VECTOR_OP:
        return vectorOp(call, m, tensor(receiver, scope, fw), args, fw);
      case CONCAT:
        return concat(call, m, receiver, args, fw);
      case SHAPE_QUERY:
        return shapeQuery(call, m, receiver, args);
      case COPY:
      case DETACH:
        return receiver instanceof Tensor t ? t : NOT_HANDLED;
      case DERIVE:
        return m.attribute("index") != null ? index(call, m, tensor(receiver, scope, fw), args, fw) : NOT_HANDLED;
      case CHECK: {
        int at = m.intAttribute("conditionArg", 0);
        if (at < call.getArguments().size()) {
          ShapeChecks checks = new ShapeChecks(ev.analysis);
          Expression condition = call.getArgument(at);
          ev.state = checks.markChecked(condition, checks.learn(condition, ev.state, true));
        }
        return null;
      }
      case BUILD:
      case ADD_LAYER:
      case LAYER_STACK:
      case TRAIN:
      case PREDICT:
        return new NetworkTransfer(ev, this).call(call, m, receiver, args);
      default:
        // Setters of layer builders and network configurations keep the value the chain builds.
        if (receiver instanceof NetworkValue || receiver instanceof NetworkValue.Layer) {
          return new NetworkTransfer(ev, this).configure(call, m, receiver, args);
        }
        return NOT_HANDLED;
    }
  }

  ShapeValue construct(ObjectCreationExpr oce, ApiMethod ctor, List<ShapeValue> args) {
    switch (ctor.effect()) {
      case MAKE_SHAPE: {
        List<Dim> dims = sizes(oce.getArguments(), args, 0);
        return dims == null ? new ShapeValue.Tuple(null, null) : ShapeValue.Tuple.of(dims);
      }
      case BUILD:
        return new NetworkTransfer(ev, this).construct(ctor, args);
      case WRAP: {
        List<Tensor> items = new ArrayList<>();
        for (ShapeValue v : args) {
          if (!(v instanceof Tensor t)) {
            return NOT_HANDLED;
          }
          items.add(t);
        }
        return ev.isTensorList(ctor.owner()) ? new ShapeValue.TensorList(items) : NOT_HANDLED;
      }
      default:
        return NOT_HANDLED;
    }
  }

  // ------------------------------------------------------------------ creation and reshaping

  private ShapeValue create(MethodCallExpr call, ApiMethod m, List<ShapeValue> args, Framework fw) {
    int at = m.intAttribute("shapeArg", 0);
    TensorShape shape;
    switch (String.valueOf(m.attribute("shape"))) {
      case "varargs" -> {
        List<Dim> dims = sizes(call.getArguments(), args, at);
        shape = dims == null ? TensorShape.unknown() : TensorShape.of(dims);
      }
      case "shape-object" -> {
        List<Dim> dims = at < args.size() && args.get(at) instanceof ShapeValue.Tuple t ? t.elements() : null;
        shape = dims == null ? TensorShape.unknown() : TensorShape.of(dims);
      }
      case "data" -> shape = dataShape(call, args, at);
      default -> shape = TensorShape.unknown();
    }
    if (shape.rankKnown() && shape.dims().stream().anyMatch(d -> d.isConstant() && d.constant().getAsLong() < 0)) {
      shape = TensorShape.unknown();
    }
    ev.state = ev.state.forget(Site.of(call));
    Tensor t = Tensor.of(shape, fw, Site.of(call));
    record(call, OpKind.CREATE, fw, List.of(), List.of(), ShapeOutcome.succeeds(shape), false, null, false);
    return t;
  }

  private TensorShape dataShape(MethodCallExpr call, List<ShapeValue> args, int at) {
    if (at < args.size() && args.get(at) instanceof ShapeValue.Tuple t && t.data() != null) {
      return t.data();
    }
    if (at < call.getArguments().size()) {
      String type = ev.types.typeOf(call.getArgument(at));
      if (type != null && type.endsWith("[]")) {
        return TensorShape.ofRank((type.length() - type.replace("[]", "").length()) / 2);
      }
    }
    return TensorShape.unknown();
  }

  /**
   * Sizes given from argument {@code from} on: one array or {@code Shape} argument, or one
   * integral argument per size. Null when an argument's type is not known to be integral: the
   * call might then bind to an overload the model does not list (data plus shape).
   */
  List<Dim> sizes(List<Expression> exprs, List<ShapeValue> values, int from) {
    if (from > exprs.size()) {
      return null;
    }
    if (exprs.size() - from == 1 && values.get(from) instanceof ShapeValue.Tuple t) {
      return t.elements();
    }
    List<Dim> dims = new ArrayList<>();
    for (int i = from; i < exprs.size(); i++) {
      String type = ev.types.typeOf(exprs.get(i));
      if (!ShapeEvaluator.isIntegral(type)) {
        return null;
      }
      dims.add(values.get(i) instanceof ShapeValue.Int n ? n.value() : Dim.UNKNOWN);
    }
    return dims;
  }

  /**
   * A reshape is "computed" when two or more of its sizes are not known constants ({@code -1}
   * counts): how the elements are split between those sizes then depends on computation the
   * element count cannot validate, so a wrong value silently lays the data out wrongly. (A single
   * free size is fixed by the element count, and a wrong one fails loudly.) Sizes that are another
   * tensor's whole shape, read as one ({@code label.reshape(prediction.getShape())}), are not
   * computed: the result is laid out as that tensor is, which is what the call asks for. Unless
   * the analysis proves the result exactly, or the input's shape was checked, a computed reshape's
   * result carries a pending unchecked mark until a check or a shape-sensitive use.
   */
  private ShapeValue reshape(MethodCallExpr call, ApiMethod m, Tensor in, List<ShapeValue> args, Framework fw) {
    int at = m.intAttribute("shapeArg", 0);
    List<Dim> target = sizes(call.getArguments(), args, at);
    ShapeOutcome out = target == null ? ShapeOutcome.unknown() : ShapeSemantics.reshape(fw, in.shape(), target);
    record(call, OpKind.RESHAPE, fw, scopeList(call), List.of(in), out, false, null, false);
    Tensor result = fresh(call, out, fw);
    boolean anotherTensorsShape = call.getArguments().size() == at + 1 && at < args.size()
        && args.get(at) instanceof ShapeValue.Tuple t && t.shapeOfTensor();
    boolean computed = !anotherTensorsShape
        && (target == null || target.stream().filter(d -> !d.isConstant() || d.is(-1)).count() >= 2);
    boolean proven = out.succeeds() && out.result().fullyKnown();
    return computed && !in.checked() && !proven ? result.withUnchecked(Set.of(Site.of(call))) : result;
  }

  private ShapeValue permute(MethodCallExpr call, ApiMethod m, Tensor in, List<ShapeValue> args, Framework fw) {
    List<Dim> axes = sizes(call.getArguments(), args, m.intAttribute("axesArg", 0));
    List<Integer> ints = axes == null ? null : axes.stream()
        .map(d -> d.isConstant() ? Integer.valueOf((int) d.constant().getAsLong()) : null).toList();
    ShapeOutcome out = ints == null ? ShapeOutcome.unknown() : ShapeSemantics.permute(fw, in.shape(), ints);
    record(call, OpKind.PERMUTE, fw, scopeList(call), List.of(in), out, false, null, false);
    Tensor result = fresh(call, out, fw);
    boolean computed = ints == null || ints.contains(null);
    if (computed && !in.checked()) {
      return result.withUnchecked(Set.of(Site.of(call)));
    }
    return result.withUnchecked(in.uncheckedReshapes());
  }

  // ------------------------------------------------------------------ products and reductions

  private ShapeValue product(MethodCallExpr call, ApiMethod m, Tensor a, List<ShapeValue> args, Framework fw) {
    if (call.getArguments().isEmpty()) {
      return NOT_HANDLED;
    }
    Tensor b = tensor(args.get(0), call.getArgument(0), fw);
    ShapeSemantics.Product kind = switch (String.valueOf(m.attribute("product"))) {
      case "mmul" -> ShapeSemantics.Product.MMUL;
      case "dot" -> ShapeSemantics.Product.DOT;
      default -> ShapeSemantics.Product.MATMUL;
    };
    ShapeOutcome out = ShapeSemantics.product(fw, kind, a.shape(), b.shape());
    record(call, OpKind.PRODUCT, fw, operands(call), List.of(a, b), out, false, null, true);
    return fresh(call, out, fw);
  }

  private ShapeValue reduce(MethodCallExpr call, ApiMethod m, Tensor in, List<ShapeValue> args, Framework fw) {
    List<Integer> axes = axes(call, m, args);
    Boolean keep = keepDims(call, m);
    boolean engineAxes = "one".equals(m.attribute("engineAxes"));
    ShapeOutcome out;
    if (keep == null) {
      ShapeOutcome kept = ShapeSemantics.reduce(fw, in.shape(), axes, true, engineAxes);
      ShapeOutcome dropped = ShapeSemantics.reduce(fw, in.shape(), axes, false, engineAxes);
      out = kept.result().equals(dropped.result()) ? kept : ShapeOutcome.unknown();
    } else {
      out = ShapeSemantics.reduce(fw, in.shape(), axes, keep, engineAxes);
    }
    record(call, OpKind.REDUCE, fw, scopeList(call), List.of(in), out, false, null, false);
    Tensor result = fresh(call, out, fw);
    List<Integer> reduced = ShapeSemantics.normalizedAxes(in.shape(), axes);
    if (Boolean.FALSE.equals(keep) && reduced != null && !reduced.isEmpty() && in.origin() != null && !out.fails()) {
      result = result.withReduction(new ShapeValue.Reduction(in.origin(), in.shape(), reduced, Site.of(call)));
    }
    return result;
  }

  /**
   * The axes a reduction names: null for "over everything" (no axes parameter, or empty varargs,
   * which ND4J treats as everything: measured), a list with null entries when some are unknown.
   */
  private static List<Integer> axes(MethodCallExpr call, ApiMethod m, List<ShapeValue> args) {
    int axesArg = m.intAttribute("axesArg", -1);
    int n = call.getArguments().size();
    if (axesArg < 0) {
      return null;
    }
    List<Dim> dims;
    if (m.isVarArgs() && axesArg == m.params().size() - 1) {
      if (n == axesArg) {
        return null;
      }
      dims = n - axesArg == 1 && args.get(axesArg) instanceof ShapeValue.Tuple t ? t.elements()
          : intArgs(args, axesArg, n);
    } else {
      dims = axesArg < n && args.get(axesArg) instanceof ShapeValue.Tuple t ? t.elements() : null;
    }
    if (dims == null) {
      return java.util.Collections.singletonList(null);
    }
    return dims.stream().map(d -> d.isConstant() ? Integer.valueOf((int) d.constant().getAsLong()) : null).toList();
  }

  /** Literal keep-dimensions flag: TRUE, FALSE, or null when it is a non-literal argument. */
  private static Boolean keepDims(MethodCallExpr call, ApiMethod m) {
    String k = m.attribute("keepDims");
    if (k == null || k.equals("false")) {
      return Boolean.FALSE;
    }
    if (k.equals("true")) {
      return Boolean.TRUE;
    }
    if (k.startsWith("param")) {
      int i = Integer.parseInt(k.substring("param".length()));
      if (i < call.getArguments().size() && call.getArgument(i).isBooleanLiteralExpr()) {
        return call.getArgument(i).asBooleanLiteralExpr().getValue();
      }
    }
    return null;
  }

  private static List<Dim> intArgs(List<ShapeValue> args, int from, int to) {
    List<Dim> out = new ArrayList<>();
    for (int i = from; i < to && i < args.size(); i++) {
      out.add(args.get(i) instanceof ShapeValue.Int n ? n.value() : Dim.UNKNOWN);
    }
    return out;
  }

  // ------------------------------------------------------------------ element-wise

  private ShapeValue elementwise(MethodCallExpr call, ApiMethod m, Tensor a, List<ShapeValue> args, Framework fw) {
    boolean inPlace = m.flag("inPlace");
    if (m.flag("scalar") || call.getArguments().isEmpty()) {
      return inPlace ? a : fresh(call, ShapeOutcome.succeeds(a.shape()), fw);
    }
    Tensor b = tensor(args.get(0), call.getArgument(0), fw);
    ShapeOutcome out = ShapeSemantics.elementwise(fw, a.shape(), b.shape(), inPlace);
    record(call, OpKind.ELEMENTWISE, fw, operands(call), List.of(a, b), out, inPlace, reducedOperand(a, b), true);
    if (inPlace) {
      return a.withUnchecked(Set.of());
    }
    return fresh(call, out, fw);
  }

  private ShapeValue vectorOp(MethodCallExpr call, ApiMethod m, Tensor a, List<ShapeValue> args, Framework fw) {
    if (call.getArguments().isEmpty()) {
      return NOT_HANDLED;
    }
    boolean inPlace = m.flag("inPlace");
    Tensor v = tensor(args.get(0), call.getArgument(0), fw);
    ShapeSemantics.VectorAxis along = "column".equals(m.attribute("vector"))
        ? ShapeSemantics.VectorAxis.COLUMN : ShapeSemantics.VectorAxis.ROW;
    ShapeOutcome out = ShapeSemantics.vectorOp(a.shape(), v.shape(), along);
    record(call, OpKind.VECTOR_OP, fw, operands(call), List.of(a, v), out, inPlace, null, true);
    return inPlace ? a.withUnchecked(Set.of()) : fresh(call, out, fw);
  }

  /** Whether one operand is a reduction, without kept dimensions, of the other operand. */
  private ShapeFacts.ReducedOperand reducedOperand(Tensor a, Tensor b) {
    if (b.reducedFrom() != null && b.reducedFrom().source().equals(a.origin())) {
      return reduced(1, b.reducedFrom());
    }
    if (a.reducedFrom() != null && a.reducedFrom().source().equals(b.origin())) {
      return reduced(0, a.reducedFrom());
    }
    return null;
  }

  private ShapeFacts.ReducedOperand reduced(int operand, ShapeValue.Reduction r) {
    MethodCallExpr call = (MethodCallExpr) r.call().node();
    boolean helper = ev.types.apiMethod(call).isEmpty() && ev.types.projectMethod(call).isPresent();
    return new ShapeFacts.ReducedOperand(operand, call, r.axes(), r.sourceShape(), helper);
  }

  // ------------------------------------------------------------------ joining and indexing

  private ShapeValue concat(MethodCallExpr call, ApiMethod m, ShapeValue receiver, List<ShapeValue> args, Framework fw) {
    List<Expression> exprs = new ArrayList<>();
    List<Tensor> inputs = new ArrayList<>();
    String from = String.valueOf(m.attribute("inputs"));
    int inputsArg = m.intAttribute("inputsArg", 0);
    switch (from) {
      case "receiver" -> {
        Expression scope = call.getScope().orElse(null);
        exprs.add(scope);
        inputs.add(tensor(receiver, scope, fw));
        exprs.add(call.getArgument(0));
        inputs.add(tensor(args.get(0), call.getArgument(0), fw));
      }
      case "list" -> {
        if (!(args.get(inputsArg) instanceof ShapeValue.TensorList l)) {
          return fresh(call, ShapeOutcome.unknown(), fw);
        }
        inputs.addAll(l.items());
        l.items().forEach(t -> exprs.add(call.getArgument(inputsArg)));
      }
      default -> {
        if (call.getArguments().size() - inputsArg == 1
            && !ev.isTensor(ev.types.typeOf(call.getArgument(inputsArg)))) {
          return fresh(call, ShapeOutcome.unknown(), fw); // an array of tensors: sizes unknown
        }
        for (int i = inputsArg; i < call.getArguments().size(); i++) {
          exprs.add(call.getArgument(i));
          inputs.add(tensor(args.get(i), call.getArgument(i), fw));
        }
      }
    }
    Integer axis = m.attribute("axisArg") == null ? Integer.valueOf(m.intAttribute("axis", 0))
        : constant(args, m.intAttribute("axisArg", -1));
    List<TensorShape> shapes = inputs.stream().map(Tensor::shape).toList();
    ShapeOutcome out;
    String join = String.valueOf(m.attribute("join"));
    if (join.equals("hstack")) {
      out = ShapeSemantics.hstack(shapes);
    } else if (join.equals("vstack")) {
      out = ShapeSemantics.vstack(shapes);
    } else if (axis == null) {
      out = ShapeOutcome.unknown();
    } else if (m.flag("stack")) {
      out = ShapeSemantics.stack(fw, shapes, axis);
    } else {
      out = ShapeSemantics.concat(fw, shapes, axis);
    }
    record(call, OpKind.CONCAT, fw, exprs, inputs, out, false, null, true);
    return fresh(call, out, fw);
  }

  private ShapeValue index(MethodCallExpr call, ApiMethod m, Tensor in, List<ShapeValue> args, Framework fw) {
    ShapeSemantics.Index kind = switch (m.attribute("index")) {
      case "row" -> ShapeSemantics.Index.ROW;
      case "column" -> ShapeSemantics.Index.COLUMN;
      default -> ShapeSemantics.Index.LEADING;
    };
    List<Long> indices = new ArrayList<>();
    List<Dim> given = sizes(call.getArguments(), args, 0);
    if (given == null) {
      return fresh(call, ShapeOutcome.unknown(), fw);
    }
    for (Dim d : given) {
      indices.add(d.isConstant() ? d.constant().getAsLong() : null);
    }
    ShapeOutcome out = ShapeSemantics.index(fw, kind, in.shape(), indices);
    record(call, OpKind.INDEX, fw, scopeList(call), List.of(in), out, false, null, false);
    return fresh(call, out, fw);
  }

  // ------------------------------------------------------------------ shape queries

  private ShapeValue shapeQuery(MethodCallExpr call, ApiMethod m, ShapeValue receiver, List<ShapeValue> args) {
    Expression scope = call.getScope().orElse(null);
    String q = String.valueOf(m.attribute("query"));
    Tensor t = receiver instanceof Tensor tr ? tr : null;
    switch (q) {
      case "shape":
        return ShapeValue.Tuple.shapeOf(t == null ? TensorShape.unknown() : t.shape());
      case "size": {
        Integer axis = constant(args, 0);
        return t == null || axis == null ? new ShapeValue.Int(Dim.UNKNOWN) : ev.dimRead(scope, t, axis, call);
      }
      case "rows":
      case "columns": {
        if (t == null || t.shape().rank() != 2) {
          return new ShapeValue.Int(Dim.UNKNOWN);
        }
        return ev.dimRead(scope, t, q.equals("rows") ? 0 : 1, call);
      }
      case "rank":
        return new ShapeValue.Int(t != null && t.shape().rankKnown() ? Dim.of(t.shape().rank()) : Dim.UNKNOWN);
      case "length":
        return new ShapeValue.Int(t != null ? t.shape().elementCount() : Dim.UNKNOWN);
      case "dim": {
        // DJL: x.getShape().get(i) reads size i of x.
        Integer axis = constant(args, 0);
        Expression inner = scope == null ? null : ShapeEvaluator.unwrap(scope);
        if (axis != null && inner instanceof MethodCallExpr shapeCall && shapeCall.getScope().isPresent()
            && "shape".equals(ev.query(shapeCall))
            && ev.valueOf(shapeCall.getScope().get()) instanceof Tensor owner) {
          return ev.dimRead(shapeCall.getScope().get(), owner, axis, call);
        }
        if (axis != null && receiver instanceof ShapeValue.Tuple tu && tu.elements() != null
            && axis >= 0 && axis < tu.elements().size()) {
          return new ShapeValue.Int(tu.elements().get(axis));
        }
        return new ShapeValue.Int(Dim.UNKNOWN);
      }
      default:
        return null;
    }
  }

  // ------------------------------------------------------------------ helpers

  static Integer constant(List<ShapeValue> args, int i) {
    if (i < 0 || i >= args.size() || !(args.get(i) instanceof ShapeValue.Int n) || !n.value().isConstant()) {
      return null;
    }
    return (int) n.value().constant().getAsLong();
  }

  /** A value as a tensor: itself, or a tensor of unknown shape when the expression has a tensor type. */
  Tensor tensor(ShapeValue v, Expression e, Framework fw) {
    if (v instanceof Tensor t) {
      return t;
    }
    return Tensor.of(TensorShape.unknown(), fw, null);
  }

  /** The result of an operation: a new tensor made at the call. */
  Tensor fresh(MethodCallExpr call, ShapeOutcome out, Framework fw) {
    ev.state = ev.state.forget(Site.of(call));
    return Tensor.of(out.fails() ? TensorShape.unknown() : out.result(), fw, Site.of(call));
  }

  private static List<Expression> scopeList(MethodCallExpr call) {
    return call.getScope().map(List::of).orElse(List.of());
  }

  private static List<Expression> operands(MethodCallExpr call) {
    List<Expression> out = new ArrayList<>();
    call.getScope().ifPresent(out::add);
    out.add(call.getArgument(0));
    return out;
  }

  Framework framework(ApiMethod m) {
    return ev.analysis.context.model.type(m.owner()).flatMap(t -> Framework.fromModel(t.framework())).orElse(null);
  }

  /**
   * Records an operation; a shape-sensitive use also records each unchecked reshape that reaches
   * it through one of the operands.
   */
  void record(MethodCallExpr call, OpKind kind, Framework fw, List<Expression> exprs, List<Tensor> tensors,
      ShapeOutcome out, boolean inPlace, ShapeFacts.ReducedOperand reduced, boolean use) {
    if (ev.sink == null) {
      return;
    }
    if (use) {
      recordUse(call, tensors);
    }
    List<com.github.javaparser.ast.Node> origins = new ArrayList<>();
    for (Tensor t : tensors) {
      com.github.javaparser.ast.Node o = t.origin() == null ? null : t.origin().node();
      boolean here = o != null && o.findCompilationUnit().orElse(null) == call.findCompilationUnit().orElse(null);
      origins.add(here ? o : null);
    }
    ev.sink.add(new ShapeFacts.Operation(ev.analysis.graph, call, kind, fw, exprs,
        tensors.stream().map(Tensor::shape).toList(), out, inPlace, reduced, java.util.Collections.unmodifiableList(origins)));
  }

  void recordUse(com.github.javaparser.ast.Node use, List<Tensor> tensors) {
    if (ev.sink == null) {
      return;
    }
    for (Tensor t : tensors) {
      List<Site> sites = new ArrayList<>(t.uncheckedReshapes());
      sites.sort(Comparator.comparingInt(Site::line));
      for (Site s : sites) {
        if (s.node() instanceof MethodCallExpr reshape) {
          java.util.Optional<ApiMethod> api = ev.types.apiMethod(reshape);
          String helper = api.isPresent() ? null : ev.types.projectMethod(reshape).map(pm -> pm.name()).orElse(null);
          boolean permute = api.map(m -> m.effect() == dev.plumbline.model.Effect.PERMUTE).orElse(false);
          ev.sink.add(new ShapeFacts.UncheckedReshape(ev.analysis.graph, reshape, helper, permute, use, t.shape()));
        }
      }
    }
  }
}
