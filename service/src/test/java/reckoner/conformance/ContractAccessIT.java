package reckoner.conformance;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.net.Socket;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import reckoner.spec.Json;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** The contract's "Access" section and the README's: keys, scopes, each key's own ledger, rate limits, streams. */
final class ContractAccessIT {
  private static final JsonMapper JSON = Json.newMapper();
  private static final Map<String, String> SECRETS = new LinkedHashMap<>();
  private static JarServer server;
  private static Path keysFile;

  @BeforeAll
  static void start() throws IOException {
    Path dir = Files.createTempDirectory("access");
    keysFile = dir.resolve("keys.jsonl");
    StringBuilder lines = new StringBuilder();
    String[][] keys = {
        {"inv", "invoke"}, {"reader", "ledger:read"}, {"adm", "admin"}, {"team-a", "invoke,ledger:read"},
        {"team-b", "invoke,ledger:read"}, {"slow", "invoke", "5"}, {"stream", "invoke", "100"}, {"streams", "invoke"}};
    for (String[] k : keys) {
      List<String> args = new ArrayList<>(List.of("key", "--id", k[0]));
      for (String scope : k[1].split(",")) {
        args.add("--scope");
        args.add(scope);
      }
      if (k.length > 2) {
        args.add("--rate");
        args.add(k[2]);
      }
      JarServer.Run run = JarServer.run(dir, args, Map.of(), Duration.ofMinutes(1));
      assertEquals(0, run.exitCode(), run.output());
      String out = run.output();
      String secret = out.substring(out.indexOf("rk_")).strip();
      SECRETS.put(k[0], secret);
      lines.append(out.lines().filter(l -> l.startsWith("{")).findFirst().orElseThrow()).append('\n');
    }
    Files.writeString(keysFile, lines.toString());
    server = JarServer.start("access", List.of("--keys-file", keysFile.toString(), "--keys-poll-ms", "200",
        "--max-streams-per-key", "2"), Map.of());
  }

  @AfterAll
  static void stop() {
    server.close();
  }

  private static Map<String, String> auth(String key) {
    Map<String, String> h = new LinkedHashMap<>();
    if (key != null) {
      h.put("Authorization", "Bearer " + (SECRETS.containsKey(key) ? SECRETS.get(key) : key));
    }
    return h;
  }

  private static HttpResponse<String> call(String method, String path, String key, String contentType, String body,
      String... headers) {
    Map<String, String> h = auth(key);
    if (contentType != null) {
      h.put("Content-Type", contentType);
    }
    for (int i = 0; i + 1 < headers.length; i += 2) {
      h.put(headers[i], headers[i + 1]);
    }
    return server.send(method, path, h, body == null ? null : body.getBytes(StandardCharsets.UTF_8));
  }

  /** A request each operation of the OpenAPI document answers 2xx to, given the right key. */
  private static String[] sample(String method, String path, JsonNode operation) {
    if (path.endsWith("/invoke")) {
      for (JsonNode ex : operation.path("requestBody").path("content").path("application/json").path("examples")) {
        if (!ex.path("summary").asString().contains("-> error ")) {
          return new String[] {"application/json", ex.get("value").toString()};
        }
      }
    }
    Map<String, String[]> samples = Map.of(
        "POST /v1/batch", new String[] {"application/json", "{\"calls\":[{\"tool\":\"arith\",\"args\":{\"expr\":\"1\"}}]}"},
        "POST /v1/splice", new String[] {"application/json", "{\"call\":\"arith(1)\"}"},
        "POST /v1/fill", new String[] {"application/json", "{\"document\":\"<:arith(1):>\"}"},
        "POST /v1/admin/facts/reload", new String[] {null, null},
        "POST /v1/admin/keys/reload", new String[] {null, null},
        "POST /v1/admin/search/reload", new String[] {null, null},
        "POST /v1/admin/audit", new String[] {null, null});
    if (method.equals("GET")) {
      return new String[] {null, null};
    }
    String[] s = samples.get(method + " " + path);
    if (s == null) {
      throw new AssertionError("no sample request for " + method + " " + path + ": add one here, so the access matrix covers it");
    }
    return s;
  }

