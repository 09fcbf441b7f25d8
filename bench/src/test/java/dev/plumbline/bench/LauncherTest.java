package dev.plumbline.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/** The benchmark measures the tool as {@code bin/plumbline} starts it. */
class LauncherTest {
  @Test
  void benchmarkUsesTheLaunchersJvmOptions() throws IOException {
    String script = Files.readString(Path.of("../bin/plumbline"), StandardCharsets.UTF_8);
    Matcher defaults = Pattern.compile("\\$\\{PLUMBLINE_JAVA_OPTS:-([^}]*)}").matcher(script);
    assertTrue(defaults.find(), "bin/plumbline names its default JVM options");
    assertEquals(String.join(" ", Launcher.JVM_OPTIONS), defaults.group(1).trim());
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
