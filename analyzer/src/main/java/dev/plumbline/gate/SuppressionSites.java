package dev.plumbline.gate;

import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.BodyDeclaration;
import com.github.javaparser.ast.comments.Comment;
import com.github.javaparser.ast.comments.LineComment;
import com.github.javaparser.ast.expr.AnnotationExpr;
import com.github.javaparser.ast.expr.ArrayInitializerExpr;
import com.github.javaparser.ast.expr.Expression;
import com.github.javaparser.ast.expr.MemberValuePair;
import com.github.javaparser.ast.expr.NormalAnnotationExpr;
import com.github.javaparser.ast.expr.SingleMemberAnnotationExpr;
import com.github.javaparser.ast.expr.StringLiteralExpr;
import com.github.javaparser.ast.stmt.BlockStmt;
import com.github.javaparser.ast.stmt.Statement;
import dev.plumbline.engine.AnalysisKey;
import dev.plumbline.fix.TextLines;
import dev.plumbline.parse.Subtrees;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The suppressions written in one file, and the malformed ones.
 *
 * <p>Two forms (see {@code docs/configuration.md}):
 * <ul>
 *   <li>Java's {@code @SuppressWarnings("plumbline:RULE-ID")} on any declaration covers the
 *       declaration's lines. Its reason is a line comment on the annotation's line or the line
 *       comments right above it; the reason is optional because the annotation is standard Java.
 *   <li>A line comment {@code // plumbline:accept RULE-ID[, RULE-ID...] because REASON}. A reason
 *       is required. After code it covers its own line; on a line of its own it covers the next
 *       line of code; in both cases extended to the end of a simple statement (an expression,
 *       declaration, return or throw) that starts on that line.
 * </ul>
 *
 * <p>Rule ids are taken as written; whether they name real rules is the caller's check, since
 * only the caller knows the rules.
 */
public final class SuppressionSites {
  /** Shared by rules that check suppressions, computed once per file. */
  public static final AnalysisKey<SuppressionSites> KEY =
      AnalysisKey.of("suppression-sites", f -> of(f.source().unit(), f.source().text()));

  /** The prefix of a {@code @SuppressWarnings} token that names a plumbline rule. */
  public static final String TOKEN_PREFIX = "plumbline:";
  /** The comment directive. */
  public static final String DIRECTIVE = "plumbline:accept";

  private static final Pattern RULE_ID = Pattern.compile("[a-z]+\\.[a-z0-9]+(-[a-z0-9]+)*");
  private static final Pattern BECAUSE = Pattern.compile("\\sbecause(\\s+|$)");

  public enum Kind { ANNOTATION, COMMENT }

  /**
   * One rule id named by one suppression.
   *
   * @param node the string literal or comment that names it, for locating reports
   * @param firstLine first covered line
   * @param lastLine last covered line
   * @param reason the justification; empty when none was written (annotations only)
   */
  public record Site(Kind kind, String ruleId, Node node, int firstLine, int lastLine,
      Optional<String> reason) {

    public boolean covers(String rule, int line) {
      return ruleId.equals(rule) && firstLine <= line && line <= lastLine;
    }

    int span() {
      return lastLine - firstLine;
    }
  }

  /** A suppression that cannot be used. */
  public enum ProblemKind { MISSING_REASON, MISSING_RULE_ID, BAD_RULE_ID, UNKNOWN_DIRECTIVE }

  /** @param text the offending id or directive, for the message */
  public record Problem(ProblemKind kind, Node node, String text) {}

  private static final SuppressionSites NONE = new SuppressionSites(List.of(), List.of());

  private final List<Site> sites;
  private final List<Problem> problems;

  private SuppressionSites(List<Site> sites, List<Problem> problems) {
    this.sites = List.copyOf(sites);
    this.problems = List.copyOf(problems);
  }

  public List<Site> sites() {
    return sites;
  }

  public List<Problem> problems() {
    return problems;
  }

  /**
   * The suppression that covers a finding of {@code ruleId} starting on {@code line}: the
   * narrowest one, a comment before an annotation of the same width.
   */
  public Optional<Site> match(String ruleId, int line) {
    return sites.stream()
        .filter(s -> s.covers(ruleId, line))
        .min(Comparator.comparingInt(Site::span).thenComparing(s -> s.kind() == Kind.ANNOTATION));
  }

  public static SuppressionSites of(CompilationUnit unit, String text) {
    // Both kinds of site are spelled out in the text, unicode escapes aside, which the parser
    // does not decode: a file without either word (nearly every file) has none, nor problems.
    if (!text.contains("SuppressWarnings") && !text.contains(TOKEN_PREFIX)) {
      return NONE;
    }
    TextLines lines = new TextLines(text);
    List<Site> sites = new ArrayList<>();
    List<Problem> problems = new ArrayList<>();
    List<LineComment> lineComments = unit.getAllComments().stream()
        .filter(Comment::isLineComment).map(Comment::asLineComment)
        .filter(c -> c.getBegin().isPresent())
        .toList();
    for (AnnotationExpr a : Subtrees.findAll(unit, AnnotationExpr.class)) {
      String name = a.getNameAsString();
      if (!name.equals("SuppressWarnings") && !name.equals("java.lang.SuppressWarnings")) {
        continue;
      }
      Node declaration = a.getParentNode().orElse(null);
      if (declaration == null || declaration.getRange().isEmpty() || a.getBegin().isEmpty()) {
        continue;
      }
      Optional<String> reason = annotationReason(a, lineComments);
      for (StringLiteralExpr token : tokens(a)) {
        String value = token.asString();
        if (!value.startsWith(TOKEN_PREFIX) && !value.equals("plumbline")) {
          continue;
        }
        String id = value.startsWith(TOKEN_PREFIX) ? value.substring(TOKEN_PREFIX.length()).strip() : "";
        if (id.isEmpty()) {
          problems.add(new Problem(ProblemKind.MISSING_RULE_ID, token, value));
        } else if (!RULE_ID.matcher(id).matches()) {
          problems.add(new Problem(ProblemKind.BAD_RULE_ID, token, id));
        } else {
          sites.add(new Site(Kind.ANNOTATION, id, token, declaration.getBegin().get().line,
              declaration.getEnd().get().line, reason));
        }
      }
    }
    for (LineComment c : lineComments) {
      String content = c.getContent().strip();
      if (!content.startsWith(TOKEN_PREFIX)) {
        continue;
      }
      if (!content.startsWith(DIRECTIVE) || (content.length() > DIRECTIVE.length()
          && !Character.isWhitespace(content.charAt(DIRECTIVE.length())))) {
        problems.add(new Problem(ProblemKind.UNKNOWN_DIRECTIVE, c, firstWord(content)));
        continue;
      }
      String rest = " " + content.substring(DIRECTIVE.length());
      Matcher because = BECAUSE.matcher(rest);
      String idsPart = rest;
      String reason = "";
      if (because.find()) {
        idsPart = rest.substring(0, because.start());
        reason = rest.substring(because.end()).strip();
      }
      List<String> ids = new ArrayList<>();
      for (String part : idsPart.split(",")) {
        if (!part.isBlank()) {
          ids.add(part.strip());
        }
      }
      if (ids.isEmpty()) {
        problems.add(new Problem(ProblemKind.MISSING_RULE_ID, c, content));
        continue;
      }
      if (reason.isEmpty()) {
        problems.add(new Problem(ProblemKind.MISSING_REASON, c, String.join(", ", ids)));
        continue;
      }
      int[] covered = coveredLines(c, lines, unit);
      for (String id : ids) {
        if (!RULE_ID.matcher(id).matches()) {
          problems.add(new Problem(ProblemKind.BAD_RULE_ID, c, id));
        } else {
          sites.add(new Site(Kind.COMMENT, id, c, covered[0], covered[1], Optional.of(reason)));
        }
      }
    }
    sites.sort(Comparator.comparingInt(Site::firstLine).thenComparing(Site::ruleId));
    return new SuppressionSites(sites, problems);
  }

  /** The string tokens of {@code @SuppressWarnings(...)}, in any of its three written forms. */
  private static List<StringLiteralExpr> tokens(AnnotationExpr a) {
    Expression value = null;
    if (a instanceof SingleMemberAnnotationExpr s) {
      value = s.getMemberValue();
    } else if (a instanceof NormalAnnotationExpr n) {
      for (MemberValuePair p : n.getPairs()) {
        if (p.getNameAsString().equals("value")) {
          value = p.getValue();
        }
      }
    }
    List<StringLiteralExpr> out = new ArrayList<>();
    if (value instanceof StringLiteralExpr s) {
      out.add(s);
    } else if (value instanceof ArrayInitializerExpr arr) {
      for (Expression e : arr.getValues()) {
        if (e instanceof StringLiteralExpr s) {
          out.add(s);
        }
      }
    }
    return out;
  }

  /** A trailing line comment on the annotation's last line, else the line comments right above it. */
  private static Optional<String> annotationReason(AnnotationExpr a, List<LineComment> comments) {
    int first = a.getBegin().get().line;
    int last = a.getEnd().map(p -> p.line).orElse(first);
    for (LineComment c : comments) {
      if (c.getBegin().get().line == last && c.getBegin().get().column > a.getEnd().get().column) {
        return nonEmpty(c.getContent());
      }
    }
    List<String> above = new ArrayList<>();
    int expected = first - 1;
    for (int i = comments.size() - 1; i >= 0; i--) {
      LineComment c = comments.get(i);
      int line = c.getBegin().get().line;
      if (line == expected && !c.getContent().strip().startsWith(TOKEN_PREFIX)) {
        above.add(0, c.getContent().strip());
        expected--;
      } else if (line < expected) {
        break;
      }
    }
    return nonEmpty(String.join(" ", above));
  }

  private static Optional<String> nonEmpty(String s) {
    String t = s.strip();
    return t.isEmpty() ? Optional.empty() : Optional.of(t);
  }

  /** First and last line a suppression comment covers. */
  private static int[] coveredLines(LineComment c, TextLines lines, CompilationUnit unit) {
    int line = c.getBegin().get().line;
    String before = lines.content(line).substring(0, Math.min(lines.content(line).length(),
        c.getBegin().get().column - 1));
    int target = line;
    if (before.isBlank()) {
      target = line + 1;
      while (target <= lines.count() && isBlankOrComment(lines.content(target))) {
        target++;
      }
      if (target > lines.count()) {
        return new int[] {line, line};
      }
    }
    int last = target;
    for (Statement s : Subtrees.findAll(unit, Statement.class)) {
      if (s.getBegin().map(p -> p.line).orElse(-1) == target && isSimple(s)) {
        last = Math.max(last, s.getEnd().get().line);
      }
    }
    for (BodyDeclaration<?> d : Subtrees.findAll(unit, BodyDeclaration.class)) {
      if (d.isFieldDeclaration() && d.getBegin().map(p -> p.line).orElse(-1) == target) {
        last = Math.max(last, d.getEnd().get().line);
      }
    }
    return new int[] {target, last};
  }

  private static boolean isSimple(Statement s) {
    return (s.isExpressionStmt() || s.isReturnStmt() || s.isThrowStmt())
        && Subtrees.findFirst(s, BlockStmt.class).isEmpty();
  }

  private static boolean isBlankOrComment(String line) {
    String t = line.strip();
    return t.isEmpty() || t.startsWith("//");
  }

  private static String firstWord(String s) {
    int i = 0;
    while (i < s.length() && !Character.isWhitespace(s.charAt(i))) {
      i++;
    }
    return s.substring(0, i);
  }
}
