package dev.plumbline.model;

import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Collection;
import java.util.Deque;
import java.util.HashMap;
import java.util.HashSet;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * Facts about the deep-learning libraries, kept as data in {@code api-model.json} beside this
 * class. Every type and method listed there is checked against the real library jars by
 * reflection in {@code ApiModelReflectionTest}, so the model cannot drift from the real API.
 *
 * <p>File format: {@code types} is a list of {name, framework, roles, supertypes, attributes};
 * {@code methods} maps an owner type to a list of {sig, returns, effect, attributes}, where
 * {@code sig} is {@code [static ]name(ParamType, ...)} and a constructor is written {@code <init>(...)}.
 *
 * <p>Instances are immutable and safe to share between threads.
 */
public final class ApiModel {
  public static final String RESOURCE = "api-model.json";

  private final Map<String, ApiType> types;
  private final Map<String, List<ApiType>> typesBySimpleName;
  private final Map<String, List<ApiMethod>> methodsByOwner;
  /** Owner, then method name: {@link #lookup} runs for every call the analyses see. */
  private final Map<String, Map<String, List<ApiMethod>>> methodsByOwnerAndName;
  private final Set<String> packages;
  /** {@link #selfAndSupertypes} of every listed type, computed once: it is asked for on every call. */
  private final Map<String, List<String>> supertypeClosures;

  private ApiModel(List<ApiType> typeList, List<ApiMethod> methodList) {
    Map<String, ApiType> byName = new TreeMap<>();
    Map<String, List<ApiType>> bySimple = new HashMap<>();
    Set<String> pkgs = new TreeSet<>();
    for (ApiType t : typeList) {
      if (byName.put(t.name(), t) != null) {
        throw new IllegalArgumentException("type listed twice in the API model: " + t.name());
      }
      bySimple.computeIfAbsent(t.simpleName(), k -> new ArrayList<>()).add(t);
      pkgs.add(t.packageName());
    }
    Map<String, List<ApiMethod>> byOwner = new LinkedHashMap<>();
    for (ApiMethod m : methodList) {
      if (!byName.containsKey(m.owner())) {
        throw new IllegalArgumentException("method owner is not a listed type: " + m.signature());
      }
      byOwner.computeIfAbsent(m.owner(), k -> new ArrayList<>()).add(m);
    }
    for (ApiType t : typeList) {
      for (String s : t.supertypes()) {
        if (!byName.containsKey(s)) {
          throw new IllegalArgumentException("supertype of " + t.name() + " is not listed: " + s);
        }
      }
    }
    this.types = Map.copyOf(byName);
    this.typesBySimpleName = copyLists(bySimple);
    this.methodsByOwner = copyLists(byOwner);
    Map<String, Map<String, List<ApiMethod>>> byOwnerAndName = new HashMap<>();
    this.methodsByOwner.forEach((owner, methods) -> {
      Map<String, List<ApiMethod>> byMethodName = new LinkedHashMap<>();
      for (ApiMethod m : methods) {
        byMethodName.computeIfAbsent(m.name(), k -> new ArrayList<>()).add(m);
      }
      byOwnerAndName.put(owner, copyLists(byMethodName));
    });
    this.methodsByOwnerAndName = Map.copyOf(byOwnerAndName);
    this.packages = Set.copyOf(pkgs);
    Map<String, List<String>> closures = new HashMap<>();
    for (String name : this.types.keySet()) {
      closures.put(name, List.copyOf(computeSelfAndSupertypes(name)));
    }
    this.supertypeClosures = Map.copyOf(closures);
  }

  private static <T> Map<String, List<T>> copyLists(Map<String, List<T>> in) {
    Map<String, List<T>> out = new HashMap<>();
    in.forEach((k, v) -> out.put(k, List.copyOf(v)));
    return Map.copyOf(out);
  }

  /** The bundled model. Each call reads the resource again; callers keep the instance they need. */
  public static ApiModel loadDefault() {
    try (InputStream in = ApiModel.class.getResourceAsStream(RESOURCE)) {
      if (in == null) {
        throw new IllegalStateException("bundled API model is missing: " + RESOURCE);
      }
      return load(in);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  public static ApiModel load(InputStream json) throws IOException {
    ObjectMapper mapper = new ObjectMapper()
        .enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION)
        .enable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES);
    JsonNode root = mapper.readTree(json);
    List<ApiType> typeList = new ArrayList<>();
    for (JsonNode t : root.path("types")) {
      Set<TypeRole> roles = new LinkedHashSet<>();
      for (JsonNode r : t.path("roles")) {
        roles.add(TypeRole.valueOf(r.asText()));
      }
      List<String> supers = new ArrayList<>();
      t.path("supertypes").forEach(s -> supers.add(s.asText()));
      typeList.add(new ApiType(
          required(t, "name"), required(t, "framework"), roles, supers, stringMap(t.path("attributes"))));
    }
    List<ApiMethod> methodList = new ArrayList<>();
    Iterator<Map.Entry<String, JsonNode>> owners = root.path("methods").fields();
    while (owners.hasNext()) {
      Map.Entry<String, JsonNode> owner = owners.next();
      for (JsonNode m : owner.getValue()) {
        methodList.add(parseMethod(owner.getKey(), m));
      }
    }
    return new ApiModel(typeList, methodList);
  }

