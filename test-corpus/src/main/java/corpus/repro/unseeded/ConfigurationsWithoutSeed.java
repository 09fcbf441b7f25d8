package corpus.repro.unseeded;

import org.deeplearning4j.nn.conf.MultiLayerConfiguration;
import org.deeplearning4j.nn.conf.NeuralNetConfiguration;
import org.deeplearning4j.nn.conf.layers.DenseLayer;
import org.deeplearning4j.nn.conf.layers.OutputLayer;
import org.nd4j.linalg.activations.Activation;
import org.nd4j.linalg.learning.config.Adam;
import org.nd4j.linalg.lossfunctions.LossFunctions;

/** Network configurations with and without a seed. */
class ConfigurationsWithoutSeed {
  MultiLayerConfiguration noSeed() {
    return new NeuralNetConfiguration.Builder() // expect: repro.unseeded-randomness
        .updater(new Adam(1e-3))
        .list()
        .layer(new DenseLayer.Builder().nIn(4).nOut(16).activation(Activation.RELU).build())
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MCXENT).nIn(16).nOut(2)
            .activation(Activation.SOFTMAX).build())
        .build();
  }

  MultiLayerConfiguration seeded() {
    return new NeuralNetConfiguration.Builder() // clean: repro.unseeded-randomness
        .seed(1234)
        .updater(new Adam(1e-3))
        .list()
        .layer(new DenseLayer.Builder().nIn(4).nOut(16).activation(Activation.RELU).build())
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MCXENT).nIn(16).nOut(2)
            .activation(Activation.SOFTMAX).build())
        .build();
  }

  MultiLayerConfiguration builderKeptWithoutSeed() {
    NeuralNetConfiguration.Builder base = new NeuralNetConfiguration.Builder(); // expect: repro.unseeded-randomness
    base.updater(new Adam(5e-4));
    return base.list()
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MSE).nIn(4).nOut(1).build())
        .build();
  }

  MultiLayerConfiguration builderSeededLater() {
    NeuralNetConfiguration.Builder base = new NeuralNetConfiguration.Builder(); // clean: repro.unseeded-randomness
    base.updater(new Adam(5e-4));
    base.seed(77);
    return base.list()
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MSE).nIn(4).nOut(1).build())
        .build();
  }

  MultiLayerConfiguration builderHandedToHelper() {
    NeuralNetConfiguration.Builder base = new NeuralNetConfiguration.Builder(); // clean: repro.unseeded-randomness
    Seeds.apply(base);
    return base.list()
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MSE).nIn(4).nOut(1).build())
        .build();
  }
}
