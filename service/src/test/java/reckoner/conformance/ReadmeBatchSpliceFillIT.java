package reckoner.conformance;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import reckoner.spec.Json;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** README, section "Many calls at once, splicing and filling", and the contract's "Splice markup". */
final class ReadmeBatchSpliceFillIT {
  private static final JsonMapper JSON = Json.newMapper();
  private static JarServer server;

  @BeforeAll
  static void start() {
    server = JarServer.start("batch-splice-fill", List.of("--cache-size", "0"), Map.of());
  }

  @AfterAll
  static void stop() {
    server.close();
  }

  @Test
  @DisplayName("Many calls: a JSON batch answers in call order, each result echoing its id; one bad call fails only itself")
  void jsonBatch_inOrder_badCallFailsAlone() {
    StringBuilder calls = new StringBuilder("{\"calls\":[");
    for (int i = 0; i < 500; i++) {
      calls.append(i == 0 ? "" : ",").append("{\"id\":").append(i).append(",\"tool\":\"arith\",\"version\":1,\"args\":{\"expr\":\"")
          .append(i == 250 ? "1/0" : i + "*2").append("\"}}");
    }
    HttpResponse<String> r = server.postJson("/v1/batch", calls.append("]}").toString());
    assertEquals(200, r.statusCode());
    JsonNode results = JSON.readTree(r.body()).get("results");
    assertEquals(500, results.size());
    for (int i = 0; i < 500; i++) {
      assertEquals(i, results.get(i).get("id").asInt());
      assertEquals(i != 250, results.get(i).get("ok").asBoolean());
      assertEquals(i == 250 ? "error: domain_error: division by zero" : Integer.toString(i * 2), results.get(i).get("text").asString());
    }
  }

  @Test
  @DisplayName("Many calls: a JSON batch holds at most 10,000 calls")
  void jsonBatch_over10000_isRefused() {
    StringBuilder calls = new StringBuilder("{\"calls\":[");
    for (int i = 0; i < 10_001; i++) {
      calls.append(i == 0 ? "" : ",").append("{\"tool\":\"arith\",\"args\":{\"expr\":\"1\"}}");
    }
    HttpResponse<String> r = server.postJson("/v1/batch", calls.append("]}").toString());
    assertEquals(422, r.statusCode());
    assertTrue(JSON.readTree(r.body()).get("detail").asString().contains("at most 10000 calls"), r.body());
  }

  @Test
  @DisplayName("Many calls: NDJSON answers one result a line, in the order of the lines; unreadable lines fail alone")
  void ndjson_oneResultALine_inOrder() {
    StringBuilder body = new StringBuilder();
    for (int i = 0; i < 3000; i++) {
      body.append(i == 7 ? "not json" : "{\"id\":" + i + ",\"tool\":\"arith\",\"args\":{\"expr\":\"" + i + "+1\"}}").append('\n');
    }
    HttpResponse<String> r = server.send("POST", "/v1/batch", Map.of("Content-Type", "application/x-ndjson"),
        body.toString().getBytes(StandardCharsets.UTF_8));
    assertEquals(200, r.statusCode());
    List<String> lines = r.body().lines().filter(l -> !l.contains("\"end\":true")).toList();
    assertEquals(3000, lines.size());
    for (int i = 0; i < 3000; i++) {
      JsonNode line = JSON.readTree(lines.get(i));
      if (i == 7) {
        assertEquals("invalid_argument", line.get("code").asString());
        assertEquals(8, line.get("line").asInt());
      } else {
        assertEquals(i, line.get("id").asInt());
        assertEquals(Integer.toString(i + 1), line.get("text").asString());
      }
    }
  }

  @Test
  @DisplayName("Splicing: one call as a model wrote it, with or without the markup, answered and spliced")
  void splice_withOrWithoutMarkup() {
    for (String call : List.of("arith@1(1250/4000)", "<:arith@1(1250/4000):>", "  <:arith@1( 1250/4000 ):>  ")) {
      HttpResponse<String> r = server.postJson("/v1/splice", JSON.createObjectNode().put("call", call).toString());
      assertEquals(200, r.statusCode(), r.body());
      JsonNode body = JSON.readTree(r.body());
      assertEquals("0.31", body.get("text").asString());
      assertEquals("<:arith@1(1250/4000) :: 0.31:>", body.get("spliced").asString());
    }
    HttpResponse<String> text = server.send("POST", "/v1/splice", Map.of("Content-Type", "text/plain", "Accept", "text/plain"),
        "arith@1(2+2)".getBytes(StandardCharsets.UTF_8));
    assertEquals("4", text.body());
  }

