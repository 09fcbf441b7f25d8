package dev.plumbline.parse;

import com.github.javaparser.ParseResult;
import com.github.javaparser.ParserConfiguration;
import com.github.javaparser.Problem;
import com.github.javaparser.Processor;
import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.validator.ProblemReporter;
import com.github.javaparser.ast.validator.SingleNodeTypeValidator;
import com.github.javaparser.ast.validator.TreeVisitorValidator;
import com.github.javaparser.ast.validator.TypedValidator;
import com.github.javaparser.ast.validator.Validator;
import com.github.javaparser.ast.validator.Validators;
import com.github.javaparser.ast.validator.VisitorValidator;
import com.github.javaparser.ast.validator.language_level_validations.Java21Validator;
import com.github.javaparser.ast.validator.postprocessors.Java10PostProcessor;
import com.github.javaparser.ast.validator.postprocessors.Java21PostProcessor;
import com.github.javaparser.ast.validator.postprocessors.PostProcessors;
import java.lang.reflect.Field;
import java.lang.reflect.Method;
import java.util.ArrayList;
import java.util.List;

/**
 * JavaParser's Java 21 language level, done at lower cost: its post-processing (which turns
 * {@code var} into a var type, among others) and its validation (reserved words, modifiers, where
 * {@code var}, {@code yield} and records may appear, ...). A parser with {@link #configuration()}
 * gives the tree and the problems that a parser configured for Java 21 gives; only the cost differs.
 *
 * <p>Why: JavaParser's Java 21 validator is a list of about 25 checks, and 20 of them walk the
 * whole tree on their own (a {@link SingleNodeTypeValidator} finds its node type with a full
 * search, a {@link TreeVisitorValidator} visits every node). On the benchmark's project these walks
 * took as long as the parse itself. Here the per-node checks run in one walk, and the checks that
 * are visitors start only at the nodes they look at (see {@link SubtreeVisitor}).
 *
 * <p>The fused walk only answers "does the tree have a problem". When it finds one, or throws, the
 * tree is validated again by JavaParser's own validator, so a rejected file gets exactly the
 * problems, in the order and with the messages, that JavaParser reports. Valid files, nearly all of
 * them, take the fast path.
 *
 * <p>The fusing reaches into two private fields of JavaParser's validator classes. If a JavaParser
 * version lacks them, that validator runs as a whole ({@link #fusedChecks()} then drops), which is
 * slower but the same.
 */
final class Java21Rules {
  private static final Field TREE_VISITOR_CHECK = PrivateFields.find(TreeVisitorValidator.class, "validator");
  private static final Field SINGLE_TYPE = PrivateFields.find(SingleNodeTypeValidator.class, "type");
  private static final Field SINGLE_TYPE_CHECK = PrivateFields.find(SingleNodeTypeValidator.class, "validator");

  /** JavaParser's own validator, for the exact problems of a rejected tree. */
  private static final Validator STANDARD = new Java21Validator();
  private static final PostProcessors POST_PROCESSOR = new Java21PostProcessor();
  /**
   * Whether the post-processing only turns class types named {@code var} into var types (its one
   * processor comes from {@link Java10PostProcessor}; later levels add none), so that a source
   * without such a name can skip it.
   */
  private static final boolean POST_PROCESSING_IS_VAR_ONLY =
      POST_PROCESSOR instanceof Java10PostProcessor && POST_PROCESSOR.getPostProcessors().size() == 1;

  /** A check applied to every node of the type (Node for a tree-visitor check). */
  private record NodeCheck(Class<? extends Node> type, Validator check) {}

  private static final List<NodeCheck> NODE_CHECKS = new ArrayList<>();
  /**
   * A visitor validator (a {@link com.github.javaparser.ast.visitor.VoidVisitorAdapter}) checks
   * only at the node types whose {@code visit} it overrides; everywhere else it only descends.
   * Started at each outermost node of those types, it therefore reports what it reports when
   * started at the root, without the walk down to them. For the name checks (reserved words,
   * {@code _}, {@code record}) that is a visit of each name instead of the whole tree.
   */
  private record SubtreeVisitor(VisitorValidator visitor, Class<?>[] entryTypes) {}

  private static final List<SubtreeVisitor> SUBTREE_VISITORS = new ArrayList<>();
  /** Checks of any other kind; each runs once on the root. */
  private static final List<Validator> WHOLE_TREE_CHECKS = new ArrayList<>();

