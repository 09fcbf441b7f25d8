package dev.plumbline.analysis.shape;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.ClassOrInterfaceDeclaration;
import com.github.javaparser.ast.body.FieldDeclaration;
import com.github.javaparser.ast.body.Parameter;
import com.github.javaparser.ast.body.TypeDeclaration;
import com.github.javaparser.ast.body.VariableDeclarator;
import com.github.javaparser.ast.expr.ArrayAccessExpr;
import com.github.javaparser.ast.expr.ArrayCreationExpr;
import com.github.javaparser.ast.expr.ArrayInitializerExpr;
import com.github.javaparser.ast.expr.AssignExpr;
import com.github.javaparser.ast.expr.BinaryExpr;
import com.github.javaparser.ast.expr.CastExpr;
import com.github.javaparser.ast.expr.ConditionalExpr;
import com.github.javaparser.ast.expr.EnclosedExpr;
import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.FieldAccessExpr;
import com.github.javaparser.ast.expr.LambdaExpr;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.expr.MethodReferenceExpr;
import com.github.javaparser.ast.expr.NameExpr;
import com.github.javaparser.ast.expr.ObjectCreationExpr;
import com.github.javaparser.ast.expr.ThisExpr;
import com.github.javaparser.ast.expr.UnaryExpr;
import com.github.javaparser.ast.expr.VariableDeclarationExpr;
import com.github.javaparser.ast.stmt.AssertStmt;
import com.github.javaparser.ast.stmt.ExplicitConstructorInvocationStmt;
import com.github.javaparser.ast.stmt.ExpressionStmt;
import com.github.javaparser.ast.stmt.ForEachStmt;
import com.github.javaparser.ast.stmt.ReturnStmt;
import com.github.javaparser.ast.stmt.ThrowStmt;
import com.github.javaparser.ast.stmt.YieldStmt;
import dev.plumbline.flow.CfgNode;
import dev.plumbline.model.ApiMethod;
import dev.plumbline.model.TypeRole;
import dev.plumbline.parse.NumberLiterals;
import dev.plumbline.parse.Subtrees;
import dev.plumbline.types.ExpressionTypes;
import dev.plumbline.types.ProjectIndex;
import dev.plumbline.types.Variable;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.Set;

/**
 * Evaluates one node's expressions in Java's order, threading the {@link ShapeState}, and, in
 * the final pass only, records {@link ShapeFacts}. Library calls are handed to
 * {@link TensorTransfer} and {@link NetworkTransfer}, project methods to {@link HelperCalls}.
 */
final class ShapeEvaluator {
  /** {@code java.util.Arrays} methods that only read the arrays they are given. */
  private static final java.util.Set<String> READ_ONLY_ARRAYS_METHODS = java.util.Set.of(
      "toString", "deepToString", "equals", "deepEquals", "hashCode", "deepHashCode", "stream",
      "copyOf", "copyOfRange", "binarySearch", "compare", "mismatch");

  private static final Set<String> INTEGRAL = Set.of("int", "long", "short", "byte",
      "java.lang.Integer", "java.lang.Long", "java.lang.Short", "java.lang.Byte");

  final ShapeAnalysis analysis;
  final ExpressionTypes types;
  final ShapeFacts sink;
  ShapeState state;
  private Node nameTarget;
  private String nameHint;

  ShapeEvaluator(ShapeAnalysis analysis, ShapeFacts sink) {
    this.analysis = analysis;
    this.types = analysis.types;
    this.sink = sink;
  }

  ShapeState node(CfgNode node, ShapeState in) {
    state = in;
    Node ast = node.ast();
    switch (node.kind()) {
      case ENTRY, EXIT, JOIN, CATCH -> {
        return in;
      }
      case FOREACH_NEXT -> {
        ForEachStmt f = (ForEachStmt) ast;
        for (VariableDeclarator d : f.getVariable().getVariables()) {
          Variable v = types.symbols().variableOf(d);
          state = state.with(v, settle(null, f, v));
        }
        return state;
      }
      default -> {
        statementOrExpression(ast);
        return state;
      }
    }
  }

  private void statementOrExpression(Node ast) {
    if (ast instanceof ExpressionStmt es) {
      eval(es.getExpression());
    } else if (ast instanceof Expression e) {
      eval(e);
    } else if (ast instanceof ReturnStmt r) {
      r.getExpression().ifPresent(this::eval);
    } else if (ast instanceof ThrowStmt t) {
      eval(t.getExpression());
    } else if (ast instanceof AssertStmt as) {
      assertion(as);
    } else if (ast instanceof YieldStmt y) {
      eval(y.getExpression());
    } else if (ast instanceof ExplicitConstructorInvocationStmt ec) {
      ec.getArguments().forEach(this::eval);
    }
  }

