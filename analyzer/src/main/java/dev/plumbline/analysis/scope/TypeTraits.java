package dev.plumbline.analysis.scope;

import com.github.javaparser.ast.expr.MethodCallExpr;
import dev.plumbline.engine.AnalysisKey;
import dev.plumbline.engine.FileContext;
import dev.plumbline.model.ApiMethod;
import dev.plumbline.model.TypeRole;
import dev.plumbline.types.ProjectIndex;
import java.util.HashMap;
import java.util.IdentityHashMap;
import java.util.Map;
import java.util.Optional;

/**
 * What the scope analysis needs to know about static types (is it a tensor, a list of tensors,
 * a scope handle; which framework; is it SameDiff) and which method each call binds to, memoized
 * per file: the solver evaluates each call many times (loop iterations, summary contexts), and
 * each answer walks supertype chains and overload lists.
 */
final class TypeTraits {
  static final AnalysisKey<TypeTraits> KEY = AnalysisKey.of("scope-type-traits", TypeTraits::new);

  private final FileContext file;
  private final ProjectIndex project;
  private final Map<String, Optional<TensorValue.Kind>> tracked = new HashMap<>();
  private final Map<String, Optional<Scope.Kind>> handles = new HashMap<>();
  private final Map<String, Optional<String>> frameworks = new HashMap<>();
  private final Map<String, Boolean> sameDiff = new HashMap<>();
  private final Map<MethodCallExpr, Optional<ApiMethod>> apiMethods = new IdentityHashMap<>();
  private final Map<MethodCallExpr, Optional<ProjectIndex.ProjectMethod>> projectMethods = new IdentityHashMap<>();

  private TypeTraits(FileContext file) {
    this.file = file;
    this.project = file.types().project();
  }

  /** The library method a call binds to, as {@code ExpressionTypes.apiMethod} says. */
  Optional<ApiMethod> apiMethod(MethodCallExpr call) {
    return apiMethods.computeIfAbsent(call, c -> file.types().apiMethod(c));
  }

  /** The project method a call binds to, as {@code ExpressionTypes.projectMethod} says. */
  Optional<ProjectIndex.ProjectMethod> projectMethod(MethodCallExpr call) {
    return projectMethods.computeIfAbsent(call, c -> file.types().projectMethod(c));
  }

  /** How a value of this static type is tracked, or null when it is not. */
  TensorValue.Kind trackedKind(String type) {
    if (type == null) {
      return null;
    }
    return tracked.computeIfAbsent(type, t -> Optional.ofNullable(computeTracked(t))).orElse(null);
  }

  private TensorValue.Kind computeTracked(String type) {
    if (type.endsWith("[]")) {
      String element = type.substring(0, type.length() - 2);
      return project.hasRole(element, TypeRole.TENSOR) ? TensorValue.Kind.TENSOR_LIST : null;
    }
    if (project.hasRole(type, TypeRole.TENSOR)) {
      return TensorValue.Kind.TENSOR;
    }
    if (project.hasRole(type, TypeRole.TENSOR_LIST)) {
      return TensorValue.Kind.TENSOR_LIST;
    }
    return handleKind(type) != null ? TensorValue.Kind.SCOPE_HANDLE : null;
  }

  /** The kind of scope a handle of this type denotes, or null. */
  Scope.Kind handleKind(String type) {
    if (type == null) {
      return null;
    }
    return handles.computeIfAbsent(type, t -> Optional.ofNullable(computeHandle(t))).orElse(null);
  }

  private Scope.Kind computeHandle(String type) {
    if (project.hasRole(type, TypeRole.GRADIENT_SCOPE)) {
      return Scope.Kind.AUTOGRAD;
    }
    if (project.hasRole(type, TypeRole.SCOPED_RESOURCE)) {
      return Scope.Kind.BATCH;
    }
    if (project.hasRole(type, TypeRole.MEMORY_SCOPE)) {
      return "djl".equals(framework(type)) ? Scope.Kind.MANAGER : Scope.Kind.WORKSPACE;
    }
    return null;
  }

  /** Framework of the nearest listed library type: djl, nd4j, ... or null. */
  String framework(String type) {
    if (type == null) {
      return null;
    }
    return frameworks.computeIfAbsent(type, t -> {
      String element = t.endsWith("[]") ? t.substring(0, t.length() - 2) : t;
      return project.nearestLibraryType(element).flatMap(file.model()::type).map(at -> at.framework());
    }).orElse(null);
  }

  /** Whether the type is a SameDiff graph or variable. */
  boolean isSameDiff(String type) {
    if (type == null) {
      return false;
    }
    return sameDiff.computeIfAbsent(type, t -> {
      Optional<String> library = project.nearestLibraryType(t);
      return library.isPresent()
          && file.model().typeAttribute(library.get(), "graph").map("samediff"::equals).orElse(false);
    });
  }
}