  @Test
  @DisplayName("Splice markup: each string may be 1 to 64 characters (a tokenizer's reserved tokens fit); 65 is refused")
  void markup_upTo64Characters() {
    String open = "<|reserved_special_token_10|>";
    String sep = "<|reserved_special_token_11|>";
    String close = "<|" + "x".repeat(60) + "|>";
    assertEquals(64, close.length());
    String request = JSON.createObjectNode().put("document", "a " + open + "arith@1(6*7)" + close + " b")
        .set("markup", JSON.createObjectNode().put("open", open).put("separator", sep).put("close", close)).toString();
    HttpResponse<String> r = server.postJson("/v1/fill", request);
    assertEquals(200, r.statusCode(), r.body());
    assertEquals("a " + open + "arith@1(6*7)" + sep + "42" + close + " b", JSON.readTree(r.body()).get("document").asString());
    String tooLong = JSON.createObjectNode().put("document", "x")
        .set("markup", JSON.createObjectNode().put("close", close + "x")).toString();
    assertEquals(400, server.postJson("/v1/fill", tooLong).statusCode());
  }

  @Test
  @DisplayName("Splice markup: nothing spliced into a document holds a markup string; a filled document parses back to its calls")
  void fill_neverSplicesAMarkupString() {
    String[][] markups = {{"{", "|", "]"}, {"<<", "e+", ">>"}, {"[[", " | ", "]]"}, {"<:", " :: ", ":>"}};
    String[] calls = {"arith@1(10^30)", "arith@1(1/0)", "arith@1(2+2)", "units@1(1 ton to kg)", "facts@1(presidnet)",
        "arith@1(1e-30)", "dates@1(2024-01-31 + P1M)"};
    for (String[] m : markups) {
      StringBuilder doc = new StringBuilder();
      for (String c : calls) {
        doc.append("text ").append(m[0]).append(c).append(m[2]).append(" ");
      }
      String request = JSON.createObjectNode().put("document", doc.toString())
          .set("markup", JSON.createObjectNode().put("open", m[0]).put("separator", m[1]).put("close", m[2])).toString();
      HttpResponse<String> r = server.postJson("/v1/fill", request);
      assertEquals(200, r.statusCode(), r.body());
      JsonNode body = JSON.readTree(r.body());
      String filled = body.get("document").asString();
      assertEquals(calls.length, body.get("calls").size());
      assertEquals(0, body.get("malformed").size(), filled);
      // Every open string of the filled document begins one of the calls: none came from an answer.
      assertEquals(calls.length, filled.split(java.util.regex.Pattern.quote(m[0]), -1).length - 1, filled);
      assertEquals(calls.length, filled.split(java.util.regex.Pattern.quote(m[1]), -1).length - 1, filled);
      assertEquals(calls.length, filled.split(java.util.regex.Pattern.quote(m[2]), -1).length - 1, filled);
      // Filling again changes nothing: every call is answered.
      String again = JSON.createObjectNode().put("document", filled)
          .set("markup", JSON.createObjectNode().put("open", m[0]).put("separator", m[1]).put("close", m[2])).toString();
      JsonNode second = JSON.readTree(server.postJson("/v1/fill", again).body());
      assertEquals(filled, second.get("document").asString());
      assertEquals(0, second.get("calls").size());
    }
  }

  @Test
  @DisplayName("Splicing: on_error says what a failed call leaves (splice_error, drop, keep)")
  void fill_onError() {
    String doc = "x <:arith@1(1/0):> y <:arith@1(2):>";
    assertEquals("x <:arith@1(1/0) :: error: domain_error: division by zero:> y <:arith@1(2) :: 2:>", fill(doc, "splice_error"));
    assertEquals("x  y <:arith@1(2) :: 2:>", fill(doc, "drop"));
    assertEquals("x <:arith@1(1/0):> y <:arith@1(2) :: 2:>", fill(doc, "keep"));
  }

  private static String fill(String doc, String onError) {
    HttpResponse<String> r = server.postJson("/v1/fill", JSON.createObjectNode().put("document", doc).put("on_error", onError).toString());
    assertEquals(200, r.statusCode(), r.body());
    return JSON.readTree(r.body()).get("document").asString();
  }

