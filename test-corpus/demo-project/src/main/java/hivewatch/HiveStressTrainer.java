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
import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;
import org.nd4j.linalg.learning.config.Adam;
import org.nd4j.linalg.lossfunctions.LossFunctions;

/** Trains a small classifier that flags stressed hives, and reports its test accuracy. */
public final class HiveStressTrainer {
  private HiveStressTrainer() {}

  public static void main(String[] args) {
    DataSet readings = HiveReadings.generate(2_000, 7);
    readings.shuffle(11);

    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(readings); // expect: leak.preprocessing-before-split
    normalizer.transform(readings);

    SplitTestAndTrain split = readings.splitTestAndTrain(0.8);
    DataSet train = split.getTrain();
    DataSet test = split.getTest();

    MultiLayerConfiguration config = new NeuralNetConfiguration.Builder()
        .seed(3)
        .updater(new Adam(1e-3))
        .list()
        .layer(new DenseLayer.Builder().nIn(HiveReadings.FEATURES).nOut(16)
            .activation(Activation.RELU).build())
        .layer(new OutputLayer.Builder(LossFunctions.LossFunction.MCXENT).nIn(16)
            .nOut(HiveReadings.CLASSES).activation(Activation.SOFTMAX).build())
        .build();
    MultiLayerNetwork network = new MultiLayerNetwork(config);
    network.init();

    DataSetIterator trainBatches = new ListDataSetIterator<>(train.asList(), 64);
    for (int epoch = 0; epoch < 20; epoch++) {
      network.fit(trainBatches);
      trainBatches.reset();
    }
    Evaluation evaluation = network.evaluate(new ListDataSetIterator<>(test.asList(), 64));
    System.out.printf("test accuracy: %.3f%n", evaluation.accuracy());
  }
}
