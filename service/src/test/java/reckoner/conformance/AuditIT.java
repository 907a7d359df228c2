package reckoner.conformance;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import reckoner.spec.Json;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The reproducibility audit on the real jar: 100,000 mixed calls recorded, exported and audited on
 * the same build with no difference; a record altered in the store reported; calls on a fact set
 * changed since reported as not checkable, never as passing.
 */
final class AuditIT {
  private static final JsonMapper JSON = Json.newMapper();
  private static final int CALLS = 100_000;

  @Test
  @DisplayName("Audit: recorded, exported, audited on the same build: no difference; an altered record and changed facts found")
  void audit_sameBuild_alteredRecord_changedFacts() throws Exception {
    Path dir = Files.createTempDirectory("audit");
    Path data = dir.resolve("data");
    Path facts = dir.resolve("facts");
    Files.createDirectories(facts);
    Path factFile = facts.resolve("harbour.jsonl");
    Files.writeString(factFile, "{\"set\":\"harbour\",\"key\":\"tide tables\",\"value\":\"posted at the quay\"}\n");
    StringBuilder sb = new StringBuilder();
    String[] calls = {
        "{\"tool\":\"arith\",\"version\":1,\"args\":{\"expr\":\"%d/7\",\"digits\":12}}",
        "{\"tool\":\"arith\",\"args\":{\"text\":\"%d%% of 80\"}}",
        "{\"tool\":\"units\",\"version\":1,\"args\":{\"text\":\"%d km to mi\"}}",
        "{\"tool\":\"units\",\"args\":{\"text\":\"%d cups to ml\"}}",
        "{\"tool\":\"dates\",\"args\":{\"text\":\"%d business days after 2024-03-01\"}}",
        "{\"tool\":\"dates\",\"version\":1,\"args\":{\"text\":\"%d days ago\",\"as_of\":\"2024-06-12\"}}",
        "{\"tool\":\"dates\",\"version\":1,\"args\":{\"text\":\"today\"}}",
        "{\"tool\":\"facts\",\"args\":{\"key\":\"capital\"}}",
        "{\"tool\":\"facts\",\"args\":{\"key\":\"tide tables\",\"set\":\"harbour\"}}",
        "{\"tool\":\"search\",\"args\":{\"query\":\"harbour lighthouse %d\"}}",
        "{\"tool\":\"arith\",\"version\":1,\"args\":{\"expr\":\"%d/0\"}}",
        "{\"tool\":\"nosuch\",\"args\":{}}"};
    for (int i = 0; i < CALLS; i++) {
      sb.append(String.format(java.util.Locale.ROOT, calls[i % calls.length], i % 997)).append('\n');
    }
    Path input = dir.resolve("calls.ndjson");
    Files.writeString(input, sb.toString(), StandardCharsets.UTF_8);
    try (JarServer server = JarServer.start("audit", data, List.of("--facts-dir", facts.toString(), "--facts-poll-ms", "0",
        "--cache-size", "1000"), Map.of())) {
      Process curl = new ProcessBuilder("curl", "-sS", "-N", "-H", "Content-Type: application/x-ndjson", "-H", "Reckoner-Run: audited",
          "--data-binary", "@" + input, "-o", dir.resolve("answers.ndjson").toString(), server.base() + "/v1/batch")
          .redirectErrorStream(true).start();
      assertTrue(curl.waitFor(600, TimeUnit.SECONDS));
      HttpResponse<String> export = server.get("/v1/invocations/export?run=audited");
      Files.writeString(dir.resolve("export.ndjson"), export.body(), StandardCharsets.UTF_8);
      assertEquals(CALLS, export.body().lines().count());
      HttpResponse<String> viaEndpoint = server.send("POST", "/v1/admin/audit?run=audited&tool=arith", Map.of(), null);
      assertEquals(200, viaEndpoint.statusCode(), viaEndpoint.body());
      assertEquals(0, JSON.readTree(viaEndpoint.body()).get("different").asLong(), viaEndpoint.body());
    }
    // The export, audited by the command on the same build: nothing differs.
    JarServer.Run clean = JarServer.run(dir, List.of("audit", "--input", "export.ndjson", "--output", "report.json", "--facts-dir",
        facts.toString(), "--data-dir", dir.resolve("elsewhere").toString()), Map.of(), Duration.ofMinutes(10));
    assertEquals(0, clean.exitCode(), clean.output());
    JsonNode report = JSON.readTree(Files.readString(dir.resolve("report.json")));
    assertEquals(CALLS, report.get("records").asLong());
    assertEquals(0, report.get("different").asLong(), report.toString());
    long unknown = CALLS / 12 + (CALLS % 12 > 11 ? 1 : 0);
    assertTrue(report.get("same").asLong() >= CALLS - 2 * unknown - 1, report.toString());
    assertTrue(report.get("by_tool_version").has("dates@1") && report.get("by_tool_version").has("search@1"), report.toString());

    // One record altered in the store is found.
    String altered;
    try (java.sql.Connection c = java.sql.DriverManager.getConnection("jdbc:sqlite:" + data.resolve("ledger.db"))) {
      try (java.sql.ResultSet rs = c.createStatement().executeQuery(
          "SELECT id FROM invocation_records WHERE run = 'audited' AND tool = 'units' AND outcome = 'ok' ORDER BY id LIMIT 1")) {
        rs.next();
        altered = rs.getString(1);
      }
      c.createStatement().executeUpdate("UPDATE invocations SET text = '1.61 mi' WHERE seq = (SELECT seq FROM invocations i "
          + "JOIN ledger_names t ON t.n = i.tool_n WHERE t.name = 'units' AND i.outcome = 'ok' ORDER BY seq LIMIT 1)");
    }
    JarServer.Run afterEdit = JarServer.run(dir, List.of("audit", "--run", "audited", "--tool", "units", "--output", "units.json",
        "--data-dir", data.toString(), "--facts-dir", facts.toString()), Map.of(), Duration.ofMinutes(10));
    assertEquals(1, afterEdit.exitCode(), afterEdit.output());
    JsonNode units = JSON.readTree(Files.readString(dir.resolve("units.json")));
    assertEquals(1, units.get("different").asLong());
    assertEquals(altered, units.get("differences").get(0).get("id").asString());
    assertEquals("1.61 mi", units.get("differences").get(0).get("recorded").get("text").asString());

    // A fact set changed since: its calls are not checkable, and never counted the same.
    Files.writeString(factFile, "{\"set\":\"harbour\",\"key\":\"tide tables\",\"value\":\"posted at the harbour office\"}\n");
    JarServer.Run afterChange = JarServer.run(dir, List.of("audit", "--input", "export.ndjson", "--output", "facts.json",
        "--facts-dir", facts.toString(), "--data-dir", dir.resolve("elsewhere").toString()), Map.of(), Duration.ofMinutes(10));
    assertEquals(0, afterChange.exitCode(), afterChange.output());
    JsonNode changed = JSON.readTree(Files.readString(dir.resolve("facts.json")));
    JsonNode factsTally = changed.get("by_tool_version").get("facts@1");
    long harbourCalls = (CALLS + 3) / 12; // the lines at index 8 mod 12
    assertEquals(harbourCalls, factsTally.get("not_checkable").asLong(), changed.toString());
    assertTrue(changed.get("not_checkable_reasons").toString().contains("is no longer loaded"), changed.toString());
  }
}
