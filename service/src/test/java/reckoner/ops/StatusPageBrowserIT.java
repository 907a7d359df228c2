package reckoner.ops;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.File;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.Duration;
import java.util.List;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.Dimension;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.OutputType;
import org.openqa.selenium.TakesScreenshot;
import org.openqa.selenium.chrome.ChromeDriver;
import org.openqa.selenium.chrome.ChromeDriverService;
import org.openqa.selenium.chrome.ChromeOptions;
import org.openqa.selenium.support.ui.WebDriverWait;

/**
 * {@code /status} in a real browser (Debian's {@code chromium} driven through its
 * {@code chromium-driver}, nothing downloaded) while calls run: every tool's row shows a non-zero
 * call rate and its rate chart has drawn a non-zero line, at desktop width and at 400 px, where
 * nothing may stick out sideways. Screenshots go to {@code target/screenshots}.
 */
final class StatusPageBrowserIT {
  private static final List<String> TOOLS = List.of("arith@1", "dates@1", "facts@1", "units@1");

  private static LiveService service;
  private static ChromeDriver browser;
  private static Thread load;
  private static final AtomicBoolean stop = new AtomicBoolean();
  private static final AtomicInteger sent = new AtomicInteger();

  @BeforeAll
  static void start() {
    Path chromium = Repo.program("/usr/bin/chromium", "chromium");
    Path driver = Repo.program("/usr/bin/chromedriver", "chromium-driver");
    service = LiveService.start();
    load = new Thread(() -> {
      long end = System.nanoTime() + Duration.ofMinutes(3).toNanos(); // bounded, whatever happens to the test
      while (!stop.get() && System.nanoTime() < end) {
        service.call(sent.getAndIncrement());
        try {
          Thread.sleep(5);
        } catch (InterruptedException e) {
          return;
        }
      }
    }, "status-page-load");
    load.setDaemon(true);
    load.start();
    ChromeOptions options = new ChromeOptions();
    options.setBinary(chromium.toFile());
    options.addArguments("--headless=new", "--no-sandbox", "--disable-dev-shm-usage", "--disable-gpu",
        "--hide-scrollbars", "--window-size=1280,1000");
    ChromeDriverService driverService = new ChromeDriverService.Builder().usingDriverExecutable(driver.toFile())
        .usingAnyFreePort().build();
    browser = new ChromeDriver(driverService, options);
  }

  @AfterAll
  static void stop() throws InterruptedException {
    stop.set(true);
    if (load != null) {
      load.join(10_000);
    }
    if (browser != null) {
      browser.quit();
    }
    if (service != null) {
      service.close();
    }
  }

  @Test
  void desktop_everyToolShowsARateAndAChart() throws IOException {
    browser.manage().window().setSize(new Dimension(1280, 1000));
    browser.get(service.uri("/status").toString());
    awaitRatesAndCharts();
    screenshot("status-desktop.png");
    assertEquals(1280, width(), "the window is as wide as asked");
  }

  @Test
  void phone_400px_everyToolShowsARateAndAChart_andNothingSticksOut() throws IOException {
    browser.manage().window().setSize(new Dimension(400, 1400));
    browser.get(service.uri("/status").toString());
    awaitRatesAndCharts();
    screenshot("status-400px.png");
    long width = width();
    assertTrue(width <= 400, "the page is laid out for 400 px, not " + width);
    long scrollWidth = (Long) ((JavascriptExecutor) browser).executeScript("return document.documentElement.scrollWidth;");
    assertTrue(scrollWidth <= width, "no horizontal scrolling: the page is " + scrollWidth + " px wide in a " + width + " px window");
    // Measured in one script run: the page redraws its rows on every poll, so element handles go stale.
    @SuppressWarnings("unchecked")
    List<String> outside = (List<String>) ((JavascriptExecutor) browser).executeScript(
        "var out = [];"
        + "arguments[0].forEach(function (tool) {"
        + "  var row = document.querySelector(\"article[data-tool='\" + tool + \"']\");"
        + "  if (!row) { out.push(tool + ': no row'); return; }"
        + "  [\"[data-field='rate']\", \"[data-field='p99']\", \"svg[data-chart='rate']\", \"svg[data-chart='latency']\"].forEach(function (part) {"
        + "    var e = row.querySelector(part), r = e && e.getBoundingClientRect();"
        + "    if (!e || r.width === 0 || r.height === 0 || getComputedStyle(e).visibility !== 'visible') { out.push(tool + ' ' + part + ': not shown'); }"
        + "    else if (r.right > window.innerWidth) { out.push(tool + ' ' + part + ': ends at ' + r.right); }"
        + "  });"
        + "});"
        + "return out;", TOOLS);
    assertEquals(List.of(), outside, "parts hidden or outside the " + width + " px window");
  }

  private long width() {
    return (Long) ((JavascriptExecutor) browser).executeScript("return window.innerWidth;");
  }

  /** Waits (the page polls every 5 s) until each tool's rate figure and rate chart are above zero. */
  private void awaitRatesAndCharts() {
    new WebDriverWait(browser, Duration.ofSeconds(40)).pollingEvery(Duration.ofMillis(500)).until(b -> {
      for (String tool : TOOLS) {
        @SuppressWarnings("unchecked")
        List<String> seen = (List<String>) ((JavascriptExecutor) b).executeScript(
            "var row = document.querySelector(\"article[data-tool='\" + arguments[0] + \"']\");"
            + "if (!row) { return null; }"
            + "var chart = row.querySelector(\"svg[data-chart='rate']\"), line = chart.querySelector('path.line');"
            + "return [row.querySelector(\"[data-field='rate']\").textContent, chart.getAttribute('data-peak'),"
            + "  line ? line.getAttribute('d') : ''];", tool);
        if (seen == null || !positive(seen.get(0)) || Double.parseDouble(seen.get(1)) <= 0 || seen.get(2).isEmpty()) {
          return false;
        }
      }
      return true;
    });
    assertTrue(sent.get() > 0);
  }

  /** "12.5", "0.4" or "<0.01" are above zero; "0" and "–" are not. */
  private static boolean positive(String shown) {
    if (shown.startsWith("<")) {
      return true;
    }
    try {
      return Double.parseDouble(shown.replace("k", "")) > 0;
    } catch (NumberFormatException e) {
      return false;
    }
  }

  private static void screenshot(String name) throws IOException {
    Path dir = Path.of(System.getProperty("reckoner.screenshots.dir", "target/screenshots"));
    Files.createDirectories(dir);
    File shot = ((TakesScreenshot) browser).getScreenshotAs(OutputType.FILE);
    Files.copy(shot.toPath(), dir.resolve(name), StandardCopyOption.REPLACE_EXISTING);
  }
}
