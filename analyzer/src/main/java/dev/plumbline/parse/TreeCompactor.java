package dev.plumbline.parse;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.NodeList;
import com.github.javaparser.ast.expr.LiteralStringValueExpr;
import com.github.javaparser.ast.expr.Name;
import com.github.javaparser.ast.expr.SimpleName;
import java.lang.reflect.Field;
import java.lang.reflect.Modifier;
import java.util.ArrayList;
import java.util.Collection;
import java.util.List;

/**
 * Shrinks a parsed tree that nothing will change again. JavaParser gives every node three lists
 * (children, orphan comments, observers) and every node list two (elements, observers); the
 * observer and orphan-comment lists stay empty for good, as do a leaf's children. They were 40% of
 * the objects of a project's retained trees, and a scan keeps every tree until its end, so the
 * collector copied them again and again. Each empty one is replaced by one shared list that refuses
 * additions (an unexpected change of a tree fails loudly instead of leaking into other nodes), and
 * the others are trimmed to size. Names and literal texts, a fresh string per token, are made to
 * share one string per distinct text ({@link SharedStrings}): a project repeats few names many
 * times, and they were a tenth of its retained trees.
 *
 * <p>This reaches into JavaParser's private fields. If a JavaParser version lacks them, the
 * compactor does nothing ({@link #active()} says so); the trees are then only bigger.
 */
final class TreeCompactor {
  /** The shared empty list: reads as empty, refuses every addition. */
  static final ArrayList<Object> FROZEN_EMPTY = new FrozenEmptyList();

  private static final Field NODE_CHILDREN = field(Node.class, "childNodes");
  private static final Field NODE_ORPHAN_COMMENTS = field(Node.class, "orphanComments");
  private static final Field NODE_OBSERVERS = field(Node.class, "observers");
  private static final Field LIST_ELEMENTS = field(NodeList.class, "innerList");
  private static final Field LIST_OBSERVERS = field(NodeList.class, "observers");
  private static final Field SIMPLE_NAME_TEXT = stringField(SimpleName.class, "identifier");
  private static final Field NAME_TEXT = stringField(Name.class, "identifier");
  private static final Field LITERAL_TEXT = stringField(LiteralStringValueExpr.class, "value");
  private static final boolean ACTIVE = NODE_CHILDREN != null && NODE_ORPHAN_COMMENTS != null
      && NODE_OBSERVERS != null && LIST_ELEMENTS != null && LIST_OBSERVERS != null
      && SIMPLE_NAME_TEXT != null && NAME_TEXT != null && LITERAL_TEXT != null;

  /** The fields of a node class (and its superclasses) that hold node lists. */
  private static final ClassValue<Field[]> NODE_LIST_FIELDS = new ClassValue<>() {
    @Override
    protected Field[] computeValue(Class<?> type) {
      List<Field> out = new ArrayList<>();
      for (Class<?> c = type; c != null && Node.class.isAssignableFrom(c); c = c.getSuperclass()) {
        for (Field f : c.getDeclaredFields()) {
          if (!Modifier.isStatic(f.getModifiers()) && NodeList.class.isAssignableFrom(f.getType())) {
            try {
              f.setAccessible(true);
              out.add(f);
            } catch (RuntimeException e) {
              // not reachable: that list keeps its spare capacity
            }
          }
        }
      }
      return out.toArray(new Field[0]);
    }
  };

  private TreeCompactor() {}

  static boolean active() {
    return ACTIVE;
  }

  /**
   * Compacts {@code node}'s own lists and those of the node lists it holds (not its children), and
   * replaces its name or literal text by the equal one in {@code strings}.
   */
  static void compact(Node node, SharedStrings strings) {
    if (!ACTIVE) {
      return;
    }
    try {
      if (node instanceof SimpleName) {
        share(node, SIMPLE_NAME_TEXT, strings);
      } else if (node instanceof Name) {
        share(node, NAME_TEXT, strings);
      } else if (node instanceof LiteralStringValueExpr) {
        share(node, LITERAL_TEXT, strings);
      }
      shrink(node, NODE_CHILDREN);
      shrink(node, NODE_ORPHAN_COMMENTS);
      shrink(node, NODE_OBSERVERS);
      for (Field f : NODE_LIST_FIELDS.get(node.getClass())) {
        Object list = f.get(node);
        if (list != null) {
          shrink(list, LIST_ELEMENTS);
          shrink(list, LIST_OBSERVERS);
        }
      }
    } catch (IllegalAccessException e) {
      throw new IllegalStateException("fields were made accessible", e);
    }
  }

  private static void share(Node node, Field field, SharedStrings strings) throws IllegalAccessException {
    if (field.get(node) instanceof String text) {
      field.set(node, strings.shared(text));
    }
  }

  private static void shrink(Object owner, Field field) throws IllegalAccessException {
    if (field.get(owner) instanceof ArrayList<?> list && list != FROZEN_EMPTY) {
      if (list.isEmpty()) {
        field.set(owner, FROZEN_EMPTY);
      } else {
        list.trimToSize();
      }
    }
  }

  private static Field field(Class<?> owner, String name) {
    Field f = PrivateFields.find(owner, name);
    return f != null && f.getType().isAssignableFrom(ArrayList.class) ? f : null;
  }

  private static Field stringField(Class<?> owner, String name) {
    Field f = PrivateFields.find(owner, name);
    return f != null && f.getType() == String.class && !Modifier.isStatic(f.getModifiers()) ? f : null;
  }

  /** Empty for good: every way of adding an element throws. */
  private static final class FrozenEmptyList extends ArrayList<Object> {
    private static final long serialVersionUID = 1L;

    FrozenEmptyList() {
      super(0);
    }

    @Override
    public boolean add(Object e) {
      throw refused();
    }

    @Override
    public void add(int index, Object element) {
      throw refused();
    }

    @Override
    public boolean addAll(Collection<?> c) {
      throw refused();
    }

    @Override
    public boolean addAll(int index, Collection<?> c) {
      throw refused();
    }

    private static UnsupportedOperationException refused() {
      return new UnsupportedOperationException("parsed trees are not changed after parsing");
    }
  }
}
