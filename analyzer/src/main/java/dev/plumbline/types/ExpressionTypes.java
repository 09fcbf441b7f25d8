package dev.plumbline.types;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.Parameter;
import com.github.javaparser.ast.body.TypeDeclaration;
import com.github.javaparser.ast.body.VariableDeclarator;
import com.github.javaparser.ast.expr.ArrayAccessExpr;
import com.github.javaparser.ast.expr.ArrayCreationExpr;
import com.github.javaparser.ast.expr.AssignExpr;
import com.github.javaparser.ast.expr.BinaryExpr;
import com.github.javaparser.ast.expr.CastExpr;
import com.github.javaparser.ast.expr.ConditionalExpr;
import com.github.javaparser.ast.expr.EnclosedExpr;
import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.FieldAccessExpr;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.expr.NameExpr;
import com.github.javaparser.ast.expr.ObjectCreationExpr;
import com.github.javaparser.ast.expr.ThisExpr;
import com.github.javaparser.ast.expr.UnaryExpr;
import com.github.javaparser.ast.stmt.ForEachStmt;
import dev.plumbline.model.ApiMethod;
import dev.plumbline.model.ApiModel;
import java.util.ArrayList;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Static types of expressions in one compilation unit, from declarations, the API model and the
 * project index: the "type facts" of the design. Answers null when unsure; never guesses
 * between overloads with different return types.
 *
 * <p>Not thread-safe; one instance per unit.
 */
public final class ExpressionTypes {
  private static final String STRING = "java.lang.String";

  private final SymbolTable symbols;
  private final ProjectIndex project;
  private final ApiModel model;
  private final Map<Node, String> cache = new IdentityHashMap<>();
  private final Map<Node, Boolean> inProgress = new IdentityHashMap<>();
  /** Bindings of calls and constructions: analyses ask again on every visit of a loop body. */
  private final Map<MethodCallExpr, Optional<ApiMethod>> apiMethods = new IdentityHashMap<>();
  private final Map<ObjectCreationExpr, Optional<ApiMethod>> apiConstructors = new IdentityHashMap<>();
  private final Map<MethodCallExpr, Optional<ProjectIndex.ProjectMethod>> projectMethods =
      new IdentityHashMap<>();

  public ExpressionTypes(SymbolTable symbols, ProjectIndex project) {
    this.symbols = symbols;
    this.project = project;
    this.model = project.model();
  }

  public SymbolTable symbols() {
    return symbols;
  }

  public ProjectIndex project() {
    return project;
  }

  /** Static type of a variable: declared, or inferred from the initializer of a {@code var}. */
  public String typeOf(Variable v) {
    if (v.declaredType() != null) {
      return v.declaredType();
    }
    Node decl = v.declaration();
    if (decl instanceof VariableDeclarator d && d.getInitializer().isPresent()) {
      return typeOf(d.getInitializer().get());
    }
    if (decl instanceof Parameter p && p.getParentNode().orElse(null) instanceof ForEachStmt) {
      return null;
    }
    if (decl.getParentNode().orElse(null) instanceof com.github.javaparser.ast.expr.VariableDeclarationExpr vde
        && vde.getParentNode().orElse(null) instanceof ForEachStmt) {
      return null; // element types of generic iterables are erased
    }
    return null;
  }

  /** Static type of an expression, qualified and erased; null when unknown. */
  public String typeOf(Expression e) {
    if (cache.containsKey(e)) {
      return cache.get(e);
    }
    if (inProgress.put(e, Boolean.TRUE) != null) {
      return null; // a var initializer that refers to itself through a cycle
    }
    String t;
    try {
      t = compute(e);
    } finally {
      inProgress.remove(e);
    }
    cache.put(e, t);
    return t;
  }

