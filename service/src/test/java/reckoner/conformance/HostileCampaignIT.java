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
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import reckoner.spec.Json;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * A hostile campaign against the shipped jar (keys in force, a 256 MiB heap, a 2 s idle timeout):
 * hundreds of requests, hand-written and generated from a fixed seed, that a careless or hostile
 * caller might send (overlong and deeply nested input, malformed Unicode and UTF-8, control
 * characters, markup injection into splice and fill, header injection, path tricks, slow clients,
 * a flood from one key). Throughout: no 5xx, no request held past its deadline, the process alive
 * within its heap, an ordinary call answered after each request, and every call that reached a
 * tool in the ledger with the outcome its caller was told.
 */
final class HostileCampaignIT {
  private static final JsonMapper JSON = Json.newMapper();
  private static final String RUN = "hostile";
  private static final Map<String, String> SECRETS = new HashMap<>();
  private static JarServer server;
  /** Invocation id -> the outcome the caller was told. */
  private static final Map<String, String> told = java.util.Collections.synchronizedMap(new LinkedHashMap<>());
  private static int requests;

  @BeforeAll
  static void start() throws IOException {
    Path dir = Files.createTempDirectory("hostile");
    StringBuilder keys = new StringBuilder();
    for (String[] k : new String[][] {{"hostile", "invoke"}, {"flood", "invoke"}, {"adm", "admin"}}) {
      List<String> args = new ArrayList<>(List.of("key", "--id", k[0], "--scope", k[1]));
      if (k[0].equals("flood")) {
        args.addAll(List.of("--rate", "20"));
      }
      JarServer.Run run = JarServer.run(dir, args, Map.of(), Duration.ofMinutes(1));
      SECRETS.put(k[0], run.output().substring(run.output().indexOf("rk_")).strip());
      keys.append(run.output().lines().filter(l -> l.startsWith("{")).findFirst().orElseThrow()).append('\n');
    }
    Files.writeString(dir.resolve("keys.jsonl"), keys.toString());
    server = JarServer.start("hostile", List.of("--keys-file", dir.resolve("keys.jsonl").toString(), "--http-idle-timeout-ms",
        "2000", "--max-body-bytes", "65536", "--max-batch-bytes", "262144"), Map.of());
  }

  @AfterAll
  static void stop() {
    server.close();
  }

  /** One request through the JDK client; checks it and the server after it. */
  private static HttpResponse<String> shot(String what, String method, String path, String contentType, byte[] body,
      String... headers) {
    Map<String, String> h = new LinkedHashMap<>();
    h.put("Authorization", "Bearer " + SECRETS.get("hostile"));
    h.put("Reckoner-Run", RUN);
    if (contentType != null) {
      h.put("Content-Type", contentType);
    }
    for (int i = 0; i + 1 < headers.length; i += 2) {
      h.put(headers[i], headers[i + 1]);
    }
    long start = System.nanoTime();
    HttpResponse<String> r = server.send(method, path, h, body);
    long millis = (System.nanoTime() - start) / 1_000_000;
    requests++;
    assertTrue(r.statusCode() < 500, what + ": " + r.statusCode() + " " + r.body());
    assertTrue(millis < 15_000, what + " was held " + millis + " ms");
    collect(what, r.body(), r.headers().firstValue("Reckoner-Invocation-Id").orElse(null),
        r.headers().firstValue("Reckoner-Error-Code").orElse(null));
    return r;
  }

  private static HttpResponse<String> shot(String what, String method, String path, String contentType, String body,
      String... headers) {
    return shot(what, method, path, contentType, body == null ? null : body.getBytes(StandardCharsets.UTF_8), headers);
  }

  /** Notes every invocation id an answer names, with the outcome the caller was told. */
  private static void collect(String what, String body, String headerId, String headerCode) {
    if (headerId != null && (body == null || !body.startsWith("{"))) {
      told.put(headerId, headerCode == null ? "ok" : headerCode);
    }
    if (body == null) {
      return;
    }
    for (String line : body.split("\n")) {
      if (!line.startsWith("{")) {
        continue;
      }
      JsonNode n;
      try {
        n = JSON.readTree(line);
      } catch (RuntimeException e) {
        continue;
      }
      List<JsonNode> results = new ArrayList<>();
      results.add(n);
      n.path("results").forEach(results::add);
      n.path("calls").forEach(results::add);
      for (JsonNode x : results) {
        if (x.has("invocation_id")) {
          String outcome = x.has("code") ? x.get("code").asString() : "ok";
          told.put(x.get("invocation_id").asString(), outcome);
        }
      }
    }
  }

