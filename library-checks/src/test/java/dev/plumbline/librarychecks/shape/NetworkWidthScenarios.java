package dev.plumbline.librarychecks.shape;

import org.deeplearning4j.nn.conf.ComputationGraphConfiguration;
import org.deeplearning4j.nn.conf.MultiLayerConfiguration;
import org.deeplearning4j.nn.conf.NeuralNetConfiguration;
import org.deeplearning4j.nn.conf.inputs.InputType;
import org.deeplearning4j.nn.conf.layers.DenseLayer;
import org.deeplearning4j.nn.conf.layers.LSTM;
import org.deeplearning4j.nn.conf.layers.OutputLayer;
import org.deeplearning4j.nn.conf.layers.RnnOutputLayer;
import org.deeplearning4j.nn.graph.ComputationGraph;
import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
import org.nd4j.linalg.factory.Nd4j;
import org.nd4j.linalg.lossfunctions.LossFunctions;

/**
 * Network configurations that are both run (by {@link NetworkWidthsTest}) and scanned by
 * plumbline. Each public method is one scenario; it returns normally when DL4J accepts it.
 * Nothing here is a golden case: the test compares what DL4J does with what plumbline claims.
 */
public final class NetworkWidthScenarios {

  public void listWithStaleNinIsOverridden() {
    MultiLayerConfiguration conf = new NeuralNetConfiguration.Builder().seed(1).list()
        .layer(new DenseLayer.Builder().nIn(4).nOut(16).build())
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MSE).nIn(8).nOut(3).build())
        .build();
    MultiLayerNetwork net = new MultiLayerNetwork(conf);
    net.init();
    net.fit(Nd4j.rand(5, 4), Nd4j.rand(5, 3));
  }

  public void listKeepingStaleNinFails() {
    MultiLayerConfiguration conf = new NeuralNetConfiguration.Builder().seed(1).list()
        .layer(new DenseLayer.Builder().nIn(4).nOut(16).build())
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MSE).nIn(8).nOut(3).build())
        .overrideNinUponBuild(false)
        .build();
    MultiLayerNetwork net = new MultiLayerNetwork(conf);
    net.init();
    net.output(Nd4j.rand(5, 4));
  }

  public void listWithInputTypeDerivesWidths() {
    MultiLayerConfiguration conf = new NeuralNetConfiguration.Builder().seed(1).list()
        .layer(new DenseLayer.Builder().nIn(4).nOut(16).build())
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MSE).nIn(8).nOut(3).build())
        .setInputType(InputType.feedForward(4))
        .build();
    MultiLayerNetwork net = new MultiLayerNetwork(conf);
    net.init();
    net.output(Nd4j.rand(5, 4));
  }

  public void graphWithStaleNinFails() {
    ComputationGraphConfiguration conf = new NeuralNetConfiguration.Builder().seed(1).graphBuilder()
        .addInputs("in")
        .addLayer("hidden", new DenseLayer.Builder().nIn(4).nOut(16).build(), "in")
        .addLayer("out", new OutputLayer.Builder(LossFunctions.LossFunction.MSE).nIn(8).nOut(3).build(), "hidden")
        .setOutputs("out")
        .build();
    ComputationGraph graph = new ComputationGraph(conf);
    graph.init();
    graph.output(Nd4j.rand(5, 4));
  }

  public void graphWithMatchingWidthsRuns() {
    ComputationGraphConfiguration conf = new NeuralNetConfiguration.Builder().seed(1).graphBuilder()
        .addInputs("in")
        .addLayer("hidden", new DenseLayer.Builder().nIn(4).nOut(16).build(), "in")
        .addLayer("out", new OutputLayer.Builder(LossFunctions.LossFunction.MSE).nIn(16).nOut(3).build(), "hidden")
        .setOutputs("out")
        .build();
    ComputationGraph graph = new ComputationGraph(conf);
    graph.init();
    graph.output(Nd4j.rand(5, 4));
  }

  public void graphOfRecurrentLayersWithStaleNinFails() {
    ComputationGraphConfiguration conf = new NeuralNetConfiguration.Builder().seed(1).graphBuilder()
        .addInputs("in")
        .addLayer("lstm", new LSTM.Builder().nIn(4).nOut(16).build(), "in")
        .addLayer("out", new RnnOutputLayer.Builder(LossFunctions.LossFunction.MSE).nIn(8).nOut(3).build(), "lstm")
        .setOutputs("out")
        .build();
    ComputationGraph graph = new ComputationGraph(conf);
    graph.init();
    graph.output(Nd4j.rand(new int[] {5, 4, 7}));
  }

  public void featuresWiderThanFirstLayerFail() {
    MultiLayerConfiguration conf = new NeuralNetConfiguration.Builder().seed(1).list()
        .layer(new DenseLayer.Builder().nIn(4).nOut(16).build())
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MSE).nIn(16).nOut(3).build())
        .build();
    MultiLayerNetwork net = new MultiLayerNetwork(conf);
    net.init();
    net.fit(Nd4j.rand(5, 6), Nd4j.rand(5, 3));
  }

  public void featuresOfFirstLayerWidthRun() {
    MultiLayerConfiguration conf = new NeuralNetConfiguration.Builder().seed(1).list()
        .layer(new DenseLayer.Builder().nIn(4).nOut(16).build())
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MSE).nIn(16).nOut(3).build())
        .build();
    MultiLayerNetwork net = new MultiLayerNetwork(conf);
    net.init();
    net.output(Nd4j.rand(5, 4));
  }

  public void labelsNarrowerThanOutputFailWithMse() {
    MultiLayerConfiguration conf = new NeuralNetConfiguration.Builder().seed(1).list()
        .layer(new DenseLayer.Builder().nIn(4).nOut(16).build())
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MSE).nIn(16).nOut(3).build())
        .build();
    MultiLayerNetwork net = new MultiLayerNetwork(conf);
    net.init();
    net.fit(Nd4j.rand(5, 4), Nd4j.rand(5, 2));
  }

  public void labelsNarrowerThanOutputFailWithCrossEntropy() {
    MultiLayerConfiguration conf = new NeuralNetConfiguration.Builder().seed(1).list()
        .layer(new DenseLayer.Builder().nIn(4).nOut(16).build())
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MCXENT).nIn(16).nOut(3).build())
        .build();
    MultiLayerNetwork net = new MultiLayerNetwork(conf);
    net.init();
    net.fit(Nd4j.rand(5, 4), Nd4j.rand(5, 2));
  }

  public void recurrentFeaturesOfWrongWidthFail() {
    MultiLayerConfiguration conf = new NeuralNetConfiguration.Builder().seed(1).list()
        .layer(new LSTM.Builder().nIn(4).nOut(16).build())
        .layer(new RnnOutputLayer.Builder(LossFunctions.LossFunction.MSE).nIn(16).nOut(3).build())
        .build();
    MultiLayerNetwork net = new MultiLayerNetwork(conf);
    net.init();
    net.output(Nd4j.rand(new int[] {5, 6, 7}));
  }

  public void recurrentLabelsOfWrongWidthFail() {
    MultiLayerConfiguration conf = new NeuralNetConfiguration.Builder().seed(1).list()
        .layer(new LSTM.Builder().nIn(4).nOut(16).build())
        .layer(new RnnOutputLayer.Builder(LossFunctions.LossFunction.MSE).nIn(16).nOut(3).build())
        .build();
    MultiLayerNetwork net = new MultiLayerNetwork(conf);
    net.init();
    net.fit(Nd4j.rand(new int[] {5, 4, 7}), Nd4j.rand(new int[] {5, 2, 7}));
  }

  public void recurrentListWithStaleNinIsOverridden() {
    MultiLayerConfiguration conf = new NeuralNetConfiguration.Builder().seed(1).list()
        .layer(new LSTM.Builder().nIn(4).nOut(16).build())
        .layer(new RnnOutputLayer.Builder(LossFunctions.LossFunction.MSE).nIn(8).nOut(3).build())
        .build();
    MultiLayerNetwork net = new MultiLayerNetwork(conf);
    net.init();
    net.output(Nd4j.rand(new int[] {5, 4, 7}));
  }
}