  private String compute(Expression e) {
    if (e instanceof EnclosedExpr en) {
      return typeOf(en.getInner());
    }
    if (e instanceof NameExpr n) {
      return symbols.resolve(n).map(this::typeOf).orElse(null);
    }
    if (e instanceof FieldAccessExpr fa) {
      if (fa.getScope() instanceof ThisExpr) {
        return symbols.field(fa, fa.getNameAsString()).map(this::typeOf).orElse(null);
      }
      return null;
    }
    if (e instanceof ObjectCreationExpr oce) {
      return symbols.types().resolve(oce.getType());
    }
    if (e instanceof CastExpr c) {
      return symbols.types().resolve(c.getType());
    }
    if (e instanceof ArrayCreationExpr ac) {
      String element = symbols.types().resolve(ac.getElementType());
      return element == null ? null : element + "[]".repeat(ac.getLevels().size());
    }
    if (e instanceof ArrayAccessExpr aa) {
      String array = typeOf(aa.getName());
      return array != null && array.endsWith("[]") ? array.substring(0, array.length() - 2) : null;
    }
    if (e instanceof AssignExpr a) {
      return typeOf(a.getTarget());
    }
    if (e instanceof ConditionalExpr c) {
      String left = typeOf(c.getThenExpr());
      String right = typeOf(c.getElseExpr());
      return left != null && left.equals(right) ? left : null;
    }
    if (e.isStringLiteralExpr() || e.isTextBlockLiteralExpr()) {
      return STRING;
    }
    if (e.isIntegerLiteralExpr()) {
      return "int";
    }
    if (e.isLongLiteralExpr()) {
      return "long";
    }
    if (e.isDoubleLiteralExpr()) {
      String v = e.asDoubleLiteralExpr().getValue();
      return v.endsWith("f") || v.endsWith("F") ? "float" : "double";
    }
    if (e.isBooleanLiteralExpr()) {
      return "boolean";
    }
    if (e.isCharLiteralExpr()) {
      return "char";
    }
    if (e instanceof UnaryExpr u) {
      return u.getOperator() == UnaryExpr.Operator.LOGICAL_COMPLEMENT ? "boolean" : typeOf(u.getExpression());
    }
    if (e instanceof BinaryExpr b) {
      return binaryType(b);
    }
    if (e instanceof MethodCallExpr call) {
      return callReturnType(call);
    }
    return null;
  }

  private String binaryType(BinaryExpr b) {
    switch (b.getOperator()) {
      case OR, AND, EQUALS, NOT_EQUALS, LESS, GREATER, LESS_EQUALS, GREATER_EQUALS:
        return "boolean";
      default:
        break;
    }
    String l = typeOf(b.getLeft());
    String r = typeOf(b.getRight());
    if (b.getOperator() == BinaryExpr.Operator.PLUS && (STRING.equals(l) || STRING.equals(r))) {
      return STRING;
    }
    if (l == null || r == null) {
      return null;
    }
    for (String wide : List.of("double", "float", "long")) {
      if (l.equals(wide) || r.equals(wide)) {
        return wide;
      }
    }
    return isIntegral(l) && isIntegral(r) ? "int" : null;
  }

  private static boolean isIntegral(String t) {
    return t.equals("int") || t.equals("short") || t.equals("byte") || t.equals("char");
  }

  /** Type named by a scope expression used as a type ({@code Nd4j} in {@code Nd4j.create()}). */
  public String typeReference(Expression scope) {
    if (scope instanceof NameExpr n && symbols.resolve(n).isEmpty()) {
      String resolved = symbols.types().resolveName(n.getNameAsString());
      return resolved != null ? resolved : samePackageType(n);
    }
    if (scope instanceof FieldAccessExpr fa && looksQualified(fa)) {
      String written = dottedName(fa);
      String resolved = symbols.types().resolveName(written);
      return resolved != null ? resolved : written;
    }
    return null;
  }

  /** {@code a.b.C} as written, from the identifiers (no printing, no comments). */
  private static String dottedName(Expression e) {
    if (e instanceof FieldAccessExpr f) {
      return dottedName(f.getScope()) + "." + f.getNameAsString();
    }
    return ((NameExpr) e).getNameAsString();
  }

  /**
   * A project type of the unit's own package, which Java makes visible without an import
   * (JLS 6.4.1, 7.4.1): {@code Layers.flatten(x)} with {@code Layers} declared in another file.
   */
  private String samePackageType(NameExpr n) {
    String pkg = n.findCompilationUnit().flatMap(u -> u.getPackageDeclaration())
        .map(p -> p.getNameAsString() + ".").orElse("");
    String candidate = pkg + n.getNameAsString();
    return project.type(candidate).isPresent() ? candidate : null;
  }

  private static boolean looksQualified(FieldAccessExpr fa) {
    Expression current = fa;
    while (current instanceof FieldAccessExpr f) {
      current = f.getScope();
    }
    return current instanceof NameExpr;
  }

  /** The receiver type of a call and whether the call is static; empty if unknown. */
  public Optional<Receiver> receiverOf(MethodCallExpr call) {
    if (call.getScope().isEmpty() || call.getScope().get() instanceof ThisExpr) {
      return enclosingType(call).map(t -> new Receiver(t, false, true));
    }
    Expression scope = call.getScope().get();
    String instanceType = typeOf(scope);
    if (instanceType != null) {
      return Optional.of(new Receiver(instanceType, false, false));
    }
    String staticType = typeReference(scope);
    if (staticType != null) {
      return Optional.of(new Receiver(staticType, true, false));
    }
    return Optional.empty();
  }

