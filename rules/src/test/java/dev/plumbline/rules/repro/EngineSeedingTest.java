package dev.plumbline.rules.repro;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.plumbline.engine.ScanRequest;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.engine.Scanner;
import dev.plumbline.model.ApiModel;
import dev.plumbline.rules.BuiltInRules;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A DJL split is reported only when nothing in the project can seed DJL's engine-wide generator.
 * The seeding file is a second file of the project, as it usually is (a helper or the main class);
 * it cannot sit in the golden corpus, where one seed would silence every DJL draw.
 */
class EngineSeedingTest {
  @TempDir
  Path dir;

  private static final String SPLIT = """
      import ai.djl.training.dataset.RandomAccessDataset;
      class Splits {
        RandomAccessDataset[] split(RandomAccessDataset rows) throws Exception {
          return rows.randomSplit(8, 2);
        }
      }
      """;

  private long unseededDraws(String seedingFile) throws IOException {
    Files.writeString(dir.resolve("Splits.java"), SPLIT);
    if (seedingFile != null) {
      Files.writeString(dir.resolve("Seeding.java"), seedingFile);
    }
    ScanResult result = new Scanner(ApiModel.loadDefault(), BuiltInRules.all(),
        BuiltInRules.projectAnalyses(), Scanner.ScanListener.NONE)
        .scan(ScanRequest.of(dir, List.of(dir)).withJobs(1));
    return result.findings().stream().filter(f -> f.ruleId().equals(UnseededRandomnessRule.ID)).count();
  }

  @Test
  void aProjectWithoutASeedIsReported() throws IOException {
    assertEquals(1, unseededDraws(null));
  }

  @Test
  void theDefaultEngineSeededElsewhereSilencesIt() throws IOException {
    assertEquals(0, unseededDraws("""
        import ai.djl.engine.Engine;
        class Seeding {
          static void fix() { Engine.getInstance().setRandomSeed(7); }
        }
        """));
  }

  /** Engine.setRandomSeed seeds RandomUtils.RANDOM whichever engine it is called on (javap -c, ai.djl:api 0.36.0). */
  @Test
  void anEngineLookedUpByNameSilencesIt() throws IOException {
    assertEquals(0, unseededDraws("""
        import ai.djl.engine.Engine;
        class Seeding {
          static void fix(int seed) { Engine.getEngine("PyTorch").setRandomSeed(seed); }
        }
        """));
  }

  @Test
  void anEngineOfUnknownTypeMaySeedAndSilencesIt() throws IOException {
    assertEquals(0, unseededDraws("""
        import ai.djl.ndarray.NDManager;
        class Seeding {
          static void fix(NDManager manager) { manager.getEngine().setRandomSeed(11); }
        }
        """));
  }

  @Test
  void aProjectMethodOfTheSameNameDoesNotCount() throws IOException {
    assertEquals(1, unseededDraws("""
        class Seeding {
          private int seed;
          void setRandomSeed(int seed) { this.seed = seed; }
          static void fix() { new Seeding().setRandomSeed(3); }
        }
        """));
  }
}
