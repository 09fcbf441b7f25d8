package hivewatch;

import org.deeplearning4j.datasets.iterator.utilty.ListDataSetIterator;
import org.deeplearning4j.nn.conf.MultiLayerConfiguration;
import org.deeplearning4j.nn.conf.NeuralNetConfiguration;
import org.deeplearning4j.nn.conf.layers.DenseLayer;
import org.deeplearning4j.nn.conf.layers.OutputLayer;
import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
import org.nd4j.evaluation.classification.Evaluation;
import org.nd4j.linalg.activations.Activation;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;
import org.nd4j.linalg.learning.config.Adam;
import org.nd4j.linalg.lossfunctions.LossFunctions;

/**
 * Checks the stress classifier on a winter's worth of readings. Clean: the split comes first,
 * the normalizer learns from the training rows only, and the test set is large.
 */
public final class HiveWinterCheck {
  private HiveWinterCheck() {}

  public static void main(String[] args) {
    DataSet winter = HiveReadings.generate(15_000, 23);
    SplitTestAndTrain split = winter.splitTestAndTrain(3_000);
    DataSet train = split.getTrain();
    DataSet test = split.getTest();

    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(train); // clean: leak.preprocessing-before-split
    normalizer.transform(train);
    normalizer.transform(test);

    MultiLayerConfiguration config = new NeuralNetConfiguration.Builder()
        .seed(5)
        .updater(new Adam(1e-3))
        .list()
        .layer(new DenseLayer.Builder().nIn(HiveReadings.FEATURES).nOut(8)
            .activation(Activation.RELU).build())
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MCXENT).nIn(8)
            .nOut(HiveReadings.CLASSES).activation(Activation.SOFTMAX).build())
        .build();
    MultiLayerNetwork network = new MultiLayerNetwork(config);
    network.init();
    for (int epoch = 0; epoch < 10; epoch++) {
      network.fit(train);
    }
    Evaluation evaluation = network.evaluate(new ListDataSetIterator<>(test.asList(), 256));
    System.out.printf("winter accuracy: %.3f%n", evaluation.accuracy());
  }
}
