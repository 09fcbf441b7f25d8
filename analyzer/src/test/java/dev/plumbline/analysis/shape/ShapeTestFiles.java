package dev.plumbline.analysis.shape;

import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.expr.Expression;
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
import java.util.stream.Collectors;

/** Analyzes in-memory sources as one project; the first source is the file under test. */
final class ShapeTestFiles {
  private static final ApiModel MODEL = ApiModel.loadDefault();

  private ShapeTestFiles() {}

  static FileContext context(String uri, String... sources) {
    List<ParsedSource> parsed = new ArrayList<>();
    SourceParser parser = new SourceParser();
    for (int i = 0; i < sources.length; i++) {
      String name = i == 0 ? uri : "src/main/java/Other" + i + ".java";
      SourceFile file = new SourceFile(Path.of(name), name);
      parsed.add(parser.parseText(file, sources[i], LineMap.IDENTITY, List.of()).parsed()
          .orElseThrow(() -> new AssertionError("does not parse: " + file)));
    }
    List<CompilationUnit> units = parsed.stream().map(ParsedSource::unit).toList();
    ProjectIndex index = ProjectIndex.build(MODEL, units);
    return new FileContext(parsed.get(0), index, new ProjectFacts());
  }

  static ShapeFacts facts(String... sources) {
    return context("src/main/java/T.java", sources).analysis(ShapeAnalysis.KEY);
  }

  /** Each tensor expression's inferred shape, one per line as {@code line: expression = shape}. */
  static String shapes(String... sources) {
    FileContext file = context("src/main/java/T.java", sources);
    ShapeFacts facts = file.analysis(ShapeAnalysis.KEY);
    List<String> out = new ArrayList<>();
    file.source().unit().walk(Node.TreeTraversal.PREORDER, n -> {
      if (n instanceof Expression e) {
        TensorShape s = facts.shapeOf(e);
        if (s != null && !(e.isNameExpr() || e.isEnclosedExpr())) {
          out.add(e.getBegin().get().line + ": " + e + " = " + s);
        }
      }
    });
    return out.stream().collect(Collectors.joining("\n"));
  }
}
