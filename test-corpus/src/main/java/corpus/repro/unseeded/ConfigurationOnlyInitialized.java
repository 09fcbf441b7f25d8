package corpus.repro.unseeded;

import org.deeplearning4j.nn.conf.MultiLayerConfiguration;
import org.deeplearning4j.nn.conf.NeuralNetConfiguration;
import org.deeplearning4j.nn.conf.layers.DenseLayer;
import org.deeplearning4j.nn.conf.layers.OutputLayer;
import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
import org.nd4j.linalg.activations.Activation;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.learning.config.Sgd;
import org.nd4j.linalg.lossfunctions.LossFunctions;

/**
 * A soil-moisture classifier whose configuration is only built and initialized (to show how it
 * is declared), next to one whose untrained outputs are printed. Without a seed the starting
 * weights change from run to run; that matters only where something reads them.
 */
class ConfigurationOnlyInitialized {
  void declareOnly() {
    MultiLayerConfiguration conf = new NeuralNetConfiguration.Builder() // clean: repro.unseeded-randomness
        .updater(new Sgd(0.05))
        .list()
        .layer(new DenseLayer.Builder().nIn(6).nOut(12).activation(Activation.RELU).build())
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MCXENT).nIn(12).nOut(3)
            .activation(Activation.SOFTMAX).build())
        .build();
    MultiLayerNetwork net = new MultiLayerNetwork(conf);
    net.init();
  }

  void declareInline() {
    new MultiLayerNetwork(new NeuralNetConfiguration.Builder() // clean: repro.unseeded-randomness
        .list()
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MSE).nIn(6).nOut(1).build())
        .build()).init();
  }

  INDArray untrainedOutputs(INDArray readings) {
    MultiLayerConfiguration conf = new NeuralNetConfiguration.Builder() // expect: repro.unseeded-randomness
        .updater(new Sgd(0.05))
        .list()
        .layer(new DenseLayer.Builder().nIn(6).nOut(12).activation(Activation.RELU).build())
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MCXENT).nIn(12).nOut(3)
            .activation(Activation.SOFTMAX).build())
        .build();
    MultiLayerNetwork net = new MultiLayerNetwork(conf);
    net.init();
    return net.output(readings);
  }

  MultiLayerNetwork handedOut() {
    MultiLayerConfiguration conf = new NeuralNetConfiguration.Builder() // expect: repro.unseeded-randomness
        .list()
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MSE).nIn(6).nOut(1).build())
        .build();
    MultiLayerNetwork net = new MultiLayerNetwork(conf);
    net.init();
    return net;
  }
}
