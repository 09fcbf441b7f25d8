package dev.plumbline.parse;

import com.github.javaparser.JavaParser;
import com.github.javaparser.ParseResult;
import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.Node;
import com.github.javaparser.utils.LineSeparator;
import java.lang.reflect.Field;
import java.util.Arrays;
import java.util.EmptyStackException;
import java.util.Stack;

/**
 * The parsers of one thread: a JavaParser for each of the two configurations of
 * {@link Java21Rules#configuration(boolean)}, kept from file to file (JavaParser resets its
 * generated parser for each parse; that is how it reuses one itself), with one change: the
 * token manager's work stack, a {@link Stack} whose every operation takes a lock, is replaced by
 * {@link ThreadConfinedStack}, which takes none. The token manager pushes and pops every token
 * through that stack, and without the optimizing compiler each lock is paid in full: the stack's
 * operations were 9% of a scan's CPU samples. The parser stays on its thread, so no lock is
 * needed. Trees and problems are JavaParser's own ({@code Java21RulesTest} compares them with a
 * fresh JavaParser's, parse after parse on one thread). A text without a carriage return skips
 * JavaParser's line separator detection, whose answer is then known
 * ({@link #lineSeparatorWithoutCarriageReturn}).
 *
 * <p>This reaches into three fields of JavaParser's (the parser a {@code JavaParser} keeps, its
 * token manager, that manager's work stack), two of them private. If a JavaParser version lacks
 * them, the stack stays as it is ({@link #active()} says so, and a test fails): slower, the same
 * trees. After a parse that
 * throws, the thread's parsers are dropped and the next parse starts from new ones.
 */
final class ThreadParsers {
  private static final Field AST_PARSER = PrivateFields.find(JavaParser.class, "astParser");
  // The generated classes are not public; their fields are found through the fields' types.
  private static final Field TOKEN_SOURCE = AST_PARSER == null ? null : PrivateFields.find(AST_PARSER.getType(), "token_source");
  private static final Field WORK_STACK = TOKEN_SOURCE == null ? null : PrivateFields.find(TOKEN_SOURCE.getType(), "tokenWorkStack");
  private static final boolean ACTIVE = AST_PARSER != null && TOKEN_SOURCE != null && WORK_STACK != null
      && WORK_STACK.getType() == Stack.class;

  private static final ThreadLocal<ThreadParsers> CURRENT = ThreadLocal.withInitial(ThreadParsers::new);

  private JavaParser mayNameVar;
  private JavaParser cannotNameVar;

  private ThreadParsers() {}

  static boolean active() {
    return ACTIVE;
  }

  /** Parses {@code text} as a parser with {@code Java21Rules.configuration(mayNameVar)} does. */
  static ParseResult<CompilationUnit> parse(String text, boolean mayNameVar) {
    ThreadParsers parsers = CURRENT.get();
    JavaParser parser = parsers.parserFor(mayNameVar);
    boolean hasCarriageReturn = text.indexOf('\r') >= 0;
    parser.getParserConfiguration().setDetectOriginalLineSeparator(hasCarriageReturn);
    ParseResult<CompilationUnit> result;
    try {
      result = parser.parse(text);
    } catch (RuntimeException | Error e) {
      CURRENT.remove();
      throw e;
    }
    if (!hasCarriageReturn) {
      result.getResult().ifPresent(unit -> unit.setData(Node.LINE_SEPARATOR_KEY, lineSeparatorWithoutCarriageReturn(text)));
    }
    return result;
  }

  /**
   * What JavaParser's line separator detection finds in a text without {@code '\r'}, without
   * its cost: it looks every character up in a table of separators by making a string of it (5% of
   * a scan's CPU samples). It counts CR, LF and CR-LF; with no CR, the outcome is {@code LF} if
   * there is a line feed and {@code NONE} if not ({@code LineSeparator.getLineEnding}). Texts with
   * a CR keep JavaParser's detection, which also has its own way with a CR-LF split between two
   * reads.
   */
  static LineSeparator lineSeparatorWithoutCarriageReturn(String text) {
    return text.indexOf('\n') >= 0 ? LineSeparator.LF : LineSeparator.NONE;
  }

  private JavaParser parserFor(boolean var) {
    JavaParser parser = var ? mayNameVar : cannotNameVar;
    if (parser == null) {
      parser = withLockFreeStack(new JavaParser(Java21Rules.configuration(var)
          .setCharacterEncoding(java.nio.charset.StandardCharsets.UTF_8)));
      if (var) {
        mayNameVar = parser;
      } else {
        cannotNameVar = parser;
      }
    }
    return parser;
  }

  /** A first, empty parse makes the generated parser and its token manager, which are kept. */
  private static JavaParser withLockFreeStack(JavaParser parser) {
    if (!ACTIVE) {
      return parser;
    }
    parser.parse("");
    try {
      Object generated = AST_PARSER.get(parser);
      Object tokens = generated == null ? null : TOKEN_SOURCE.get(generated);
      if (tokens != null && WORK_STACK.get(tokens) instanceof Stack<?> old && old.isEmpty()) {
        WORK_STACK.set(tokens, new ThreadConfinedStack<>());
      }
    } catch (IllegalAccessException e) {
      throw new IllegalStateException("fields were made accessible", e);
    }
    return parser;
  }

  /** Whether {@code parser}'s token manager has the lock-free stack (for tests). */
  static boolean hasLockFreeStack(JavaParser parser) {
    try {
      Object generated = AST_PARSER.get(parser);
      return generated != null && WORK_STACK.get(TOKEN_SOURCE.get(generated)) instanceof ThreadConfinedStack<?>;
    } catch (IllegalAccessException e) {
      throw new IllegalStateException(e);
    }
  }

  /** This thread's parser for the configuration (for tests). */
  static JavaParser current(boolean mayNameVar) {
    return CURRENT.get().parserFor(mayNameVar);
  }

  /**
   * A stack for one thread, without locks. It keeps its elements itself: the inherited storage
   * stays empty, so of {@link java.util.Vector}'s other operations none may be used; the token
   * manager uses {@code push}, {@code empty} and {@code pop} only.
   */
  static final class ThreadConfinedStack<E> extends Stack<E> {
    private static final long serialVersionUID = 1L;

    private Object[] items = new Object[16];
    private int count;

    @Override
    public E push(E item) {
      if (count == items.length) {
        items = Arrays.copyOf(items, count * 2);
      }
      items[count++] = item;
      return item;
    }

    @Override
    @SuppressWarnings("unchecked")
    public E pop() {
      if (count == 0) {
        throw new EmptyStackException();
      }
      E item = (E) items[--count];
      items[count] = null;
      return item;
    }

    @Override
    @SuppressWarnings("unchecked")
    public E peek() {
      if (count == 0) {
        throw new EmptyStackException();
      }
      return (E) items[count - 1];
    }

    @Override
    public boolean empty() {
      return count == 0;
    }

    @Override
    public boolean isEmpty() {
      return count == 0;
    }

    @Override
    public int size() {
      return count;
    }

    @Override
    public void clear() {
      Arrays.fill(items, 0, count, null);
      count = 0;
    }

    @Override
    public boolean equals(Object o) {
      return this == o;
    }

    @Override
    public int hashCode() {
      return System.identityHashCode(this);
    }
  }
}
