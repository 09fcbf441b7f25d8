package dev.plumbline.bench;

import com.github.javaparser.JavaParser;
import com.github.javaparser.ParseResult;
import com.github.javaparser.ParserConfiguration;
import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.ImportDeclaration;
import com.github.javaparser.ast.Modifier;
import com.github.javaparser.ast.NodeList;
import com.github.javaparser.ast.PackageDeclaration;
import com.github.javaparser.ast.body.BodyDeclaration;
import com.github.javaparser.ast.body.ClassOrInterfaceDeclaration;
import com.github.javaparser.ast.body.ConstructorDeclaration;
import com.github.javaparser.ast.body.MethodDeclaration;
import com.github.javaparser.ast.body.Parameter;
import com.github.javaparser.ast.body.TypeDeclaration;
import com.github.javaparser.ast.comments.Comment;
import com.github.javaparser.ast.expr.Name;
import com.github.javaparser.ast.expr.NameExpr;
import com.github.javaparser.ast.expr.BooleanLiteralExpr;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.expr.StringLiteralExpr;
import com.github.javaparser.ast.stmt.BlockStmt;
import com.github.javaparser.ast.stmt.CatchClause;
import com.github.javaparser.ast.stmt.DoStmt;
import com.github.javaparser.ast.stmt.ExpressionStmt;
import com.github.javaparser.ast.stmt.IfStmt;
import com.github.javaparser.ast.stmt.LabeledStmt;
import com.github.javaparser.ast.stmt.Statement;
import com.github.javaparser.ast.stmt.ThrowStmt;
import com.github.javaparser.ast.stmt.TryStmt;
import com.github.javaparser.ast.type.ClassOrInterfaceType;
import com.github.javaparser.ast.type.Type;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import java.util.TreeMap;
import java.util.regex.Pattern;
import java.util.stream.Stream;

/**
 * Makes a large Java project out of the test corpus, for the benchmark and the determinism tests.
 *
 * <p>The corpus is copied again and again, each copy into packages of its own
 * ({@code gen.c<k>.<original package>}) with every class the copy declares renamed
 * ({@code FitOnEitherPart} becomes {@code FitOnEitherPartV7}) and every reference to it updated,
 * until the project has the requested number of lines. Each copy varies the structure with a
 * seeded random generator, so the project is not the same small file thousands of times:
 * <ul>
 *   <li>some files take in other classes of their copy as static nested classes, so file sizes
 *       range from a few dozen lines to several hundred;
 *   <li>some methods are duplicated under new names, some method bodies are wrapped in
 *       {@code try/finally}, {@code try/catch}, a labeled block, a once-through {@code do} loop
 *       or an {@code if/else} with the body on both branches;
 *   <li>some classes get driver methods that call their methods from {@code for}, {@code while}
 *       and for-each loops, {@code switch} statements and lambdas;
 *   <li>some classes have their methods in a shuffled order.
 * </ul>
 * The same corpus, seed and size always give byte-identical files. The output parses; it is
 * meant to be scanned, not compiled (calls in driver methods pass {@code null}s).
 */
public final class CorpusProjectGenerator {
  /** Expectation comments of the golden corpus; dropped so copies do not look like golden cases. */
  private static final Pattern MARK = Pattern.compile("\\s*(expect|clean|expect-miss):.*");

  /** What was written. */
  public record Result(int files, long lines) {}

  /**
   * The corpus files of one package, parsed once and cloned for each copy.
   *
   * @param mentioned per unit, whether another file of the package names its class
   */
  private record Group(String packageName, List<CompilationUnit> units, List<Boolean> mentioned) {
    static Group of(String packageName, List<CompilationUnit> units) {
      List<String> texts = units.stream().map(CompilationUnit::toString).toList();
      List<Boolean> mentioned = new ArrayList<>();
      for (int i = 0; i < units.size(); i++) {
        Pattern word = Pattern.compile("\\b" + Pattern.quote(units.get(i).getType(0).getNameAsString()) + "\\b");
        boolean found = false;
        for (int j = 0; j < texts.size() && !found; j++) {
          found = j != i && word.matcher(texts.get(j)).find();
        }
        mentioned.add(found);
      }
      return new Group(packageName, List.copyOf(units), List.copyOf(mentioned));
    }
  }

  /** Not thread-safe, like the generator itself. */
  private final JavaParser parser = new JavaParser(
      new ParserConfiguration().setLanguageLevel(ParserConfiguration.LanguageLevel.JAVA_21));
  private final List<Group> groups;
  private final long seed;

  public CorpusProjectGenerator(List<Path> corpusRoots, long seed) {
    this.groups = readGroups(corpusRoots);
    this.seed = seed;
    if (groups.isEmpty()) {
      throw new IllegalArgumentException("no Java files under " + corpusRoots);
    }
  }

