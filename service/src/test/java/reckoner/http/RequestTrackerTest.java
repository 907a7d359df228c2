package reckoner.http;

import static io.restassured.RestAssured.given;
import static org.hamcrest.Matchers.equalTo;
import static org.hamcrest.Matchers.matchesPattern;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

final class RequestTrackerTest {
  private static TestServer server;

  @BeforeAll
  static void start() {
    server = TestServer.start();
  }

  @AfterAll
  static void stop() {
    server.close();
  }

  // ---- request ids ----

  @Test
  void requestId_sane_isKept() {
    assertEquals("batch-7:line.12", RequestTracker.requestId("batch-7:line.12"));
    assertEquals("0b5c1f2e-44a1-4d1c-9a51-3f2a8e0f7c11", RequestTracker.requestId("0b5c1f2e-44a1-4d1c-9a51-3f2a8e0f7c11"));
  }

  @Test
  void requestId_missingTooLongOrOdd_isReplacedByANewOne() {
    for (String offered : new String[] {null, "", "x".repeat(129), "a b", "id\r\nSet-Cookie: x", "é"}) {
      assertTrue(RequestTracker.requestId(offered).matches("[0-9a-f]{32}"), String.valueOf(offered));
    }
  }

  @Test
  void request_echoesTheCallersRequestId() {
    given().port(server.port()).header("X-Request-Id", "tarrowin-job-17").get("/health/live").then()
        .statusCode(200).header("X-Request-Id", equalTo("tarrowin-job-17"));
  }

  @Test
  void request_withoutAnId_getsANewOne() {
    given().port(server.port()).get("/v1/tools").then().statusCode(200).header("X-Request-Id", matchesPattern("[0-9a-f]{32}"));
  }

  @Test
  void refusal_hasARequestIdToo() {
    given().port(server.port()).header("X-Request-Id", "r-404").get("/no/such/endpoint").then()
        .statusCode(404).header("X-Request-Id", equalTo("r-404"));
  }

  // ---- HTTP metrics ----

  @Test
  void refusals_areCountedByRouteStatusAndCode() {
    given().port(server.port()).get("/no/such/endpoint").then().statusCode(404);
    given().port(server.port()).contentType("application/xml").body("<a/>").post("/v1/tools/arith/1/invoke").then().statusCode(415);
    given().port(server.port()).contentType("application/json").body("{bad").post("/v1/tools/arith/1/invoke").then().statusCode(400);
    given().port(server.port()).contentType("application/json").body("{\"expr\":\"" + "1".repeat(70_000) + "\"}")
        .post("/v1/tools/arith/1/invoke").then().statusCode(413);
    String text = given().port(server.port()).get("/metrics").then().extract().asString();
    String invoke = "route=\"/v1/tools/{name}/{version}/invoke\"";
    assertTrue(text.contains("reckoner_http_problems_total{code=\"unknown_endpoint\",route=\"unmatched\",status=\"404\"}"), text);
    assertTrue(text.contains("reckoner_http_problems_total{code=\"unsupported_media_type\"," + invoke + ",status=\"415\"}"));
    assertTrue(text.contains("reckoner_http_problems_total{code=\"invalid_argument\"," + invoke + ",status=\"400\"}"));
    assertTrue(text.contains("reckoner_http_problems_total{code=\"payload_too_large\"," + invoke + ",status=\"413\"}"));
    assertTrue(text.contains("reckoner_http_requests_total{method=\"GET\",route=\"unmatched\",status=\"4xx\"}"));
  }

  @Test
  void requests_areCountedByRouteAndStatusClass_neverByRawPath() {
    given().port(server.port()).contentType("application/json").body("{\"expr\":\"1+1\"}").post("/v1/tools/arith/1/invoke");
    given().port(server.port()).get("/v1/tools/arith/1").then().statusCode(200);
    String text = given().port(server.port()).get("/metrics").then().extract().asString();
    assertTrue(text.contains("reckoner_http_requests_total{method=\"POST\",route=\"/v1/tools/{name}/{version}/invoke\",status=\"2xx\"}"));
    assertTrue(text.contains("reckoner_http_requests_total{method=\"GET\",route=\"/v1/tools/{name}/{version}\",status=\"2xx\"}"));
    assertTrue(text.contains("reckoner_http_request_duration_seconds_bucket{method=\"GET\",route=\"/v1/tools/{name}/{version}\",le=\"0.001\"}"));
    assertTrue(!text.contains("route=\"/v1/tools/arith/1"), "the raw path is never a label");
    assertTrue(!text.contains("route=\"/no/such/endpoint\""));
  }

  @Test
  void inFlight_isBackToZeroAfterTheRequests() {
    given().port(server.port()).get("/health/live");
    String text = given().port(server.port()).get("/metrics").then().extract().asString();
    // the scrape itself is in flight while it is written
    assertTrue(text.contains("reckoner_http_requests_in_flight 1.0"), text.lines().filter(l -> l.contains("in_flight")).toList().toString());
  }
}
