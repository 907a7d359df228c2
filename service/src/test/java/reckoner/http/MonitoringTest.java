package reckoner.http;

import static io.restassured.RestAssured.given;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.endsWith;
import static org.hamcrest.Matchers.equalTo;
import static org.hamcrest.Matchers.not;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/** {@code GET /metrics}: the names, labels and bucket counts ops staff rely on, in both formats. */
final class MonitoringTest {
  private static TestServer server;

  @BeforeAll
  static void start() {
    server = TestServer.start();
  }

  @AfterAll
  static void stop() {
    server.close();
  }

  private static String scrape() {
    return given().port(server.port()).get("/metrics").then().statusCode(200).extract().asString();
  }

  @Test
  void metrics_callsByOutcome_andTheCallHistogram() {
    given().port(server.port()).contentType("application/json").body("{\"expr\":\"x\"}").post("/v1/tools/arith/1/invoke");
    String text = scrape();
    assertTrue(text.contains("reckoner_calls_total{outcome=\"syntax_error\",tool=\"arith\",version=\"1\"}"), text);
    assertTrue(text.contains("reckoner_call_duration_seconds_bucket{tool=\"arith\",version=\"1\",le=\"0.001\"}"));
    assertTrue(text.contains("cache_gets_total{cache=\"answers\",result=\"miss\"}"));
  }

  /** 15 bounds from 10 µs to 1 s and +Inf: not the hundred-odd of a percentile histogram. */
  @Test
  void metrics_callHistogram_hasTheFixedBuckets() {
    given().port(server.port()).contentType("application/json").body("{\"expr\":\"2+2\"}").post("/v1/tools/arith/1/invoke");
    String[] les = scrape().lines().filter(l -> l.startsWith("reckoner_call_duration_seconds_bucket{tool=\"arith\",version=\"1\""))
        .map(l -> l.replaceAll(".*le=\"([^\"]+)\".*", "$1")).toArray(String[]::new);
    assertEquals(Arrays.asList("1.0E-5", "2.5E-5", "5.0E-5", "1.0E-4", "2.5E-4", "5.0E-4", "0.001", "0.0025", "0.005", "0.01",
        "0.025", "0.05", "0.1", "0.25", "1.0", "+Inf"), Arrays.asList(les));
  }

  @Test
  void metrics_ledgerCommitHistograms_haveBoundedBuckets() {
    given().port(server.port()).contentType("application/json").body("{\"expr\":\"3+3\"}").post("/v1/tools/arith/1/invoke");
    String text = scrape();
    assertEquals(17, text.lines().filter(l -> l.startsWith("reckoner_ledger_commit_seconds_bucket")).count());
    assertEquals(14, text.lines().filter(l -> l.startsWith("reckoner_ledger_commit_records_bucket")).count());
    assertTrue(text.contains("reckoner_ledger_commit_records_bucket{le=\"4096.0\"}"));
  }

  @Test
  void metrics_ledgerAndBuildGauges() {
    String text = scrape();
    assertTrue(text.contains("reckoner_ledger_healthy 1"));
    assertTrue(text.contains("reckoner_ledger_queue_capacity 65536"));
    assertTrue(text.contains("reckoner_ledger_records_refused_total 0"));
    assertTrue(text.contains("reckoner_build_info{version=\"1.0.0\"} 1"));
  }

  @Test
  void metrics_leaveOutTheNamesPromtoolRefuses() {
    String text = scrape();
    assertTrue(!text.contains("system_cpu_count") && !text.contains("process_cpu_time_ns"), "names promtool refuses are left out");
  }

  @Test
  void metrics_prometheusTextByDefault() {
    given().port(server.port()).get("/metrics").then().statusCode(200)
        .contentType(equalTo("text/plain; version=0.0.4; charset=utf-8"))
        .body(not(containsString("# EOF")));
  }

  @Test
  void metrics_openMetricsWhenAsked() {
    given().port(server.port())
        .header("Accept", "application/openmetrics-text;version=1.0.0,text/plain;version=0.0.4;q=0.5")
        .get("/metrics").then().statusCode(200)
        .header("Vary", "Accept")
        .contentType(equalTo("application/openmetrics-text; version=1.0.0; charset=utf-8"))
        .body(endsWith("# EOF\n"));
  }
}
