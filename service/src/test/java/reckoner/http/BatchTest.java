package reckoner.http;

import static io.restassured.RestAssured.given;
import static org.hamcrest.Matchers.equalTo;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import io.restassured.path.json.JsonPath;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.util.List;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import reckoner.spec.Json;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

final class BatchTest {
  private static TestServer server;
  private static final JsonMapper JSON = Json.newMapper();

  @BeforeAll
  static void start() {
    server = TestServer.start();
  }

  @AfterAll
  static void stop() {
    server.close();
  }

  @Test
  void jsonBatch_keepsOrderAndIds_andOneBadCallFailsOnlyItself() {
    StringBuilder body = new StringBuilder("{\"calls\":[");
    for (int i = 0; i < 500; i++) {
      if (i > 0) {
        body.append(',');
      }
      body.append(i % 50 == 7
          ? "{\"id\":\"c" + i + "\",\"tool\":\"arith\",\"args\":{\"expr\":\"" + i + "/0\"}}"
          : "{\"id\":\"c" + i + "\",\"tool\":\"arith\",\"version\":1,\"args\":{\"expr\":\"" + i + "/8\",\"places\":3},\"ref\":\"r" + i + "\"}");
    }
    body.append("]}");
    JsonPath r = given().port(server.port()).contentType("application/json").body(body.toString()).post("/v1/batch")
        .then().statusCode(200).extract().jsonPath();
    List<java.util.Map<String, Object>> results = r.getList("results"); // one path evaluation, not 1,500
    assertEquals(500, results.size());
    for (int i = 0; i < 500; i++) {
      java.util.Map<String, Object> result = results.get(i);
      assertEquals("c" + i, result.get("id"));
      if (i % 50 == 7) {
        assertEquals(false, result.get("ok"));
        assertEquals("domain_error", result.get("code"));
      } else {
        assertEquals(true, result.get("ok"));
        assertEquals(new java.math.BigDecimal(i).divide(new java.math.BigDecimal(8)).setScale(3).stripTrailingZeros()
            .toPlainString().replaceAll("^0E.*", "0"), result.get("text"));
      }
    }
  }

  @Test
  void jsonBatch_malformedItems_failOnlyThemselves() {
    String body = "{\"calls\":[{\"id\":1,\"tool\":\"arith\",\"args\":{\"expr\":\"1+1\"}},"
        + "{\"id\":2,\"tool\":\"arith\"},"
        + "{\"id\":3,\"tool\":\"arith\",\"args\":{\"expr\":\"2+2\"},\"colour\":1},"
        + "{\"id\":4,\"tool\":\"nope\",\"args\":{}},"
        + "\"not an object\","
        + "{\"id\":6,\"tool\":\"arith\",\"version\":0,\"args\":{\"expr\":\"1\"}},"
        + "{\"id\":7,\"tool\":\"arith\",\"args\":{\"expr\":\"3+3\"}}]}";
    JsonPath r = given().port(server.port()).contentType("application/json").body(body).post("/v1/batch")
        .then().statusCode(200).extract().jsonPath();
    assertEquals(List.of(true, false, false, false, false, false, true), r.getList("results.ok"));
    assertEquals(List.of("2", "6"), List.of(r.getString("results[0].text"), r.getString("results[6].text")));
    assertEquals("invalid_argument", r.getString("results[1].code"));
    assertEquals("invalid_argument", r.getString("results[2].code"));
    assertEquals("unknown_tool", r.getString("results[3].code"));
    assertEquals("invalid_argument", r.getString("results[4].code"));
    assertEquals("invalid_argument", r.getString("results[5].code"));
  }

  @Test
  void jsonBatch_notAnObjectOfCalls_isRefusedWhole() {
    given().port(server.port()).contentType("application/json").body("[1,2]").post("/v1/batch")
        .then().statusCode(400).body("code", equalTo("invalid_argument"));
    given().port(server.port()).contentType("text/csv").body("a,b").post("/v1/batch")
        .then().statusCode(415).body("code", equalTo("unsupported_media_type"));
  }

