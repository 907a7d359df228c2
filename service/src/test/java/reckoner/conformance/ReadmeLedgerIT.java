package reckoner.conformance;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import reckoner.spec.Json;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** README, section "The ledger", and the contract's "Ledger" section, on the real jar with its SQLite ledger. */
final class ReadmeLedgerIT {
  private static final JsonMapper JSON = Json.newMapper();
  private static JarServer server;

  @BeforeAll
  static void start() {
    server = JarServer.start("ledger", List.of(), Map.of());
  }

  @AfterAll
  static void stop() {
    server.close();
  }

  private static List<JsonNode> records(String query) {
    HttpResponse<String> r = server.get("/v1/invocations?" + query);
    assertEquals(200, r.statusCode(), r.body());
    List<JsonNode> out = new ArrayList<>();
    JSON.readTree(r.body()).get("invocations").forEach(out::add);
    return out;
  }

  @Test
  @DisplayName("The ledger: every call (ok, error or cache hit, through every endpoint) is one invocation, readable as soon as it is answered")
  void everyCall_throughEveryEndpoint_isOneInvocation() {
    String run = "every-endpoint";
    Set<String> answered = new HashSet<>();
    for (int i = 0; i < 2; i++) { // the second round hits the cache
      answered.add(server.postJson("/v1/tools/arith/1/invoke", "{\"expr\":\"2+2\"}", "Reckoner-Run", run, "Reckoner-Ref", "inv-ok")
          .headers().firstValue("Reckoner-Invocation-Id").orElseThrow());
      answered.add(JSON.readTree(server.postJson("/v1/tools/arith/1/invoke", "{\"expr\":\"1/0\"}", "Reckoner-Run", run,
          "Reckoner-Ref", "inv-err").body()).get("invocation_id").asString());
    }
    JsonNode batch = JSON.readTree(server.postJson("/v1/batch", "{\"calls\":[{\"id\":1,\"tool\":\"arith\",\"args\":{\"expr\":\"3\"},"
        + "\"ref\":\"batch-1\"},{\"id\":2,\"tool\":\"units\",\"version\":1,\"args\":{\"text\":\"1 furlong to m\"},\"ref\":\"batch-2\"},"
        + "{\"id\":3,\"tool\":\"nosuch\",\"args\":{}},\"not a call\"]}", "Reckoner-Run", run).body());
    batch.get("results").forEach(res -> {
      if (res.has("invocation_id")) {
        answered.add(res.get("invocation_id").asString());
      }
    });
    HttpResponse<String> ndjson = server.send("POST", "/v1/batch", Map.of("Content-Type", "application/x-ndjson", "Reckoner-Run", run),
        "{\"id\":\"n1\",\"tool\":\"dates\",\"version\":1,\"args\":{\"text\":\"leap year 2100\"}}\nnot json\n".getBytes(StandardCharsets.UTF_8));
    ndjson.body().lines().map(JSON::readTree).filter(n -> n.has("invocation_id"))
        .forEach(n -> answered.add(n.get("invocation_id").asString()));
    answered.add(JSON.readTree(server.postJson("/v1/splice", "{\"call\":\"facts@1(capital)\"}", "Reckoner-Run", run).body())
        .get("invocation_id").asString());
    JSON.readTree(server.postJson("/v1/fill", "{\"document\":\"<:arith@1(1+1):> <:arith@1(x):>\"}", "Reckoner-Run", run,
        "Reckoner-Ref", "fill-doc").body()).get("calls").forEach(c -> answered.add(c.get("invocation_id").asString()));

    List<JsonNode> recorded = records("run=" + run + "&limit=100");
    Set<String> ids = new HashSet<>();
    recorded.forEach(r -> ids.add(r.get("id").asString()));
    assertEquals(answered, ids, "each answered call is exactly one record, none more (the line that was not a call has none)");
    assertEquals(recorded.size(), ids.size());
    assertEquals(11, recorded.size());
    JsonNode hit = recorded.stream().filter(r -> "inv-ok".equals(r.get("ref").asString()) && r.get("cached").asBoolean())
        .findFirst().orElseThrow(() -> new AssertionError("the cache hit is recorded"));
    assertEquals("4", hit.get("text").asString());
    for (JsonNode r : recorded) {
      for (String field : List.of("id", "ts", "key_id", "run", "ref", "tool", "version", "args", "text", "outcome", "cached",
          "elapsed_us", "data_version", "as_of")) {
        assertTrue(r.has(field), field + " in " + r);
      }
        assertEquals("anonymous", r.get("key_id").asString());
    }
    assertTrue(recorded.stream().anyMatch(r -> r.get("ref").asString().equals("fill-doc:pos-0")), "fill refs: prefix:pos-N");
    assertTrue(recorded.stream().anyMatch(r -> r.get("tool").asString().equals("nosuch") && r.get("outcome").asString().equals("unknown_tool")));
    JsonNode fact = recorded.stream().filter(r -> r.get("tool").asString().equals("facts")).findFirst().orElseThrow();
    assertTrue(fact.get("data_version").asString().startsWith("sha256:"), fact.toString());
  }

