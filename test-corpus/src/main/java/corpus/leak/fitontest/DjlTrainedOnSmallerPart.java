package corpus.leak.fitontest;

import ai.djl.training.EasyTrain;
import ai.djl.training.Trainer;
import ai.djl.training.dataset.RandomAccessDataset;
import ai.djl.translate.TranslateException;
import java.io.IOException;

/** DJL: randomSplit(8, 2) makes the first part the large training part; the small one is trained on. */
class DjlTrainedOnSmallerPart {
  void train(Trainer trainer, RandomAccessDataset samples) throws IOException, TranslateException {
    RandomAccessDataset[] parts = samples.randomSplit(8, 2); // expect: repro.unseeded-randomness
    EasyTrain.fit(trainer, 2, parts[1], parts[0]); // expect: leak.fit-on-test
  }

  void trainOnLargerPart(Trainer trainer, RandomAccessDataset samples) throws IOException, TranslateException {
    RandomAccessDataset[] parts = samples.randomSplit(2, 8); // expect: repro.unseeded-randomness
    EasyTrain.fit(trainer, 2, parts[1], parts[0]); // clean: leak.fit-on-test
  }
}
