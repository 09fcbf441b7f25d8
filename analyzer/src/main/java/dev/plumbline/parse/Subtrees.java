package dev.plumbline.parse;

import com.github.javaparser.Range;
import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.DataKey;
import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.comments.Comment;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import java.util.function.Consumer;
import java.util.function.Predicate;

/**
 * Subtree queries (all nodes of a type, the first match, a walk) answered from a file's nodes laid
 * out once in pre-order, where a node's subtree is a contiguous slice. JavaParser's own
 * {@code findAll} and {@code walk} build an iterator with a synchronized stack and copy every
 * child list on the way; the analyses ask such questions of every method many times, and in a
 * profile of a scan 40% of the analysis time went to those walks.
 *
 * <p>Answers are exactly JavaParser's: the same nodes in the same order (pre-order, children in
 * {@link Node#getChildNodes()} order, the root included when it matches). The layout is made by
 * {@link #index} when a file is parsed and lives in each node's range (an {@link IndexedRange},
 * so it costs no map and follows the node wherever it goes). A node without one (made after
 * parsing, or from a file parsed elsewhere) is answered by JavaParser's walk. Parsed trees are never
 * changed afterwards, which is what keeps the layout true.
 */
public final class Subtrees {
  private Subtrees() {}

  /**
   * A node's range plus its place in its file's pre-order layout. Equal (as {@link Range} defines
   * it, class included) only to another node's indexed range with the same ends.
   */
  public static final class IndexedRange extends Range {
    private final Node[] preorder;
    private final int index;
    /** One past the last node of the subtree in {@link #preorder}. */
    private final int subtreeEnd;

    IndexedRange(Range range, Node[] preorder, int index, int subtreeEnd) {
      super(range.begin, range.end);
      this.preorder = preorder;
      this.index = index;
      this.subtreeEnd = subtreeEnd;
    }
  }

  /**
   * A tree's nodes in pre-order (children in {@link Node#getChildNodes()} order, the root first)
   * with, for each, one past the last node of its subtree. Made once per file: the parse's
   * validation walks it ({@link Java21Rules}), then {@link #install} keeps it in the nodes' ranges.
   */
  static final class Layout {
    /** Where a parse leaves the layout of its tree (on the root), for {@link SourceParser}. */
    static final DataKey<Layout> KEY = new DataKey<>() {};

    final Node[] preorder;
    final int[] subtreeEnds;

    private Layout(Node[] preorder, int[] subtreeEnds) {
      this.preorder = preorder;
      this.subtreeEnds = subtreeEnds;
    }

    /** Lays out {@code root}'s subtree. Iterative, so deeply nested code cannot overflow the stack. */
    static Layout of(Node root) {
      Node[] order = new Node[256];
      int[] ends = new int[256];
      int size = 0;
      // The path from the root to the node being entered: each open node's place in the layout,
      // its children, and the next of them to enter. Primitive arrays, as this runs on every node
      // of every file while parsing.
      int[] place = new int[32];
      Object[] children = new Object[32];
      int[] nextChild = new int[32];
      int depth = 0;
      Node entering = root;
      while (true) {
        if (entering != null) {
          if (size == order.length) {
            order = Arrays.copyOf(order, size * 2);
            ends = Arrays.copyOf(ends, size * 2);
          }
          if (depth == place.length) {
            place = Arrays.copyOf(place, depth * 2);
            children = Arrays.copyOf(children, depth * 2);
            nextChild = Arrays.copyOf(nextChild, depth * 2);
          }
          order[size] = entering;
          place[depth] = size;
          children[depth] = entering.getChildNodes();
          nextChild[depth] = 0;
          size++;
          depth++;
          entering = null;
        }
        int top = depth - 1;
        List<?> kids = (List<?>) children[top];
        if (nextChild[top] < kids.size()) {
          entering = (Node) kids.get(nextChild[top]++);
        } else {
          ends[place[top]] = size;
          children[top] = null;
          depth--;
          if (depth == 0) {
            break;
          }
        }
      }
      return new Layout(Arrays.copyOf(order, size), ends);
    }

