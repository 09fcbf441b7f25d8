package dev.plumbline.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The benchmark measures the tool as {@code bin/plumbline} starts it. */
class LauncherTest {
  /**
   * Runs a copy of {@code bin/plumbline} with a stand-in {@code java} first on the path that
   * writes out its arguments, so the comparison is with what the script really passes on this
   * machine, huge-page option included or not.
   */
  @Test
  void benchmarkUsesTheLaunchersJvmOptions(@TempDir Path dir) throws IOException, InterruptedException {
    Path script = dir.resolve("bin/plumbline");
    Files.createDirectories(script.getParent());
    Files.copy(Path.of("../bin/plumbline"), script);
    Files.createDirectories(dir.resolve("cli/target"));
    Files.write(dir.resolve("cli/target/plumbline.jar"), new byte[0]); // present, so nothing is built
    Path fakeJava = dir.resolve("fake/java");
    Files.createDirectories(fakeJava.getParent());
    Path argsOut = dir.resolve("args.txt");
    Files.writeString(fakeJava, "#!/usr/bin/env bash\nprintf '%s\\n' \"$@\" > '" + argsOut + "'\n",
        StandardCharsets.UTF_8);
    assertTrue(fakeJava.toFile().setExecutable(true));
    ProcessBuilder pb = new ProcessBuilder("bash", script.toString(), "--version").redirectErrorStream(true);
    pb.environment().put("PATH", fakeJava.getParent() + ":" + System.getenv("PATH"));
    pb.environment().remove("PLUMBLINE_JAVA_OPTS");
    Process p = pb.start();
    String output = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    assertTrue(p.waitFor(60, TimeUnit.SECONDS), "the script did not finish");
    assertEquals(0, p.exitValue(), output);
    List<String> expected = new ArrayList<>(Launcher.JVM_OPTIONS);
    expected.addAll(List.of("-jar", dir.resolve("cli/target/plumbline.jar").toString(), "--version"));
    assertEquals(expected, Files.readAllLines(argsOut, StandardCharsets.UTF_8));
  }

  @Test
  void hugePagesOnlyWhereTheKernelGivesThemOnRequest() {
    assertTrue(Launcher.options("always [madvise] never").contains(Launcher.HUGE_PAGES));
    assertTrue(Launcher.options("[always] madvise never").contains(Launcher.HUGE_PAGES));
    assertEquals(Launcher.BASE_OPTIONS, Launcher.options("always madvise [never]"));
    assertEquals(Launcher.BASE_OPTIONS, Launcher.options(""));
    assertEquals(Launcher.BASE_OPTIONS, Launcher.options(Launcher.readSetting(Path.of("/no/such/file"))));
  }

  /** Where the launcher asks for huge pages the JVM takes them without a word (no warning line). */
  @Test
  void theJvmTakesTheOptionsSilently() throws IOException, InterruptedException {
    String java = ProcessHandle.current().info().command().orElse("java");
    List<String> command = new ArrayList<>(List.of(java));
    command.addAll(Launcher.JVM_OPTIONS);
    command.add("-version");
    Process p = new ProcessBuilder(command).redirectErrorStream(true).start();
    String output = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    assertTrue(p.waitFor(60, TimeUnit.SECONDS), "java -version did not finish");
    assertEquals(0, p.exitValue(), output);
    assertFalse(output.toLowerCase(Locale.ROOT).contains("warning"), output);
  }

  /**
   * On a small machine the options leave the JVM's default maximum heap (a quarter of the
   * memory) alone. A fixed initial heap would raise it: {@code -Xms768m} on a 1 GiB machine makes
   * a 768 MiB heap, three quarters of the memory (checked by turning this test on such an option).
   */
  @Test
  void smallMachinesKeepTheDefaultMaximumHeap() throws IOException, InterruptedException {
    String java = ProcessHandle.current().info().command().orElse("java");
    for (long mib : List.of(1024L, 2048L, 65536L)) {
      List<String> command = new ArrayList<>(List.of(java));
      command.addAll(Launcher.JVM_OPTIONS);
      command.addAll(List.of("-XX:MaxRAM=" + mib + "m", "-XX:+PrintFlagsFinal", "-version"));
      Process p = new ProcessBuilder(command).redirectErrorStream(true).start();
      String output = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
      assertTrue(p.waitFor(60, TimeUnit.SECONDS), "java -version did not finish");
      assertEquals(0, p.exitValue(), "with " + mib + " MiB of memory: " + output);
      Matcher max = Pattern.compile("\\bMaxHeapSize\\s*=\\s*(\\d+)").matcher(output);
      assertTrue(max.find(), output);
      assertTrue(Long.parseLong(max.group(1)) <= mib * 1024 * 1024 / 4,
          "maximum heap " + max.group(1) + " bytes on a machine of " + mib + " MiB");
    }
  }
}
