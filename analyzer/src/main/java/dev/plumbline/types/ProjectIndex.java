package dev.plumbline.types;

import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.body.BodyDeclaration;
import com.github.javaparser.ast.body.CallableDeclaration;
import com.github.javaparser.ast.body.ClassOrInterfaceDeclaration;
import com.github.javaparser.ast.body.ConstructorDeclaration;
import com.github.javaparser.ast.body.EnumDeclaration;
import com.github.javaparser.ast.body.MethodDeclaration;
import com.github.javaparser.ast.body.RecordDeclaration;
import com.github.javaparser.ast.body.TypeDeclaration;
import com.github.javaparser.ast.type.ClassOrInterfaceType;
import dev.plumbline.model.ApiModel;
import dev.plumbline.model.TypeRole;
import dev.plumbline.parse.Subtrees;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Collection;
import java.util.Deque;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * The scanned project's own types and methods, so that calls into project code and project
 * subclasses of library types are understood. Built once per scan, before files are analyzed;
 * immutable afterwards and shared by all analysis threads.
 *
 * <p>Only what declarations say is recorded: declared supertypes (resolved through each file's
 * imports) and declared method return types. Overloads are told apart by arity only.
 */
public final class ProjectIndex {

  /** A project method declaration with its resolved return type. */
  public record ProjectMethod(String ownerType, CallableDeclaration<?> declaration, String returnType) {
    public String name() {
      return declaration instanceof ConstructorDeclaration ? "<init>" : declaration.getNameAsString();
    }

    public int arity() {
      return declaration.getParameters().size();
    }

    public boolean isVarArgs() {
      return declaration.getParameters().stream().anyMatch(p -> p.isVarArgs());
    }

    public boolean isStatic() {
      return declaration instanceof MethodDeclaration m && m.isStatic();
    }

    public boolean acceptsArity(int n) {
      return isVarArgs() ? n >= arity() - 1 : n == arity();
    }
  }

  /** A project type: its declaration, resolved supertypes and methods. */
  public record ProjectType(String name, TypeDeclaration<?> declaration, List<String> supertypes,
      List<ProjectMethod> methods) {}

  private final ApiModel model;
  private final Map<String, ProjectType> types;
  /** {@link #selfAndSupertypes} of every project type, computed once: it is asked for on every call. */
  private final Map<String, List<String>> supertypeClosures;

  private final Set<String> typeNames;
  /**
   * The library roles of each type asked about, with its supertypes': asked on nearly every
   * expression. A memo of a pure function, safe to share between the analysis threads.
   */
  private final Map<String, Set<TypeRole>> roles = new java.util.concurrent.ConcurrentHashMap<>();

  private ProjectIndex(ApiModel model, Map<String, ProjectType> types, Set<String> typeNames) {
    this.model = model;
    this.types = types;
    Map<String, List<String>> closures = new HashMap<>();
    for (String name : types.keySet()) {
      closures.put(name, List.copyOf(computeSelfAndSupertypes(name)));
    }
    this.supertypeClosures = Map.copyOf(closures);
    this.typeNames = typeNames;
  }

  /** Qualified names of all types the project declares (for resolving names across files). */
  public Set<String> typeNames() {
    return typeNames;
  }

  public static ProjectIndex build(ApiModel model, Collection<CompilationUnit> units) {
    Set<String> names = new HashSet<>();
    for (CompilationUnit unit : units) {
      names.addAll(declaredTypeNames(unit));
    }
    Set<String> typeNames = Set.copyOf(names);
    List<List<ProjectType>> perUnit = new ArrayList<>();
    for (CompilationUnit unit : units) {
      perUnit.add(declaredTypes(model, unit, typeNames));
    }
    return of(model, perUnit, typeNames);
  }

  /**
   * The index of the types each unit declares, given in the units' order: where two units
   * declare the same qualified name, the first keeps it. With {@link #declaredTypeNames} and
   * {@link #declaredTypes}, lets a caller index the units in parallel.
   */
  public static ProjectIndex of(ApiModel model, List<List<ProjectType>> perUnit,
      Set<String> typeNames) {
    Map<String, ProjectType> types = new LinkedHashMap<>();
    for (List<ProjectType> declared : perUnit) {
      for (ProjectType type : declared) {
        types.putIfAbsent(type.name(), type);
      }
    }
    return new ProjectIndex(model, Map.copyOf(types), Set.copyOf(typeNames));
  }

  /** Qualified names of the types a unit declares (local classes have none). */
  public static Set<String> declaredTypeNames(CompilationUnit unit) {
    Set<String> names = new HashSet<>();
    for (TypeDeclaration<?> type : Subtrees.findAll(unit, TypeDeclaration.class)) {
      type.getFullyQualifiedName().ifPresent(names::add);
    }
    return names;
  }