  /** A raw request on its own connection; the status line's code, checked as above. */
  private static int raw(String what, byte[] request) {
    String response = server.raw(request);
    requests++;
    int status = response.length() >= 12 && response.startsWith("HTTP/1.1 ") ? Integer.parseInt(response.substring(9, 12)) : 0;
    assertTrue(status == 0 || status < 500, what + ": " + response);
    assertFalse(response.contains("<html"), what + " answered Jetty's HTML page");
    int split = response.indexOf("\r\n\r\n");
    if (split > 0) {
      String head = response.substring(0, split);
      String id = header(head, "Reckoner-Invocation-Id");
      collect(what, response.substring(split + 4), id, header(head, "Reckoner-Error-Code"));
    }
    return status;
  }

  private static String header(String head, String name) {
    for (String line : head.split("\r\n")) {
      if (line.regionMatches(true, 0, name + ":", 0, name.length() + 1)) {
        return line.substring(name.length() + 1).strip();
      }
    }
    return null;
  }

  private static byte[] rawRequest(String method, String path, String contentType, byte[] body, String... extraHeaderLines) {
    StringBuilder head = new StringBuilder(method + " " + path + " HTTP/1.1\r\nHost: 127.0.0.1\r\nConnection: close\r\n"
        + "Authorization: Bearer " + SECRETS.get("hostile") + "\r\nReckoner-Run: " + RUN + "\r\n");
    if (contentType != null) {
      head.append("Content-Type: ").append(contentType).append("\r\n");
    }
    for (String h : extraHeaderLines) {
      head.append(h).append("\r\n");
    }
    head.append("Content-Length: ").append(body == null ? 0 : body.length).append("\r\n\r\n");
    byte[] h = head.toString().getBytes(StandardCharsets.ISO_8859_1);
    byte[] out = new byte[h.length + (body == null ? 0 : body.length)];
    System.arraycopy(h, 0, out, 0, h.length);
    if (body != null) {
      System.arraycopy(body, 0, out, h.length, body.length);
    }
    return out;
  }

  private static void ordinaryCallAnswered(String after) {
    HttpResponse<String> ok = shot("ordinary call after " + after, "POST", "/v1/tools/arith/1/invoke", "application/json",
        "{\"expr\":\"1250/4000\"}", "Accept", "text/plain");
    assertEquals(200, ok.statusCode(), "after " + after);
    assertEquals("0.31", ok.body(), "after " + after);
  }

  private static final String INVOKE = "/v1/tools/arith/1/invoke";

  @Test
  @DisplayName("Access: a hostile campaign of hand-written and generated requests: no 5xx, no hang, every call recorded")
  void campaign() throws Exception {
    handWritten();
    generated(new Random(20261205L), 220);
    slowClients();
    flood();
    assertTrue(requests >= 300, "requests sent: " + requests);
    assertTrue(server.isAlive());
    heapBounded();
    everyCallThatReachedAToolIsRecorded();
  }