  static {
    split(STANDARD);
  }

  private Java21Rules() {}

  /**
   * A parser configuration for Java 21 whose language-level work is done here. JavaParser reads
   * the configuration's language level twice: before the parse, to choose the grammar (whether
   * {@code yield} is a statement), and after it, to post-process and validate. A first processor
   * sets the level to raw once the tree is built, so JavaParser's own validation is skipped; a last
   * one does that work as the Java 21 level would and sets the level back. Both run inside
   * {@code JavaParser.parse}, which sorts the problems afterwards and turns a failing check into a
   * problem, as it does for its own.
   */
  static ParserConfiguration configuration() {
    return configuration(true);
  }

  /**
   * As {@link #configuration()}, for a source of which {@code mayNameVar} says whether it may
   * have an identifier {@code var} ({@link #mayNameVar(String)}). If not, the post-processing,
   * which searches the whole tree for types named {@code var}, has nothing to do and is skipped.
   */
  static ParserConfiguration configuration(boolean mayNameVar) {
    boolean postProcess = mayNameVar || !POST_PROCESSING_IS_VAR_ONLY;
    ParserConfiguration configuration = new ParserConfiguration()
        .setLanguageLevel(ParserConfiguration.LanguageLevel.JAVA_21);
    configuration.getProcessors().add(0, () -> new Processor() {
      @Override
      public void postProcess(ParseResult<? extends Node> result, ParserConfiguration config) {
        config.setLanguageLevel(ParserConfiguration.LanguageLevel.RAW);
      }
    });
    configuration.getProcessors().add(() -> new Processor() {
      @Override
      public void postProcess(ParseResult<? extends Node> result, ParserConfiguration config) {
        config.setLanguageLevel(ParserConfiguration.LanguageLevel.JAVA_21);
        if (postProcess) {
          POST_PROCESSOR.postProcess(result, config);
        }
        Node root = result.getResult().get(); // absent only where JavaParser's level fails too
        Subtrees.Layout layout = Subtrees.Layout.of(root);
        if (!result.getProblems().isEmpty() || hasProblem(layout)) {
          STANDARD.accept(root, new ProblemReporter(result.getProblems()::add));
        } else {
          root.setData(Subtrees.Layout.KEY, layout); // the tree stays as laid out: SourceParser reuses it
        }
      }
    });
    return configuration;
  }

  /**
   * False only if {@code text} cannot hold the identifier {@code var}: every occurrence of the
   * letters is inside a longer name, which the lexer reads as one token. That is so when a
   * letter, digit, {@code _} or {@code $} follows, or when the run of such characters just before
   * starts with a letter, {@code _} or {@code $} (a run starting with a digit may be a number
   * followed by a name, as in {@code 1Lvar}). JavaParser leaves unicode escapes in names
   * undecoded, so a {@code var} spelled with one is no {@code var}. Linear: the runs walked back
   * over end at distinct non-word characters, so they do not overlap.
   */
  static boolean mayNameVar(String text) {
    for (int i = text.indexOf("var"); i >= 0; i = text.indexOf("var", i + 1)) {
      if (i + 3 < text.length() && isWordPart(text.charAt(i + 3))) {
        continue;
      }
      int runStart = i;
      while (runStart > 0 && isWordPart(text.charAt(runStart - 1))) {
        runStart--;
      }
      if (runStart == i || isDigit(text.charAt(runStart))) {
        return true;
      }
    }
    return false;
  }

  private static boolean isDigit(char c) {
    return c >= '0' && c <= '9';
  }

  private static boolean isWordPart(char c) {
    return c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' || isDigit(c) || c == '_' || c == '$';
  }

  /** Number of checks run in the fused walk (a test watches that fusing still happens). */
  static int fusedChecks() {
    return NODE_CHECKS.size() + SUBTREE_VISITORS.size();
  }

  /** True if any check reports a problem on the tree, or fails on it. */
  static boolean hasProblem(Node unit) {
    return hasProblem(Subtrees.Layout.of(unit));
  }