  /**
   * The types a unit declares, with supertypes and return types resolved through its imports
   * against the project's {@code typeNames}; a name declared twice in the unit keeps the first.
   */
  public static List<ProjectType> declaredTypes(ApiModel model, CompilationUnit unit,
      Set<String> typeNames) {
    TypeResolver resolver = new TypeResolver(unit, model, typeNames::contains);
    Map<String, ProjectType> types = new LinkedHashMap<>();
    for (TypeDeclaration<?> type : Subtrees.findAll(unit, TypeDeclaration.class)) {
      Optional<String> qualified = type.getFullyQualifiedName();
      if (qualified.isEmpty() || types.containsKey(qualified.get())) {
        continue; // local classes have no qualified name; duplicates keep the first
      }
      List<String> supers = new ArrayList<>();
      List<ClassOrInterfaceType> written = new ArrayList<>();
      if (type instanceof ClassOrInterfaceDeclaration c) {
        written.addAll(c.getExtendedTypes());
        written.addAll(c.getImplementedTypes());
      } else if (type instanceof EnumDeclaration e) {
        written.addAll(e.getImplementedTypes());
      } else if (type instanceof RecordDeclaration r) {
        written.addAll(r.getImplementedTypes());
      }
      for (ClassOrInterfaceType t : written) {
        String resolved = resolver.resolve(t);
        if (resolved != null) {
          supers.add(resolved);
        }
      }
      List<ProjectMethod> methods = new ArrayList<>();
      for (BodyDeclaration<?> member : type.getMembers()) {
        if (!(member instanceof CallableDeclaration<?> callable)) {
          continue;
        }
        String returns = callable instanceof MethodDeclaration m ? resolver.resolve(m.getType())
            : qualified.get();
        methods.add(new ProjectMethod(qualified.get(), callable, returns));
      }
      types.put(qualified.get(), new ProjectType(qualified.get(), type, List.copyOf(supers),
          List.copyOf(methods)));
    }
    return List.copyOf(types.values());
  }

  /** An index with no project types, for analyzing a lone snippet. */
  public static ProjectIndex empty(ApiModel model) {
    return new ProjectIndex(model, Map.of(), Set.of());
  }

  public ApiModel model() {
    return model;
  }

  /** Whether the project declares a type of this qualified name. */
  public boolean hasType(String name) {
    return types.containsKey(name);
  }

  public Optional<ProjectType> type(String name) {
    return Optional.ofNullable(types.get(name));
  }

  /** The type, its project supertypes and, through them, listed library supertypes. */
  public List<String> selfAndSupertypes(String name) {
    List<String> known = supertypeClosures.get(name);
    return known != null ? known : model.selfAndSupertypes(name);
  }

  private List<String> computeSelfAndSupertypes(String name) {
    List<String> out = new ArrayList<>();
    Set<String> seen = new HashSet<>();
    Deque<String> work = new ArrayDeque<>();
    work.add(name);
    while (!work.isEmpty()) {
      String t = work.poll();
      if (!seen.add(t)) {
        continue;
      }
      ProjectType pt = types.get(t);
      if (pt != null) {
        out.add(t);
        work.addAll(pt.supertypes());
      } else {
        for (String s : model.selfAndSupertypes(t)) {
          if (seen.add(s) || s.equals(t)) {
            out.add(s);
          }
        }
      }
    }
    return out;
  }

  /** Whether a project or library type has the role, through any supertype. */
  public boolean hasRole(String typeName, TypeRole role) {
    if (typeName == null) {
      return false;
    }
    return roles.computeIfAbsent(typeName, this::computeRoles).contains(role);
  }

  /** Whether a project or library type has any of the roles, through any supertype. */
  public boolean hasAnyRole(String typeName, Set<TypeRole> wanted) {
    if (typeName == null) {
      return false;
    }
    for (TypeRole role : roles.computeIfAbsent(typeName, this::computeRoles)) {
      if (wanted.contains(role)) {
        return true;
      }
    }
    return false;
  }

  private Set<TypeRole> computeRoles(String typeName) {
    Set<TypeRole> out = java.util.EnumSet.noneOf(TypeRole.class);
    for (String t : selfAndSupertypes(typeName)) {
      model.type(t).ifPresent(at -> out.addAll(at.roles()));
    }
    return java.util.Collections.unmodifiableSet(out);
  }

  /** Project methods callable on {@code typeName} by name and arity, nearest class first. */
  public List<ProjectMethod> methods(String typeName, String name, int arity) {
    List<ProjectMethod> out = new ArrayList<>();
    for (String t : selfAndSupertypes(typeName)) {
      ProjectType pt = types.get(t);
      if (pt == null) {
        continue;
      }
      for (ProjectMethod m : pt.methods()) {
        if (m.name().equals(name) && m.acceptsArity(arity)) {
          out.add(m);
        }
      }
      if (!out.isEmpty()) {
        return out; // nearest declaring class wins (overriding)
      }
    }
    return out;
  }

  /** The listed library type nearest to {@code typeName} in its supertype chain, if any. */
  public Optional<String> nearestLibraryType(String typeName) {
    for (String t : selfAndSupertypes(typeName)) {
      if (model.type(t).isPresent()) {
        return Optional.of(t);
      }
    }
    return Optional.empty();
  }
}
