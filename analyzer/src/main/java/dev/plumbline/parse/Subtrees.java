package dev.plumbline.parse;

import com.github.javaparser.Range;
import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.Node;
import java.util.ArrayDeque;
import java.util.ArrayList;
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
   * Lays out {@code unit}'s nodes in pre-order and gives each node with a range an
   * {@link IndexedRange}; each node's token range is dropped on the way (see
   * {@link SourceParser}). Iterative, so deeply nested code cannot overflow the stack.
   */
  static void index(CompilationUnit unit) {
    List<Node> order = new ArrayList<>();
    List<Integer> ends = new ArrayList<>();
    ArrayDeque<Object> stack = new ArrayDeque<>();
    stack.push(unit);
    while (!stack.isEmpty()) {
      Object top = stack.pop();
      if (top instanceof Integer exitOf) {
        ends.set(exitOf, order.size());
        continue;
      }
      Node node = (Node) top;
      int at = order.size();
      order.add(node);
      ends.add(at + 1);
      stack.push(at);
      List<Node> children = node.getChildNodes();
      for (int i = children.size() - 1; i >= 0; i--) {
        stack.push(children.get(i));
      }
    }
    Node[] preorder = order.toArray(new Node[0]);
    for (int i = 0; i < preorder.length; i++) {
      Node node = preorder[i];
      Optional<Range> range = node.getRange();
      node.setTokenRange(null); // also clears the range
      if (range.isPresent()) {
        node.setRange(new IndexedRange(range.get(), preorder, i, ends.get(i)));
      }
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