  /** An assert teaches its condition (when asserts run, the path continues only if it holds). */
  private void assertion(AssertStmt as) {
    ShapeChecks checks = new ShapeChecks(analysis);
    ShapeState before = state;
    boolean holds = sink != null && checks.alreadyHolds(as.getCheck(), before);
    eval(as.getCheck());
    as.getMessage().ifPresent(this::eval);
    if (sink != null) {
      checks.describeAssertion(as, before, holds, sink);
    }
    state = checks.markChecked(as.getCheck(), checks.learn(as.getCheck(), state, true));
  }

  // ------------------------------------------------------------------ expressions

  ShapeValue eval(Expression e) {
    ShapeValue v = compute(e);
    if (sink != null && v instanceof ShapeValue.Tensor t) {
      sink.shape(e, t.shape());
    }
    return v;
  }

  /** Evaluates {@code e}, naming a symbol it creates at its top after the variable it initializes. */
  ShapeValue evalNamed(Expression e, String name) {
    Node saved = nameTarget;
    String savedHint = nameHint;
    nameTarget = unwrap(e);
    nameHint = name;
    try {
      return eval(e);
    } finally {
      nameTarget = saved;
      nameHint = savedHint;
    }
  }

  /** The display name for a symbol created at {@code site}. */
  String nameFor(Node site) {
    return site == nameTarget && nameHint != null ? nameHint : dev.plumbline.flow.AstText.abbreviate(site);
  }

  /** The value of {@code e} in the current state, without changing it or recording anything. */
  ShapeValue valueOf(Expression e) {
    ShapeEvaluator silent = new ShapeEvaluator(analysis, null);
    silent.state = state;
    return silent.eval(e);
  }

  private ShapeValue compute(Expression e) {
    if (e instanceof EnclosedExpr en) {
      return eval(en.getInner());
    }
    if (e instanceof CastExpr c) {
      ShapeValue inner = eval(c.getExpression());
      String to = types.symbols().types().resolve(c.getType());
      return to == null || INTEGRAL.contains(to) || inner instanceof ShapeValue.Tensor ? inner : null;
    }
    if (e.isIntegerLiteralExpr()) {
      return new ShapeValue.Int(Dim.of(NumberLiterals.value(e.asIntegerLiteralExpr()).longValue()));
    }
    if (e.isLongLiteralExpr()) {
      return new ShapeValue.Int(Dim.of(NumberLiterals.value(e.asLongLiteralExpr()).longValue()));
    }
    if (e instanceof UnaryExpr u) {
      return unary(u);
    }
    if (e instanceof BinaryExpr b) {
      return binary(b);
    }
    if (e instanceof NameExpr n) {
      return types.symbols().resolve(n).map(v -> read(v, n)).orElse(null);
    }
    if (e instanceof FieldAccessExpr fa) {
      return fieldAccess(fa);
    }
    if (e instanceof ArrayAccessExpr aa) {
      return arrayAccess(aa);
    }
    if (e instanceof ArrayCreationExpr ac) {
      return arrayCreation(ac);
    }
    if (e instanceof ArrayInitializerExpr ai) {
      return arrayInitializer(ai);
    }
    if (e instanceof VariableDeclarationExpr vde) {
      declare(vde);
      return null;
    }
    if (e instanceof AssignExpr as) {
      return assign(as);
    }
    if (e instanceof ConditionalExpr c) {
      eval(c.getCondition());
      ShapeState before = state;
      ShapeValue t = eval(c.getThenExpr());
      ShapeState afterThen = state;
      state = before;
      ShapeValue f = eval(c.getElseExpr());
      state = state.join(afterThen);
      return ShapeValue.join(t, f);
    }
    if (e instanceof MethodCallExpr call) {
      return call(call);
    }
    if (e instanceof ObjectCreationExpr oce) {
      return construct(oce);
    }
    if (e instanceof LambdaExpr || e instanceof MethodReferenceExpr) {
      return null; // evaluated in its own graph
    }
    for (Node child : e.getChildNodes()) {
      if (child instanceof Expression ce) {
        eval(ce);
      }
    }
    return null;
  }