  private void handWritten() {
    // Overlong input.
    shot("argument at the limit", "POST", INVOKE, "application/json", "{\"expr\":\"" + "1+".repeat(499) + "1\"}");
    shot("argument over max-argument-chars", "POST", "/v1/tools/facts/1/invoke", "application/json",
        "{\"key\":\"" + "k".repeat(10_001) + "\"}");
    assertEquals(413, shot("body over max-body-bytes", "POST", INVOKE, "application/json",
        "{\"expr\":\"" + "1".repeat(70_000) + "\"}").statusCode());
    assertEquals(431, raw("headers over max-header-bytes", rawRequest("GET", "/health/live", null, null,
        "X-Filler: " + "a".repeat(20_000))));
    assertEquals(414, raw("a path longer than the server reads", rawRequest("GET", "/v1/" + "a".repeat(20_000), null, null)));
    shot("a run tag of 201 characters", "POST", INVOKE, "application/json", "{\"expr\":\"1\"}", "Reckoner-Ref", "r".repeat(201));
    shot("an NDJSON line over max-batch-bytes", "POST", "/v1/batch", "application/x-ndjson",
        "{\"id\":1,\"tool\":\"arith\",\"args\":{\"expr\":\"" + "1".repeat(300_000) + "\"}}\n{\"id\":2,\"tool\":\"arith\",\"args\":{\"expr\":\"2\"}}\n");
    ordinaryCallAnswered("overlong input");

    // Deep nesting.
    shot("JSON nested 5,000 deep", "POST", INVOKE, "application/json", "{\"expr\":" + "[".repeat(5000) + "]".repeat(5000) + "}");
    shot("an expression nested 5,000 deep", "POST", INVOKE, "application/json",
        "{\"expr\":\"" + "(".repeat(5000) + "1" + ")".repeat(5000) + "\"}");
    shot("a batch nested in a batch", "POST", "/v1/batch", "application/json",
        "{\"calls\":[{\"tool\":\"arith\",\"args\":{\"calls\":[{\"tool\":\"arith\",\"args\":{\"expr\":\"1\"}}]}}]}");
    shot("a unit compound nested deep", "POST", "/v1/tools/units/1/invoke", "application/json",
        "{\"text\":\"1 " + "(m/".repeat(500) + "s" + ")".repeat(500) + " to km\"}");
    ordinaryCallAnswered("deep nesting");

    // Malformed Unicode and UTF-8.
    byte[][] badUtf8 = {{(byte) 0xff}, {(byte) 0xc0, (byte) 0xaf}, {(byte) 0xed, (byte) 0xa0, (byte) 0x80},
        {(byte) 0xf4, (byte) 0x90, (byte) 0x80, (byte) 0x80}, {(byte) 0xe2, (byte) 0x82}};
    for (byte[] bad : badUtf8) {
      for (String type : List.of("application/json", "text/plain")) {
        byte[] prefix = type.equals("text/plain") ? new byte[] {'1', '+'} : "{\"expr\":\"1".getBytes(StandardCharsets.US_ASCII);
        byte[] suffix = type.equals("text/plain") ? new byte[0] : "\"}".getBytes(StandardCharsets.US_ASCII);
        byte[] body = new byte[prefix.length + bad.length + suffix.length];
        System.arraycopy(prefix, 0, body, 0, prefix.length);
        System.arraycopy(bad, 0, body, prefix.length, bad.length);
        System.arraycopy(suffix, 0, body, prefix.length + bad.length, suffix.length);
        assertEquals(400, shot("invalid UTF-8 as " + type, "POST", INVOKE, type, body).statusCode());
      }
    }
    for (String text : List.of("\\ud800", "\\udfff1", "1\\u0000+1", "\\u202e1+1", "1\\u200b+1", "\\ufeff1", "e\\u0301", "\\uffff",
        "\\ud83d\\ude00")) {
      shot("JSON escape " + text, "POST", INVOKE, "application/json", "{\"expr\":\"" + text + "\"}");
      shot("JSON escape " + text + " to dates", "POST", "/v1/tools/dates/1/invoke", "application/json",
          "{\"text\":\"" + text + " days ago\",\"as_of\":\"2024-01-01\"}");
      shot("JSON escape " + text + " to facts", "POST", "/v1/tools/facts/1/invoke", "application/json", "{\"key\":\"" + text + "\"}");
      shot("JSON escape " + text + " to units", "POST", "/v1/tools/units/1/invoke", "application/json",
          "{\"text\":\"1 m" + text + " to km\"}");
    }
    ordinaryCallAnswered("malformed Unicode");

    // Control characters in every argument.
    for (int c : new int[] {0x01, 0x07, 0x08, 0x0b, 0x0c, 0x1b, 0x7f, 0x85, 0x9b}) {
      String esc = String.format("\\u%04x", c);
      shot("control " + esc, "POST", INVOKE, "application/json", "{\"expr\":\"1" + esc + "+1\"}");
      shot("control " + esc + " in a call", "POST", "/v1/splice", "application/json", "{\"call\":\"arith(1" + esc + ")\"}");
    }
    ordinaryCallAnswered("control characters");

    // Markup injection into splice and fill.
    String[] injections = {"arith(1):> <:arith(2)", "arith(1) :: 999", "<:arith(1) :: 3:>", "arith(<:arith(1):>)",
        ":>:>:>", "<:<:<:", "arith(1)\n:>", "facts@1(capital :: x)"};
    for (String inj : injections) {
      shot("splice " + inj, "POST", "/v1/splice", "application/json", JSON.createObjectNode().put("call", inj).toString());
      HttpResponse<String> f = shot("fill " + inj, "POST", "/v1/fill", "application/json",
          JSON.createObjectNode().put("document", "x <:" + inj + ":> y").toString());
      assertEquals(200, f.statusCode());
    }
    shot("a fill of 2,000 calls", "POST", "/v1/fill", "application/json",
        JSON.createObjectNode().put("document", "<:arith(1+1):> ".repeat(2000)).toString());
    shot("markup strings of 65 characters", "POST", "/v1/fill", "application/json",
        "{\"document\":\"x\",\"markup\":{\"open\":\"" + "<".repeat(65) + "\"}}");
    shot("markup that runs into a call", "POST", "/v1/fill", "application/json",
        "{\"document\":\"x\",\"markup\":{\"close\":\")\"}}");
    ordinaryCallAnswered("markup injection");

    // Header injection, in run, ref, Accept and the key.
    raw("CRLF in a run tag", rawRequest("POST", INVOKE, "application/json", "{\"expr\":\"1\"}".getBytes(StandardCharsets.US_ASCII),
        "Reckoner-Ref: a\r\nX-Injected: 1"));
    raw("a bare CR in a header", rawRequest("POST", INVOKE, "application/json", "{\"expr\":\"1\"}".getBytes(StandardCharsets.US_ASCII),
        "Reckoner-Ref: a\rb"));
    raw("a NUL in a header", rawRequest("POST", INVOKE, "application/json", "{\"expr\":\"1\"}".getBytes(StandardCharsets.US_ASCII),
        "Reckoner-Ref: a\0b"));
    for (String auth : List.of("Bearer", "Bearer ", "bearer " + SECRETS.get("hostile"), "Basic dXNlcjpwYXNz",
        "Bearer " + "x".repeat(5000), "Bearer " + SECRETS.get("hostile") + " extra", "Bearer \u00e9")) {
      HttpResponse<String> r = server.send("POST", INVOKE, Map.of("Authorization", auth, "Content-Type", "application/json",
          "Reckoner-Run", RUN), "{\"expr\":\"1\"}".getBytes(StandardCharsets.UTF_8));
      requests++;
      assertTrue(r.statusCode() == 401 || r.statusCode() == 200, auth + ": " + r.statusCode());
      collect("auth " + auth, r.body(), null, null);
    }
    for (String accept : List.of("*/*;q=abc", "text/plain;q=2", ",,,,", "a/b/c", "text/plain;" + "q=1;".repeat(1000))) {
      shot("Accept " + accept.substring(0, Math.min(20, accept.length())), "POST", INVOKE, "application/json", "{\"expr\":\"2\"}",
          "Accept", accept);
    }
    ordinaryCallAnswered("header injection");

    // Path tricks.
    for (String path : List.of("/v1/tools/../admin/facts", "/v1/tools/%2e%2e/%2e%2e/v1/admin/facts", "//v1//tools",
        "/v1/tools/arith/1/invoke/", "/v1/tools/arith/01/invoke", "/v1/tools/ARITH/1/invoke", "/v1/tools/arith/1.0/invoke",
        "/v1/tools/arith/-1/invoke", "/v1/tools/arith/99999999999999999999/invoke", "/v1/tools/arith%2F1/invoke",
        "/v1/tools/arith/1/invoke;jsessionid=x", "/v1/admin/facts%00", "/v1/invocations/../admin/keys", "/status?x=<script>",
        "/v1/tools/%61rith/1/invoke", "/v1/tools/arith/1/invoke?expr=1", "/problems/../v1/admin/keys", "/.env", "/WEB-INF/web.xml")) {
      raw("path " + path, rawRequest("POST", path, "application/json", "{\"expr\":\"1\"}".getBytes(StandardCharsets.US_ASCII)));
      raw("GET path " + path, rawRequest("GET", path, null, null));
    }
    int trick = raw("an admin path reached by a trick", rawRequest("GET", "/v1/tools/../admin/keys", null, null));
    assertTrue(trick == 400 || trick == 403 || trick == 404, "an invoke key never reads an admin path: " + trick);
    ordinaryCallAnswered("path tricks");
  }

