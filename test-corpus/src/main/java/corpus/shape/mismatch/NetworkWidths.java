package corpus.shape.mismatch;

import org.deeplearning4j.nn.conf.ComputationGraphConfiguration;
import org.deeplearning4j.nn.conf.MultiLayerConfiguration;
import org.deeplearning4j.nn.conf.NeuralNetConfiguration;
import org.deeplearning4j.nn.conf.layers.DenseLayer;
import org.deeplearning4j.nn.conf.layers.OutputLayer;
import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
import org.nd4j.linalg.activations.Activation;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;
import org.nd4j.linalg.learning.config.Adam;
import org.nd4j.linalg.lossfunctions.LossFunctions;

/** Layer widths in DL4J configurations, checked the way DL4J checks them (measured). */
class NetworkWidths {
  ComputationGraphConfiguration graph() {
    return new NeuralNetConfiguration.Builder()
        .seed(7)
        .graphBuilder()
        .addInputs("sensors")
        .addLayer("hidden", new DenseLayer.Builder().nIn(6).nOut(24).activation(Activation.RELU).build(), "sensors")
        .addLayer("out", new OutputLayer.Builder(LossFunctions.LossFunction.MCXENT) // expect: shape.mismatch
            .nIn(12).nOut(3).activation(Activation.SOFTMAX).build(), "hidden")
        .setOutputs("out")
        .build();
  }

  ComputationGraphConfiguration graphRight() {
    return new NeuralNetConfiguration.Builder()
        .seed(7)
        .graphBuilder()
        .addInputs("sensors")
        .addLayer("hidden", new DenseLayer.Builder().nIn(6).nOut(24).build(), "sensors")
        .addLayer("out", new OutputLayer.Builder(LossFunctions.LossFunction.MCXENT) // clean: shape.mismatch
            .nIn(24).nOut(3).activation(Activation.SOFTMAX).build(), "hidden")
        .setOutputs("out")
        .build();
  }

  /** In a list() configuration DL4J replaces a written nIn by the previous nOut: it runs. */
  MultiLayerConfiguration listWithStaleWidth() {
    return new NeuralNetConfiguration.Builder()
        .seed(7)
        .updater(new Adam(1e-3))
        .list()
        .layer(new DenseLayer.Builder().nIn(6).nOut(24).build())
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MSE) // clean: shape.mismatch
            .nIn(12).nOut(3).build())
        .build();
  }

  MultiLayerConfiguration listKeepingWidths() {
    return new NeuralNetConfiguration.Builder()
        .seed(7)
        .list()
        .layer(new DenseLayer.Builder().nIn(6).nOut(24).build())
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MSE) // expect: shape.mismatch
            .nIn(12).nOut(3).build())
        .overrideNinUponBuild(false)
        .build();
  }

  MultiLayerNetwork network() {
    MultiLayerNetwork net = new MultiLayerNetwork(listWithStaleWidth());
    net.init();
    return net;
  }

  void train(int batch) {
    MultiLayerNetwork net = new MultiLayerNetwork(listWithStaleWidth());
    net.init();
    INDArray features = Nd4j.rand(batch, 5);
    INDArray labels = Nd4j.rand(batch, 3);
    net.fit(features, labels); // expect: shape.mismatch
  }

  void trainRight(int batch) {
    MultiLayerNetwork net = new MultiLayerNetwork(listWithStaleWidth());
    net.init();
    net.fit(Nd4j.rand(batch, 6), Nd4j.rand(batch, 3)); // clean: shape.mismatch
  }

  INDArray predictWithWrongLabels(int batch) {
    MultiLayerNetwork net = new MultiLayerNetwork(listWithStaleWidth());
    net.init();
    net.fit(Nd4j.rand(batch, 6), Nd4j.rand(batch, 4)); // expect: shape.mismatch
    return net.output(Nd4j.rand(batch, 6));
  }
}
