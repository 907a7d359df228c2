package reckoner.http;

import static io.restassured.RestAssured.given;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.equalTo;
import static org.hamcrest.Matchers.hasItem;
import static org.hamcrest.Matchers.not;
import static org.hamcrest.Matchers.nullValue;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import io.restassured.response.Response;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import reckoner.Service;

final class StatusPageTest {
  private static TestServer server;

  @BeforeAll
  static void start() {
    server = TestServer.start();
    for (int i = 0; i < 5; i++) {
      given().port(server.port()).contentType("application/json").body("{\"expr\":\"" + i + "+1\"}").post("/v1/tools/arith/1/invoke");
    }
    given().port(server.port()).contentType("application/json").body("{\"expr\":\"1/0\"}").post("/v1/tools/arith/1/invoke");
  }

  @AfterAll
  static void stop() {
    server.close();
  }

  // ---- /status.json ----

  @Test
  void statusJson_callsErrorsAndOutcomesPerTool() {
    given().port(server.port()).get("/status.json").then().statusCode(200)
        .header("Cache-Control", "no-store")
        .body("tools.tool", hasItem("arith"))
        .body("tools.find { it.tool == 'arith' }.calls", equalTo(6))
        .body("tools.find { it.tool == 'arith' }.errors", equalTo(1))
        .body("tools.find { it.tool == 'arith' }.outcomes.domain_error", equalTo(1))
        .body("tools.find { it.tool == 'arith' }.outcomes.ok", equalTo(5));
  }

  @Test
  void statusJson_serviceVersionLedgerAndCache() {
    given().port(server.port()).get("/status.json").then().statusCode(200)
        .body("service.version", equalTo(Service.VERSION))
        .body("service.ledger", equalTo("sqlite"))
        .body("service.uptime_seconds", not(nullValue()))
        .body("ledger.healthy", equalTo(true))
        .body("ledger.queue_capacity", equalTo(65536))
        .body("ledger.records_written", equalTo(6))
        .body("ledger.records_refused", equalTo(0))
        .body("cache.enabled", equalTo(true))
        .body("interval_seconds", equalTo(5.0f))
        .body("window_seconds", equalTo(900.0f));
  }

  @Test
  void statusJson_seriesHaveOnePointPerTime() {
    Response r = given().port(server.port()).get("/status.json");
    int times = r.path("times.size()"); // how many depends on the time since the first sample (StatusHistoryTest fixes it)
    for (String series : new String[] {"calls_per_second", "errors_per_second", "p50_seconds", "p99_seconds"}) {
      assertEquals(times, (int) r.path("tools.find { it.tool == 'arith' }.series." + series + ".size()"), series);
    }
    assertEquals(times, (int) r.path("ledger.series.queue_depth.size()"));
    assertEquals(times, (int) r.path("cache.series.hit_ratio.size()"));
  }

  @Test
  void status_withAcceptJson_answersTheJson() {
    given().port(server.port()).accept("application/json").get("/status").then().statusCode(200)
        .contentType(containsString("application/json"))
        .body("tools.find { it.tool == 'arith' }.calls", equalTo(6));
  }

  // ---- /status (HTML) ----

  @Test
  void status_html_isOneDocumentWithItsOwnScriptAndTheDataInside() {
    String html = given().port(server.port()).get("/status").then().statusCode(200)
        .contentType(containsString("text/html")).extract().asString();
    assertTrue(html.contains("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">"), "phones get a viewport");
    assertTrue(html.contains("\"tool\":\"arith\""), "the current figures are in the page");
    assertTrue(html.contains("\"domain_error\":1"));
    assertTrue(html.contains("fetch(\"/status.json\""), "the script polls the JSON");
    Matcher external = Pattern.compile("(src|href)=\"(https?:)?//").matcher(html);
    assertFalse(external.find(), "no external asset");
    assertFalse(html.contains("{{STATUS_JSON}}"));
  }

  @Test
  void status_html_embeddedJsonCannotCloseTheScriptElement() {
    String html = given().port(server.port()).get("/status").then().extract().asString();
    int start = html.indexOf("<script type=\"application/json\" id=\"initial\">");
    int end = html.indexOf("</script>", start);
    assertFalse(html.substring(start + 10, end).contains("<"), "a '<' inside the data is written as \\u003c");
  }

  /** The sampling thread ends with the server: no idle thread is left per server started. */
  @Test
  void serverStopped_endsTheSamplingThread() throws InterruptedException {
    long before = samplerThreads();
    TestServer other = TestServer.start();
    assertEquals(before + 1, samplerThreads());
    other.close();
    long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(10);
    while (samplerThreads() > before && System.nanoTime() < deadline) {
      Thread.sleep(10);
    }
    assertEquals(before, samplerThreads());
  }

  private static long samplerThreads() {
    return Thread.getAllStackTraces().keySet().stream()
        .filter(t -> t.isAlive() && t.getName().equals(StatusHistory.THREAD_NAME)).count();
  }
}