  @Test
  @DisplayName("The ledger: ids are time-ordered UUIDv7, pages run oldest first with a cursor, and the filters select")
  void filtersAndCursor() {
    String run = "filters";
    Instant before = Instant.now().minusSeconds(2);
    for (int i = 0; i < 25; i++) {
      server.postJson("/v1/tools/arith/1/invoke", "{\"expr\":\"" + (i % 5 == 0 ? "1/0" : i + "") + "\"}", "Reckoner-Run", run,
          "Reckoner-Ref", "doc-" + (i % 3) + ":pos-" + i);
    }
    server.postJson("/v1/tools/units/1/invoke", "{\"text\":\"1 mi to km\"}", "Reckoner-Run", run);
    List<String> all = new ArrayList<>();
    String after = null;
    do {
      HttpResponse<String> r = server.get("/v1/invocations?run=" + run + "&limit=7" + (after == null ? "" : "&after=" + after));
      JsonNode page = JSON.readTree(r.body());
      page.get("invocations").forEach(n -> all.add(n.get("id").asString()));
      after = page.get("next").isNull() ? null : page.get("next").asString();
    } while (after != null);
    assertEquals(26, all.size());
    List<String> sorted = new ArrayList<>(all);
    sorted.sort(null);
    assertEquals(sorted, all, "oldest first, in id order");
    assertTrue(all.stream().allMatch(id -> id.charAt(14) == '7'), "UUID version 7");

    assertEquals(25, records("run=" + run + "&tool=arith&limit=100").size());
    assertEquals(1, records("run=" + run + "&tool=units&version=1").size());
    assertEquals(5, records("run=" + run + "&outcome=error&limit=100").size());
    assertEquals(5, records("run=" + run + "&outcome=domain_error&limit=100").size());
    assertEquals(21, records("run=" + run + "&outcome=ok&limit=100").size());
    assertEquals(8, records("run=" + run + "&ref_prefix=doc-1:&limit=100").size());
    assertEquals(26, records("run=" + run + "&since=" + before + "&limit=100").size());
    assertEquals(0, records("run=" + run + "&until=" + before).size());
    assertEquals(0, records("run=no-such-run").size());

    HttpResponse<String> export = server.get("/v1/invocations/export?run=" + run + "&outcome=error");
    assertEquals(200, export.statusCode());
    assertTrue(export.headers().firstValue("Content-Type").orElse("").startsWith("application/x-ndjson"));
    List<String> lines = export.body().lines().toList();
    assertEquals(5, lines.size());
    lines.forEach(l -> assertEquals("domain_error", JSON.readTree(l).get("outcome").asString()));
  }

  @Test
  @DisplayName("The ledger: one process writes a SQLite ledger; reckoner fill on a running server's data dir is refused with the reason")
  void fillOnARunningServersDataDir_isRefused() throws Exception {
    Path dir = Files.createTempDirectory("locked-fill");
    Files.writeString(dir.resolve("docs.jsonl"), "{\"id\":1,\"document\":\"<:arith(1):>\"}\n");
    JarServer.Run run = JarServer.run(dir, List.of("fill", "--input", "docs.jsonl", "--output", "out.jsonl", "--data-dir",
        server.dataDir().toString()), Map.of(), Duration.ofMinutes(1));
    assertNotEquals(0, run.exitCode(), run.output());
    assertTrue(run.output().contains("ledger.db.writer-lock") || run.output().toLowerCase().contains("another process"), run.output());
    assertFalse(run.output().contains("\tat "), "no stack trace: " + run.output());
  }

  @Test
  @DisplayName("The ledger: readers of the file find ids, times, keys, runs and tools as text in the view invocation_records")
  void sqliteView_readableByHand() throws Exception {
    server.postJson("/v1/tools/arith/1/invoke", "{\"expr\":\"6*7\"}", "Reckoner-Run", "view-run");
    // The README: a committed record reaches the file itself from the intake log within a moment
    // (about 25 ms when the ledger keeps up); this test allows 2 s for a busy machine.
    long deadline = System.nanoTime() + 2_000_000_000L;
    while (true) {
      try (java.sql.Connection c = java.sql.DriverManager.getConnection("jdbc:sqlite:file:"
          + server.dataDir().resolve("ledger.db") + "?mode=ro");
          java.sql.ResultSet rs = c.createStatement().executeQuery(
              "SELECT id, ts, key_id, run, tool, text FROM invocation_records WHERE run = 'view-run'")) {
        if (!rs.next()) {
          assertTrue(System.nanoTime() < deadline, "the record is in the view within 2 s");
          Thread.sleep(10);
          continue;
        }
        assertTrue(rs.getString("id").matches("[0-9a-f]{8}-[0-9a-f]{4}-7[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}"), rs.getString("id"));
        assertTrue(rs.getString("ts").matches("\\d{4}-\\d\\d-\\d\\dT\\d\\d:\\d\\d:\\d\\d\\.\\d{3}Z"), rs.getString("ts"));
        assertEquals("anonymous", rs.getString("key_id"));
        assertEquals("arith", rs.getString("tool"));
        assertEquals("42", rs.getString("text"));
        return;
      }
    }
  }
}