  private static ApiMethod parseMethod(String owner, JsonNode m) {
    String sig = required(m, "sig").trim();
    boolean isStatic = sig.startsWith("static ");
    if (isStatic) {
      sig = sig.substring("static ".length()).trim();
    }
    int open = sig.indexOf('(');
    if (open <= 0 || !sig.endsWith(")")) {
      throw new IllegalArgumentException("bad signature in API model for " + owner + ": " + sig);
    }
    String name = sig.substring(0, open).trim();
    String inside = sig.substring(open + 1, sig.length() - 1).trim();
    List<String> params = new ArrayList<>();
    if (!inside.isEmpty()) {
      for (String p : inside.split(",")) {
        params.add(p.trim());
      }
    }
    String effect = m.path("effect").asText("NONE");
    String returns = m.path("returns").asText(ApiMethod.CONSTRUCTOR.equals(name) ? owner : "void");
    return new ApiMethod(owner, name, params, returns, isStatic, Effect.valueOf(effect),
        stringMap(m.path("attributes")));
  }

  private static String required(JsonNode node, String field) {
    JsonNode v = node.get(field);
    if (v == null || !v.isTextual() || v.asText().isBlank()) {
      throw new IllegalArgumentException("API model entry lacks '" + field + "': " + node);
    }
    return v.asText();
  }

  private static Map<String, String> stringMap(JsonNode node) {
    Map<String, String> out = new LinkedHashMap<>();
    node.fields().forEachRemaining(e -> out.put(e.getKey(), e.getValue().asText()));
    return out;
  }

  // ------------------------------------------------------------------ queries

  public Collection<ApiType> types() {
    return types.values();
  }

  /** All methods, owners in file order. */
  public List<ApiMethod> methods() {
    List<ApiMethod> all = new ArrayList<>();
    methodsByOwner.values().forEach(all::addAll);
    return all;
  }

  public Optional<ApiType> type(String qualifiedName) {
    return Optional.ofNullable(types.get(qualifiedName));
  }

  /** Listed types with this simple name (several frameworks may share one, e.g. {@code DataSet}). */
  public List<ApiType> typesWithSimpleName(String simpleName) {
    return typesBySimpleName.getOrDefault(simpleName, List.of());
  }

  /** Packages that contain at least one listed type; used to resolve on-demand imports. */
  public Set<String> packages() {
    return packages;
  }

  /** The type itself and all its listed supertypes, nearest first. */
  public List<String> selfAndSupertypes(String qualifiedName) {
    List<String> known = supertypeClosures.get(qualifiedName);
    return known != null ? known : List.of(qualifiedName);
  }

  private List<String> computeSelfAndSupertypes(String qualifiedName) {
    List<String> out = new ArrayList<>();
    Set<String> seen = new HashSet<>();
    Deque<String> work = new ArrayDeque<>();
    work.add(qualifiedName);
    while (!work.isEmpty()) {
      String t = work.poll();
      if (!seen.add(t)) {
        continue;
      }
      out.add(t);
      ApiType type = types.get(t);
      if (type != null) {
        work.addAll(type.supertypes());
      }
    }
    return out;
  }

  public boolean isSubtype(String qualifiedName, String ancestor) {
    return selfAndSupertypes(qualifiedName).contains(ancestor);
  }

  /** Whether the type or one of its supertypes has the role. */
  public boolean hasRole(String qualifiedName, TypeRole role) {
    if (qualifiedName == null) {
      return false;
    }
    for (String t : selfAndSupertypes(qualifiedName)) {
      ApiType type = types.get(t);
      if (type != null && type.roles().contains(role)) {
        return true;
      }
    }
    return false;
  }

  /** First value of a type attribute along the supertype chain, nearest first. */
  public Optional<String> typeAttribute(String qualifiedName, String key) {
    for (String t : selfAndSupertypes(qualifiedName)) {
      ApiType type = types.get(t);
      if (type != null && type.attributes().containsKey(key)) {
        return Optional.of(type.attributes().get(key));
      }
    }
    return Optional.empty();
  }

  /**
   * Methods named {@code name} callable on {@code receiverType} with {@code arity} arguments,
   * looking through listed supertypes; nearest declarations first.
   */
  public List<ApiMethod> lookup(String receiverType, String name, int arity) {
    List<ApiMethod> out = new ArrayList<>();
    for (String t : selfAndSupertypes(receiverType)) {
      for (ApiMethod m : methodsByOwnerAndName.getOrDefault(t, Map.of()).getOrDefault(name, List.of())) {
        if (m.acceptsArity(arity) && !overriddenIn(out, m)) {
          out.add(m);
        }
      }
    }
    return out;
  }

