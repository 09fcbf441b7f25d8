package corpus.leak.tuning;

import org.deeplearning4j.datasets.iterator.utilty.ListDataSetIterator;
import org.deeplearning4j.nn.conf.MultiLayerConfiguration;
import org.deeplearning4j.nn.conf.NeuralNetConfiguration;
import org.deeplearning4j.nn.conf.layers.DenseLayer;
import org.deeplearning4j.nn.conf.layers.OutputLayer;
import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
import org.nd4j.evaluation.classification.Evaluation;
import org.nd4j.linalg.activations.Activation;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
import org.nd4j.linalg.learning.config.Adam;
import org.nd4j.linalg.lossfunctions.LossFunctions;

/** Project helpers shared by the tuning cases: a network factory and a scorer. */
final class Networks {
  private Networks() {}

  /** Both arguments reach the configuration: a loop over either is a hyperparameter loop. */
  static MultiLayerNetwork build(int hidden, double rate) {
    MultiLayerConfiguration config = new NeuralNetConfiguration.Builder()
        .seed(17)
        .updater(new Adam(rate))
        .list()
        .layer(new DenseLayer.Builder().nIn(4).nOut(hidden).activation(Activation.RELU).build())
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MCXENT).nIn(hidden).nOut(3)
            .activation(Activation.SOFTMAX).build())
        .build();
    MultiLayerNetwork net = new MultiLayerNetwork(config);
    net.init();
    return net;
  }

  static double accuracyOn(MultiLayerNetwork net, DataSetIterator batches) {
    batches.reset();
    Evaluation evaluation = net.evaluate(batches);
    return evaluation.accuracy();
  }

  static DataSetIterator batches(DataSet rows) {
    return new ListDataSetIterator<>(rows.asList(), 32);
  }
}
