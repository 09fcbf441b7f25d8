package dev.plumbline.librarychecks;

import ai.djl.Model;
import ai.djl.ndarray.NDArray;
import ai.djl.ndarray.NDManager;
import ai.djl.ndarray.types.Shape;
import ai.djl.nn.core.Linear;
import ai.djl.training.DefaultTrainingConfig;
import ai.djl.training.Trainer;
import ai.djl.training.dataset.ArrayDataset;
import ai.djl.training.loss.Loss;
import ai.djl.training.optimizer.Optimizer;
import ai.djl.training.tracker.Tracker;
import dev.plumbline.engine.ScanRequest;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.engine.Scanner;
import dev.plumbline.finding.Finding;
import dev.plumbline.model.ApiModel;
import dev.plumbline.rules.BuiltInRules;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;

/**
 * Shared pieces of the evidence tests: a tiny DJL regression model and data set, and a scan of a
 * golden-corpus file, so a test can show that the code plumbline flags really misbehaves when run
 * and that the code it leaves alone does not.
 */
public final class Evidence {
  /** Rows per batch of the generated data sets. */
  public static final int BATCH_SIZE = 4;

  private static final Path CORPUS = Path.of("").toAbsolutePath().resolveSibling("test-corpus")
      .resolve("src/main/java");

  private Evidence() {}

  /** A one-layer linear model with an L2 loss and plain SGD, initialized for 3 inputs. */
  public static Trainer linearTrainer(Model model) {
    model.setBlock(Linear.builder().setUnits(1).build());
    Trainer trainer = model.newTrainer(new DefaultTrainingConfig(Loss.l2Loss())
        .optOptimizer(Optimizer.sgd().setLearningRateTracker(Tracker.fixed(0.01f)).build()));
    trainer.initialize(new Shape(BATCH_SIZE, 3));
    return trainer;
  }

  /** Random regression rows in {@code batches} batches, in order. */
  public static ArrayDataset dataset(NDManager manager, int batches) {
    NDArray x = manager.randomNormal(new Shape((long) BATCH_SIZE * batches, 3));
    NDArray y = manager.randomNormal(new Shape((long) BATCH_SIZE * batches, 1));
    return new ArrayDataset.Builder().setData(x).optLabels(y).setSampling(BATCH_SIZE, false).build();
  }

  /** Arrays a manager (and its sub-managers) still hold. */
  public static int liveArrays(NDManager manager) {
    return manager.getManagedArrays().size();
  }

  /** {@code "line rule"} for every finding plumbline reports in a golden-corpus file. */
  public static Set<String> findings(String corpusFile) {
    Path file = CORPUS.resolve(corpusFile);
    ScanResult result = new Scanner(ApiModel.loadDefault(), BuiltInRules.all(), BuiltInRules.projectAnalyses(),
        Scanner.ScanListener.NONE).scan(new ScanRequest(List.of(file), CORPUS, List.of(), List.of(), 1));
    Set<String> out = new TreeSet<>();
    for (Finding f : result.findings()) {
      out.add(f.location().range().startLine() + " " + f.ruleId());
    }
    return out;
  }

  /** The 1-based line of the first line of a corpus file containing {@code text}. */
  public static int lineOf(String corpusFile, String text) {
    try {
      List<String> lines = Files.readAllLines(CORPUS.resolve(corpusFile));
      for (int i = 0; i < lines.size(); i++) {
        if (lines.get(i).contains(text)) {
          return i + 1;
        }
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    throw new IllegalArgumentException(text + " not found in " + corpusFile);
  }
}
