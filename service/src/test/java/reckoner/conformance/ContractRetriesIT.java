package reckoner.conformance;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import reckoner.spec.Json;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The contract's "Retries record nothing twice" and "Streams say whether they finished", on the
 * real jar: a stream cut by SIGKILL or stopped by SIGTERM, three times, then sent whole again with
 * the same Idempotency-Key until it finishes; curl is the client, as the README suggests.
 */
final class ContractRetriesIT {
  private static final JsonMapper JSON = Json.newMapper();
  private static final int LINES = 12_000;

  /** A mixed stream of deterministic calls (every tool, errors among them), each line with an id. */
  private static Path input(Path dir) throws IOException {
    StringBuilder sb = new StringBuilder();
    String[] calls = {
        "{\"tool\":\"arith\",\"version\":1,\"args\":{\"expr\":\"%d/7\"}}",
        "{\"tool\":\"arith\",\"args\":{\"text\":\"what is %d times 3\"}}",
        "{\"tool\":\"units\",\"version\":1,\"args\":{\"text\":\"%d km to mi\"}}",
        "{\"tool\":\"dates\",\"args\":{\"text\":\"%d days ago\",\"as_of\":\"2024-06-12\"}}",
        "{\"tool\":\"facts\",\"args\":{\"key\":\"capital\"}}",
        "{\"tool\":\"arith\",\"version\":1,\"args\":{\"expr\":\"%d/0\"}}"};
    for (int i = 0; i < LINES; i++) {
      String call = String.format(java.util.Locale.ROOT, calls[i % calls.length], i);
      sb.append("{\"id\":\"line-").append(i).append("\",").append(call, 1, call.length()).append('\n');
    }
    Path file = dir.resolve("calls.ndjson");
    Files.writeString(file, sb.toString(), StandardCharsets.UTF_8);
    return file;
  }

  /** Streams {@code input} with curl, as a pipeline would; the answer's bytes go to {@code out}. */
  private static Process curl(JarServer server, Path input, Path out, String key) throws IOException {
    List<String> cmd = new ArrayList<>(List.of("curl", "-sS", "-N", "-H", "Content-Type: application/x-ndjson", "-H",
        "Reckoner-Run: resumed", "--data-binary", "@" + input, "-o", out.toString()));
    if (key != null) {
      cmd.addAll(List.of("-H", "Idempotency-Key: " + key));
    }
    cmd.add(server.base() + "/v1/batch");
    return new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(ProcessBuilder.Redirect.DISCARD).start();
  }

  private static long lines(Path file) throws IOException {
    if (!Files.exists(file)) {
      return 0;
    }
    try (var s = Files.lines(file, StandardCharsets.UTF_8)) {
      return s.count();
    }
  }

  private static List<JsonNode> read(Path file) throws IOException {
    List<JsonNode> out = new ArrayList<>();
    for (String line : Files.readAllLines(file, StandardCharsets.UTF_8)) {
      try {
        out.add(JSON.readTree(line));
      } catch (RuntimeException e) {
        // a line cut in the middle by the kill
      }
    }
    return out;
  }

  /** What is compared between runs: each line's id, ok, code and text (ids of invocations, replayed and cached aside). */
  private static Map<String, String> answers(List<JsonNode> lines) {
    Map<String, String> out = new TreeMap<>();
    for (JsonNode n : lines) {
      if (n.has("id")) {
        out.put(n.get("id").asString(), n.get("ok").asBoolean() + "|" + n.path("code").asString("") + "|" + n.get("text").asString());
      }
    }
    return out;
  }

