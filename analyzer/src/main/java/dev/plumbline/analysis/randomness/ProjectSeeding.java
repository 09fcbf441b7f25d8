package dev.plumbline.analysis.randomness;

import com.github.javaparser.ast.expr.MethodCallExpr;
import dev.plumbline.engine.FileContext;
import dev.plumbline.engine.ProjectAnalysis;
import dev.plumbline.engine.ProjectFacts;
import dev.plumbline.engine.Workers;
import dev.plumbline.model.ApiMethod;
import dev.plumbline.model.Effect;
import dev.plumbline.parse.Subtrees;
import dev.plumbline.types.ProjectIndex;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;

/**
 * Which framework-wide random generators the project seeds anywhere: a call with
 * {@code Effect.SEED} and a {@code scope} attribute (DJL's {@code Engine.setRandomSeed} seeds the
 * generator behind {@code randomSplit} and shuffled sampling). Whether the seeding call runs
 * before the random draw is not checked: any seeding call in the project silences the finding.
 */
public final class ProjectSeeding implements ProjectAnalysis {

  /** The seeded scopes, e.g. {@code djl}. */
  public record SeededScopes(Set<String> scopes) {
    public SeededScopes {
      scopes = Set.copyOf(scopes);
    }

    public boolean seeded(String scope) {
      return scopes.contains(scope);
    }
  }

  @Override
  public void compute(List<FileContext> files, ProjectIndex index, ProjectFacts out,
      Workers workers) {
    Set<String> scopes = new TreeSet<>();
    workers.map(files, ProjectSeeding::seededIn).forEach(scopes::addAll);
    out.put(SeededScopes.class, new SeededScopes(scopes));
  }

  private static Set<String> seededIn(FileContext file) {
    Set<String> scopes = new TreeSet<>();
    for (MethodCallExpr call : Subtrees.findAll(file.source().unit(), MethodCallExpr.class)) {
      Optional<ApiMethod> m = file.types().apiMethod(call);
      if (m.isPresent() && m.get().effect() == Effect.SEED && m.get().attribute("scope") != null) {
        scopes.add(m.get().attribute("scope"));
      }
    }
    return scopes;
  }
}
