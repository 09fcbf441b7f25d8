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
 * generator behind {@code randomSplit} and shuffled sampling), or a call with such a method's
 * name and arity on a receiver of unknown type. Whether the seeding call runs before the random
 * draw is not checked: any seeding call in the project silences the finding.
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
    List<ApiMethod> seeders = index.model().methods().stream()
        .filter(m -> m.effect() == Effect.SEED && m.attribute("scope") != null)
        .toList();
    workers.map(files, file -> seededIn(file, seeders)).forEach(scopes::addAll);
    out.put(SeededScopes.class, new SeededScopes(scopes));
  }

  private static Set<String> seededIn(FileContext file, List<ApiMethod> seeders) {
    Set<String> scopes = new TreeSet<>();
    for (MethodCallExpr call : Subtrees.findAll(file.source().unit(), MethodCallExpr.class)) {
      Optional<ApiMethod> m = file.types().apiMethod(call);
      if (m.isPresent() && m.get().effect() == Effect.SEED && m.get().attribute("scope") != null) {
        scopes.add(m.get().attribute("scope"));
      } else if (m.isEmpty() && file.types().receiverOf(call).isEmpty()) {
        // The receiver's type is unknown (an engine reached through a call the model does not
        // list, as Engine.getEngine(name) or a manager's getEngine()): a call with a seeding
        // method's name and arity may be that method, and an unseeded draw is reported only
        // when no seed can be anywhere.
        for (ApiMethod seeder : seeders) {
          if (seeder.name().equals(call.getNameAsString()) && seeder.acceptsArity(call.getArguments().size())) {
            scopes.add(seeder.attribute("scope"));
          }
        }
      }
    }
    return scopes;
  }
}