  private ShapeValue unary(UnaryExpr u) {
    ShapeValue v = eval(u.getExpression());
    switch (u.getOperator()) {
      case MINUS:
        return v instanceof ShapeValue.Int i ? new ShapeValue.Int(i.value().times(Dim.of(-1))) : null;
      case PLUS:
        return v;
      case PREFIX_INCREMENT, POSTFIX_INCREMENT, PREFIX_DECREMENT, POSTFIX_DECREMENT: {
        Optional<Variable> target = targetOf(u.getExpression());
        if (target.isPresent()) {
          long step = u.getOperator() == UnaryExpr.Operator.PREFIX_INCREMENT
              || u.getOperator() == UnaryExpr.Operator.POSTFIX_INCREMENT ? 1 : -1;
          Dim now = v instanceof ShapeValue.Int i ? i.value() : Dim.UNKNOWN;
          Dim next = now.plus(Dim.of(step));
          state = state.with(target.get(), new ShapeValue.Int(next));
          return new ShapeValue.Int(u.isPrefix() ? next : now);
        }
        if (unwrap(u.getExpression()) instanceof ArrayAccessExpr element) {
          // The index was evaluated with the element; its value only matters when constant.
          ShapeValue index = element.getIndex() instanceof com.github.javaparser.ast.expr.IntegerLiteralExpr
              ? eval(element.getIndex()) : null;
          long step = u.getOperator() == UnaryExpr.Operator.PREFIX_INCREMENT
              || u.getOperator() == UnaryExpr.Operator.POSTFIX_INCREMENT ? 1 : -1;
          Dim now = v instanceof ShapeValue.Int i ? i.value() : Dim.UNKNOWN;
          changeElement(element, index, new ShapeValue.Int(now.plus(Dim.of(step))));
          return new ShapeValue.Int(u.isPrefix() ? now.plus(Dim.of(step)) : now);
        }
        return null;
      }
      default:
        return null;
    }
  }

  private ShapeValue binary(BinaryExpr b) {
    ShapeValue l = eval(b.getLeft());
    ShapeValue r = eval(b.getRight());
    if (!(l instanceof ShapeValue.Int li) || !(r instanceof ShapeValue.Int ri)) {
      return null;
    }
    return switch (b.getOperator()) {
      case PLUS -> new ShapeValue.Int(li.value().plus(ri.value()));
      case MINUS -> new ShapeValue.Int(li.value().minus(ri.value()));
      case MULTIPLY -> new ShapeValue.Int(li.value().times(ri.value()));
      case DIVIDE -> new ShapeValue.Int(li.value().dividedBy(ri.value()));
      default -> null;
    };
  }

  // ------------------------------------------------------------------ variables and fields

  /** A variable's value; parameters and fields get their entry values on first read. */
  ShapeValue read(Variable v, Expression at) {
    Optional<ShapeValue> known = state.get(v);
    if (known.isPresent()) {
      if (known.get() instanceof ShapeValue.Tuple t && storedFromNestedCode(v)) {
        return t.overwritten(); // the lambda may have run, or may run, at any time
      }
      return known.get();
    }
    String type = types.typeOf(v);
    if (v.kind() == Variable.Kind.PARAMETER) {
      if (isIntegral(type)) {
        return new ShapeValue.Int(Dim.of(Symbol.at(v.declaration(), v.name())));
      }
      if (isTensor(type)) {
        return ShapeValue.Tensor.of(TensorShape.unknown(), framework(type), Site.of(v.declaration()));
      }
      return null;
    }
    if (v.kind() == Variable.Kind.FIELD && v.declaration() instanceof VariableDeclarator d) {
      return fieldValue(d, type, at);
    }
    return null;
  }

  /**
   * A field's value when read: a final field with a constant or creating initializer has that
   * value; another final field is one fixed symbol; a non-final field may change between reads,
   * so each read is its own symbol.
   */
  private ShapeValue fieldValue(VariableDeclarator d, String type, Expression at) {
    boolean fixed = isFinalField(d);
    if (isIntegral(type)) {
      if (fixed && d.getInitializer().isPresent()) {
        ShapeValue init = initializerValue(d);
        if (init instanceof ShapeValue.Int i && i.value().known()) {
          return i;
        }
      }
      if (fixed) {
        return new ShapeValue.Int(Dim.of(Symbol.at(d, d.getNameAsString())));
      }
      state = state.forget(Site.of(at));
      return new ShapeValue.Int(Dim.of(Symbol.at(at, d.getNameAsString())));
    }
    if (isTensor(type)) {
      if (fixed && d.getInitializer().isPresent()) {
        ShapeValue init = initializerValue(d);
        if (init instanceof ShapeValue.Tensor t) {
          return t.withOrigin(Site.of(d));
        }
      }
      if (fixed) {
        return ShapeValue.Tensor.of(TensorShape.unknown(), framework(type), Site.of(d));
      }
      state = state.forget(Site.of(at));
      return ShapeValue.Tensor.of(TensorShape.unknown(), framework(type), Site.of(at));
    }
    return null;
  }

