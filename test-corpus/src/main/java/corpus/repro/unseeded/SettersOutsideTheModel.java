package corpus.repro.unseeded;

import org.deeplearning4j.nn.api.OptimizationAlgorithm;
import org.deeplearning4j.nn.conf.MultiLayerConfiguration;
import org.deeplearning4j.nn.conf.NeuralNetConfiguration;
import org.deeplearning4j.nn.conf.layers.OutputLayer;
import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
import org.nd4j.linalg.learning.config.Sgd;
import org.nd4j.linalg.lossfunctions.LossFunctions;

/**
 * A shop's demand model whose configuration chains setters the API model does not list
 * (optimizationAlgo, miniBatch) before and after the seed. The type of what such a setter
 * returns is unknown to the analysis, so a seed that follows it cannot be recognized; the
 * builder then counts as possibly seeded. A chain that leaves the builder before any unknown
 * setter is still reported.
 */
class SettersOutsideTheModel {
  double seedAfterUnlistedSetter(DataSetIterator weeks) {
    MultiLayerConfiguration conf = new NeuralNetConfiguration.Builder() // clean: repro.unseeded-randomness
        .optimizationAlgo(OptimizationAlgorithm.STOCHASTIC_GRADIENT_DESCENT)
        .seed(2024)
        .updater(new Sgd(0.05))
        .list()
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MSE).nIn(6).nOut(1).build())
        .build();
    MultiLayerNetwork net = new MultiLayerNetwork(conf);
    net.init();
    net.fit(weeks);
    return net.score();
  }

  double keptBuilderSeededAfterUnlistedSetter(DataSetIterator weeks) {
    NeuralNetConfiguration.Builder base = new NeuralNetConfiguration.Builder(); // clean: repro.unseeded-randomness
    base.miniBatch(false).seed(2024);
    MultiLayerNetwork net = new MultiLayerNetwork(base.list()
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MSE).nIn(6).nOut(1).build())
        .build());
    net.init();
    net.fit(weeks);
    return net.score();
  }

  double leavesBuilderBeforeUnlistedSetter(DataSetIterator weeks) {
    MultiLayerConfiguration conf = new NeuralNetConfiguration.Builder() // expect: repro.unseeded-randomness
        .updater(new Sgd(0.05))
        .list()
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MSE).nIn(6).nOut(1).build())
        .build();
    MultiLayerNetwork net = new MultiLayerNetwork(conf);
    net.init();
    net.fit(weeks);
    return net.score();
  }
}