  /** Writes copies under {@code out} until at least {@code targetLines} lines are written. */
  public Result generate(Path out, long targetLines) {
    Random random = new Random(seed);
    long lines = 0;
    int files = 0;
    for (int copy = 0; lines < targetLines; copy++) {
      Map<String, String> packages = new HashMap<>();
      for (Group g : groups) {
        packages.put(g.packageName(), "gen.c" + copy + (g.packageName().isEmpty() ? "" : "." + g.packageName()));
      }
      for (Group g : groups) {
        for (CompilationUnit unit : new CopyMaker(copy, g, packages, random).make()) {
          String text = unit.toString();
          write(out, unit, text);
          files++;
          lines += text.lines().count();
          if (lines >= targetLines) {
            break;
          }
        }
        if (lines >= targetLines) {
          break;
        }
      }
    }
    return new Result(files, lines);
  }

  private static void write(Path out, CompilationUnit unit, String text) {
    String pkg = unit.getPackageDeclaration().map(p -> p.getNameAsString()).orElse("");
    Path dir = pkg.isEmpty() ? out : out.resolve(pkg.replace('.', '/'));
    String name = unit.getType(0).getNameAsString() + ".java";
    try {
      Files.createDirectories(dir);
      Files.writeString(dir.resolve(name), text, StandardCharsets.UTF_8);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  // ------------------------------------------------------------------ one copy of one package

  /** Renames and restructures one copy of one corpus package. */
  private final class CopyMaker {
    private final int copy;
    private final Group group;
    private final Map<String, String> packages;
    private final Random random;
    private final String suffix;
    private final Map<String, String> renamed = new HashMap<>();

    CopyMaker(int copy, Group group, Map<String, String> packages, Random random) {
      this.copy = copy;
      this.group = group;
      this.packages = packages;
      this.random = random;
      this.suffix = "V" + copy;
      for (CompilationUnit u : group.units()) {
        for (TypeDeclaration<?> t : u.findAll(TypeDeclaration.class)) {
          renamed.put(t.getNameAsString(), t.getNameAsString() + suffix);
        }
      }
    }

    List<CompilationUnit> make() {
      List<CompilationUnit> units = new ArrayList<>();
      for (CompilationUnit original : group.units()) {
        CompilationUnit u = original.clone();
        rename(u);
        units.add(u);
      }
      List<CompilationUnit> hosts = nest(units);
      for (CompilationUnit u : hosts) {
        for (ClassOrInterfaceDeclaration c : u.findAll(ClassOrInterfaceDeclaration.class)) {
          if (!c.isInterface() && !c.isLocalClassDeclaration()) {
            restructure(c);
          }
        }
      }
      return hosts;
    }

    private void rename(CompilationUnit u) {
      u.setPackageDeclaration(new PackageDeclaration(new Name(packages.get(group.packageName()))));
      for (ImportDeclaration imp : u.getImports()) {
        String name = imp.getNameAsString();
        for (Map.Entry<String, String> p : packages.entrySet()) {
          if (!p.getKey().isEmpty() && name.startsWith(p.getKey() + ".")) {
            String rest = name.substring(p.getKey().length() + 1);
            String head = rest.contains(".") ? rest.substring(0, rest.indexOf('.')) : rest;
            String tail = rest.substring(head.length());
            imp.setName(p.getValue() + "." + head + (imp.isAsterisk() ? "" : suffix) + tail);
          }
        }
      }
      for (TypeDeclaration<?> t : u.findAll(TypeDeclaration.class)) {
        t.setName(renamed.get(t.getNameAsString()));
      }
      for (ConstructorDeclaration c : u.findAll(ConstructorDeclaration.class)) {
        String to = renamed.get(c.getNameAsString());
        if (to != null) {
          c.setName(to);
        }
      }
      for (ClassOrInterfaceType t : u.findAll(ClassOrInterfaceType.class)) {
        String to = renamed.get(t.getNameAsString());
        if (to != null) {
          t.setName(to);
        }
      }
      for (NameExpr n : u.findAll(NameExpr.class)) {
        String to = renamed.get(n.getNameAsString());
        if (to != null) {
          n.setName(to);
        }
      }
      for (Comment c : u.getAllContainedComments()) {
        if (MARK.matcher(c.getContent()).matches()) {
          c.remove();
        }
      }
    }

    /**
     * Moves some files into others as static nested classes. A file can move only if it declares
     * one class that no other file of the package mentions, and its imports do not clash.
     */
    private List<CompilationUnit> nest(List<CompilationUnit> units) {
      List<CompilationUnit> hosts = new ArrayList<>();
      List<CompilationUnit> guests = new ArrayList<>();
      for (int i = 0; i < units.size(); i++) {
        CompilationUnit u = units.get(i);
        boolean movable = u.getTypes().size() == 1 && !group.mentioned().get(i) && random.nextInt(3) > 0;
        (movable ? guests : hosts).add(u);
      }
      if (hosts.isEmpty() && !guests.isEmpty()) {
        hosts.add(guests.remove(0));
      }
      for (CompilationUnit guest : guests) {
        CompilationUnit host = hosts.get(random.nextInt(hosts.size()));
        if (!importsFit(guest, host)) {
          hosts.add(guest);
          continue;
        }
        TypeDeclaration<?> type = guest.getType(0).clone();
        type.removeModifier(Modifier.Keyword.PUBLIC);
        if (!type.hasModifier(Modifier.Keyword.STATIC)) {
          type.addModifier(Modifier.Keyword.STATIC);
        }
        for (ImportDeclaration imp : guest.getImports()) {
          if (!host.getImports().contains(imp)) {
            host.addImport(imp.clone());
          }
        }
        host.getType(0).addMember(type);
      }
      return hosts;
    }

    /** No simple name imported by both files from different packages, and no static imports. */
    private static boolean importsFit(CompilationUnit guest, CompilationUnit host) {
      Map<String, String> bySimpleName = new HashMap<>();
      for (ImportDeclaration imp : host.getImports()) {
        if (imp.isStatic()) {
          return false;
        }
        if (!imp.isAsterisk()) {
          bySimpleName.put(imp.getName().getIdentifier(), imp.getNameAsString());
        }
      }
      for (ImportDeclaration imp : guest.getImports()) {
        if (imp.isStatic()) {
          return false;
        }
        String known = imp.isAsterisk() ? null : bySimpleName.get(imp.getName().getIdentifier());
        if (known != null && !known.equals(imp.getNameAsString())) {
          return false;
        }
      }
      return true;
    }

    // ---------------------------------------------------------------- structure

    private void restructure(ClassOrInterfaceDeclaration c) {
      List<MethodDeclaration> methods = new ArrayList<>(c.getMethods());
      for (MethodDeclaration m : methods) {
        if (m.getBody().isEmpty()) {
          continue;
        }
        int copies = random.nextInt(10) < 4 ? 1 + random.nextInt(2) : 0;
        for (int i = 1; i <= copies; i++) {
          MethodDeclaration twin = m.clone();
          twin.setName(m.getNameAsString() + "Alt" + i);
          twin.getAnnotations().clear();
          wrapBody(twin);
          c.addMember(twin);
        }
        wrapBody(m);
      }
      if (random.nextInt(2) == 0) {
        c.addMember(driver(c));
      }
      if (random.nextInt(10) < 3) {
        shuffleMethods(c);
      }
    }

    private void wrapBody(MethodDeclaration m) {
      BlockStmt body = m.getBody().orElseThrow();
      Statement wrapped = switch (random.nextInt(10)) {
        case 0 -> new TryStmt(body, new NodeList<>(), new BlockStmt(NodeList.nodeList(
            new ExpressionStmt(new MethodCallExpr(new NameExpr("System"), "nanoTime")))));
        case 1 -> new TryStmt(body, NodeList.nodeList(new CatchClause(
            new Parameter(new ClassOrInterfaceType(null, "RuntimeException"), "e" + copy),
            new BlockStmt(NodeList.nodeList(new ThrowStmt(new NameExpr("e" + copy)))))), null);
        case 2 -> new LabeledStmt("body" + copy, body);
        case 3 -> new DoStmt(body, new BooleanLiteralExpr(false));
        case 4 -> new IfStmt(new MethodCallExpr(new NameExpr("Boolean"), "getBoolean",
            NodeList.nodeList(new StringLiteralExpr("gen.alternate"))), body.clone(), body);
        default -> null;
      };
      if (wrapped != null) {
        m.setBody(new BlockStmt(NodeList.nodeList(wrapped)));
      }
    }

    /** A method calling the class's methods from loops, a switch and a lambda. */
    private MethodDeclaration driver(ClassOrInterfaceDeclaration c) {
      List<String> calls = new ArrayList<>();
      for (MethodDeclaration m : c.getMethods()) {
        if (m.getBody().isPresent() && !m.getNameAsString().startsWith("exercise")) {
          calls.add(m.getNameAsString() + "(" + arguments(m.getParameters()) + ");");
        }
      }
      StringBuilder b = new StringBuilder("{\n");
      b.append("int done = 0;\n");
      b.append("for (int i = 0; i < rounds; i++) {\n switch (i % ").append(Math.max(1, calls.size() + 1))
          .append(") {\n");
      for (int i = 0; i < calls.size(); i++) {
        b.append("case ").append(i).append(":\n").append(calls.get(i)).append("\ndone++;\nbreak;\n");
      }
      b.append("default:\n done += i;\n }\n}\n");
      b.append("int left = rounds;\nwhile (left-- > 0) {\n if (left % 7 == 3) {\n break;\n }\n");
      if (!calls.isEmpty()) {
        b.append(calls.get(random.nextInt(calls.size()))).append('\n');
      }
      b.append("}\n");
      b.append("for (Integer step : java.util.List.of(1, 2, 3)) {\n try {\n done += step;\n");
      if (!calls.isEmpty()) {
        b.append(calls.get(random.nextInt(calls.size()))).append('\n');
      }
      b.append(" } finally {\n done--;\n }\n}\n");
      if (!calls.isEmpty()) {
        b.append("Runnable again = () -> { ").append(calls.get(random.nextInt(calls.size())))
            .append(" };\nagain.run();\n");
      }
      b.append("return done;\n}");
      MethodDeclaration m = new MethodDeclaration(new NodeList<>(Modifier.privateModifier()),
          parser.parseType("int").getResult().orElseThrow(), "exercise" + copy);
      m.addParameter(new Parameter(parser.parseType("int").getResult().orElseThrow(), "rounds"));
      m.setBody(parser.parseBlock(b.toString()).getResult().orElseThrow());
      return m;
    }

    private static String arguments(NodeList<Parameter> parameters) {
      List<String> args = new ArrayList<>();
      for (Parameter p : parameters) {
        Type t = p.getType();
        if (p.isVarArgs()) {
          args.add("(" + t + "[]) null");
        } else if (t.isPrimitiveType()) {
          args.add(switch (t.asString()) {
            case "boolean" -> "false";
            case "char" -> "'a'";
            case "long" -> "0L";
            case "float" -> "0f";
            case "double" -> "0.0";
            default -> "0";
          });
        } else {
          args.add("(" + t + ") null");
        }
      }
      return String.join(", ", args);
    }

    private void shuffleMethods(ClassOrInterfaceDeclaration c) {
      List<BodyDeclaration<?>> methods = new ArrayList<>();
      for (BodyDeclaration<?> member : c.getMembers()) {
        if (member instanceof MethodDeclaration) {
          methods.add(member);
        }
      }
      Collections.shuffle(methods, random);
      c.getMembers().removeIf(m -> m instanceof MethodDeclaration);
      methods.forEach(c::addMember);
    }
  }

  // ------------------------------------------------------------------ reading the corpus

  private List<Group> readGroups(List<Path> roots) {
    Map<String, List<CompilationUnit>> byPackage = new TreeMap<>();
    Set<String> seen = new HashSet<>();
    for (Path root : roots) {
      List<Path> files;
      try (Stream<Path> walk = Files.walk(root)) {
        files = walk.filter(p -> p.toString().endsWith(".java")).sorted().toList();
      } catch (IOException e) {
        throw new UncheckedIOException(e);
      }
      for (Path file : files) {
        String text;
        try {
          text = Files.readString(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
          throw new UncheckedIOException(e);
        }
        ParseResult<CompilationUnit> r = parser.parse(text);
        if (!r.isSuccessful() || r.getResult().isEmpty() || r.getResult().get().getTypes().isEmpty()) {
          throw new IllegalArgumentException("corpus file does not parse: " + file + " " + r.getProblems());
        }
        CompilationUnit unit = r.getResult().get();
        String pkg = unit.getPackageDeclaration().map(p -> p.getNameAsString()).orElse("");
        if (seen.add(pkg + "/" + file.getFileName())) {
          byPackage.computeIfAbsent(pkg, k -> new ArrayList<>()).add(unit);
        }
      }
    }
    List<Group> out = new ArrayList<>();
    byPackage.forEach((pkg, units) -> out.add(Group.of(pkg, units)));
    return out;
  }

  /** {@code --corpus DIR (repeatable) --out DIR --lines N [--seed S]}: writes a project. */
  public static void main(String[] args) {
    List<Path> corpus = new ArrayList<>();
    Path out = null;
    long lines = 200_000;
    long seed = 1;
    for (int i = 0; i < args.length; i++) {
      switch (args[i]) {
        case "--corpus" -> corpus.add(Path.of(args[++i]));
        case "--out" -> out = Path.of(args[++i]);
        case "--lines" -> lines = Long.parseLong(args[++i]);
        case "--seed" -> seed = Long.parseLong(args[++i]);
        default -> throw new IllegalArgumentException("unknown argument " + args[i]);
      }
    }
    if (corpus.isEmpty() || out == null) {
      throw new IllegalArgumentException("usage: --corpus DIR... --out DIR [--lines N] [--seed S]");
    }
    Result r = new CorpusProjectGenerator(corpus, seed).generate(out, lines);
    System.out.println("wrote " + r.files() + " files, " + r.lines() + " lines to " + out);
  }
}