  @ParameterizedTest(name = "{0}")
  @ValueSource(strings = {"SIGKILL", "SIGTERM"})
  @DisplayName("Retries: a stream cut three times, sent whole again with its key: every line answered once, recorded once")
  void cutThreeTimes_resentWithTheSameKey_recordsEachCallOnce(String signal) throws Exception {
    Path dir = Files.createTempDirectory("retries-" + signal);
    Path data = dir.resolve("data");
    Path input = input(dir);
    String key = "dataset-2031-" + signal;
    Map<String, String> invocationOf = new HashMap<>(); // line id -> invocation id, across attempts
    List<JsonNode> finished = null;
    for (int attempt = 0; attempt <= 3; attempt++) {
      try (JarServer server = JarServer.start("retries-" + signal + "-" + attempt, data, List.of(), Map.of())) {
        Path out = dir.resolve("attempt-" + attempt + ".ndjson");
        Process client = curl(server, input, out, key);
        if (attempt < 3) {
          long target = 2_000L * (attempt + 1) + 500;
          long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(120);
          while (lines(out) < target && client.isAlive() && System.nanoTime() < deadline) {
            Thread.sleep(20);
          }
          assertTrue(lines(out) < LINES, "the kill comes mid-stream (attempt " + attempt + ")");
          if (signal.equals("SIGKILL")) {
            ProcessHandle.of(server.pid()).ifPresent(ProcessHandle::destroyForcibly);
          } else {
            server.stop(); // SIGTERM: stop reading, answer what was read, trailer, exit
          }
        }
        assertTrue(client.waitFor(120, TimeUnit.SECONDS), "the client ends");
        List<JsonNode> got = read(out);
        for (JsonNode n : got) {
          if (n.has("invocation_id")) {
            String before = invocationOf.putIfAbsent(n.get("id").asString(), n.get("invocation_id").asString());
            assertTrue(before == null || before.equals(n.get("invocation_id").asString()),
                "line " + n.get("id") + " answered by two invocations: " + before + " and " + n.get("invocation_id"));
          }
        }
        JsonNode last = got.isEmpty() ? null : got.get(got.size() - 1);
        if (attempt < 3 && signal.equals("SIGTERM")) {
          assertTrue(last != null && last.path("end").asBoolean(), "a stopped stream ends with its trailer");
          assertFalse(last.get("complete").asBoolean());
          assertEquals("shutdown", last.get("reason").asString());
          assertEquals(got.size() - 1, last.get("answered").asLong());
        } else if (attempt < 3) {
          assertFalse(last != null && last.path("end").asBoolean(), "a killed stream has no trailer");
        } else {
          assertTrue(last.path("end").asBoolean() && last.get("complete").asBoolean(), "the last attempt finishes: " + last);
          assertEquals(LINES, last.get("answered").asLong());
          assertTrue(last.get("replayed").asLong() > 0, "lines recorded before were replayed");
          finished = got;
        }
        if (attempt == 3) {
          // The ledger holds each call exactly once, and any replica's... here, this one's query sees them all.
          HttpResponse<String> export = server.get("/v1/invocations/export?run=resumed");
          Map<String, Integer> perKey = new HashMap<>();
          export.body().lines().map(JSON::readTree).forEach(r -> perKey.merge(r.get("idempotency_key").asString(), 1, Integer::sum));
          assertEquals(LINES, perKey.size(), "one record per line");
          assertTrue(perKey.values().stream().allMatch(n -> n == 1), "no call recorded twice");
        }
      }
    }
    assertEquals(LINES, invocationOf.size());
    // An uninterrupted run of the same input (no key) gives the same answers.
    try (JarServer clean = JarServer.start("retries-clean-" + signal, List.of(), Map.of())) {
      Path out = dir.resolve("uninterrupted.ndjson");
      Process client = curl(clean, input, out, null);
      assertTrue(client.waitFor(180, TimeUnit.SECONDS));
      assertEquals(answers(read(out)), answers(finished));
    }
  }

  @Test
  @DisplayName("Streams: a finished stream ends with its trailer, a cut one does not (read from the raw bytes)")
  void trailer_tellsAFinishedStreamFromACutOne() throws Exception {
    Path dir = Files.createTempDirectory("trailer");
    Path input = input(dir);
    try (JarServer server = JarServer.start("trailer", List.of(), Map.of())) {
      Path whole = dir.resolve("whole.ndjson");
      assertTrue(curl(server, input, whole, null).waitFor(120, TimeUnit.SECONDS));
      byte[] bytes = Files.readAllBytes(whole);
      String tail = new String(bytes, Math.max(0, bytes.length - 200), Math.min(200, bytes.length), StandardCharsets.UTF_8);
      assertTrue(tail.endsWith("{\"end\":true,\"complete\":true,\"answered\":" + LINES + ",\"replayed\":0}\n"), tail);
      Path cut = dir.resolve("cut.ndjson");
      Process client = curl(server, input, cut, null);
      while (lines(cut) < 1000 && client.isAlive()) {
        Thread.sleep(10);
      }
      ProcessHandle.of(server.pid()).ifPresent(ProcessHandle::destroyForcibly);
      client.waitFor(60, TimeUnit.SECONDS);
      byte[] cutBytes = Files.readAllBytes(cut);
      String cutTail = new String(cutBytes, Math.max(0, cutBytes.length - 200), Math.min(200, cutBytes.length), StandardCharsets.UTF_8);
      assertFalse(cutTail.contains("\"end\":true"), "a cut stream has no trailer: " + cutTail);
    }
  }