  /** A field initializer evaluated on its own (it can only use constants and other fields). */
  private ShapeValue initializerValue(VariableDeclarator d) {
    if (!analysis.context.evaluatingFields.add(d)) {
      return null; // a cycle between constants
    }
    try {
      ExpressionTypes fieldTypes = analysis.context.typesFor(d);
      if (fieldTypes == null) {
        return null;
      }
      ShapeAnalysis fieldAnalysis = new ShapeAnalysis(analysis.context, fieldTypes, analysis.graph,
          ShapeState.EMPTY, analysis.depth);
      ShapeEvaluator e = new ShapeEvaluator(fieldAnalysis, null);
      e.state = ShapeState.EMPTY;
      return e.eval(d.getInitializer().get());
    } finally {
      analysis.context.evaluatingFields.remove(d);
    }
  }

  private static boolean isFinalField(VariableDeclarator d) {
    if (!(d.getParentNode().orElse(null) instanceof FieldDeclaration f)) {
      return false;
    }
    if (f.isFinal()) {
      return true;
    }
    return f.getParentNode().orElse(null) instanceof ClassOrInterfaceDeclaration c && c.isInterface();
  }

  private ShapeValue fieldAccess(FieldAccessExpr fa) {
    if (fa.getScope() instanceof ThisExpr) {
      return types.symbols().field(fa, fa.getNameAsString()).map(v -> read(v, fa)).orElse(null);
    }
    String typeName = types.typeReference(fa.getScope());
    if (typeName != null) {
      return staticField(typeName, fa);
    }
    ShapeValue scope = eval(fa.getScope());
    if (fa.getNameAsString().equals("length") && scope instanceof ShapeValue.Tuple t && t.elements() != null) {
      return new ShapeValue.Int(Dim.of(t.elements().size()));
    }
    return null;
  }

  /** {@code Type.NAME} of a project type: its constant value when it is a final field. */
  private ShapeValue staticField(String typeName, FieldAccessExpr fa) {
    Optional<ProjectIndex.ProjectType> type = analysis.context.project.type(typeName);
    if (type.isEmpty()) {
      return null;
    }
    TypeDeclaration<?> decl = type.get().declaration();
    Optional<FieldDeclaration> field = decl.getFieldByName(fa.getNameAsString());
    if (field.isEmpty()) {
      return null;
    }
    for (VariableDeclarator d : field.get().getVariables()) {
      if (d.getNameAsString().equals(fa.getNameAsString()) && isFinalField(d) && d.getInitializer().isPresent()) {
        ShapeValue v = initializerValue(d);
        if (v instanceof ShapeValue.Int i && i.value().isConstant()) {
          return v;
        }
        if (v instanceof ShapeValue.Tensor t) {
          return t.withOrigin(Site.of(d));
        }
      }
    }
    return null;
  }

  private void declare(VariableDeclarationExpr vde) {
    for (VariableDeclarator d : vde.getVariables()) {
      Variable v = types.symbols().variableOf(d);
      ShapeValue init = d.getInitializer().map(i -> evalNamed(i, d.getNameAsString())).orElse(null);
      state = state.with(v, d.getInitializer().isPresent() ? settle(init, d, v) : null);
    }
  }

  private ShapeValue assign(AssignExpr as) {
    if (unwrap(as.getTarget()) instanceof ArrayAccessExpr element) {
      return storeElement(element, as.getOperator(), as.getValue());
    }
    Optional<Variable> target = targetOf(as.getTarget());
    ShapeValue value = target.isPresent() ? evalNamed(as.getValue(), target.get().name()) : eval(as.getValue());
    if (as.getOperator() != AssignExpr.Operator.ASSIGN) {
      ShapeValue now = target.map(v -> read(v, as.getTarget())).orElse(null);
      value = compound(as.getOperator(), now, value);
    }
    if (target.isPresent()) {
      value = settle(value, as, target.get());
      state = state.with(target.get(), value);
    } else {
      eval(as.getTarget());
    }
    return value;
  }

