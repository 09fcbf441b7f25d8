package dev.plumbline.analysis.rowcount;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.plumbline.analysis.entrypoints.Evaluation;
import dev.plumbline.analysis.entrypoints.TrainingEntryPoint;
import dev.plumbline.engine.ScanRequest;
import dev.plumbline.engine.ScanResult;
import dev.plumbline.engine.Scanner;
import dev.plumbline.model.ApiModel;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalLong;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Test-set sizes known without running: through arrays, splits, wrappers and helpers. */
class RowCountAnalysisTest {
  private static final String IMPORTS = """
      import java.util.List;
      import org.deeplearning4j.datasets.iterator.utilty.ListDataSetIterator;
      import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
      import org.nd4j.evaluation.classification.Evaluation;
      import org.nd4j.linalg.api.ndarray.INDArray;
      import org.nd4j.linalg.dataset.DataSet;
      import org.nd4j.linalg.dataset.SplitTestAndTrain;
      import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
      import org.nd4j.linalg.factory.Nd4j;
      """;

  @TempDir
  Path dir;

  /** Rows of each evaluation in the scanned class, in source order (-1 when unknown). */
  private List<Long> rows(String... classes) throws IOException {
    for (String body : classes) {
      String name = body.substring(body.indexOf("class ") + 6, body.indexOf(" {")).trim();
      Files.writeString(dir.resolve(name + ".java"), IMPORTS + body);
    }
    ScanResult result = new Scanner(ApiModel.loadDefault(), List.of()).withAudit()
        .scan(ScanRequest.of(dir, List.of(dir)).withJobs(1));
    List<Long> out = new ArrayList<>();
    for (TrainingEntryPoint e : result.entryPoints()) {
      for (Evaluation ev : e.evaluations()) {
        out.add(ev.rows().orElse(-1));
      }
    }
    return out;
  }

  private static final String TRAIN_AND_EVALUATE = """
          MultiLayerNetwork net = new MultiLayerNetwork(null);
          net.fit(split.getTrain());
          Evaluation e = net.evaluate(new ListDataSetIterator<>(split.getTest().asList(), 32));
      """;

  @Test
  void literalArraysSplitByCount() throws IOException {
    assertEquals(List.of(250L), rows("""
        class Direct {
          public static void main(String[] args) {
            double[][] x = new double[1000][4];
            double[][] y = new double[1000][2];
            DataSet all = new DataSet(Nd4j.create(x), Nd4j.create(y));
            all.shuffle(3);
            SplitTestAndTrain split = all.splitTestAndTrain(750);
        """ + TRAIN_AND_EVALUATE + "  }\n}\n"));
  }

  @Test
  void fractionIsTruncatedAsTheLibraryDoes() throws IOException {
    // (int) (0.29 * 100) is 28 in double arithmetic, so 72 test rows, not 71.
    assertEquals(List.of(72L), rows("""
        class Fraction {
          static final int ROWS = 100;
          public static void main(String[] args) {
            DataSet all = new DataSet(Nd4j.create(ROWS, 4), Nd4j.create(ROWS, 2));
            SplitTestAndTrain split = all.splitTestAndTrain(0.29);
        """ + TRAIN_AND_EVALUATE + "  }\n}\n"));
  }

  @Test
  void helperMethodSummaryCarriesTheArgument() throws IOException {
    assertEquals(List.of(500L), rows("""
        class Loader {
          static DataSet make(int n, long seed) {
            double[][] x = new double[n][3];
            double[][] y = new double[n][2];
            INDArray f = Nd4j.create(x);
            return new DataSet(f, Nd4j.create(y));
          }
        }
        """, """
        class UsesHelper {
          public static void main(String[] args) {
            DataSet all = Loader.make(2_500, 7);
            SplitTestAndTrain split = all.splitTestAndTrain(0.8);
        """ + TRAIN_AND_EVALUATE + "  }\n}\n"));
  }

  @Test
  void unknownWhenPathsDisagreeOrDataGoesToUnknownCode() throws IOException {
    assertEquals(List.of(-1L, -1L, -1L), rows("""
        class Unsure {
          public static void main(String[] args) {
            int n = args.length > 0 ? 1000 : 2000;
            DataSet all = new DataSet(Nd4j.create(n, 4), Nd4j.create(n, 2));
            SplitTestAndTrain split = all.splitTestAndTrain(0.5);
        """ + TRAIN_AND_EVALUATE + """
          }
          static void grow(DataSet d) {}
          static void second(DataSet all, MultiLayerNetwork net) {
            all = new DataSet(Nd4j.create(100, 4), Nd4j.create(100, 2));
            grow(all);
            SplitTestAndTrain split = all.splitTestAndTrain(50);
            net.fit(split.getTrain());
            Evaluation e = net.evaluate(new ListDataSetIterator<>(split.getTest().asList(), 32));
          }
          static void third(MultiLayerNetwork net, DataSetIterator batches) {
            net.fit(batches);
            Evaluation e = net.evaluate(batches);
          }
        }
        """));
  }
}