  @Test
  @DisplayName("Retries: the same key with another body is 409 on every endpoint; another API key's same key is independent")
  void sameKeyOtherBody_409_everywhere_otherApiKeyIndependent() throws Exception {
    Path dir = Files.createTempDirectory("idem-keys");
    Map<String, String> secrets = new HashMap<>();
    StringBuilder keys = new StringBuilder();
    for (String id : List.of("team-a", "team-b")) {
      JarServer.Run run = JarServer.run(dir, List.of("key", "--id", id, "--scope", "invoke", "--scope", "ledger:read"), Map.of(),
          Duration.ofMinutes(1));
      secrets.put(id, run.output().substring(run.output().indexOf("rk_")).strip());
      keys.append(run.output().lines().filter(l -> l.startsWith("{")).findFirst().orElseThrow()).append('\n');
    }
    Files.writeString(dir.resolve("keys.jsonl"), keys.toString());
    try (JarServer server = JarServer.start("idem-keys", List.of("--keys-file", dir.resolve("keys.jsonl").toString()), Map.of())) {
      String[][] endpoints = {
          {"/v1/tools/arith/1/invoke", "application/json", "{\"expr\":\"1+1\"}", "{\"expr\":\"1+2\"}"},
          {"/v1/batch", "application/json", "{\"calls\":[{\"id\":1,\"tool\":\"arith\",\"args\":{\"expr\":\"1\"}}]}",
              "{\"calls\":[{\"id\":1,\"tool\":\"arith\",\"args\":{\"expr\":\"2\"}}]}"},
          {"/v1/batch", "application/x-ndjson", "{\"id\":1,\"tool\":\"arith\",\"args\":{\"expr\":\"1\"}}\n",
              "{\"id\":1,\"tool\":\"arith\",\"args\":{\"expr\":\"2\"}}\n"},
          {"/v1/splice", "application/json", "{\"call\":\"arith(1+1)\"}", "{\"call\":\"arith(1+2)\"}"},
          {"/v1/fill", "application/json", "{\"document\":\"a <:arith(1+1):>\"}", "{\"document\":\"a <:arith(1+2):>\"}"}};
      int n = 0;
      for (String[] e : endpoints) {
        String idem = "k-" + n++;
        HttpResponse<String> first = send(server, secrets.get("team-a"), idem, e[0], e[1], e[2]);
        assertEquals(200, first.statusCode(), e[0] + " " + first.body());
        HttpResponse<String> again = send(server, secrets.get("team-a"), idem, e[0], e[1], e[2]);
        assertEquals(200, again.statusCode());
        assertTrue(again.body().contains("\"replayed\":true"), "sent again: replayed: " + again.body());
        assertEquals(ids(first.body()), ids(again.body()), "the original invocation ids");
        HttpResponse<String> other = send(server, secrets.get("team-a"), idem, e[0], e[1], e[3]);
        assertEquals(409, other.statusCode(), e[0] + " " + e[1] + ": " + other.body());
        assertEquals("idempotency_conflict", JSON.readTree(other.body()).get("code").asString());
        HttpResponse<String> otherKey = send(server, secrets.get("team-b"), idem, e[0], e[1], e[3]);
        assertEquals(200, otherKey.statusCode(), "another API key's " + idem + " is its own: " + otherKey.body());
        assertFalse(otherKey.body().contains("\"replayed\":true"));
      }
      // Each key's first request made one record per call; the replays and refusals made none.
      for (String team : List.of("team-a", "team-b")) {
        HttpResponse<String> mine = server.send("GET", "/v1/invocations?limit=100", Map.of("Authorization",
            "Bearer " + secrets.get(team)), null);
        assertEquals(5, JSON.readTree(mine.body()).get("invocations").size(), team + ": " + mine.body());
      }
    }
  }

  private static HttpResponse<String> send(JarServer server, String secret, String idem, String path, String type, String body) {
    return server.send("POST", path, Map.of("Authorization", "Bearer " + secret, "Idempotency-Key", idem, "Content-Type", type),
        body.getBytes(StandardCharsets.UTF_8));
  }

  private static List<String> ids(String body) {
    List<String> ids = new ArrayList<>();
    java.util.regex.Matcher m = java.util.regex.Pattern.compile("\"invocation_id\":\"([0-9a-f-]{36})\"").matcher(body);
    while (m.find()) {
      ids.add(m.group(1));
    }
    return ids;
  }

}
