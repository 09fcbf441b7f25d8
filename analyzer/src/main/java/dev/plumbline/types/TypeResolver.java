package dev.plumbline.types;

import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.ImportDeclaration;
import com.github.javaparser.ast.body.TypeDeclaration;
import com.github.javaparser.ast.type.ArrayType;
import com.github.javaparser.ast.type.ClassOrInterfaceType;
import com.github.javaparser.ast.type.Type;
import dev.plumbline.model.ApiModel;
import dev.plumbline.model.ApiType;
import dev.plumbline.parse.Subtrees;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.Predicate;

/**
 * Resolves type names written in one compilation unit to qualified names, from its imports,
 * its own package and the API model; no classpath is consulted.
 *
 * <p>Errs towards "unknown": a simple name that could mean two listed types (two on-demand
 * imports both providing it) resolves to null rather than to a guess. Generic arguments are
 * erased. Names of the project's own types resolve to their qualified name when declared in
 * this unit, imported by name, declared in the same package, or imported on demand from a
 * project package (when the resolver is given the project's type names).
 */
public final class TypeResolver {
  private static final Set<String> PRIMITIVES =
      Set.of("boolean", "byte", "short", "char", "int", "long", "float", "double", "void");

  private final ApiModel model;
  private final String packageName;
  private final Map<String, String> singleImports = new HashMap<>();
  private final List<String> onDemandPackages = new ArrayList<>();
  private final Map<String, String> localTypes = new HashMap<>();
  private final Predicate<String> projectTypes;

  public TypeResolver(CompilationUnit unit, ApiModel model) {
    this(unit, model, name -> false);
  }

  /**
   * A resolver that also knows the project's own types, so that a type of the same package
   * declared in another file, or one from a package imported on demand, resolves (JLS 6.4.1:
   * single-type imports, then types of this file, then of the package, then on-demand imports).
   *
   * @param projectTypes whether the project declares a type of this qualified name
   */
  public TypeResolver(CompilationUnit unit, ApiModel model, Predicate<String> projectTypes) {
    this.model = model;
    this.projectTypes = projectTypes;
    this.packageName = unit.getPackageDeclaration().map(p -> p.getNameAsString()).orElse("");
    for (ImportDeclaration imp : unit.getImports()) {
      if (imp.isStatic()) {
        continue;
      }
      String name = imp.getNameAsString();
      if (imp.isAsterisk()) {
        onDemandPackages.add(name);
      } else {
        singleImports.put(name.substring(name.lastIndexOf('.') + 1), name);
      }
    }
    for (TypeDeclaration<?> t : Subtrees.findAll(unit, TypeDeclaration.class)) {
      t.getFullyQualifiedName().ifPresent(q -> localTypes.putIfAbsent(t.getNameAsString(), q));
    }
  }

  /** Qualified, erased name of a written type; arrays keep their brackets; null if unknown. */
  public String resolve(Type type) {
    if (type == null || type.isVarType() || type.isUnknownType()) {
      return null;
    }
    if (type.isPrimitiveType()) {
      return type.asPrimitiveType().asString();
    }
    if (type instanceof ArrayType a) {
      String component = resolve(a.getComponentType());
      return component == null ? null : component + "[]";
    }
    if (type instanceof ClassOrInterfaceType c) {
      return resolveName(c.getScope().isPresent() ? c.getScope().get().asString() + "." + c.getNameAsString()
          : c.getNameAsString());
    }
    return null;
  }

  /** Qualified name for a simple or qualified type name as written in source; null if unknown. */
  public String resolveName(String written) {
    if (PRIMITIVES.contains(written)) {
      return written;
    }
    int dot = written.indexOf('.');
    if (dot > 0) {
      // Outer.Inner with Outer imported, or an already qualified name.
      String head = written.substring(0, dot);
      String headResolved = resolveSimple(head);
      if (headResolved != null) {
        return headResolved + written.substring(dot);
      }
      return written;
    }
    return resolveSimple(written);
  }

  private String resolveSimple(String simple) {
    String single = singleImports.get(simple);
    if (single != null) {
      return single;
    }
    String local = localTypes.get(simple);
    if (local != null) {
      return local;
    }
    String samePackage = packageName.isEmpty() ? simple : packageName + "." + simple;
    if (projectTypes.test(samePackage)) {
      return samePackage;
    }
    String onDemand = null;
    for (String pkg : onDemandPackages) {
      if (projectTypes.test(pkg + "." + simple)) {
        if (onDemand != null) {
          return null; // ambiguous between two imported packages
        }
        onDemand = pkg + "." + simple;
      }
    }
    if (onDemand != null) {
      return onDemand;
    }
    String found = null;
    for (ApiType t : model.typesWithSimpleName(simple)) {
      if (onDemandPackages.contains(t.packageName()) || t.packageName().equals(packageName)
          || t.packageName().equals("java.lang")) {
        if (found != null && !found.equals(t.name())) {
          return null; // ambiguous between two listed types
        }
        found = t.name();
      }
    }
    if (found != null) {
      return found;
    }
    if (JavaLang.TYPES.contains(simple)) {
      return "java.lang." + simple;
    }
    return null;
  }

  /** The few java.lang types the analyses care about (numbers, strings, boxes). */
  static final class JavaLang {
    static final Set<String> TYPES = Set.of("Object", "String", "Integer", "Long", "Double",
        "Float", "Short", "Byte", "Character", "Boolean", "Number", "Math", "System", "Thread",
        "Iterable", "Runnable", "AutoCloseable");

    private JavaLang() {}
  }
}