  /** Random bodies from a fixed seed at every call endpoint, with random media types. */
  private void generated(Random random, int count) {
    String[] endpoints = {INVOKE, "/v1/tools/dates/1/invoke", "/v1/tools/units/1/invoke", "/v1/tools/facts/1/invoke",
        "/v1/tools/dates/2/invoke", "/v1/splice", "/v1/fill", "/v1/batch"};
    String[] types = {"application/json", "text/plain", "application/x-ndjson", "application/json; charset=utf-16", null};
    String alphabet = "{}[]\":,0123456789.eE+-*/^%() abcxyz<>:@\\\n\t\u00e9\u202e\u0000\ud83d\ude00";
    for (int i = 0; i < count; i++) {
      StringBuilder body = new StringBuilder();
      int kind = random.nextInt(4);
      if (kind == 0) { // well-formed JSON with random text
        body.append("{\"").append(random.nextBoolean() ? "text" : "expr").append("\":");
        body.append(JSON.writeValueAsString(randomText(random, alphabet, random.nextInt(40))));
        body.append('}');
      } else if (kind == 1) { // a batch with random items
        body.append("{\"calls\":[");
        for (int j = 0; j < 1 + random.nextInt(5); j++) {
          body.append(j == 0 ? "" : ",").append("{\"id\":").append(j).append(",\"tool\":\"")
              .append(new String[] {"arith", "dates", "units", "facts", "nosuch", ""}[random.nextInt(6)])
              .append("\",\"args\":{\"text\":").append(JSON.writeValueAsString(randomText(random, alphabet, 20))).append("}}");
        }
        body.append("]}");
      } else { // raw noise
        body.append(randomText(random, alphabet, random.nextInt(200)));
      }
      String endpoint = endpoints[random.nextInt(endpoints.length)];
      String type = types[random.nextInt(types.length)];
      shot("generated " + i + " to " + endpoint, "POST", endpoint, type, body.toString(),
          "Accept", random.nextBoolean() ? "text/plain" : "application/json");
      if (i % 25 == 0) {
        ordinaryCallAnswered("generated request " + i);
      }
    }
  }

