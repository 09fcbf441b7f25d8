package dev.plumbline.analysis.loops;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.stmt.Statement;
import dev.plumbline.analysis.provenance.ProvenanceFacts;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

/**
 * What the loop-role analysis publishes for one file: hyperparameter loops, and for each
 * evaluation of a model, whether its result steers training or model choice.
 */
public final class LoopRoleFacts {

  /**
   * A loop whose values reach a training configuration: {@code variable} names the loop value,
   * {@code configuration} is the first place it is configured.
   */
  public record HyperparameterLoop(Statement loop, String variable, Node configuration) {}

  /** How an evaluation's result is used to choose something. */
  public enum Steering {
    /** A score compared against a running best, and the branch keeps a model, epoch or setting. */
    MODEL_SELECTION,
    /** A score that decides when a training loop stops. */
    EARLY_STOP,
    /** An early-stopping configuration scores the model on this data. */
    EARLY_STOPPING_CONFIGURATION,
    /** Evaluated once per hyperparameter setting; the choice is left to whoever reads the output. */
    HYPERPARAMETER_COMPARISON
  }

  /**
   * An evaluation whose result steers something. {@code decision} is the condition or call that
   * decides; {@code kept} what the decision keeps (null if nothing specific); {@code loop} the
   * hyperparameter loop around it, if any.
   */
  public record SteeringUse(ProvenanceFacts.Evaluation evaluation, Steering steering, Node decision,
      Node kept, HyperparameterLoop loop) {}

  private final List<HyperparameterLoop> loops = new ArrayList<>();
  private final List<SteeringUse> uses = new ArrayList<>();

  void add(HyperparameterLoop l) {
    loops.add(l);
  }

  void add(SteeringUse u) {
    uses.add(u);
  }

  public List<HyperparameterLoop> hyperparameterLoops() {
    return Collections.unmodifiableList(loops);
  }

  public List<SteeringUse> steeringUses() {
    return Collections.unmodifiableList(uses);
  }
}
