package corpus.leak.temporal;

import ai.djl.ndarray.NDArray;
import ai.djl.training.dataset.ArrayDataset;
import ai.djl.training.dataset.RandomAccessDataset;
import ai.djl.translate.TranslateException;
import java.io.IOException;
import java.io.File;
import org.datavec.api.io.filters.RandomPathFilter;
import org.datavec.api.split.FileSplit;
import org.datavec.api.split.InputSplit;

/** Random splits of time-ordered rows: DJL randomSplit and a DataVec sample with a shuffling filter. */
class DjlTimeSeriesRandomSplit {
  RandomAccessDataset[] splitSales(NDArray features, NDArray targets) throws IOException, TranslateException {
    RandomAccessDataset dailySales = new ArrayDataset.Builder()
        .setData(features).optLabels(targets).setSampling(32, false).build();
    return dailySales.randomSplit(8, 2); // expect: leak.temporal-shuffle, repro.unseeded-randomness
  }

  RandomAccessDataset[] splitPortraits(NDArray features, NDArray targets) throws IOException, TranslateException {
    RandomAccessDataset portraits = new ArrayDataset.Builder()
        .setData(features).optLabels(targets).setSampling(32, false).build();
    return portraits.randomSplit(8, 2); // expect: repro.unseeded-randomness // clean: leak.temporal-shuffle
  }

  InputSplit[] sampleTraces(File root) {
    FileSplit files = new FileSplit(new File(root, "sensor-timeseries"));
    return files.sample(new RandomPathFilter(new java.util.Random(6)), 80, 20); // expect: leak.temporal-shuffle
  }

  InputSplit[] sampleTracesInOrder(File root) {
    FileSplit files = new FileSplit(new File(root, "sensor-timeseries"));
    return files.sample(null, 80, 20); // clean: leak.temporal-shuffle
  }
}