  /**
   * True if any check reports a problem on the tree laid out in {@code layout}, or fails on it.
   * One pass over the nodes in pre-order; a visitor validator started at a node covers the node's
   * subtree, the slice up to its subtree end, and starts again only after it.
   */
  static boolean hasProblem(Subtrees.Layout layout) {
    boolean[] found = {false};
    ProblemReporter flag = new ProblemReporter((Problem p) -> found[0] = true);
    Node[] nodes = layout.preorder;
    int[] subtreeEnds = layout.subtreeEnds;
    int[] coveredUntil = new int[SUBTREE_VISITORS.size()];
    try {
      for (Validator whole : WHOLE_TREE_CHECKS) {
        whole.accept(nodes[0], flag);
        if (found[0]) {
          return true;
        }
      }
      for (int i = 0; i < nodes.length; i++) {
        Node node = nodes[i];
        Dispatch dispatch = DISPATCH.get(node.getClass());
        for (Validator check : dispatch.checks()) {
          check.accept(node, flag);
        }
        for (int k : dispatch.visitors()) {
          if (i >= coveredUntil[k]) {
            SUBTREE_VISITORS.get(k).visitor().accept(node, flag);
            coveredUntil[k] = subtreeEnds[i];
          }
        }
        if (found[0]) {
          return true;
        }
      }
      return false;
    } catch (RuntimeException e) {
      return true; // let the standard validator meet it, as a parse without fusing would
    }
  }

  /** What applies to nodes of one class: its node checks, and the visitors that start there. */
  private record Dispatch(Validator[] checks, int[] visitors) {}

  private static final ClassValue<Dispatch> DISPATCH = new ClassValue<>() {
    @Override
    protected Dispatch computeValue(Class<?> nodeClass) {
      List<Validator> checks = new ArrayList<>();
      for (NodeCheck c : NODE_CHECKS) {
        if (c.type().isAssignableFrom(nodeClass)) {
          checks.add(c.check());
        }
      }
      List<Integer> visitors = new ArrayList<>();
      for (int k = 0; k < SUBTREE_VISITORS.size(); k++) {
        for (Class<?> entry : SUBTREE_VISITORS.get(k).entryTypes()) {
          if (entry.isAssignableFrom(nodeClass)) {
            visitors.add(k);
            break;
          }
        }
      }
      return new Dispatch(checks.toArray(new Validator[0]),
          visitors.stream().mapToInt(Integer::intValue).toArray());
    }
  };

  @SuppressWarnings({"unchecked", "rawtypes"})
  private static void split(Validator validator) {
    if (validator instanceof Validators group) {
      for (Validator v : group.getValidators()) {
        split(v);
      }
      return;
    }
    Object inner;
    if (validator instanceof TreeVisitorValidator
        && (inner = read(TREE_VISITOR_CHECK, validator)) instanceof Validator check) {
      NODE_CHECKS.add(new NodeCheck(Node.class, check));
      return;
    }
    Object type;
    if (validator instanceof SingleNodeTypeValidator
        && (type = read(SINGLE_TYPE, validator)) instanceof Class<?> nodeType
        && (inner = read(SINGLE_TYPE_CHECK, validator)) instanceof TypedValidator typed) {
      NODE_CHECKS.add(new NodeCheck((Class<? extends Node>) nodeType,
          (node, reporter) -> typed.accept(node, reporter)));
      return;
    }
    if (validator instanceof VisitorValidator visitor) {
      List<Class<?>> entries = visitedTypes(visitor.getClass());
      if (!entries.isEmpty()) {
        SUBTREE_VISITORS.add(new SubtreeVisitor(visitor, entries.toArray(new Class<?>[0])));
        return;
      }
    }
    WHOLE_TREE_CHECKS.add(validator);
  }

  /** The node types whose {@code visit} a visitor validator overrides: where it checks anything. */
  private static List<Class<?>> visitedTypes(Class<?> visitorClass) {
    List<Class<?>> out = new ArrayList<>();
    for (Class<?> c = visitorClass; c != null && c != VisitorValidator.class; c = c.getSuperclass()) {
      for (Method m : c.getDeclaredMethods()) {
        if (m.getName().equals("visit") && m.getParameterCount() == 2
            && Node.class.isAssignableFrom(m.getParameterTypes()[0])
            && !out.contains(m.getParameterTypes()[0])) {
          out.add(m.getParameterTypes()[0]);
        }
      }
    }
    return out;
  }

  private static Object read(Field field, Object owner) {
    try {
      return field == null ? null : field.get(owner);
    } catch (IllegalAccessException e) {
      return null;
    }
  }
}
