package reckoner.http;

import static io.restassured.RestAssured.given;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.equalTo;
import static org.hamcrest.Matchers.hasItem;

import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

final class StatusPageTest {
  private static TestServer server;

  @BeforeAll
  static void start() {
    server = TestServer.start();
  }

  @AfterAll
  static void stop() {
    server.close();
  }

  @Test
  void status_showsCallsAndErrorsPerTool_asJsonAndHtml() {
    for (int i = 0; i < 5; i++) {
      given().port(server.port()).contentType("application/json").body("{\"expr\":\"" + i + "+1\"}").post("/v1/tools/arith/1/invoke");
    }
    given().port(server.port()).contentType("application/json").body("{\"expr\":\"1/0\"}").post("/v1/tools/arith/1/invoke");
    given().port(server.port()).accept("application/json").get("/status").then().statusCode(200)
        .body("tools.tool", hasItem("arith"))
        .body("tools.find { it.tool == 'arith' }.calls", equalTo(6))
        .body("tools.find { it.tool == 'arith' }.errors", equalTo(1))
        .body("tools.find { it.tool == 'arith' }.outcomes.domain_error", equalTo(1));
    given().port(server.port()).get("/status").then().statusCode(200).contentType(containsString("text/html"))
        .body(containsString("arith@1")).body(containsString("domain_error 1"));
  }

  @Test
  void metrics_exposeCallsByOutcome_inPrometheusText() {
    given().port(server.port()).contentType("application/json").body("{\"expr\":\"x\"}").post("/v1/tools/arith/1/invoke");
    given().port(server.port()).get("/metrics").then().statusCode(200)
        .body(containsString("reckoner_calls_total{outcome=\"syntax_error\",tool=\"arith\",version=\"1\"}"))
        .body(containsString("reckoner_call_duration_seconds_bucket"))
        .body(containsString("cache_gets_total"));
  }

  /** The sampling thread ends with the server: no idle thread is left per server started. */
  @Test
  void serverStopped_endsTheSamplingThread() throws InterruptedException {
    long before = samplerThreads();
    TestServer other = TestServer.start();
    org.junit.jupiter.api.Assertions.assertEquals(before + 1, samplerThreads());
    other.close();
    long deadline = System.nanoTime() + java.util.concurrent.TimeUnit.SECONDS.toNanos(10);
    while (samplerThreads() > before && System.nanoTime() < deadline) {
      Thread.sleep(10);
    }
    org.junit.jupiter.api.Assertions.assertEquals(before, samplerThreads());
  }

  private static long samplerThreads() {
    return Thread.getAllStackTraces().keySet().stream()
        .filter(t -> t.isAlive() && t.getName().equals("reckoner-status-sampler")).count();
  }
}
