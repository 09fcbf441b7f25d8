package dev.plumbline.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
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
}