  /**
   * Whether a nearer declaration with the same parameters overrides {@code m} (JLS 8.4.8.1),
   * possibly with a narrower return type, as DL4J's layer builders' build() do.
   */
  private static boolean overriddenIn(List<ApiMethod> nearer, ApiMethod m) {
    for (ApiMethod n : nearer) {
      if (n.isStatic() == m.isStatic() && n.params().equals(m.params())) {
        return true;
      }
    }
    return false;
  }

  /**
   * The one effect shared by all candidate overloads, or empty when they disagree or none match:
   * with argument types unknown, the analyses act only on what every overload would do.
   */
  public Optional<ApiMethod> resolve(String receiverType, String name, int arity) {
    List<ApiMethod> candidates = lookup(receiverType, name, arity);
    if (candidates.isEmpty()) {
      return Optional.empty();
    }
    ApiMethod first = candidates.get(0);
    for (ApiMethod m : candidates) {
      if (m.effect() != first.effect() || !m.returns().equals(first.returns())
          || !m.attributes().equals(first.attributes())) {
        return Optional.empty();
      }
    }
    return Optional.of(first);
  }

  /**
   * Like {@link #resolve(String, String, int)}, but drops overloads that cannot accept an argument
   * whose static type is known ({@code null} entries are unknown).
   */
  public Optional<ApiMethod> resolve(String receiverType, String name, List<String> argumentTypes) {
    List<ApiMethod> candidates = new ArrayList<>();
    for (ApiMethod m : lookup(receiverType, name, argumentTypes.size())) {
      if (accepts(m, argumentTypes)) {
        candidates.add(m);
      }
    }
    if (candidates.isEmpty()) {
      return Optional.empty();
    }
    ApiMethod first = candidates.get(0);
    for (ApiMethod m : candidates) {
      if (m.effect() != first.effect() || !m.returns().equals(first.returns())
          || !m.attributes().equals(first.attributes())) {
        return Optional.empty();
      }
    }
    return Optional.of(first);
  }

  private boolean accepts(ApiMethod m, List<String> argumentTypes) {
    List<String> params = m.params();
    for (int i = 0; i < argumentTypes.size(); i++) {
      String arg = argumentTypes.get(i);
      if (arg == null) {
        continue;
      }
      String param;
      if (m.isVarArgs() && i >= params.size() - 1) {
        String last = params.get(params.size() - 1);
        String element = last.substring(0, last.length() - 3);
        // A single array argument may fill the varargs slot itself.
        param = arg.endsWith("[]") && argumentTypes.size() == params.size() ? element + "[]" : element;
      } else {
        param = params.get(i);
      }
      if (!assignable(arg, param)) {
        return false;
      }
    }
    return true;
  }

  private static final List<String> WIDENING =
      List.of("byte", "short", "char", "int", "long", "float", "double");

  /** JLS 5.3 assignment contexts, as far as source-level type names allow us to tell. */
  private boolean assignable(String from, String to) {
    if (from.equals(to) || to.equals("java.lang.Object")) {
      return true;
    }
    if (from.endsWith("[]") || to.endsWith("[]")) {
      return arrayAssignable(from, to);
    }
    int f = WIDENING.indexOf(from);
    int t = WIDENING.indexOf(to);
    if (f >= 0 && t >= 0) {
      return f <= t && !(from.equals("char") && (to.equals("short") || to.equals("byte")));
    }
    if (f >= 0) {
      return to.equals("java.lang.Number") && !from.equals("char") && !from.equals("boolean")
          || to.equals("java.lang." + boxed(from));
    }
    if (from.equals("boolean") || to.equals("boolean")) {
      return from.equals(to) || to.equals("java.lang.Boolean");
    }
    if (t >= 0) {
      return from.equals("java.lang." + boxed(to));
    }
    if (types.containsKey(from)) {
      return isSubtype(from, to) || !types.containsKey(to);
    }
    return true; // an unlisted class type: we cannot tell, so do not exclude the overload
  }

  /**
   * JLS 5.2 for arrays: an array goes to {@code Object}, {@code Cloneable} or
   * {@code Serializable}, or to an array of the same depth whose element type it can be assigned
   * to by reference; arrays of primitives only to the identical type.
   */
  private boolean arrayAssignable(String from, String to) {
    if (!from.endsWith("[]")) {
      return false;
    }
    if (!to.endsWith("[]")) {
      return to.equals("java.lang.Cloneable") || to.equals("java.io.Serializable");
    }
    String fromElement = from.substring(0, from.length() - 2);
    String toElement = to.substring(0, to.length() - 2);
    if (WIDENING.contains(fromElement) || WIDENING.contains(toElement)
        || fromElement.equals("boolean") || toElement.equals("boolean")) {
      return fromElement.equals(toElement);
    }
    return assignable(fromElement, toElement);
  }

  private static String boxed(String primitive) {
    return switch (primitive) {
      case "int" -> "Integer";
      case "char" -> "Character";
      default -> Character.toUpperCase(primitive.charAt(0)) + primitive.substring(1);
    };
  }
}
