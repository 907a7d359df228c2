package reckoner.conformance;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import io.swagger.v3.parser.OpenAPIV3Parser;
import io.swagger.v3.parser.core.models.SwaggerParseResult;
import java.net.http.HttpResponse;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import reckoner.spec.Json;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** The contract's "Endpoints" table, each row on the real jar. */
final class ContractEndpointsIT {
  private static final JsonMapper JSON = Json.newMapper();
  private static final JarServer SERVER = JarServer.shared();

  @Test
  @DisplayName("Endpoints: GET /v1/tools lists the tools and versions served, with summaries, specs and invoke paths that work")
  void tools_listed_withWorkingLinks() {
    JsonNode tools = JSON.readTree(SERVER.get("/v1/tools").body()).get("tools");
    Set<String> names = new HashSet<>();
    for (JsonNode t : tools) {
      names.add(t.get("name").asString());
      assertEquals(t.get("name").asString() + "@" + t.get("version").asInt(), t.get("id").asString());
      assertFalse(t.get("summary").asString().isBlank());
      assertFalse(t.get("text_form").asString().isBlank());
      JsonNode spec = JSON.readTree(SERVER.get(t.get("spec").asString()).body());
      assertEquals(t.get("id").asString(), spec.get("title").asString());
      assertEquals("https://json-schema.org/draft/2020-12/schema", spec.get("$schema").asString());
      assertFalse(spec.get("description").asString().isBlank());
      assertTrue(spec.get("x-reckoner").get("examples").size() > 0);
      JsonNode example = spec.get("x-reckoner").get("examples").get(0);
      HttpResponse<String> r = SERVER.postJson(t.get("invoke").asString(), example.get("args").toString());
      JsonNode body = JSON.readTree(r.body());
      if (example.has("text")) {
        assertEquals(200, r.statusCode(), r.body());
        assertEquals(example.get("text").asString(), body.get("text").asString());
      } else {
        assertEquals(example.get("error").asString(), body.get("code").asString());
      }
    }
    assertTrue(names.containsAll(List.of("arith", "dates", "units", "facts")), names.toString());
    for (String name : names) { // "Versions 2": an unpinned call gets the newest, which the list marks as the default
      int newest = 0;
      String marked = null;
      for (JsonNode t : tools) {
        if (t.get("name").asString().equals(name)) {
          newest = Math.max(newest, t.get("version").asInt());
          if (t.get("default").asBoolean()) {
            assertEquals(null, marked, "one default per tool");
            marked = t.get("id").asString();
          }
        }
      }
      assertEquals(name + "@" + newest, marked);
    }
  }

  @Test
  @DisplayName("Endpoints: invoke answers {tool, version, text, cached, invocation_id, data_version?}, or the text alone with Accept: text/plain")
  void invoke_answerShapes() {
    JsonNode a = JSON.readTree(SERVER.postJson("/v1/tools/facts/1/invoke", "{\"key\":\"capital\"}").body());
    assertEquals("facts", a.get("tool").asString());
    assertEquals(1, a.get("version").asInt());
    assertEquals("Brindlecove", a.get("text").asString());
    assertTrue(a.has("cached") && a.has("invocation_id"));
    assertTrue(a.get("data_version").asString().startsWith("sha256:"));
    HttpResponse<String> text = SERVER.postJson("/v1/tools/facts/1/invoke", "{\"key\":\"capital\"}", "Accept", "text/plain");
    assertEquals("Brindlecove", text.body());
    assertTrue(text.headers().firstValue("Content-Type").orElse("").startsWith("text/plain"));
    assertTrue(text.headers().firstValue("Reckoner-Invocation-Id").isPresent());
  }

  @Test
  @DisplayName("Endpoints: the reference time travels in the as_of argument or the Reckoner-As-Of header")
  void referenceTime_argumentOrHeader() {
    assertEquals("2019-04-30", SERVER.postJson("/v1/tools/dates/1/invoke", "{\"text\":\"45 days ago\"}", "Accept", "text/plain",
        "Reckoner-As-Of", "2019-06-14").body());
    assertEquals("2019-04-30", SERVER.postJson("/v1/tools/dates/1/invoke", "{\"text\":\"45 days ago\",\"as_of\":\"2019-06-14\"}",
        "Accept", "text/plain", "Reckoner-As-Of", "2001-01-01").body(), "the argument wins over the header");
  }

  @Test
  @DisplayName("Words: without a reference time the server clock is read; the answer is not cached and the time used is recorded")
  void serverClock_notCached_timeRecorded() {
    JsonNode first = JSON.readTree(SERVER.postJson("/v1/tools/dates/1/invoke", "{\"text\":\"today\"}",
        "Reckoner-Run", "clock-read").body());
    JsonNode second = JSON.readTree(SERVER.postJson("/v1/tools/dates/1/invoke", "{\"text\":\"today\"}",
        "Reckoner-Run", "clock-read").body());
    assertFalse(second.get("cached").asBoolean());
    assertNotNull(first.get("as_of"), "the time used is returned");
    JsonNode record = JSON.readTree(SERVER.get("/v1/invocations?run=clock-read&limit=1").body()).get("invocations").get(0);
    assertEquals(first.get("as_of").asString(), record.get("as_of").asString(), "and recorded");
  }

  @Test
  @DisplayName("Endpoints: GET /openapi.json is an OpenAPI 3.1 document a general-purpose parser reads without a message")
  void openApi_parses() {
    SwaggerParseResult result = new OpenAPIV3Parser().readContents(SERVER.get("/openapi.json").body());
    assertEquals(List.of(), result.getMessages());
    assertEquals("3.1.0", result.getOpenAPI().getOpenapi());
    for (String path : List.of("/v1/tools", "/v1/batch", "/v1/splice", "/v1/fill", "/v1/invocations", "/v1/invocations/export",
        "/metrics", "/health/live", "/health/ready", "/status", "/v1/tools/arith/1/invoke")) {
      assertNotNull(result.getOpenAPI().getPaths().get(path), path);
    }
  }

  @Test
  @DisplayName("Endpoints: /metrics is the Prometheus text exposition; /health/live and /health/ready answer; /status is a page")
  void operationsEndpoints() {
    SERVER.postJson("/v1/tools/arith/1/invoke", "{\"expr\":\"1\"}");
    HttpResponse<String> metrics = SERVER.get("/metrics");
    assertEquals(200, metrics.statusCode());
    assertTrue(metrics.headers().firstValue("Content-Type").orElse("").startsWith("text/plain"));
    assertTrue(metrics.body().contains("# TYPE ") && metrics.body().contains("reckoner_"), "Prometheus text");
    assertEquals(200, SERVER.get("/health/live").statusCode());
    assertEquals("ready", JSON.readTree(SERVER.get("/health/ready").body()).get("status").asString());
    HttpResponse<String> status = SERVER.get("/status");
    assertEquals(200, status.statusCode());
    assertTrue(status.headers().firstValue("Content-Type").orElse("").startsWith("text/html"));
  }
}
