package dev.plumbline.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.ByteArrayOutputStream;
import java.io.File;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.OutputType;
import org.openqa.selenium.TakesScreenshot;
import org.openqa.selenium.WebDriver;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.chrome.ChromeDriver;
import org.openqa.selenium.chrome.ChromeDriverService;
import org.openqa.selenium.chrome.ChromeOptions;

/**
 * The HTML audit report in a real browser: Debian's headless Chromium driven through
 * chromedriver. CI installs both ({@code .ci/run}); when they are missing the tests fail, unless
 * {@code -Dplumbline.skipBrowserTests=true} is given for a local run without a browser.
 * Reports and screenshots are written under {@code target/browser-tests/}.
 */
class HtmlReportBrowserTest {
  static final Path CHROMIUM = Path.of("/usr/bin/chromium");
  static final Path CHROMEDRIVER = Path.of("/usr/bin/chromedriver");
  static final Path OUTPUT = Path.of("target/browser-tests").toAbsolutePath();
  static final Path DEMO = Path.of("../test-corpus/demo-project").toAbsolutePath().normalize();

  private static WebDriver driver;

  @BeforeAll
  static void startBrowser() throws IOException {
    if (!Files.isExecutable(CHROMIUM) || !Files.isExecutable(CHROMEDRIVER)) {
      String missing = "Chromium or chromedriver is missing (" + CHROMIUM + ", " + CHROMEDRIVER
          + "); install them with: apt-get install -y chromium chromium-driver";
      if (Boolean.getBoolean("plumbline.skipBrowserTests")) {
        Assumptions.abort(missing + " (skipped: plumbline.skipBrowserTests=true)");
      }
      fail(missing + ", or pass -Dplumbline.skipBrowserTests=true to skip these tests locally");
    }
    Files.createDirectories(OUTPUT);
    Path profile = Files.createTempDirectory(OUTPUT, "chromium-profile-");
    ChromeOptions options = new ChromeOptions();
    options.setBinary(CHROMIUM.toFile());
    options.addArguments("--headless", "--no-sandbox", "--disable-gpu",
        "--disable-background-networking", "--disable-component-update", "--disable-sync",
        "--no-first-run", "--user-data-dir=" + profile, "--window-size=1300,1600");
    ChromeDriverService service = new ChromeDriverService.Builder()
        .usingDriverExecutable(CHROMEDRIVER.toFile())
        .usingAnyFreePort()
        .build();
    driver = new ChromeDriver(service, options);
  }

  @AfterAll
  static void stopBrowser() {
    if (driver != null) {
      driver.quit();
    }
  }

  /** Runs {@code plumbline scan ... --format html} in-process and returns the report path. */
  static Path report(Path workingDirectory, String name, String... paths) {
    Path out = OUTPUT.resolve(name);
    String[] args = new String[paths.length + 5];
    args[0] = "scan";
    System.arraycopy(paths, 0, args, 1, paths.length);
    args[paths.length + 1] = "--format";
    args[paths.length + 2] = "html";
    args[paths.length + 3] = "--output";
    args[paths.length + 4] = out.toString();
    ByteArrayOutputStream err = new ByteArrayOutputStream();
    int code = Main.run(args, new PrintStream(new ByteArrayOutputStream(), true, StandardCharsets.UTF_8),
        new PrintStream(err, true, StandardCharsets.UTF_8), workingDirectory);
    assertTrue(code == Main.EXIT_OK || code == Main.EXIT_FINDINGS, () -> "exit " + code + ": " + err);
    assertTrue(Files.exists(out));
    return out;
  }

  private static void screenshot(String name) throws IOException {
    File shot = ((TakesScreenshot) driver).getScreenshotAs(OutputType.FILE);
    Files.copy(shot.toPath(), OUTPUT.resolve(name), java.nio.file.StandardCopyOption.REPLACE_EXISTING);
  }

  private static String text(String css) {
    return driver.findElement(By.cssSelector(css)).getText();
  }

