package corpus.repro.unseeded;

import ai.djl.ndarray.NDArray;
import ai.djl.training.dataset.ArrayDataset;
import ai.djl.training.dataset.RandomAccessDataset;
import ai.djl.translate.TranslateException;
import java.io.IOException;

/** DJL draws from its engine-wide generator; nothing in this project seeds it. */
class DjlSampling {
  ArrayDataset shuffledBatches(NDArray x, NDArray y) {
    return new ArrayDataset.Builder().setData(x).optLabels(y)
        .setSampling(32, true) // expect: repro.unseeded-randomness
        .build();
  }

  ArrayDataset orderedBatches(NDArray x, NDArray y) {
    return new ArrayDataset.Builder().setData(x).optLabels(y)
        .setSampling(32, false) // clean: repro.unseeded-randomness
        .build();
  }

  RandomAccessDataset[] split(RandomAccessDataset all) throws IOException, TranslateException {
    return all.randomSplit(7, 3); // expect: repro.unseeded-randomness
  }
}
