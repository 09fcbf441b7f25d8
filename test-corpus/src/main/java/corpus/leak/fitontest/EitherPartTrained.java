package corpus.leak.fitontest;

import java.util.ArrayList;
import java.util.List;
import org.deeplearning4j.datasets.iterator.utilty.ListDataSetIterator;
import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;
import org.nd4j.linalg.dataset.api.preprocessor.ImagePreProcessingScaler;

/** Paths that may train on test rows (warnings), and look-alikes that do not. */
class EitherPartTrained {
  void quickOrFull(MultiLayerNetwork net, DataSet rows, boolean smoke) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    DataSet fitRows = smoke ? split.getTest() : split.getTrain();
    net.fit(fitRows); // expect: leak.fit-on-test
  }

  void pooledParts(MultiLayerNetwork net, DataSet rows) {
    SplitTestAndTrain split = rows.splitTestAndTrain(0.8);
    List<DataSet> pool = new ArrayList<>();
    pool.add(split.getTrain());
    pool.add(split.getTest());
    net.fit(new ListDataSetIterator<>(pool, 8)); // expect: leak.fit-on-test
  }

  void retrainOnTrainingAndValidation(MultiLayerNetwork net, DataSet rows) {
    SplitTestAndTrain outer = rows.splitTestAndTrain(0.85);
    SplitTestAndTrain inner = outer.getTrain().splitTestAndTrain(0.8);
    List<DataSet> pool = new ArrayList<>();
    pool.add(inner.getTrain());
    pool.add(inner.getTest());
    net.fit(new ListDataSetIterator<>(pool, 8)); // clean: leak.fit-on-test
  }

  void pixelScaling(DataSet images) {
    SplitTestAndTrain split = images.splitTestAndTrain(0.8);
    ImagePreProcessingScaler scaler = new ImagePreProcessingScaler(0, 1);
    scaler.fit(split.getTest()); // clean: leak.fit-on-test
  }
}
