package dev.plumbline.analysis.scope;

import dev.plumbline.model.ApiMethod;
import dev.plumbline.model.Effect;
import java.util.EnumSet;
import java.util.Set;

/**
 * How the API model's effects read for tensor operations. A tensor method whose effect is one of
 * {@link #COPY_EFFECTS} returns a new tensor (or view) and leaves its receiver and arguments as
 * they were, unless the model marks it {@code inPlace=true}; its only product is the returned
 * value. The in-place variants ({@code addi}, {@code muli}, ...) carry {@code inPlace=true}.
 */
public final class TensorOps {
  /** Effects of operations that produce their result as a return value. */
  public static final Set<Effect> COPY_EFFECTS = EnumSet.of(Effect.ELEMENTWISE, Effect.VECTOR_OP,
      Effect.RESHAPE, Effect.PERMUTE, Effect.TRANSPOSE, Effect.MATMUL, Effect.REDUCE, Effect.CONCAT,
      Effect.COPY, Effect.DETACH, Effect.LEAVE_MEMORY_SCOPE);

  private TensorOps() {}

  /** The call returns a new tensor and changes nothing else. */
  public static boolean returnsCopy(ApiMethod m) {
    return COPY_EFFECTS.contains(m.effect()) && !m.flag("inPlace");
  }

  /** The call writes its result into the receiver. */
  public static boolean inPlace(ApiMethod m) {
    return m.flag("inPlace");
  }
}