  private static String randomText(Random random, String alphabet, int length) {
    StringBuilder sb = new StringBuilder();
    while (sb.length() < length) {
      sb.append(alphabet.charAt(random.nextInt(alphabet.length())));
    }
    String s = sb.toString();
    // Never end on a lone high surrogate from the alphabet's emoji: the JDK client would not encode it.
    return Character.isHighSurrogate(s.isEmpty() ? 'a' : s.charAt(s.length() - 1)) ? s.substring(0, s.length() - 1) : s;
  }

  /** Clients that send too slowly: each is closed once silent past the idle timeout, while others are served. */
  private void slowClients() throws Exception {
    ExecutorService pool = Executors.newFixedThreadPool(8);
    try {
      List<Future<Long>> slow = new ArrayList<>();
      for (int i = 0; i < 6; i++) {
        slow.add(pool.submit(() -> {
          try (Socket s = new Socket(java.net.InetAddress.getLoopbackAddress(), server.port())) {
            s.setSoTimeout(20_000);
            OutputStream out = s.getOutputStream();
            out.write("POST /v1/tools/arith/1/invoke HTTP/1.1\r\nHost: x\r\nContent-Length: 100\r\n".getBytes(StandardCharsets.US_ASCII));
            out.flush();
            long start = System.nanoTime();
            InputStream in = s.getInputStream();
            while (in.read() >= 0) {
              // the server closes the connection (possibly after an error answer)
            }
            return (System.nanoTime() - start) / 1_000_000;
          }
        }));
      }
      for (int i = 0; i < 10; i++) {
        ordinaryCallAnswered("slow clients holding connections");
      }
      for (Future<Long> f : slow) {
        long held = f.get();
        requests++;
        assertTrue(held < 10_000, "a silent client was let go at the idle timeout, not held: " + held + " ms");
      }
      // A client that dribbles its body a byte at a time, slower than the idle timeout.
      try (Socket s = new Socket(java.net.InetAddress.getLoopbackAddress(), server.port())) {
        s.setSoTimeout(20_000);
        OutputStream out = s.getOutputStream();
        out.write(("POST /v1/tools/arith/1/invoke HTTP/1.1\r\nHost: x\r\nAuthorization: Bearer " + SECRETS.get("hostile")
            + "\r\nContent-Type: application/json\r\nContent-Length: 12\r\n\r\n{").getBytes(StandardCharsets.US_ASCII));
        out.flush();
        Thread.sleep(3_000);
        try {
          out.write('"');
          out.flush();
        } catch (IOException e) {
          // closed already: as it should be
        }
        byte[] rest = s.getInputStream().readAllBytes();
        requests++;
        String answer = new String(rest, StandardCharsets.ISO_8859_1);
        assertTrue(answer.isEmpty() || !answer.startsWith("HTTP/1.1 5"), answer);
      }
    } finally {
      pool.shutdownNow();
    }
    ordinaryCallAnswered("slow clients");
  }