  private static ShapeValue compound(AssignExpr.Operator op, ShapeValue now, ShapeValue operand) {
    if (!(now instanceof ShapeValue.Int a) || !(operand instanceof ShapeValue.Int b)) {
      return null;
    }
    return switch (op) {
      case PLUS -> new ShapeValue.Int(a.value().plus(b.value()));
      case MINUS -> new ShapeValue.Int(a.value().minus(b.value()));
      case MULTIPLY -> new ShapeValue.Int(a.value().times(b.value()));
      case DIVIDE -> new ShapeValue.Int(a.value().dividedBy(b.value()));
      default -> null;
    };
  }

  /**
   * The value a variable gets at {@code site}: an unknown {@code int} becomes a symbol named
   * after the variable (so later uses of it agree with each other), an unknown tensor a tensor
   * of unknown shape made here.
   */
  private ShapeValue settle(ShapeValue value, Node site, Variable v) {
    String type = types.typeOf(v);
    if (isIntegral(type) && !(value instanceof ShapeValue.Int i && i.value().known())) {
      state = state.forget(Site.of(site));
      return new ShapeValue.Int(Dim.of(Symbol.at(site, v.name())));
    }
    if (isTensor(type)) {
      if (value instanceof ShapeValue.Tensor t) {
        if (t.origin() == null) {
          state = state.forget(Site.of(site));
          return t.withOrigin(Site.of(site));
        }
        return t;
      }
      state = state.forget(Site.of(site));
      return ShapeValue.Tensor.of(TensorShape.unknown(), framework(type), Site.of(site));
    }
    return value;
  }

  Optional<Variable> targetOf(Expression target) {
    Expression t = unwrap(target);
    if (t instanceof NameExpr n) {
      return types.symbols().resolve(n);
    }
    if (t instanceof FieldAccessExpr fa && fa.getScope() instanceof ThisExpr) {
      return types.symbols().field(fa, fa.getNameAsString());
    }
    return Optional.empty();
  }

  /** The current value of a variable as a tensor, entry values included. */
  ShapeValue.Tensor tensorValueOf(Variable v, Expression at) {
    return read(v, at) instanceof ShapeValue.Tensor t ? t : null;
  }

  // ------------------------------------------------------------------ arrays

  /**
   * {@code a[i] = v} (or a compound assignment) on an array of sizes held in a variable: the
   * element becomes {@code v} when the index is a known constant, every element becomes unknown
   * otherwise. A store into an inner array ({@code m[i][j] = v}) keeps the outer array's
   * contents but, storing an array, may change its nested shape.
   */
  private ShapeValue storeElement(ArrayAccessExpr element, AssignExpr.Operator op, Expression valueExpr) {
    ShapeValue arr = eval(element.getName());
    ShapeValue index = eval(element.getIndex());
    ShapeValue value = eval(valueExpr);
    if (op != AssignExpr.Operator.ASSIGN) {
      value = compound(op, elementOf(arr, index), value);
    }
    changeElement(element, index, value);
    return value;
  }

  /** Records that an element of the array behind {@code element} now holds {@code value}. */
  private void changeElement(ArrayAccessExpr element, ShapeValue index, ShapeValue value) {
    Expression array = unwrap(element.getName());
    Expression root = array;
    while (root instanceof ArrayAccessExpr inner) {
      root = unwrap(inner.getName());
    }
    Optional<Variable> holder = targetOf(root);
    if (holder.isEmpty() || !(read(holder.get(), root) instanceof ShapeValue.Tuple t)) {
      return;
    }
    ShapeValue.Tuple after;
    if (root != array) {
      after = value instanceof ShapeValue.Tuple ? t.overwritten() : new ShapeValue.Tuple(t.elements(), t.data());
    } else {
      Long at = index instanceof ShapeValue.Int i && i.value().isConstant() ? i.value().constant().getAsLong() : null;
      after = t.storing(at, value instanceof ShapeValue.Int n ? n.value() : Dim.UNKNOWN);
    }
    state = state.with(holder.get(), after);
  }

  private static ShapeValue elementOf(ShapeValue arr, ShapeValue index) {
    if (arr instanceof ShapeValue.Tuple t && t.elements() != null && index instanceof ShapeValue.Int i
        && i.value().isConstant()) {
      long k = i.value().constant().getAsLong();
      return k >= 0 && k < t.elements().size() ? new ShapeValue.Int(t.elements().get((int) k)) : null;
    }
    return null;
  }

