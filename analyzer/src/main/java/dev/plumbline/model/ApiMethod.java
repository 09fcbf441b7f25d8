package dev.plumbline.model;

import java.util.List;
import java.util.Map;

/**
 * One library method or constructor (name {@code <init>}) and what it does.
 *
 * @param owner the declaring or inheriting type, fully qualified
 * @param name method name, or {@code <init>} for a constructor
 * @param params parameter types as written in Java source with generics erased, varargs as {@code T...}
 * @param returns return type, fully qualified, or {@code void}
 * @param isStatic whether the method is static
 * @param effect what the method does
 * @param attributes effect-specific facts (e.g. {@code inPlace=true}, {@code part=test}, {@code dataArg=0})
 */
public record ApiMethod(
    String owner,
    String name,
    List<String> params,
    String returns,
    boolean isStatic,
    Effect effect,
    Map<String, String> attributes) {

  public static final String CONSTRUCTOR = "<init>";

  public ApiMethod {
    params = List.copyOf(params == null ? List.of() : params);
    attributes = Map.copyOf(attributes == null ? Map.of() : attributes);
    effect = effect == null ? Effect.NONE : effect;
  }

  public boolean isConstructor() {
    return CONSTRUCTOR.equals(name);
  }

  public boolean isVarArgs() {
    return !params.isEmpty() && params.get(params.size() - 1).endsWith("...");
  }

  /** Whether a call with {@code argumentCount} arguments can bind to this method. */
  public boolean acceptsArity(int argumentCount) {
    if (isVarArgs()) {
      return argumentCount >= params.size() - 1;
    }
    return argumentCount == params.size();
  }

  public String attribute(String key) {
    return attributes.get(key);
  }

  public boolean flag(String key) {
    return "true".equals(attributes.get(key));
  }

  /** Integer attribute, or {@code fallback} when absent. */
  public int intAttribute(String key, int fallback) {
    String v = attributes.get(key);
    return v == null ? fallback : Integer.parseInt(v);
  }

  /** Readable signature, e.g. {@code DataSet.splitTestAndTrain(double)}. */
  public String signature() {
    String simpleOwner = owner.substring(owner.lastIndexOf('.') + 1);
    return simpleOwner + "." + (isConstructor() ? simpleOwner : name) + "(" + String.join(", ", params) + ")";
  }
}
