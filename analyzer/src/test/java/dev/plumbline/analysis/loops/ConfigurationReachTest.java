package dev.plumbline.analysis.loops;

import static org.junit.jupiter.api.Assertions.assertEquals;

import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.body.MethodDeclaration;
import dev.plumbline.discover.SourceFile;
import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.ProjectFacts;
import dev.plumbline.model.ApiModel;
import dev.plumbline.parse.LineMap;
import dev.plumbline.parse.ParsedSource;
import dev.plumbline.parse.SourceParser;
import dev.plumbline.types.ProjectIndex;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;

/**
 * Which parameters reach a training configuration through helpers. The analysis visits methods
 * in source order and looks again only at methods whose callees changed, so these cases put
 * callers before callees (each level is learned one round later) and recursion (a method whose
 * own answer feeds its next look).
 */
class ConfigurationReachTest {
  private static final ApiModel MODEL = ApiModel.loadDefault();

  private static final String HEADER = """
      import org.deeplearning4j.nn.conf.NeuralNetConfiguration;
      import org.nd4j.linalg.learning.config.Adam;
      """;

  @Test
  void aChainDeclaredCallersFirstIsFollowedToItsEnd() {
    Map<String, Set<Integer>> reach = reach(HEADER + """
        class Helpers {
          static Object outer(int unused, double rate) { return middle(rate); }
          static Object middle(double rate) { return inner(rate, 3); }
          static Object inner(double rate, int layers) {
            return new NeuralNetConfiguration.Builder().updater(new Adam(rate)).list().build();
          }
        }
        """);
    assertEquals(Set.of(1), reach.get("outer"));
    assertEquals(Set.of(0), reach.get("middle"));
    assertEquals(Set.of(0), reach.get("inner"));
  }

  @Test
  void aParameterPassedOnlyToARecursiveCallReachesWhatTheRecursionReaches() {
    Map<String, Set<Integer>> reach = reach(HEADER + """
        class Search {
          static Object tune(double rate, double other, int depth) {
            if (depth == 0) {
              return new NeuralNetConfiguration.Builder().updater(new Adam(rate)).list().build();
            }
            return tune(other, rate, depth - 1);
          }
        }
        """);
    // rate reaches directly; other reaches only because it becomes rate in the recursive call.
    assertEquals(Set.of(0, 1), reach.get("tune"));
  }

  @Test
  void parametersThatNeverMeetAConfigurationReachNothing() {
    Map<String, Set<Integer>> reach = reach(HEADER + """
        class Plain {
          static int caller(int n) { return twice(n); }
          static int twice(int n) { return 2 * n; }
        }
        """);
    assertEquals(Set.of(), reach.get("caller"));
    assertEquals(Set.of(), reach.get("twice"));
  }

  private static Map<String, Set<Integer>> reach(String source) {
    SourceFile file = new SourceFile(Path.of("src/main/java/T.java"), "src/main/java/T.java");
    ParsedSource parsed = new SourceParser().parseText(file, source, LineMap.IDENTITY, List.of())
        .parsed().orElseThrow(() -> new AssertionError("does not parse"));
    List<CompilationUnit> units = List.of(parsed.unit());
    ProjectIndex index = ProjectIndex.build(MODEL, units);
    ProjectFacts facts = new ProjectFacts();
    FileContext context = new FileContext(parsed, index, facts);
    new ConfigurationReach().compute(new ArrayList<>(List.of(context)), index, facts);
    ConfigurationReach.Parameters parameters = facts.get(ConfigurationReach.Parameters.class);
    Map<String, Set<Integer>> out = new TreeMap<>();
    for (MethodDeclaration m : parsed.unit().findAll(MethodDeclaration.class)) {
      out.put(m.getNameAsString(), parameters.of(m));
    }
    return out;
  }
}
