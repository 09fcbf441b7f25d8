package dev.plumbline.gate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.github.javaparser.StaticJavaParser;
import com.github.javaparser.ast.expr.AnnotationExpr;
import dev.plumbline.discover.SourceFile;
import dev.plumbline.parse.LineMap;
import dev.plumbline.parse.ParsedSource;
import dev.plumbline.parse.SourceParser;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

class SuppressionSitesTest {
  private static SuppressionSites sites(String code) {
    return SuppressionSites.of(StaticJavaParser.parse(code), code);
  }

  @Test
  void annotationCoversItsDeclarationWithTheCommentAboveAsReason() {
    SuppressionSites s = sites("""
        class A {
          // rows are synthetic
          // and never scored
          @SuppressWarnings({"unchecked", "plumbline:leak.x"})
          void m() {
            f();
          }
          void n() { f(); }
        }
        """);
    assertEquals(1, s.sites().size());
    SuppressionSites.Site site = s.sites().get(0);
    assertEquals("leak.x", site.ruleId());
    assertEquals(Optional.of("rows are synthetic and never scored"), site.reason());
    assertEquals(4, site.firstLine());
    assertEquals(7, site.lastLine());
    assertTrue(s.match("leak.x", 6).isPresent());
    assertTrue(s.match("leak.x", 8).isEmpty(), "the next method is not covered");
    assertTrue(s.match("leak.y", 6).isEmpty(), "another rule is not covered");
  }

  @Test
  void aNameSpelledWithUnicodeEscapesIsNoSuppression() {
    // A file without the words "SuppressWarnings" and "plumbline:" is answered without looking
    // at its tree; that is exact only because the parser leaves unicode escapes undecoded.
    String code = "class A {\n  @\\u0053uppressWarnings(\"\\u0070lumbline:leak.x\") void m() {}\n}\n";
    SourceFile file = new SourceFile(Path.of("A.java"), "A.java");
    Optional<ParsedSource> parsed =
        new SourceParser().parseText(file, code, LineMap.IDENTITY, List.of()).parsed();
    parsed.ifPresent(p -> assertTrue(p.unit().findAll(AnnotationExpr.class).stream()
        .noneMatch(a -> a.getNameAsString().contains("SuppressWarnings")), code));
    assertTrue(parsed.isEmpty() || SuppressionSites.of(parsed.get().unit(), code).sites().isEmpty());
  }

  @Test
  void annotationWithoutAnyCommentStillSuppressesWithNoReason() {
    SuppressionSites s = sites("""
        class A {
          @SuppressWarnings(value = "plumbline:leak.x") int field = f();
        }
        """);
    assertEquals(Optional.empty(), s.match("leak.x", 2).get().reason());
  }

  @Test
  void commentAfterCodeCoversItsLineAndAloneCoversTheNextStatement() {
    SuppressionSites s = sites("""
        class A {
          void m() {
            f(); // plumbline:accept leak.x, shape.y because the sizes are fixed upstream
            // plumbline:accept leak.z because checked by hand

            g(1,
              2);
            h();
          }
        }
        """);
    assertEquals(List.of("leak.x", "shape.y", "leak.z"),
        s.sites().stream().map(SuppressionSites.Site::ruleId).toList());
    assertEquals("the sizes are fixed upstream", s.match("shape.y", 3).get().reason().get());
    assertTrue(s.match("leak.x", 4).isEmpty());
    assertTrue(s.match("leak.z", 6).isPresent());
    assertTrue(s.match("leak.z", 7).isPresent(), "a statement spanning lines is covered whole");
    assertTrue(s.match("leak.z", 8).isEmpty());
  }

  @Test
  void unusableSuppressionsAreProblemsNotSites() {
    SuppressionSites s = sites("""
        class A {
          @SuppressWarnings({"plumbline:", "plumbline:Leak X"})
          void m() {
            f(); // plumbline:accept leak.x
            g(); // plumbline:accept because nobody cares
            h(); // plumbline:ignore leak.x because no
            i(); // plumbline:accept leak.x because
            j(); // plumbline:acceptance leak.x because x
          }
        }
        """);
    assertTrue(s.sites().isEmpty(), () -> "sites: " + s.sites());
    assertEquals(List.of(
            SuppressionSites.ProblemKind.MISSING_RULE_ID, SuppressionSites.ProblemKind.BAD_RULE_ID,
            SuppressionSites.ProblemKind.MISSING_REASON, SuppressionSites.ProblemKind.MISSING_RULE_ID,
            SuppressionSites.ProblemKind.UNKNOWN_DIRECTIVE, SuppressionSites.ProblemKind.MISSING_REASON,
            SuppressionSites.ProblemKind.UNKNOWN_DIRECTIVE),
        s.problems().stream().map(SuppressionSites.Problem::kind).toList());
  }

  @Test
  void theNarrowestSuppressionWins() {
    SuppressionSites s = sites("""
        class A {
          // broad reason
          @SuppressWarnings("plumbline:leak.x")
          void m() {
            f(); // plumbline:accept leak.x because narrow reason
          }
        }
        """);
    assertEquals("narrow reason", s.match("leak.x", 5).get().reason().get());
  }
}
