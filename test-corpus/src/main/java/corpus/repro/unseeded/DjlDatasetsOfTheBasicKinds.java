package corpus.repro.unseeded;

import ai.djl.basicdataset.cv.classification.Cifar10;
import ai.djl.basicdataset.cv.classification.ImageFolder;
import ai.djl.basicdataset.tabular.CsvDataset;
import ai.djl.modality.cv.transform.Resize;
import ai.djl.modality.cv.transform.ToTensor;
import ai.djl.training.dataset.Dataset;
import ai.djl.training.dataset.RandomAccessDataset;
import ai.djl.translate.TranslateException;
import java.io.IOException;
import java.nio.file.Path;

/**
 * A greenhouse's leaf photos and sensor tables, split with DJL's engine-wide generator, which
 * nothing in this project seeds: the concrete dataset classes of DJL's basic datasets draw from it
 * as every RandomAccessDataset does (randomSplit calls ai.djl.util.RandomUtils.nextInt, read with
 * javap -c from ai.djl:api 0.36.0).
 */
class DjlDatasetsOfTheBasicKinds {
  RandomAccessDataset[] photos(ImageFolder leaves) throws IOException, TranslateException {
    return leaves.randomSplit(8, 2); // expect: repro.unseeded-randomness
  }

  RandomAccessDataset[] sensorTable(CsvDataset readings) throws IOException, TranslateException {
    return readings.randomSplit(9, 1); // expect: repro.unseeded-randomness
  }

  RandomAccessDataset[] smallImages(Cifar10 images) throws IOException, TranslateException {
    return images.randomSplit(3, 1); // expect: repro.unseeded-randomness
  }

  ImageFolder shuffledLeafPhotos(Path folder) {
    return ImageFolder.builder()
        .setRepositoryPath(folder)
        .optMaxDepth(2)
        .addTransform(new Resize(64, 64))
        .addTransform(new ToTensor())
        .setSampling(16, true) // expect: repro.unseeded-randomness
        .build();
  }

  ImageFolder orderedLeafPhotos(Path folder) {
    return ImageFolder.builder()
        .setRepositoryPath(folder)
        .addTransform(new ToTensor())
        .setSampling(16, false) // clean: repro.unseeded-randomness
        .build();
  }

  Cifar10 shuffledSmallImages() {
    return Cifar10.builder()
        .optUsage(Dataset.Usage.TRAIN)
        .setSampling(32, true) // expect: repro.unseeded-randomness
        .build();
  }

  /** The test split is only evaluated: a full pass sums over every row in any order. */
  Cifar10 shuffledTestImages() {
    return Cifar10.builder()
        .optUsage(Dataset.Usage.TEST)
        .setSampling(32, true) // clean: repro.unseeded-randomness
        .build();
  }
}