  /**
   * Whether a local array is written into from a lambda or a class body within its scope: those
   * stores run when the code is called, which this flow analysis does not follow.
   */
  private boolean storedFromNestedCode(Variable v) {
    if (v.kind() == Variable.Kind.FIELD) {
      return false;
    }
    return analysis.context.storedFromNestedCode.computeIfAbsent(v.declaration(), declaration -> {
      Node scope = declaration.findAncestor(com.github.javaparser.ast.body.CallableDeclaration.class)
          .map(n -> (Node) n).orElse(null);
      if (scope == null) {
        return true;
      }
      for (ArrayAccessExpr access : Subtrees.findAll(scope, ArrayAccessExpr.class)) {
        Node parent = access.getParentNode().orElse(null);
        boolean store = parent instanceof AssignExpr as && as.getTarget() == access
            || parent instanceof UnaryExpr u && u.getExpression() == access && isStep(u.getOperator());
        if (!store) {
          continue;
        }
        Expression root = unwrap(access.getName());
        while (root instanceof ArrayAccessExpr inner) {
          root = unwrap(inner.getName());
        }
        if (root instanceof NameExpr n && types.symbols().resolve(n).filter(x -> x == v).isPresent()
            && nestedBoundaryBetween(access, declaration)) {
          return true;
        }
      }
      return false;
    });
  }

  private static boolean isStep(UnaryExpr.Operator op) {
    return op == UnaryExpr.Operator.PREFIX_INCREMENT || op == UnaryExpr.Operator.POSTFIX_INCREMENT
        || op == UnaryExpr.Operator.PREFIX_DECREMENT || op == UnaryExpr.Operator.POSTFIX_DECREMENT;
  }

  /** Whether a lambda or class body lies between {@code node} and the code that declares {@code declaration}. */
  private static boolean nestedBoundaryBetween(Node node, Node declaration) {
    for (Node current = node.getParentNode().orElse(null); current != null;
        current = current.getParentNode().orElse(null)) {
      if (encloses(current, declaration)) {
        return false; // reached code that also encloses the declaration
      }
      if (current instanceof LambdaExpr || current instanceof com.github.javaparser.ast.body.BodyDeclaration<?>
          || current instanceof ObjectCreationExpr oce && oce.getAnonymousClassBody().isPresent()) {
        return true;
      }
    }
    return false;
  }

  private static boolean encloses(Node ancestor, Node node) {
    for (Node n = node; n != null; n = n.getParentNode().orElse(null)) {
      if (n == ancestor) {
        return true;
      }
    }
    return false;
  }

  /**
   * Java arrays handed to code we do not model (a project method, a library outside the API
   * model such as {@code Arrays.fill}) may be written into there: their contents are forgotten.
   * A DJL {@code Shape} cannot change, and the JDK's read-only array utilities do not write.
   */
  private void mayWriteInto(MethodCallExpr call, List<Expression> arguments, List<ShapeValue> values) {
    if (call != null && call.getScope().isPresent()
        && "java.util.Arrays".equals(types.typeReference(call.getScope().get()))
        && READ_ONLY_ARRAYS_METHODS.contains(call.getNameAsString())) {
      return;
    }
    for (int i = 0; i < arguments.size(); i++) {
      String type = types.typeOf(arguments.get(i));
      if (values.get(i) instanceof ShapeValue.Tuple t && type != null && type.endsWith("[]")) {
        Optional<Variable> holder = targetOf(arguments.get(i));
        if (holder.isPresent()) {
          state = state.with(holder.get(), t.overwritten());
        }
      }
    }
  }

  private ShapeValue arrayAccess(ArrayAccessExpr aa) {
    Expression array = unwrap(aa.getName());
    // x.shape()[i] reads one size of x: name it and remember it in x's shape.
    if (array instanceof MethodCallExpr shapeCall && shapeCall.getScope().isPresent()
        && "shape".equals(query(shapeCall))) {
      ShapeValue scope = eval(shapeCall.getScope().get());
      ShapeValue index = eval(aa.getIndex());
      if (scope instanceof ShapeValue.Tensor t && index instanceof ShapeValue.Int i && i.value().isConstant()) {
        return dimRead(shapeCall.getScope().get(), t, (int) i.value().constant().getAsLong(), aa);
      }
      return new ShapeValue.Int(Dim.UNKNOWN);
    }
    ShapeValue arr = eval(aa.getName());
    ShapeValue index = eval(aa.getIndex());
    if (arr instanceof ShapeValue.Tuple t && t.elements() != null && index instanceof ShapeValue.Int i
        && i.value().isConstant()) {
      long k = i.value().constant().getAsLong();
      return k >= 0 && k < t.elements().size() ? new ShapeValue.Int(t.elements().get((int) k)) : null;
    }
    if (arr instanceof ShapeValue.TensorList l && index instanceof ShapeValue.Int i && i.value().isConstant()) {
      long k = i.value().constant().getAsLong();
      return k >= 0 && k < l.items().size() ? l.items().get((int) k) : null;
    }
    return null;
  }

