package corpus.leak.fitontest;

import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;

/** The test part comes out of another class's getter, whose field summary says it is test rows. */
class FitThroughGetter {
  NormalizerStandardize prepare(RowStore store) {
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(store.heldOut()); // expect: leak.fit-on-test
    normalizer.transform(store.training());
    return normalizer;
  }

  NormalizerStandardize prepareCorrectly(RowStore store) {
    NormalizerStandardize normalizer = new NormalizerStandardize();
    normalizer.fit(store.training()); // clean: leak.fit-on-test
    normalizer.transform(store.heldOut());
    return normalizer;
  }
}