  @Test
  @DisplayName("Access: every operation x {no key, unknown key, each scope} answers 200, 401 or 403 as its scope says")
  void accessMatrix_everyOperation() {
    JsonNode doc = JSON.readTree(server.get("/openapi.json").body());
    int checked = 0;
    for (Map.Entry<String, JsonNode> p : doc.get("paths").properties()) {
      for (Map.Entry<String, JsonNode> o : p.getValue().properties()) {
        String method = o.getKey().toUpperCase(java.util.Locale.ROOT);
        String path = p.getKey().replace("{code}", "invalid_argument");
        JsonNode security = o.getValue().get("security");
        assertTrue(security != null && security.size() == 1, method + " " + path + " states its security");
        JsonNode requirement = security.get(0).get("apiKey");
        String scope = requirement == null ? null : requirement.get(0).asString();
        String[] sample = sample(method, p.getKey(), o.getValue());
        for (String key : new String[] {null, "rk_not-a-key", "inv", "reader", "adm"}) {
          HttpResponse<String> r = call(method, path, key, sample[0], sample[1]);
          String who = method + " " + path + " as " + key;
          int expected;
          if (scope == null) {
            expected = 200;
          } else if (key == null || !SECRETS.containsKey(key)) {
            expected = 401;
          } else {
            boolean has = switch (key) {
              case "inv" -> scope.equals("invoke");
              case "reader" -> scope.equals("ledger:read");
              case "adm" -> scope.equals("admin") || scope.equals("ledger:read");
              default -> false;
            };
            expected = has ? 200 : 403;
          }
          assertEquals(expected, r.statusCode(), who + ": " + r.body());
          if (expected == 401) {
            assertTrue(r.headers().firstValue("WWW-Authenticate").orElse("").startsWith("Bearer"), who);
            assertEquals("unauthorized", JSON.readTree(r.body()).get("code").asString(), who);
          } else if (expected == 403) {
            assertEquals("forbidden", JSON.readTree(r.body()).get("code").asString(), who);
          }
          checked++;
        }
      }
    }
    assertTrue(checked >= 5 * 20, "operations x callers checked: " + checked);
  }

  @Test
  @DisplayName("Access: a key reads only its own records, through every ledger filter and the export; admin reads all")
  void isolation_everyFilterAndTheExport() {
    Instant before = Instant.now().minusSeconds(2);
    for (String key : List.of("team-a", "team-b")) {
      for (int i = 0; i < 6; i++) {
        call("POST", "/v1/tools/arith/1/invoke", key, "application/json", "{\"expr\":\"" + (i == 0 ? "1/0" : i + "") + "\"}",
            "Reckoner-Run", "shared-run", "Reckoner-Ref", "doc-" + i);
      }
    }
    List<String> queries = List.of("run=shared-run", "tool=arith", "version=1", "outcome=error", "outcome=domain_error",
        "outcome=ok", "ref_prefix=doc-", "since=" + before, "until=" + Instant.now().plusSeconds(60), "limit=3",
        "run=shared-run&ref_prefix=doc-1&outcome=ok", "key=team-a");
    for (String query : queries) {
      HttpResponse<String> r = call("GET", "/v1/invocations?" + query, "team-a", null, null);
      assertEquals(200, r.statusCode(), query + ": " + r.body());
      JsonNode page = JSON.readTree(r.body());
      assertTrue(page.get("invocations").size() > 0, query);
      page.get("invocations").forEach(n -> assertEquals("team-a", n.get("key_id").asString(), query));
      if (!page.get("next").isNull()) { // the cursor also stays within the key
        JsonNode next = JSON.readTree(call("GET", "/v1/invocations?" + query + "&after=" + page.get("next").asString(), "team-a",
            null, null).body());
        next.get("invocations").forEach(n -> assertEquals("team-a", n.get("key_id").asString(), query + " next"));
      }
      HttpResponse<String> export = call("GET", "/v1/invocations/export?" + query, "team-a", null, null);
      export.body().lines().forEach(l -> assertEquals("team-a", JSON.readTree(l).get("key_id").asString(), "export " + query));
    }
    HttpResponse<String> other = call("GET", "/v1/invocations?key=team-b", "team-a", null, null);
    assertEquals(403, other.statusCode());
    JsonNode admin = JSON.readTree(call("GET", "/v1/invocations?run=shared-run&limit=100", "adm", null, null).body());
    java.util.Set<String> keys = new java.util.HashSet<>();
    admin.get("invocations").forEach(n -> keys.add(n.get("key_id").asString()));
    assertEquals(java.util.Set.of("team-a", "team-b"), keys);
    JsonNode onlyB = JSON.readTree(call("GET", "/v1/invocations?run=shared-run&key=team-b&limit=100", "adm", null, null).body());
    assertEquals(6, onlyB.get("invocations").size());
  }