  private ShapeValue arrayCreation(ArrayCreationExpr ac) {
    List<Dim> levels = new ArrayList<>();
    for (var level : ac.getLevels()) {
      ShapeValue size = level.getDimension().map(this::eval).orElse(null);
      levels.add(size instanceof ShapeValue.Int i ? i.value() : Dim.UNKNOWN);
    }
    if (ac.getInitializer().isPresent()) {
      return arrayInitializer(ac.getInitializer().get());
    }
    boolean allGiven = ac.getLevels().stream().allMatch(l -> l.getDimension().isPresent());
    return new ShapeValue.Tuple(null, allGiven ? TensorShape.of(levels) : TensorShape.ofRank(levels.size()));
  }

  private ShapeValue arrayInitializer(ArrayInitializerExpr ai) {
    List<Dim> elements = new ArrayList<>();
    List<ShapeValue> values = new ArrayList<>();
    for (Expression v : ai.getValues()) {
      ShapeValue value = eval(v);
      values.add(value);
      elements.add(value instanceof ShapeValue.Int i ? i.value() : Dim.UNKNOWN);
    }
    return new ShapeValue.Tuple(elements, dataShape(ai, values));
  }

  /** The shape of a (possibly nested) array initializer as data; inner lengths must agree. */
  private static TensorShape dataShape(ArrayInitializerExpr ai, List<ShapeValue> values) {
    List<Dim> dims = new ArrayList<>();
    dims.add(Dim.of(ai.getValues().size()));
    if (!values.isEmpty() && values.stream().allMatch(v -> v instanceof ShapeValue.Tuple t && t.data() != null)) {
      TensorShape inner = ((ShapeValue.Tuple) values.get(0)).data();
      for (ShapeValue v : values) {
        if (!((ShapeValue.Tuple) v).data().equals(inner)) {
          return null;
        }
      }
      if (!inner.rankKnown()) {
        return null;
      }
      dims.addAll(inner.dims());
    }
    return TensorShape.of(dims);
  }

  // ------------------------------------------------------------------ calls

  private ShapeValue call(MethodCallExpr call) {
    Expression scopeExpr = call.getScope().orElse(null);
    ShapeValue receiver = scopeExpr == null ? null : eval(scopeExpr);
    List<ShapeValue> args = new ArrayList<>();
    for (Expression arg : call.getArguments()) {
      args.add(eval(arg));
    }
    ShapeValue math = javaMath(call, args);
    if (math != null) {
      return math;
    }
    Optional<ApiMethod> api = types.apiMethod(call);
    if (api.isPresent()) {
      ShapeValue v = new TensorTransfer(this).call(call, api.get(), receiver, args);
      return v != TensorTransfer.NOT_HANDLED ? v : unknownResult(call);
    }
    Optional<ProjectIndex.ProjectMethod> helper = types.projectMethod(call);
    if (helper.isPresent()) {
      ShapeValue v = new HelperCalls(this).call(call, helper.get(), args);
      mayWriteInto(call, call.getArguments(), args);
      if (v != null) {
        return v;
      }
      return unknownResult(call);
    }
    mayWriteInto(call, call.getArguments(), args);
    return unknownResult(call);
  }

  /** {@code Math.toIntExact} and exact arithmetic keep the value they compute. */
  private ShapeValue javaMath(MethodCallExpr call, List<ShapeValue> args) {
    if (call.getScope().isEmpty() || !"java.lang.Math".equals(types.typeReference(call.getScope().get()))) {
      return null;
    }
    Dim a = args.size() > 0 && args.get(0) instanceof ShapeValue.Int i ? i.value() : Dim.UNKNOWN;
    Dim b = args.size() > 1 && args.get(1) instanceof ShapeValue.Int i ? i.value() : Dim.UNKNOWN;
    return switch (call.getNameAsString()) {
      case "toIntExact" -> new ShapeValue.Int(a);
      case "multiplyExact" -> new ShapeValue.Int(a.times(b));
      case "addExact" -> new ShapeValue.Int(a.plus(b));
      default -> null;
    };
  }

