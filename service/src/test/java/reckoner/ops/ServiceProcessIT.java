package reckoner.ops;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The packaged service's logs, as ops staff's log collector reads them: one JSON object a line,
 * an access line per request carrying the request id, no secret and no argument value, an access
 * log that turns off, and a SIGTERM that says what it drained.
 */
final class ServiceProcessIT {
  private static final JsonMapper JSON = JsonMapper.builder().build();
  private static final String SECRET = "tarrowin-harbour-secret-5521";
  private static final String ARGUMENT = "7919*104729";

  @TempDir Path dir;

  private static HttpResponse<String> invoke(int port, String requestId) throws Exception {
    HttpClient client = HttpClient.newBuilder().version(HttpClient.Version.HTTP_1_1).build();
    return client.send(HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + port + "/v1/tools/arith/1/invoke"))
        .header("Content-Type", "application/json").header("X-Request-Id", requestId)
        .header("Authorization", "Bearer " + SECRET).header("Reckoner-Run", "brindlecove-census")
        .POST(HttpRequest.BodyPublishers.ofString("{\"expr\":\"" + ARGUMENT + "\"}")).timeout(Duration.ofSeconds(20)).build(),
        HttpResponse.BodyHandlers.ofString());
  }

  private static List<JsonNode> parse(List<String> lines) {
    List<JsonNode> events = new ArrayList<>();
    for (String line : lines) {
      JsonNode event = JSON.readTree(line); // every line is one JSON object, or this fails
      assertTrue(event.isObject(), line);
      assertTrue(event.has("@timestamp") && event.has("level") && event.has("logger_name") && event.has("message"), line);
      events.add(event);
    }
    return events;
  }

  private static JsonNode find(List<JsonNode> events, String messagePrefix) {
    return events.stream().filter(e -> e.get("message").asString().startsWith(messagePrefix)).findFirst()
        .orElseThrow(() -> new AssertionError("no log line starting '" + messagePrefix + "' in " + events));
  }

  @Test
  void logs_areJsonLines_withAnAccessLineAndADrainAccount_andNoSecrets() throws Exception {
    List<String> lines;
    int exit;
    try (ServiceProcess service = ServiceProcess.serve("--port", "0", "--data-dir", dir.toString())) {
      HttpResponse<String> answer = invoke(service.port(), "census-row-17");
      assertEquals(200, answer.statusCode(), answer.body());
      assertEquals("census-row-17", answer.headers().firstValue("X-Request-Id").orElseThrow());
      exit = service.stop();
      lines = service.lines();
    }
    assertEquals(143, exit, "the JVM's exit code after a SIGTERM it handled");
    List<JsonNode> events = parse(lines);

    JsonNode access = events.stream().filter(e -> e.get("logger_name").asString().equals("reckoner.access")).findFirst()
        .orElseThrow(() -> new AssertionError("no access line in " + lines));
    assertEquals("census-row-17", access.get("request_id").asString());
    assertEquals("POST", access.get("method").asString());
    assertEquals("/v1/tools/{name}/{version}/invoke", access.get("route").asString());
    assertEquals("/v1/tools/arith/1/invoke", access.get("path").asString());
    assertEquals(200, access.get("status").asInt());
    assertTrue(access.get("duration_ms").isNumber());
    assertEquals("INFO", access.get("level").asString());

    for (String line : lines) {
      assertFalse(line.contains(SECRET), "a secret in the log: " + line);
      assertFalse(line.contains(ARGUMENT), "an argument value in the log: " + line);
      assertFalse(line.toLowerCase(java.util.Locale.ROOT).contains("authorization"), line);
    }

    JsonNode stopping = find(events, "stopping: draining");
    assertTrue(stopping.get("http_in_flight").isNumber() && stopping.get("ledger_queued").isNumber(), stopping.toString());
    JsonNode stopped = find(events, "stopped in");
    assertEquals(0, stopped.get("ledger_not_written").asInt());
    assertTrue(stopped.get("ledger_written_in_drain").isNumber(), stopped.toString());
  }

  @Test
  void accessLog_turnedOff_leavesTheOtherLines() throws Exception {
    List<String> lines;
    try (ServiceProcess service = ServiceProcess.serve("--port", "0", "--data-dir", dir.toString(), "--no-access-log")) {
      assertEquals(200, invoke(service.port(), "quiet-1").statusCode());
      service.stop();
      lines = service.lines();
    }
    List<JsonNode> events = parse(lines);
    assertTrue(events.stream().noneMatch(e -> e.get("logger_name").asString().equals("reckoner.access")), lines.toString());
    find(events, "serving ");
    find(events, "stopped in");
  }
}