  @Test
  void ndjsonBatch_answersLineByLine_inOrder_withPerLineFailures() throws Exception {
    StringBuilder body = new StringBuilder();
    for (int i = 0; i < 3000; i++) {
      switch (i % 100) {
        case 13 -> body.append("{broken json\n");
        case 14 -> body.append("\n"); // blank lines are skipped, not answered
        case 15 -> body.append("{\"id\":").append(i).append(",\"tool\":\"arith\",\"args\":{\"expr\":\"1/0\"}}\r\n");
        default -> body.append("{\"id\":").append(i).append(",\"tool\":\"arith\",\"args\":{\"expr\":\"").append(i).append("*2\"}}\n");
      }
    }
    HttpResponse<java.util.stream.Stream<String>> r = HttpClient.newHttpClient().send(
        HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + server.port() + "/v1/batch"))
            .header("Content-Type", "application/x-ndjson").POST(HttpRequest.BodyPublishers.ofString(body.toString())).build(),
        HttpResponse.BodyHandlers.ofLines());
    assertEquals(200, r.statusCode());
    assertEquals("application/x-ndjson", r.headers().firstValue("content-type").orElse("").split(";")[0]);
    List<JsonNode> all = r.body().map(JSON::readTree).toList();
    assertEquals(3000 - 30 + 1, all.size());
    JsonNode trailer = all.get(all.size() - 1);
    assertEquals("{\"end\":true,\"complete\":true,\"answered\":2970,\"replayed\":0}", trailer.toString(), "the stream says it finished");
    List<JsonNode> lines = all.subList(0, all.size() - 1);
    int expectedLine = 0;
    int i = 0;
    for (JsonNode line : lines) {
      while (i % 100 == 14) {
        i++;
      }
      if (i % 100 == 13) {
        assertEquals("invalid_argument", line.get("code").asString());
        assertEquals(i + 1, line.get("line").asInt(), "the error names its line");
      } else if (i % 100 == 15) {
        assertEquals(i, line.get("id").asInt());
        assertEquals("domain_error", line.get("code").asString());
      } else {
        assertEquals(i, line.get("id").asInt());
        assertEquals(Integer.toString(i * 2), line.get("text").asString());
      }
      i++;
      expectedLine++;
    }
    assertTrue(expectedLine > 0);
  }

  /**
   * A caller that sends one line and waits for its answer before sending the next (an inference
   * server pausing at each call) gets each answer while the request is still open: lines are not
   * held back to fill a chunk of work.
   */
  @Test
  void ndjsonBatch_oneLineAtATime_answersEachBeforeTheNextIsSent() throws Exception {
    try (java.net.Socket socket = new java.net.Socket("127.0.0.1", server.port())) {
      socket.setSoTimeout(10_000); // a held-back answer fails the test instead of hanging it
      java.io.OutputStream out = socket.getOutputStream();
      out.write(("POST /v1/batch HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Type: application/x-ndjson\r\n"
          + "Transfer-Encoding: chunked\r\n\r\n").getBytes(java.nio.charset.StandardCharsets.US_ASCII));
      java.io.InputStream in = new java.io.BufferedInputStream(socket.getInputStream());
      java.io.BufferedReader answers = null;
      for (int i = 0; i < 3; i++) {
        byte[] line = ("{\"id\":" + i + ",\"tool\":\"arith\",\"args\":{\"expr\":\"" + (i + 1) + "*1.5\"}}\n")
            .getBytes(java.nio.charset.StandardCharsets.UTF_8);
        out.write((Integer.toHexString(line.length) + "\r\n").getBytes(java.nio.charset.StandardCharsets.US_ASCII));
        out.write(line);
        out.write("\r\n".getBytes(java.nio.charset.StandardCharsets.US_ASCII));
        out.flush();
        if (answers == null) {
          assertEquals("HTTP/1.1 200 OK", NdjsonStreamTest.ChunkedReader.line(in));
          while (!NdjsonStreamTest.ChunkedReader.line(in).isEmpty()) {
            // headers
          }
          answers = new java.io.BufferedReader(new java.io.InputStreamReader(new NdjsonStreamTest.ChunkedReader(in),
              java.nio.charset.StandardCharsets.UTF_8));
        }
        JsonNode answer = JSON.readTree(answers.readLine());
        assertEquals(i, answer.get("id").asInt());
        assertEquals(new java.math.BigDecimal(i + 1).multiply(new java.math.BigDecimal("1.5")).stripTrailingZeros()
            .toPlainString(), answer.get("text").asString());
      }
      out.write("0\r\n\r\n".getBytes(java.nio.charset.StandardCharsets.US_ASCII));
      out.flush();
      assertEquals("{\"end\":true,\"complete\":true,\"answered\":3,\"replayed\":0}", answers.readLine());
      assertEquals(null, answers.readLine());
    }
  }
}