  @Test
  @DisplayName("Filling offline: reckoner fill writes, for each document, what /v1/fill answers for it, byte for byte")
  void offlineFill_matchesTheHttpFill_byteForByte() throws Exception {
    Path dir = Files.createTempDirectory("offline-fill");
    List<String> documents = List.of(
        "Shipped <:dates(45 days ago):> and <:dates@1(today):>; held by <:facts@1(president):>.",
        "Of 4000 crates, 1250 (<:arith@1(1250/4000*100):> %) went north, <:units@1(3.5 km to mi):> away, <:arith@1(1/0):>.",
        "Nested <:arith(<:arith(1):>):> and <:arith@1(7*6):> and unclosed <:arith(2",
        "<:nosuchtool(1):> <:units@1(1 ton to kg):> <:facts@1(presidnet):>");
    List<String> ids = List.of("\"doc-1\"", "2", "\"d\u00f6c-3\"", "\"100% sure\"");
    StringBuilder input = new StringBuilder();
    for (int i = 0; i < documents.size(); i++) {
      input.append(JSON.createObjectNode().set("id", JSON.readTree(ids.get(i)))).deleteCharAt(input.length() - 1)
          .append(",\"document\":").append(JSON.writeValueAsString(documents.get(i))).append("}\n");
    }
    Files.writeString(dir.resolve("docs.jsonl"), input.toString(), StandardCharsets.UTF_8);
    JarServer.Run run = JarServer.run(dir, List.of("fill", "--input", "docs.jsonl", "--output", "filled.jsonl", "--run", "it-run",
        "--as-of", "2031-05-17", "--cache-size", "0", "--data-dir", dir.resolve("data").toString(), "--no-progress"), Map.of(),
        Duration.ofMinutes(2));
    assertEquals(0, run.exitCode(), run.output());
    List<String> lines = Files.readAllLines(dir.resolve("filled.jsonl"), StandardCharsets.UTF_8);
    assertEquals(documents.size(), lines.size());
    for (int i = 0; i < documents.size(); i++) {
      String ref = reckonerRef(JSON.readTree(ids.get(i)));
      HttpResponse<String> http = server.postJson("/v1/fill", JSON.createObjectNode().put("document", documents.get(i)).toString(),
          "Reckoner-Run", "it-run", "Reckoner-Ref", ref, "Reckoner-As-Of", "2031-05-17");
      String prefix = "{\"id\":" + JSON.writeValueAsString(JSON.readTree(ids.get(i))) + ",";
      assertTrue(lines.get(i).startsWith(prefix), lines.get(i));
      assertEquals(withoutIds(http.body()), withoutIds("{" + lines.get(i).substring(prefix.length())), documents.get(i));
    }
    List<String> refs = new ArrayList<>();
    try (java.sql.Connection c = java.sql.DriverManager.getConnection("jdbc:sqlite:" + dir.resolve("data").resolve("ledger.db"));
        java.sql.ResultSet rs = c.createStatement().executeQuery(
            "SELECT DISTINCT ref FROM invocation_records WHERE run = 'it-run' ORDER BY ref")) {
      while (rs.next()) {
        refs.add(rs.getString(1));
      }
    }
    assertTrue(refs.contains("doc-d%C3%B6c-3:pos-35"), "the id is in the refs, reversibly: " + refs);
    assertTrue(refs.contains("doc-100%25 sure:pos-0") && refs.contains("doc-2:pos-22") && refs.contains("doc-doc-1:pos-8"), refs.toString());
  }

  private static String reckonerRef(JsonNode id) {
    StringBuilder sb = new StringBuilder("doc-");
    for (byte b : id.asString().getBytes(StandardCharsets.UTF_8)) {
      int c = b & 0xff;
      sb.append(c >= 0x20 && c < 0x7f && c != '%' ? String.valueOf((char) c) : String.format("%%%02X", c));
    }
    return sb.toString();
  }

  /** The answer with each invocation's id blanked: those name calls, which are two here by design. */
  private static String withoutIds(String json) {
    String out = json.replaceAll("\"invocation_id\":\"[0-9a-f-]{36}\"", "\"invocation_id\":\"…\"");
    assertFalse(out.contains("\"cached\":true"), "the cache is off on both sides");
    return out;
  }
}
