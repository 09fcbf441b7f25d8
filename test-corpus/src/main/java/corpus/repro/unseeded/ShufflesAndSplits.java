package corpus.repro.unseeded;

import java.util.Collections;
import java.util.List;
import java.util.Random;
import org.nd4j.linalg.dataset.DataSet;
import org.nd4j.linalg.dataset.SplitTestAndTrain;

/** Shuffles and splits of data rows, seeded from the clock or not at all (defects) and seeded (clean). */
class ShufflesAndSplits {
  private final Random sharedRandom = new Random();
  private final Random fixedRandom = new Random(2024);

  SplitTestAndTrain clockShuffle(DataSet rows) {
    rows.shuffle(); // expect: repro.unseeded-randomness
    return rows.splitTestAndTrain(0.8);
  }

  SplitTestAndTrain seededShuffle(DataSet rows) {
    rows.shuffle(42); // clean: repro.unseeded-randomness
    return rows.splitTestAndTrain(0.8); // clean: repro.unseeded-randomness
  }

  void clockShuffleOfList(DataSet rows) {
    List<DataSet> examples = rows.asList();
    Collections.shuffle(examples); // expect: repro.unseeded-randomness
  }

  void localGenerator(DataSet rows) {
    List<DataSet> examples = rows.asList();
    Random random = new Random();
    Collections.shuffle(examples, random); // expect: repro.unseeded-randomness
  }

  void localGeneratorSeededLater(DataSet rows) {
    List<DataSet> examples = rows.asList();
    Random random = new Random();
    random.setSeed(99);
    Collections.shuffle(examples, random); // clean: repro.unseeded-randomness
  }

  SplitTestAndTrain inlineGenerator(DataSet rows) {
    return rows.splitTestAndTrain(100, new Random()); // expect: repro.unseeded-randomness
  }

  SplitTestAndTrain inlineSeededGenerator(DataSet rows) {
    return rows.splitTestAndTrain(100, new Random(11)); // clean: repro.unseeded-randomness
  }

  void fieldGenerator(DataSet rows) {
    Collections.shuffle(rows.asList(), sharedRandom); // expect: repro.unseeded-randomness
  }

  void seededFieldGenerator(DataSet rows) {
    Collections.shuffle(rows.asList(), fixedRandom); // clean: repro.unseeded-randomness
  }

  void generatorFromCaller(DataSet rows, Random random) {
    Collections.shuffle(rows.asList(), random); // clean: repro.unseeded-randomness
  }
}
