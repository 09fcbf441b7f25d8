package dev.plumbline.bench;

import com.github.javaparser.JavaParser;
import com.github.javaparser.ParseResult;
import com.github.javaparser.ParserConfiguration;
import com.github.javaparser.ast.CompilationUnit;
import dev.plumbline.cli.Main;
import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.stream.Stream;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;

/**
 * The two measured operations, on the same folder of Java files and with the same number of
 * threads:
 * <ul>
 *   <li>{@link #parse}, the floor: walk the folder, read every file and parse it with a bare
 *       JavaParser, nothing else;
 *   <li>{@link #scan}: the full {@code plumbline scan} as the command line runs it (discovery,
 *       parsing, type facts, analyses, rules, the text report), with its output thrown away.
 * </ul>
 * Options come from {@link BenchmarkMain}, which generates the inputs and runs JMH.
 */
@State(Scope.Benchmark)
public class ScanBenchmark {
  /** Folder to scan (absolute). */
  @Param("")
  public String input;

  /** Worker threads for both operations. */
  @Param("2")
  public int jobs;

  private ExecutorService pool;

  @Setup(Level.Trial)
  public void start() {
    pool = Executors.newFixedThreadPool(jobs);
  }

  @TearDown(Level.Trial)
  public void stop() {
    pool.shutdownNow();
  }

  @Benchmark
  public long parse() throws InterruptedException, ExecutionException {
    List<Path> files;
    try (Stream<Path> walk = Files.walk(Path.of(input))) {
      files = walk.filter(p -> p.toString().endsWith(".java")).sorted().toList();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    List<Future<Integer>> parsed = new ArrayList<>();
    for (Path file : files) {
      parsed.add(pool.submit(() -> {
        JavaParser parser = new JavaParser(new ParserConfiguration()
            .setLanguageLevel(ParserConfiguration.LanguageLevel.JAVA_21));
        ParseResult<CompilationUnit> r =
            parser.parse(new String(Files.readAllBytes(file), StandardCharsets.UTF_8));
        return r.getResult().map(cu -> cu.getTypes().size()).orElse(0);
      }));
    }
    long types = 0;
    for (Future<Integer> f : parsed) {
      types += f.get();
    }
    return types;
  }

  @Benchmark
  public int scan() {
    PrintStream discard = new PrintStream(OutputStream.nullOutputStream(), false, StandardCharsets.UTF_8);
    int code = Main.run(new String[] {"scan", input, "--jobs", String.valueOf(jobs), "--fail-on", "none"},
        discard, discard, Path.of(input));
    if (code != Main.EXIT_OK) {
      throw new IllegalStateException("scan of " + input + " exited with " + code);
    }
    return code;
  }
}