  /** The result of a call we do not model: an opaque tensor made here, or an opaque size. */
  ShapeValue unknownResult(MethodCallExpr call) {
    String type = types.typeOf(call);
    if (isTensor(type)) {
      state = state.forget(Site.of(call));
      return ShapeValue.Tensor.of(TensorShape.unknown(), framework(type), Site.of(call));
    }
    if (isIntegral(type)) {
      state = state.forget(Site.of(call));
      return new ShapeValue.Int(Dim.of(Symbol.at(call, nameFor(call))));
    }
    return null;
  }

  private ShapeValue construct(ObjectCreationExpr oce) {
    oce.getScope().ifPresent(this::eval);
    List<ShapeValue> args = new ArrayList<>();
    for (Expression arg : oce.getArguments()) {
      args.add(eval(arg));
    }
    Optional<ApiMethod> ctor = types.apiConstructor(oce);
    if (ctor.isPresent()) {
      ShapeValue v = new TensorTransfer(this).construct(oce, ctor.get(), args);
      if (v != TensorTransfer.NOT_HANDLED) {
        return v;
      }
    } else {
      mayWriteInto(null, oce.getArguments(), args);
    }
    String type = types.symbols().types().resolve(oce.getType());
    if (type != null) {
      Optional<String> layer = analysis.context.model.type(type).map(t -> t.attributes().get("layer"));
      if (layer.isPresent() && layer.get() != null) {
        return new NetworkValue.Layer(layer.get(), Dim.UNKNOWN, Dim.UNKNOWN, Site.of(oce));
      }
      if (isTensor(type)) {
        state = state.forget(Site.of(oce));
        return ShapeValue.Tensor.of(TensorShape.unknown(), framework(type), Site.of(oce));
      }
    }
    return null;
  }

  // ------------------------------------------------------------------ sizes

  /**
   * Reading size {@code axis} of a tensor: the known size, or a new symbol named after the
   * variable it initializes, remembered in the tensor's shape so later reads agree.
   */
  ShapeValue dimRead(Expression tensorExpr, ShapeValue.Tensor t, int axis, Node site) {
    Dim d = t.shape().dim(axis);
    if (d.known()) {
      return new ShapeValue.Int(d);
    }
    if (axis < 0 && !t.shape().rankKnown()) {
      return new ShapeValue.Int(Dim.UNKNOWN);
    }
    state = state.forget(Site.of(site));
    Symbol s = Symbol.at(site, nameFor(site));
    Optional<Variable> v = targetOf(tensorExpr);
    if (v.isPresent()) {
      ShapeValue.Tensor now = tensorValueOf(v.get(), tensorExpr);
      if (now != null) {
        state = state.with(v.get(), now.withShape(now.shape().withDim(axis, Dim.of(s))));
      }
    }
    return new ShapeValue.Int(Dim.of(s));
  }

  /** The {@code query} attribute of a SHAPE_QUERY call, or null. */
  String query(MethodCallExpr call) {
    return types.apiMethod(call)
        .filter(m -> m.effect() == dev.plumbline.model.Effect.SHAPE_QUERY)
        .map(m -> m.attribute("query"))
        .orElse(null);
  }

  // ------------------------------------------------------------------ types

  boolean isTensor(String type) {
    return type != null && !type.endsWith("[]") && types.project().hasRole(type, TypeRole.TENSOR);
  }

  /** Whether the type is a list of tensors (DJL {@code NDList}): role {@code TENSOR_LIST}. */
  boolean isTensorList(String type) {
    return type != null && types.project().hasRole(type, TypeRole.TENSOR_LIST);
  }

  static boolean isIntegral(String type) {
    return type != null && INTEGRAL.contains(type);
  }

  Framework framework(String type) {
    if (type == null) {
      return null;
    }
    for (String t : types.project().selfAndSupertypes(type)) {
      Optional<Framework> f = analysis.context.model.type(t).flatMap(at -> Framework.fromModel(at.framework()));
      if (f.isPresent()) {
        return f.get();
      }
    }
    return null;
  }

  static Expression unwrap(Expression e) {
    Expression c = e;
    while (c instanceof EnclosedExpr || c instanceof CastExpr) {
      c = c instanceof EnclosedExpr en ? en.getInner() : ((CastExpr) c).getExpression();
    }
    return c;
  }

  static boolean isParameterOfCallable(Variable v) {
    return v.kind() == Variable.Kind.PARAMETER && v.declaration() instanceof Parameter p
        && p.getParentNode().orElse(null) instanceof com.github.javaparser.ast.body.CallableDeclaration<?>;
  }
}
