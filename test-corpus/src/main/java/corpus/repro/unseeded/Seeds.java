package corpus.repro.unseeded;

import org.deeplearning4j.nn.conf.NeuralNetConfiguration;

/** Sets the project-wide seed on a configuration builder. */
final class Seeds {
  static final long PROJECT_SEED = 20_240_611L;

  private Seeds() {}

  static void apply(NeuralNetConfiguration.Builder builder) {
    builder.seed(PROJECT_SEED);
  }
}
