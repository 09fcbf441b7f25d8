package dev.plumbline.model;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.reflect.Constructor;
import java.lang.reflect.Executable;
import java.lang.reflect.GenericArrayType;
import java.lang.reflect.Method;
import java.lang.reflect.Modifier;
import java.lang.reflect.ParameterizedType;
import java.lang.reflect.Type;
import java.lang.reflect.TypeVariable;
import java.lang.reflect.WildcardType;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;

/**
 * Checks every type and method of the API model against the real library jars on the test
 * classpath (org.nd4j:nd4j-api, org.deeplearning4j:deeplearning4j-nn,
 * org.deeplearning4j:deeplearning4j-datavec-iterators, org.datavec:datavec-api 1.0.0-M2.1;
 * ai.djl:api and ai.djl:basicdataset 0.36.0) by reflection: each type exists and has its listed supertypes,
 * and each method exists with the stated static-ness, parameter types and return type, after
 * resolving the type variables the owner binds (so {@code DataNormalization.fit(DataSet)},
 * declared generically in a superinterface, is found as the real API has it).
 */
class ApiModelReflectionTest {
  private final ApiModel model = ApiModel.loadDefault();

  @Test
  void everyTypeExistsWithItsSupertypes() {
    List<String> problems = new ArrayList<>();
    for (ApiType t : model.types()) {
      Optional<Class<?>> c = load(t.name());
      if (c.isEmpty()) {
        problems.add("no class " + t.name());
        continue;
      }
      for (String s : t.supertypes()) {
        Optional<Class<?>> sc = load(s);
        if (sc.isEmpty() || !sc.get().isAssignableFrom(c.get())) {
          problems.add(t.name() + " is not a subtype of " + s);
        }
      }
    }
    assertTrue(problems.isEmpty(), () -> String.join("\n", problems));
  }

  @Test
  void everyMethodExistsWithItsSignature() {
    List<String> problems = new ArrayList<>();
    for (ApiMethod m : model.methods()) {
      Optional<Class<?>> owner = load(m.owner());
      if (owner.isEmpty()) {
        problems.add("no owner class for " + m.signature());
        continue;
      }
      if (!exists(owner.get(), m)) {
        problems.add("not found in the real jar: " + m.signature() + (m.isStatic() ? " (static)" : "")
            + " -> " + m.returns());
      }
    }
    assertTrue(problems.isEmpty(), () -> problems.size() + " model entries disagree with the jars:\n"
        + String.join("\n", problems));
  }

  @Test
  void theCheckRejectsAMethodThatDoesNotExist() {
    ApiMethod invented = new ApiMethod("org.nd4j.linalg.dataset.DataSet", "splitIntoThree",
        List.of("double"), "void", false, Effect.SPLIT, Map.of());
    assertFalse(exists(load(invented.owner()).orElseThrow(), invented));
    ApiMethod wrongReturn = new ApiMethod("org.nd4j.linalg.api.ndarray.INDArray", "transpose",
        List.of(), "double", false, Effect.TRANSPOSE, Map.of());
    assertFalse(exists(load(wrongReturn.owner()).orElseThrow(), wrongReturn));
    ApiMethod wrongStatic = new ApiMethod("org.nd4j.linalg.api.ndarray.INDArray", "transpose",
        List.of(), "org.nd4j.linalg.api.ndarray.INDArray", true, Effect.TRANSPOSE, Map.of());
    assertFalse(exists(load(wrongStatic.owner()).orElseThrow(), wrongStatic));
  }

  private static boolean exists(Class<?> owner, ApiMethod m) {
    Map<TypeVariable<?>, Type> bindings = new HashMap<>();
    collectBindings(owner, bindings);
    List<Executable> candidates = new ArrayList<>();
    if (m.isConstructor()) {
      candidates.addAll(Arrays.asList(owner.getConstructors()));
    } else {
      candidates.addAll(Arrays.asList(owner.getMethods()));
    }
    for (Executable e : candidates) {
      if (!m.isConstructor() && !e.getName().equals(m.name())) {
        continue;
      }
      if (e instanceof Method method && Modifier.isStatic(method.getModifiers()) != m.isStatic()) {
        continue;
      }
      if (e.isVarArgs() != m.isVarArgs()) {
        continue;
      }
      Type[] params = e.getGenericParameterTypes();
      if (params.length != m.params().size()) {
        continue;
      }
      boolean same = true;
      for (int i = 0; i < params.length; i++) {
        String want = m.params().get(i).replace("...", "[]");
        if (!erasure(params[i], bindings).equals(want)) {
          same = false;
          break;
        }
      }
      if (!same) {
        continue;
      }
      if (e instanceof Method method) {
        String actualReturn = erasure(method.getGenericReturnType(), bindings);
        if (!actualReturn.equals(m.returns())) {
          continue;
        }
      } else if (e instanceof Constructor<?> && !m.returns().equals(m.owner())) {
        continue;
      }
      return true;
    }
    return false;
  }

  /** Type variables bound by the owner's generic supertypes, transitively. */
  private static void collectBindings(Type type, Map<TypeVariable<?>, Type> out) {
    Class<?> raw;
    if (type instanceof ParameterizedType p) {
      raw = (Class<?>) p.getRawType();
      TypeVariable<?>[] vars = raw.getTypeParameters();
      Type[] args = p.getActualTypeArguments();
      for (int i = 0; i < vars.length && i < args.length; i++) {
        out.putIfAbsent(vars[i], args[i]);
      }
    } else if (type instanceof Class<?> c) {
      raw = c;
    } else {
      return;
    }
    if (raw.getGenericSuperclass() != null) {
      collectBindings(raw.getGenericSuperclass(), out);
    }
    for (Type i : raw.getGenericInterfaces()) {
      collectBindings(i, out);
    }
  }

  private static String erasure(Type t, Map<TypeVariable<?>, Type> bindings) {
    if (t instanceof Class<?> c) {
      return c.isArray() ? erasure(c.getComponentType(), bindings) + "[]" : c.getName().replace('$', '.');
    }
    if (t instanceof ParameterizedType p) {
      return erasure(p.getRawType(), bindings);
    }
    if (t instanceof GenericArrayType g) {
      return erasure(g.getGenericComponentType(), bindings) + "[]";
    }
    if (t instanceof TypeVariable<?> v) {
      Type bound = bindings.get(v);
      if (bound != null && bound != v) {
        return erasure(bound, bindings);
      }
      return erasure(v.getBounds()[0], bindings);
    }
    if (t instanceof WildcardType w) {
      return erasure(w.getUpperBounds()[0], bindings);
    }
    return t.getTypeName();
  }

  /** Loads a class by its dotted name, trying nested-class spellings from the right. */
  private static Optional<Class<?>> load(String dotted) {
    String name = dotted;
    while (true) {
      try {
        return Optional.of(Class.forName(name, false, ApiModelReflectionTest.class.getClassLoader()));
      } catch (ClassNotFoundException | LinkageError e) {
        int dot = name.lastIndexOf('.');
        if (dot < 0) {
          return Optional.empty();
        }
        name = name.substring(0, dot) + "$" + name.substring(dot + 1);
        if (name.indexOf('.') < 0) {
          return Optional.empty();
        }
      }
    }
  }
}
