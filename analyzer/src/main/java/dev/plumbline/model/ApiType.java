package dev.plumbline.model;

import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * A library type the analyses know.
 *
 * @param name fully qualified binary-free name (nested types with a dot)
 * @param framework nd4j, dl4j, datavec, djl or java
 * @param roles what the type is
 * @param supertypes model-relevant supertypes, so facts stated on an interface reach implementations
 * @param attributes free facts read by specific analyses (e.g. {@code learns=false} on a fixed scaler)
 */
public record ApiType(
    String name,
    String framework,
    Set<TypeRole> roles,
    List<String> supertypes,
    Map<String, String> attributes) {

  public ApiType {
    roles = Set.copyOf(roles == null ? Set.of() : roles);
    supertypes = List.copyOf(supertypes == null ? List.of() : supertypes);
    attributes = Map.copyOf(attributes == null ? Map.of() : attributes);
  }

  public String simpleName() {
    return name.substring(name.lastIndexOf('.') + 1);
  }

  public String packageName() {
    int dot = name.lastIndexOf('.');
    return dot < 0 ? "" : name.substring(0, dot);
  }
}