  @Test
  void demoReportShowsVerdictsAndFiltersFindings() throws IOException {
    Path report = report(DEMO.getParent(), "demo-report.html", "demo-project");
    driver.get(report.toUri().toString());

    assertTrue(text("#limits").contains("never show that a number is right"), "limits stated at the top");
    List<WebElement> rows = driver.findElements(By.cssSelector("#verdict-table tbody tr"));
    assertEquals(2, rows.size(), "one evaluation per training entry point of the demo");
    WebElement leaky = rows.get(0);
    assertTrue(leaky.getText().contains("HiveStressTrainer.main(String[])"), leaky.getText());
    assertEquals("At risk", leaky.findElement(By.cssSelector(".verdict")).getText());
    assertTrue(leaky.getText().contains("400 rows"), leaky.getText());
    assertTrue(leaky.getText().contains("Too small to tell apart models a few points apart"));
    assertTrue(leaky.getText().contains("leak.preprocessing-before-split"), "linked to the finding");
    WebElement winter = rows.get(1);
    assertTrue(winter.getText().contains("HiveWinterCheck.main(String[])"), winter.getText());
    assertEquals("No known risk", winter.findElement(By.cssSelector(".verdict")).getText());
    assertTrue(winter.getText().contains("12,000 rows"), winter.getText());
    assertTrue(driver.findElement(By.cssSelector("#chart-rules svg")).isDisplayed(), "chart drawn");
    screenshot("demo-report.png");

    WebElement finding = driver.findElement(By.cssSelector("article.finding"));
    assertTrue(finding.isDisplayed());
    // The demo's two planted defects: the leak and the broadcast over the wrong totals, both errors.
    assertEquals("2 of 2 findings shown", text("#shown-count"));
    driver.findElement(By.id("filter-severity-error")).click();
    assertFalse(finding.isDisplayed(), "unchecking 'error' hides the error findings");
    assertEquals("0 of 2 findings shown", text("#shown-count"));
    screenshot("demo-report-filtered.png");
    driver.findElement(By.id("filter-reset")).click();
    assertTrue(finding.isDisplayed());
    // A link from the verdict table lands on the finding.
    leaky.findElement(By.cssSelector("a.finding-link")).click();
    assertTrue(((String) ((JavascriptExecutor) driver).executeScript("return location.hash"))
        .startsWith("#f-"));
  }

  @Test
  void codeThatLooksLikeHtmlIsShownAsTextAndRunsNothing() throws IOException {
    Path project = Files.createDirectories(OUTPUT.resolve("hostile"));
    // Folder names reach the page too (paths, data attributes, chart labels).
    Path folder = Files.createDirectories(project.resolve("x\"><img src=q onerror=\"window.pwned=1\">"));
    String literal = "</code><script>window.pwned=2</script><b>";
    Files.writeString(folder.resolve("Onload.java"), """
        package script;
        import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
        import org.nd4j.evaluation.classification.Evaluation;
        import org.nd4j.linalg.dataset.DataSet;
        import org.nd4j.linalg.dataset.SplitTestAndTrain;
        import org.nd4j.linalg.dataset.api.iterator.DataSetIterator;
        import org.nd4j.linalg.dataset.api.preprocessor.NormalizerStandardize;
        class Onload {
          static DataSetIterator batches(DataSet rows, String label) { return null; }
          static void script$onerror(DataSetIterator source, MultiLayerNetwork img) {
            DataSet alert = source.next();
            NormalizerStandardize onmouseover = new NormalizerStandardize();
            onmouseover.fit(alert); String note = "%s";
            SplitTestAndTrain split = alert.splitTestAndTrain(0.5);
            img.fit(split.getTrain());
            Evaluation e = img.evaluate(batches(split.getTest(), "%s"));
          }
        }
        """.formatted(literal, literal));
    Path report = report(project, "hostile-report.html", ".");
    driver.get(report.toUri().toString());

    JavascriptExecutor js = (JavascriptExecutor) driver;
    assertEquals("undefined", js.executeScript("return typeof window.pwned"), "no injected script ran");
    assertEquals(1L, js.executeScript("return document.scripts.length"), "only the report's own script");
    assertTrue(driver.findElements(By.cssSelector("img")).isEmpty(), "no element made from scanned text");
    String body = driver.findElement(By.tagName("body")).getText();
    assertTrue(body.contains(literal), "the literal is shown as text");
    assertTrue(body.contains("x\"><img src=q onerror=\"window.pwned=1\">"), "the folder name as text");
    assertTrue(body.contains("Onload.script$onerror(DataSetIterator, MultiLayerNetwork)"), body);
    // The helper's result is built from split.getTest(): provenance reads it as test rows
    // (a name-based judgement), and the verdict row says so in plain text.
    assertTrue(body.contains("test rows"), "the evaluated data's rows are described");
    // The filters still work with hostile file names in their values.
    WebElement file = driver.findElement(By.id("filter-file"));
    new org.openqa.selenium.support.ui.Select(file).selectByIndex(1);
    assertEquals("1 of 1 findings shown", text("#shown-count"));
    screenshot("hostile-report.png");
  }
}