  @Test
  @DisplayName("Access: a key over its rate gets 429 with Retry-After while another key, at the same time, keeps getting 200")
  void rateLimit_oneKeyNeverSlowsAnother() throws Exception {
    ExecutorService pool = Executors.newFixedThreadPool(8);
    AtomicInteger limited = new AtomicInteger();
    AtomicInteger slowOk = new AtomicInteger();
    List<Future<?>> flood = new ArrayList<>();
    try {
      for (int t = 0; t < 6; t++) {
        flood.add(pool.submit(() -> {
          for (int i = 0; i < 40; i++) {
            HttpResponse<String> r = call("POST", "/v1/tools/arith/1/invoke", "slow", "application/json", "{\"expr\":\"2+2\"}");
            if (r.statusCode() == 429) {
              limited.incrementAndGet();
              assertTrue(r.headers().firstValue("Retry-After").isPresent());
              assertEquals("rate_limited", JSON.readTree(r.body()).get("code").asString());
            } else {
              assertEquals(200, r.statusCode(), r.body());
              slowOk.incrementAndGet();
            }
          }
        }));
      }
      for (int i = 0; i < 60; i++) {
        HttpResponse<String> r = call("POST", "/v1/tools/arith/1/invoke", "team-b", "application/json", "{\"expr\":\"3+3\"}");
        assertEquals(200, r.statusCode(), "the other key, call " + i + ": " + r.body());
      }
      for (Future<?> f : flood) {
        f.get();
      }
    } finally {
      pool.shutdownNow();
    }
    assertTrue(limited.get() > 0, "the flooding key was limited");
    assertTrue(slowOk.get() > 0, "and still got its rate's worth");
  }

  @Test
  @DisplayName("Access: an NDJSON stream over its key's rate slows down; no line fails for it")
  void ndjsonOverItsRate_slowsDown() {
    StringBuilder body = new StringBuilder();
    for (int i = 0; i < 400; i++) {
      body.append("{\"id\":").append(i).append(",\"tool\":\"arith\",\"args\":{\"expr\":\"").append(i).append("*3\"}}\n");
    }
    long start = System.nanoTime();
    HttpResponse<String> r = call("POST", "/v1/batch", "stream", "application/x-ndjson", body.toString());
    long millis = (System.nanoTime() - start) / 1_000_000;
    assertEquals(200, r.statusCode());
    List<JsonNode> results = r.body().lines().map(JSON::readTree).filter(n -> n.has("id")).toList();
    assertEquals(400, results.size());
    results.forEach(n -> assertTrue(n.get("ok").asBoolean(), n.toString()));
    // 100 a second with a burst of 100: the other 300 lines take at least 3 s (a lower bound only).
    assertTrue(millis >= 2_500, "the stream was held to its key's rate: " + millis + " ms");
  }

