package dev.plumbline.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.github.javaparser.JavaParser;
import com.github.javaparser.ast.CompilationUnit;
import com.github.javaparser.ast.ImportDeclaration;
import com.github.javaparser.ast.expr.MethodCallExpr;
import com.github.javaparser.ast.expr.Name;
import com.github.javaparser.ast.type.ClassOrInterfaceType;
import java.io.IOException;
import java.net.DatagramSocket;
import java.net.InetSocketAddress;
import java.net.ServerSocket;
import java.net.Socket;
import java.net.URL;
import java.net.URLConnection;
import java.net.URLStreamHandler;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Set;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * plumbline makes no network connection and never loads, compiles or runs what it scans.
 *
 * <p>At run time: the JDK's socket factories ({@link Socket#setSocketImplFactory},
 * {@link ServerSocket#setSocketFactory}, {@link DatagramSocket#setDatagramSocketImplFactory})
 * and URL stream handlers for network protocols are replaced by guards that record and refuse
 * every attempt, then whole scans of the corpus run through the command line in every format.
 * The guards are JVM-wide and stay installed for the rest of this test JVM; the module's build
 * gives each test class a JVM of its own (surefire {@code reuseForks=false}).
 * NIO channels cannot be guarded this way, so the source check below covers them.
 *
 * <p>In the source: no main class of the analyzer, rules or command line names an API that
 * opens connections, loads or defines classes, compiles code or starts processes.
 */
class NoNetworkTest {
  static final Path MODULE = Path.of("").toAbsolutePath();
  static final Path ROOT = MODULE.getParent();
  private static final List<String> ATTEMPTS = Collections.synchronizedList(new ArrayList<>());

  @BeforeAll
  static void installGuards() throws IOException {
    if (Boolean.getBoolean("plumbline.test.networkGuard")) {
      return;
    }
    System.setProperty("plumbline.test.networkGuard", "true");
    Socket.setSocketImplFactory(() -> {
      throw refuse("socket");
    });
    ServerSocket.setSocketFactory(() -> {
      throw refuse("server socket");
    });
    DatagramSocket.setDatagramSocketImplFactory(() -> {
      throw refuse("datagram socket");
    });
    URL.setURLStreamHandlerFactory(protocol -> switch (protocol) {
      case "http", "https", "ftp", "mailto", "ldap" -> new URLStreamHandler() {
        @Override
        protected URLConnection openConnection(URL u) {
          throw refuse("url " + u);
        }
      };
      default -> null; // file:, jar: and jrt: keep the JDK's handlers: resources are read through them
    });
  }

  private static SecurityException refuse(String what) {
    ATTEMPTS.add(what);
    return new SecurityException("network use refused in test: " + what);
  }

  @Test
  void guardsCatchEachKindOfAttempt() throws IOException {
    int before = ATTEMPTS.size();
    assertThrows(SecurityException.class, () -> new Socket().connect(new InetSocketAddress("127.0.0.1", 9)));
    assertThrows(SecurityException.class, () -> new ServerSocket(0).close());
    assertThrows(SecurityException.class, () -> new DatagramSocket().close());
    assertThrows(SecurityException.class, () -> new URL("http://127.0.0.1:9/").openConnection());
    assertEquals(4, ATTEMPTS.size() - before, ATTEMPTS::toString);
    ATTEMPTS.subList(before, ATTEMPTS.size()).clear();
  }

  @Test
  void scansOfTheCorpusMakeNoConnection(@TempDir Path out) {
    String corpus = ROOT.resolve("test-corpus/src/main/java").toString();
    String demo = ROOT.resolve("test-corpus/demo-project/src/main/java").toString();
    int before = ATTEMPTS.size();
    MainTest.Run text = MainTest.run(ROOT, "scan", corpus, demo);
    MainTest.Run sarif = MainTest.run(ROOT, "scan", corpus, demo, "--format", "sarif",
        "--output", out.resolve("report.sarif").toString());
    MainTest.run(ROOT, "rules");
    MainTest.run(ROOT, "explain", "leak.preprocessing-before-split");
    assertEquals(Main.EXIT_FINDINGS, text.code(), text.err());
    assertEquals(Main.EXIT_FINDINGS, sarif.code(), sarif.err());
    assertEquals(List.of(), ATTEMPTS.subList(before, ATTEMPTS.size()), "network attempts during scans");
  }

  /** Names whose use in main code would mean network, class loading, compiling or processes. */
  private static final Set<String> FORBIDDEN_TYPES = Set.of("Socket", "ServerSocket",
      "DatagramSocket", "SocketChannel", "ServerSocketChannel", "DatagramChannel",
      "AsynchronousSocketChannel", "URL", "URLConnection", "HttpURLConnection", "HttpClient",
      "InetAddress", "ClassLoader", "URLClassLoader", "ProcessBuilder", "Process", "ToolProvider",
      "JavaCompiler", "ScriptEngineManager", "Instrumentation");
  private static final Set<String> FORBIDDEN_PACKAGES = Set.of("java.net.http", "javax.tools",
      "javax.script", "java.lang.instrument", "java.rmi", "javax.naming");
  private static final Set<String> FORBIDDEN_CALLS = Set.of("forName", "exec", "defineClass",
      "defineHiddenClass", "getClassLoader", "getSystemClassLoader", "loadLibrary");
  /** {@code System.load} and {@code Runtime.load} load native code; other {@code load}s read data. */
  private static final Set<String> NATIVE_LOADERS = Set.of("System", "Runtime", "Runtime.getRuntime()");

  @Test
  void mainSourcesUseNoNetworkLoadingCompilingOrProcessApi() throws IOException {
    List<String> problems = new ArrayList<>();
    int files = 0;
    for (String module : List.of("analyzer", "rules", "cli")) {
      try (Stream<Path> walk = Files.walk(ROOT.resolve(module).resolve("src/main/java"))) {
        for (Path file : walk.filter(p -> p.toString().endsWith(".java")).sorted().toList()) {
          files++;
          CompilationUnit unit = new JavaParser().parse(Files.readString(file, StandardCharsets.UTF_8))
              .getResult().orElseThrow();
          String where = ROOT.relativize(file).toString();
          for (ImportDeclaration imp : unit.getImports()) {
            Name name = imp.getName();
            String full = name.asString();
            if (FORBIDDEN_PACKAGES.stream().anyMatch(p -> full.equals(p) || full.startsWith(p + "."))
                || FORBIDDEN_TYPES.contains(name.getIdentifier()) && !full.startsWith("dev.plumbline")) {
              problems.add(where + ": import " + full);
            }
          }
          for (ClassOrInterfaceType t : unit.findAll(ClassOrInterfaceType.class)) {
            if (FORBIDDEN_TYPES.contains(t.getNameAsString())) {
              problems.add(where + ": type " + t);
            }
          }
          for (MethodCallExpr call : unit.findAll(MethodCallExpr.class)) {
            boolean nativeLoad = call.getNameAsString().equals("load")
                && call.getScope().map(sc -> NATIVE_LOADERS.contains(sc.toString())).orElse(false);
            if (FORBIDDEN_CALLS.contains(call.getNameAsString()) || nativeLoad) {
              problems.add(where + ": call " + call);
            }
          }
        }
      }
    }
    assertTrue(files > 40, "main sources not found from " + ROOT);
    assertEquals(List.of(), problems);
  }
}