  /** One key floods; it is refused with 429 while the campaign's own key goes on. */
  private void flood() throws Exception {
    ExecutorService pool = Executors.newFixedThreadPool(6);
    try {
      List<Future<int[]>> floods = new ArrayList<>();
      for (int t = 0; t < 6; t++) {
        floods.add(pool.submit(() -> {
          int[] counts = new int[2];
          for (int i = 0; i < 40; i++) {
            HttpResponse<String> r = server.send("POST", INVOKE, Map.of("Authorization", "Bearer " + SECRETS.get("flood"),
                "Content-Type", "application/json", "Reckoner-Run", RUN), "{\"expr\":\"7*6\"}".getBytes(StandardCharsets.UTF_8));
            assertTrue(r.statusCode() == 200 || r.statusCode() == 429, r.statusCode() + " " + r.body());
            counts[r.statusCode() == 200 ? 0 : 1]++;
            collect("flood", r.body(), null, null);
          }
          return counts;
        }));
      }
      for (int i = 0; i < 20; i++) {
        ordinaryCallAnswered("the flood from another key");
      }
      int refused = 0;
      for (Future<int[]> f : floods) {
        refused += f.get()[1];
        requests += 40;
      }
      assertTrue(refused > 0, "the flood was limited");
    } finally {
      pool.shutdownNow();
    }
  }

  private void heapBounded() {
    HttpResponse<String> metrics = server.get("/metrics");
    double used = 0;
    double max = 0;
    for (String line : metrics.body().split("\n")) {
      if (line.startsWith("jvm_memory_used_bytes{") && line.contains("area=\"heap\"")) {
        used += Double.parseDouble(line.substring(line.lastIndexOf(' ') + 1));
      }
      if (line.startsWith("jvm_memory_max_bytes{") && line.contains("area=\"heap\"")) {
        double v = Double.parseDouble(line.substring(line.lastIndexOf(' ') + 1));
        max += Math.max(0, v);
      }
    }
    assertTrue(used > 0 && used <= 512L * 1024 * 1024, "heap in use after the campaign: " + used);
    assertTrue(max <= 600L * 1024 * 1024, "the heap is bounded by the jar's -Xmx: " + max);
  }

  private void everyCallThatReachedAToolIsRecorded() {
    Map<String, String> recorded = new HashMap<>();
    HttpResponse<String> export = server.send("GET", "/v1/invocations/export?run=" + RUN, Map.of("Authorization",
        "Bearer " + SECRETS.get("adm")), null);
    assertEquals(200, export.statusCode());
    export.body().lines().forEach(l -> {
      JsonNode n = JSON.readTree(l);
      recorded.put(n.get("id").asString(), n.get("outcome").asString());
    });
    assertTrue(told.size() >= 200, "invocations named in answers: " + told.size());
    List<String> missing = new ArrayList<>();
    told.forEach((id, outcome) -> {
      if (!outcome.equals(recorded.get(id))) {
        missing.add(id + " told " + outcome + ", recorded " + recorded.get(id));
      }
    });
    assertEquals(List.of(), missing.subList(0, Math.min(10, missing.size())), missing.size() + " calls differ from the ledger");
  }
}