  @Test
  @DisplayName("Access: a key may have max-streams-per-key NDJSON streams open; one more is 429")
  void streamsPerKey_bounded() throws Exception {
    List<Socket> open = new ArrayList<>();
    try {
      for (int i = 0; i < 2; i++) {
        Socket s = new Socket(java.net.InetAddress.getLoopbackAddress(), server.port());
        OutputStream out = s.getOutputStream();
        out.write(("POST /v1/batch HTTP/1.1\r\nHost: x\r\nAuthorization: Bearer " + SECRETS.get("streams")
            + "\r\nContent-Type: application/x-ndjson\r\nTransfer-Encoding: chunked\r\n\r\n").getBytes(StandardCharsets.US_ASCII));
        String line = "{\"id\":1,\"tool\":\"arith\",\"args\":{\"expr\":\"1\"}}\n";
        out.write((Integer.toHexString(line.length()) + "\r\n" + line + "\r\n").getBytes(StandardCharsets.US_ASCII));
        out.flush();
        open.add(s);
      }
      // The two streams are open once each has answered its first line.
      for (Socket s : open) {
        s.setSoTimeout(30_000);
        InputStream in = s.getInputStream();
        byte[] buf = new byte[4096];
        String seen = "";
        while (!seen.contains("\"ok\":true")) {
          int n = in.read(buf);
          assertTrue(n > 0, "stream answered: " + seen);
          seen += new String(buf, 0, n, StandardCharsets.UTF_8);
        }
      }
      HttpResponse<String> third = call("POST", "/v1/batch", "streams", "application/x-ndjson",
          "{\"id\":1,\"tool\":\"arith\",\"args\":{\"expr\":\"1\"}}\n");
      assertEquals(429, third.statusCode(), third.body());
      assertEquals("rate_limited", JSON.readTree(third.body()).get("code").asString());
      HttpResponse<String> otherKey = call("POST", "/v1/batch", "inv", "application/x-ndjson",
          "{\"id\":1,\"tool\":\"arith\",\"args\":{\"expr\":\"1\"}}\n");
      assertEquals(200, otherKey.statusCode(), "another key's stream is not counted against this one");
    } finally {
      for (Socket s : open) {
        s.getOutputStream().write("0\r\n\r\n".getBytes(StandardCharsets.US_ASCII));
        s.close();
      }
    }
    for (int i = 0; i < 100; i++) { // the slots come back as the streams end
      if (call("POST", "/v1/batch", "streams", "application/x-ndjson", "{\"id\":1,\"tool\":\"arith\",\"args\":{\"expr\":\"1\"}}\n")
          .statusCode() == 200) {
        return;
      }
      Thread.sleep(100);
    }
    throw new AssertionError("a stream slot came back once the streams ended");
  }

  @Test
  @DisplayName("Access: the keys file is re-read on change; a bad file keeps the old keys and says why; secrets are never logged")
  void keysFile_reloads_badFileKeepsOldKeys() throws Exception {
    String before = Files.readString(keysFile);
    JarServer.Run made = JarServer.run(keysFile.getParent(), List.of("key", "--id", "late", "--scope", "invoke"), Map.of(),
        Duration.ofMinutes(1));
    String line = made.output().lines().filter(l -> l.startsWith("{")).findFirst().orElseThrow();
    String secret = made.output().substring(made.output().indexOf("rk_")).strip();
    Files.writeString(keysFile, before + line + "\n");
    awaitStatus(200, secret);
    Files.writeString(keysFile, before + line + "\nnot a key\n");
    HttpResponse<String> reload = call("POST", "/v1/admin/keys/reload", "adm", null, null);
    assertEquals(422, reload.statusCode());
    assertEquals("data_error", JSON.readTree(reload.body()).get("code").asString());
    assertTrue(JSON.readTree(reload.body()).get("detail").asString().contains("line " + (before.lines().count() + 2)), reload.body());
    assertEquals(200, call("POST", "/v1/tools/arith/1/invoke", secret, "application/json", "{\"expr\":\"1\"}").statusCode(),
        "the old keys stay in force");
    assertTrue(JSON.readTree(call("GET", "/v1/admin/keys", "adm", null, null).body()).has("last_reload_problem"));
    Files.writeString(keysFile, before); // revoked
    awaitStatus(401, secret);
    String log = server.output();
    for (String s : SECRETS.values()) {
      assertFalse(log.contains(s), "a secret in the log");
    }
    assertFalse(log.contains(secret));
  }

  private static void awaitStatus(int status, String secret) throws InterruptedException {
    for (int i = 0; i < 100; i++) {
      if (call("POST", "/v1/tools/arith/1/invoke", secret, "application/json", "{\"expr\":\"1\"}").statusCode() == status) {
        return;
      }
      Thread.sleep(100);
    }
    throw new AssertionError("the keys file change took effect: expected " + status);
  }
}