    boolean isOf(Node root) {
      return preorder.length > 0 && preorder[0] == root;
    }
  }

  /**
   * Lays out {@code unit}'s nodes in pre-order and {@linkplain #install installs} the layout.
   */
  static void index(CompilationUnit unit) {
    install(Layout.of(unit), node -> {});
  }

  /**
   * Gives each node of {@code layout} with a range an {@link IndexedRange}, dropping the node's
   * token range, and that of its comment, on the way (see {@link SourceParser}); then passes the
   * node to {@code alsoPerNode}, in pre-order. The tree must not have changed since it was laid out.
   */
  static void install(Layout layout, Consumer<Node> alsoPerNode) {
    Node[] preorder = layout.preorder;
    int[] ends = layout.subtreeEnds;
    for (int i = 0; i < preorder.length; i++) {
      Node node = preorder[i];
      Range range = node.getRange().orElse(null);
      node.setTokenRange(null); // also clears the range
      if (range != null) {
        node.setRange(new IndexedRange(range, preorder, i, ends[i]));
      }
      // A node's own comment is not among its children: it keeps its range, without tokens.
      Comment comment = node.getComment().orElse(null);
      if (comment != null && !(comment.getRange().orElse(null) instanceof IndexedRange)) {
        Range commentRange = comment.getRange().orElse(null);
        comment.setTokenRange(null);
        if (commentRange != null) {
          comment.setRange(commentRange);
        }
      }
      alsoPerNode.accept(node);
    }
  }

  /** The layout of {@code root}'s subtree, if it has a valid one. */
  private static IndexedRange layout(Node root) {
    if (root.getRange().orElse(null) instanceof IndexedRange r && r.preorder[r.index] == root) {
      return r;
    }
    return null;
  }

  /** As {@link Node#findAll(Class)}. */
  public static <T extends Node> List<T> findAll(Node root, Class<T> type) {
    return findAll(root, type, n -> true);
  }

  /** As {@link Node#findAll(Class, Predicate)}. */
  public static <T extends Node> List<T> findAll(Node root, Class<T> type, Predicate<? super T> test) {
    IndexedRange r = layout(root);
    if (r == null) {
      return root.findAll(type, test::test);
    }
    List<T> out = new ArrayList<>();
    Node[] nodes = r.preorder;
    for (int i = r.index; i < r.subtreeEnd; i++) {
      if (type.isInstance(nodes[i])) {
        T t = type.cast(nodes[i]);
        if (test.test(t)) {
          out.add(t);
        }
      }
    }
    return out;
  }

  /** As {@link Node#findFirst(Class, Predicate)}. */
  public static <T extends Node> Optional<T> findFirst(Node root, Class<T> type, Predicate<? super T> test) {
    IndexedRange r = layout(root);
    if (r == null) {
      return root.findFirst(type, test::test);
    }
    Node[] nodes = r.preorder;
    for (int i = r.index; i < r.subtreeEnd; i++) {
      if (type.isInstance(nodes[i])) {
        T t = type.cast(nodes[i]);
        if (test.test(t)) {
          return Optional.of(t);
        }
      }
    }
    return Optional.empty();
  }

  /** As {@link Node#findFirst(Class)}. */
  public static <T extends Node> Optional<T> findFirst(Node root, Class<T> type) {
    return findFirst(root, type, n -> true);
  }

  /** Whether {@code root}'s subtree holds a node of {@code type} ({@code root} included). */
  public static boolean contains(Node root, Class<? extends Node> type) {
    return findFirst(root, type, n -> true).isPresent();
  }

  /** As {@link Node#walk(Consumer)}: every node of the subtree in pre-order, root first. */
  public static void walk(Node root, Consumer<Node> visit) {
    IndexedRange r = layout(root);
    if (r == null) {
      root.walk(visit);
      return;
    }
    Node[] nodes = r.preorder;
    for (int i = r.index; i < r.subtreeEnd; i++) {
      visit.accept(nodes[i]);
    }
  }
}