  /** A resolved call receiver: its type, whether it is a type name, and whether it is implicit this. */
  public record Receiver(String type, boolean isStatic, boolean isImplicitThis) {}

  /** Qualified name of the class whose body contains the node. */
  public Optional<String> enclosingType(Node node) {
    Node current = node;
    while (current != null) {
      if (current instanceof TypeDeclaration<?> t) {
        return t.getFullyQualifiedName();
      }
      if (current instanceof ObjectCreationExpr oce && oce.getAnonymousClassBody().isPresent()
          && !isInside(node, oce.getArguments())) {
        return Optional.ofNullable(symbols.types().resolve(oce.getType()));
      }
      current = current.getParentNode().orElse(null);
    }
    return Optional.empty();
  }

  private static boolean isInside(Node node, List<? extends Node> roots) {
    for (Node r : roots) {
      Node c = node;
      while (c != null) {
        if (c == r) {
          return true;
        }
        c = c.getParentNode().orElse(null);
      }
    }
    return false;
  }

  /** The library method a call binds to, if the receiver type is known and the model lists it. */
  public Optional<ApiMethod> apiMethod(MethodCallExpr call) {
    Optional<ApiMethod> known = apiMethods.get(call);
    if (known == null) {
      known = computeApiMethod(call);
      apiMethods.put(call, known);
    }
    return known;
  }

  private Optional<ApiMethod> computeApiMethod(MethodCallExpr call) {
    Optional<Receiver> receiver = receiverOf(call);
    if (receiver.isEmpty()) {
      return Optional.empty();
    }
    String type = receiver.get().type();
    Optional<String> library = project.type(type).isPresent() ? project.nearestLibraryType(type)
        : Optional.of(type);
    if (library.isEmpty()) {
      return Optional.empty();
    }
    if (!project.methods(type, call.getNameAsString(), call.getArguments().size()).isEmpty()) {
      return Optional.empty(); // the project overrides or declares it: not the library's behaviour
    }
    List<String> argTypes = new ArrayList<>();
    for (Expression arg : call.getArguments()) {
      argTypes.add(typeOf(arg));
    }
    return model.resolve(library.get(), call.getNameAsString(), argTypes)
        .filter(m -> m.isStatic() == receiver.get().isStatic() || !receiver.get().isStatic());
  }

  /** The library constructor a {@code new} expression binds to, if listed. */
  public Optional<ApiMethod> apiConstructor(ObjectCreationExpr creation) {
    Optional<ApiMethod> known = apiConstructors.get(creation);
    if (known == null) {
      known = computeApiConstructor(creation);
      apiConstructors.put(creation, known);
    }
    return known;
  }

  private Optional<ApiMethod> computeApiConstructor(ObjectCreationExpr creation) {
    String type = symbols.types().resolve(creation.getType());
    if (type == null || creation.getAnonymousClassBody().isPresent()) {
      return Optional.empty();
    }
    List<String> argTypes = new ArrayList<>();
    for (Expression arg : creation.getArguments()) {
      argTypes.add(typeOf(arg));
    }
    return model.resolve(type, ApiMethod.CONSTRUCTOR, argTypes)
        .filter(m -> m.owner().equals(type));
  }

  /** The project method a call binds to: exactly one candidate by receiver, name and arity. */
  public Optional<ProjectIndex.ProjectMethod> projectMethod(MethodCallExpr call) {
    Optional<ProjectIndex.ProjectMethod> known = projectMethods.get(call);
    if (known == null) {
      known = computeProjectMethod(call);
      projectMethods.put(call, known);
    }
    return known;
  }

  private Optional<ProjectIndex.ProjectMethod> computeProjectMethod(MethodCallExpr call) {
    Optional<Receiver> receiver = receiverOf(call);
    if (receiver.isEmpty()) {
      return Optional.empty();
    }
    List<ProjectIndex.ProjectMethod> candidates =
        project.methods(receiver.get().type(), call.getNameAsString(), call.getArguments().size());
    return candidates.size() == 1 ? Optional.of(candidates.get(0)) : Optional.empty();
  }

  private String callReturnType(MethodCallExpr call) {
    Optional<ProjectIndex.ProjectMethod> pm = projectMethod(call);
    if (pm.isPresent()) {
      return pm.get().returnType();
    }
    return apiMethod(call).map(ApiMethod::returns).filter(r -> !r.equals("void")).orElse(null);
  }
}
