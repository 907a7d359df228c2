package reckoner.http;

import static io.restassured.RestAssured.given;
import static org.hamcrest.Matchers.equalTo;
import static org.hamcrest.Matchers.startsWith;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import io.restassured.RestAssured;
import io.restassured.config.EncoderConfig;
import io.restassured.config.RestAssuredConfig;
import io.restassured.response.Response;
import io.restassured.specification.RequestSpecification;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Malformed requests against the real server over HTTP: each gets its 4xx status and stable
 * code (never a 5xx), and the server answers a good request right after each.
 */
final class BadInputTest {
  private static TestServer server;
  private static RestAssuredConfig raw;

  @BeforeAll
  static void start() {
    server = TestServer.start();
    // Send exactly the bytes and Content-Type given: no charset appended, no re-encoding.
    raw = RestAssured.config().encoderConfig(EncoderConfig.encoderConfig().appendDefaultContentCharsetToContentTypeIfUndefined(false));
  }

  @AfterAll
  static void stop() {
    server.close();
  }

  /** One malformed request: how it is sent, and the status and code it must get. */
  record Case(String name, String method, String path, String contentType, String accept, byte[] body, int status, String code) {
    @Override
    public String toString() {
      return name;
    }
  }

  private static final String INVOKE = "/v1/tools/arith/1/invoke";

  static Case json(String name, String body, int status, String code) {
    return new Case(name, "POST", INVOKE, "application/json", null, body.getBytes(StandardCharsets.UTF_8), status, code);
  }

  static Case json2(String name, String body, int status, String code) {
    return new Case(name, "POST", "/v1/tools/arith/2/invoke", "application/json", null, body.getBytes(StandardCharsets.UTF_8), status, code);
  }

  static Stream<Case> cases() {
    List<Case> c = new ArrayList<>();
    // ---- broken JSON ----
    c.add(json("unclosed object", "{", 400, "invalid_argument"));
    c.add(json("missing value", "{\"expr\":}", 400, "invalid_argument"));
    c.add(json("unclosed array", "[1,2", 400, "invalid_argument"));
    c.add(json("single quotes", "{'expr':'1'}", 400, "invalid_argument"));
    c.add(json("trailing comma", "{\"expr\":\"1\",}", 400, "invalid_argument"));
    c.add(json("trailing garbage", "{\"expr\":\"1\"} x", 400, "invalid_argument"));
    c.add(json("two documents", "{\"expr\":\"1\"}{\"expr\":\"2\"}", 400, "invalid_argument"));
    c.add(json("duplicate key", "{\"expr\":\"1\",\"expr\":\"2\"}", 400, "invalid_argument"));
    c.add(json("empty body", "", 400, "invalid_argument"));
    c.add(json("white space only", "   \n ", 400, "invalid_argument"));
    c.add(json("bare string", "\"1+1\"", 400, "invalid_argument"));
    c.add(json("bare number", "42", 400, "invalid_argument"));
    c.add(json("null document", "null", 400, "invalid_argument"));
    c.add(json("array document", "[{\"expr\":\"1\"}]", 400, "invalid_argument"));
    c.add(json("unquoted key", "{expr:\"1\"}", 400, "invalid_argument"));
    c.add(json("NaN literal", "{\"expr\":\"1\",\"places\":NaN}", 400, "invalid_argument"));
    c.add(new Case("invalid UTF-8", "POST", INVOKE, "application/json", null,
        new byte[] {'{', '"', 'e', 'x', 'p', 'r', '"', ':', '"', (byte) 0xC3, (byte) 0x28, '"', '}'}, 400, "invalid_argument"));
    // ---- wrong types ----
    c.add(json("expr is a number", "{\"expr\":12}", 400, "invalid_argument"));
    c.add(json("expr is null", "{\"expr\":null}", 400, "invalid_argument"));
    c.add(json("expr is an array", "{\"expr\":[\"1\"]}", 400, "invalid_argument"));
    c.add(json("expr is an object", "{\"expr\":{\"a\":1}}", 400, "invalid_argument"));
    c.add(json("expr is empty", "{\"expr\":\"\"}", 400, "invalid_argument"));
    c.add(json("places is a string", "{\"expr\":\"1\",\"places\":\"2\"}", 400, "invalid_argument"));
    c.add(json("places is a fraction", "{\"expr\":\"1\",\"places\":1.5}", 400, "invalid_argument"));
    c.add(json("places is huge", "{\"expr\":\"1\",\"places\":1e100}", 400, "invalid_argument"));
    c.add(json("places above range", "{\"expr\":\"1\",\"places\":41}", 400, "invalid_argument"));
    c.add(json("digits zero", "{\"expr\":\"1\",\"digits\":0}", 400, "invalid_argument"));
    c.add(json("digits above range", "{\"expr\":\"1\",\"digits\":35}", 400, "invalid_argument"));
    c.add(json("rounding is a number", "{\"expr\":\"1\",\"rounding\":1}", 400, "invalid_argument"));
    c.add(json("rounding unknown", "{\"expr\":\"1\",\"rounding\":\"nearest\"}", 400, "invalid_argument"));
    c.add(json("pad_zeros is a string", "{\"expr\":\"1\",\"pad_zeros\":\"yes\"}", 400, "invalid_argument"));
    c.add(json("text is a number", "{\"text\":5}", 400, "invalid_argument"));
    c.add(json("places and digits", "{\"expr\":\"1\",\"places\":2,\"digits\":3}", 400, "invalid_argument"));
    // ---- unknown or missing fields ----
    c.add(json("unknown field", "{\"expr\":\"1\",\"foo\":2}", 400, "invalid_argument"));
    c.add(json("field in wrong case", "{\"EXPR\":\"1\"}", 400, "invalid_argument"));
    c.add(json("empty object", "{}", 400, "invalid_argument"));
    c.add(json("empty key", "{\"\":\"1\"}", 400, "invalid_argument"));
    c.add(json("both text and expr", "{\"expr\":\"1\",\"text\":\"2\"}", 400, "invalid_argument"));
    // ---- huge or deep bodies ----
    c.add(json("body over the limit", "{\"expr\":\"" + "1+".repeat(40_000) + "1\"}", 413, "payload_too_large"));
    c.add(json("deeply nested JSON", "{\"a\":".repeat(1000) + "1" + "}".repeat(1000), 400, "invalid_argument"));
    c.add(json("deeply nested array", "[".repeat(5000) + "]".repeat(5000), 400, "invalid_argument"));
    c.add(json("expression over 1000 characters", "{\"expr\":\"" + "1+".repeat(600) + "1\"}", 422, "limit_exceeded"));
    c.add(json("10,000 nested parentheses", "{\"expr\":\"" + "(".repeat(10_000) + "1" + ")".repeat(10_000) + "\"}", 422, "limit_exceeded"));
    c.add(json("51 nested parentheses", "{\"expr\":\"" + "(".repeat(51) + "1" + ")".repeat(51) + "\"}", 422, "limit_exceeded"));
    c.add(json("number literal of 2000 digits", "{\"expr\":\"1\",\"places\":" + "9".repeat(2000) + "}", 400, "invalid_argument"));
    // ---- hostile expressions ----
    c.add(json("tower of powers", "{\"expr\":\"9^9^9^9\"}", 422, "limit_exceeded"));
    c.add(json("power overflow", "{\"expr\":\"10^10000\"}", 422, "overflow"));
    c.add(json("literal overflow", "{\"expr\":\"1e99999\"}", 422, "overflow"));
    c.add(json("division by zero", "{\"expr\":\"1/0\"}", 422, "domain_error"));
    c.add(json("sqrt of negative", "{\"expr\":\"sqrt(-1)\"}", 422, "domain_error"));
    c.add(json("log of zero", "{\"expr\":\"ln(0)\"}", 422, "domain_error"));
    c.add(json("unknown name", "{\"expr\":\"x*2\"}", 422, "syntax_error"));
    c.add(json("control character", "{\"expr\":\"1\\u00002\"}", 422, "syntax_error"));
    c.add(json("script injection", "{\"expr\":\"<script>alert(1)</script>\"}", 422, "syntax_error"));
    c.add(json("java call", "{\"expr\":\"java.lang.Runtime.getRuntime()\"}", 422, "syntax_error"));
    c.add(json("unbalanced", "{\"expr\":\"((1)\"}", 422, "syntax_error"));
    // ---- arith@2: every text it cannot read is 422 syntax_error, a contradictory request 400 ----
    c.add(json2("v2: words that do not read", "{\"text\":\"what is 2 plus\"}", 422, "syntax_error"));
    c.add(json2("v2: a bidirectional override", "{\"text\":\"2\\u202e+2\"}", 422, "syntax_error"));
    c.add(json2("v2: a zero-width space", "{\"expr\":\"2\\u200b+2\"}", 422, "syntax_error"));
    c.add(json2("v2: a phrase with two readings", "{\"text\":\"6/2(1+2)\"}", 422, "syntax_error"));
    c.add(json2("v2: a decimal comma", "{\"text\":\"3,5 + 1\"}", 422, "syntax_error"));
    c.add(json2("v2: white space only", "{\"expr\":\"   \"}", 422, "syntax_error"));
    c.add(json2("v2: expression over 1000 characters", "{\"text\":\"" + "1+".repeat(600) + "1\"}", 422, "limit_exceeded"));
    c.add(json2("v2: a rounding phrase against places", "{\"text\":\"2/3 to 3 decimal places\",\"places\":2}", 400, "invalid_argument"));
    c.add(new Case("v2: plain text that does not read", "POST", "/v1/tools/arith/2/invoke", "text/plain", null,
        "what is".getBytes(StandardCharsets.UTF_8), 422, "syntax_error"));
    // ---- unknown tool or version ----
    c.add(new Case("unknown tool", "POST", "/v1/tools/nope/1/invoke", "application/json", null, b("{\"expr\":\"1\"}"), 404, "unknown_tool"));
    c.add(new Case("unknown version", "POST", "/v1/tools/arith/9/invoke", "application/json", null, b("{\"expr\":\"1\"}"), 404, "unknown_tool"));
    c.add(new Case("version zero", "POST", "/v1/tools/arith/0/invoke", "application/json", null, b("{\"expr\":\"1\"}"), 404, "unknown_tool"));
    c.add(new Case("version with leading zero", "POST", "/v1/tools/arith/01/invoke", "application/json", null, b("{\"expr\":\"1\"}"), 404, "unknown_tool"));
    c.add(new Case("version not a number", "POST", "/v1/tools/arith/latest!/invoke", "application/json", null, b("{\"expr\":\"1\"}"), 404, "unknown_tool"));
    c.add(new Case("version beyond int", "POST", "/v1/tools/arith/99999999999/invoke", "application/json", null, b("{\"expr\":\"1\"}"), 404, "unknown_tool"));
    c.add(new Case("tool name in capitals", "POST", "/v1/tools/ARITH/1/invoke", "application/json", null, b("{\"expr\":\"1\"}"), 404, "unknown_tool"));
    c.add(new Case("describe unknown version", "GET", "/v1/tools/arith/9", null, null, null, 404, "unknown_tool"));
    c.add(new Case("unknown endpoint", "GET", "/v2/tools", null, null, null, 404, "unknown_endpoint"));
    c.add(new Case("unknown problem type", "GET", "/problems/nonsense", null, null, null, 404, "unknown_endpoint"));
    // ---- wrong method or media type ----
    c.add(new Case("GET on invoke", "GET", INVOKE, null, null, null, 405, "method_not_allowed"));
    c.add(new Case("PUT on invoke", "PUT", INVOKE, "application/json", null, b("{\"expr\":\"1\"}"), 405, "method_not_allowed"));
    c.add(new Case("DELETE on tools", "DELETE", "/v1/tools", null, null, null, 405, "method_not_allowed"));
    c.add(new Case("POST on tools", "POST", "/v1/tools", "application/json", null, b("{}"), 405, "method_not_allowed"));
    c.add(new Case("form encoded", "POST", INVOKE, "application/x-www-form-urlencoded", null, b("expr=1"), 415, "unsupported_media_type"));
    c.add(new Case("xml", "POST", INVOKE, "application/xml", null, b("<expr>1</expr>"), 415, "unsupported_media_type"));
    c.add(new Case("latin-1 charset", "POST", INVOKE, "application/json; charset=ISO-8859-1", null, b("{\"expr\":\"1\"}"), 415, "unsupported_media_type"));
    c.add(new Case("no content type", "POST", INVOKE, null, null, b("{\"expr\":\"1\"}"), 415, "unsupported_media_type"));
    c.add(new Case("accepts only images", "POST", INVOKE, "application/json", "image/png", b("{\"expr\":\"1\"}"), 406, "not_acceptable"));
    c.add(new Case("text form with a syntax error", "POST", INVOKE, "text/plain", "text/plain", b("1+"), 422, "syntax_error"));
    c.add(new Case("text form that is empty", "POST", INVOKE, "text/plain", null, b("   "), 400, "invalid_argument"));
    return c.stream();
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("cases")
  void malformedRequest_getsItsCode_andTheNextGoodRequestSucceeds(Case c) throws Exception {
    Response r = send(c);
    assertEquals(c.status(), r.statusCode(), () -> c.name() + ": " + r.asString());
    assertTrue(r.statusCode() < 500, "never a 5xx");
    assertEquals(c.code(), r.header(Responses.ERROR_CODE_HEADER), c.name());
    if ("text/plain".equals(c.accept())) {
      assertTrue(r.asString().startsWith("error: " + c.code() + ": "), r.asString());
    } else {
      assertEquals("application/problem+json", r.contentType().split(";")[0]);
      assertEquals(c.code(), r.jsonPath().getString("code"));
      assertEquals(c.status(), r.jsonPath().getInt("status"));
      assertEquals("/problems/" + c.code(), r.jsonPath().getString("type"));
      String text = r.jsonPath().getString("text");
      assertTrue(text.startsWith("error: " + c.code() + ": ") && !text.contains("\n") && text.length() <= 200, text);
      assertTrue(!r.asString().contains("Exception") && !r.asString().contains("\tat "), "no stack trace: " + r.asString());
    }
    good().then().statusCode(200).body(equalTo("0.31"));
  }

  @Test
  void noContentTypeOrRawBytes_stillGetAProblem() throws Exception {
    // java.net.http sends a body with no Content-Type at all, which REST Assured would fill in.
    HttpResponse<String> r = HttpClient.newHttpClient().send(HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + server.port() + INVOKE))
        .POST(HttpRequest.BodyPublishers.ofString("{\"expr\":\"1\"}")).build(), HttpResponse.BodyHandlers.ofString());
    assertEquals(415, r.statusCode());
    assertTrue(r.body().contains("\"code\":\"unsupported_media_type\""), r.body());
  }

  /**
   * A client still sending a body far over the limit gets its 413, every time: the server reads on
   * (up to Bodies.DRAIN_BYTES) before answering, instead of closing with bytes unread, which
   * resets the connection and can take the answer with it (as one CI run saw).
   */
  @Test
  void aBodyFarOverTheLimit_getsIts413EveryTime() throws Exception {
    HttpClient client = HttpClient.newBuilder().version(HttpClient.Version.HTTP_1_1).build();
    byte[] body = ("{\"expr\":\"" + "1".repeat(6_000_000) + "\"}").getBytes(StandardCharsets.UTF_8); // more than socket buffers hold
    for (int i = 0; i < 10; i++) {
      HttpResponse<String> r = client.send(HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + server.port() + INVOKE))
          .header("Content-Type", "application/json").POST(HttpRequest.BodyPublishers.ofByteArray(body)).build(),
          HttpResponse.BodyHandlers.ofString());
      assertEquals(413, r.statusCode(), "attempt " + i);
      assertTrue(r.body().contains("\"code\":\"payload_too_large\""), r.body());
    }
  }

  @Test
  void runAndRefHeaders_areBounded() {
    given().port(server.port()).contentType("application/json").header("Reckoner-Run", "r".repeat(201)).body("{\"expr\":\"1\"}")
        .post(INVOKE).then().statusCode(400).body("code", equalTo("invalid_argument"))
        .body("detail", startsWith("Reckoner-Run must be"));
  }

  private static Response good() {
    return given().port(server.port()).config(raw).contentType("application/json").accept("text/plain")
        .body("{\"expr\":\"1250/4000\"}").post(INVOKE);
  }

  private static Response send(Case c) {
    RequestSpecification req = given().port(server.port()).config(raw).urlEncodingEnabled(false);
    if (c.contentType() != null) {
      req = req.contentType(c.contentType());
    }
    if (c.accept() != null) {
      req = req.accept(c.accept());
    }
    if (c.body() != null && c.contentType() != null && c.contentType().startsWith("application/x-www-form-urlencoded")) {
      req = req.body(new String(c.body(), StandardCharsets.US_ASCII)); // REST Assured form-encodes strings only
    } else if (c.body() != null) {
      req = req.body(c.body());
    }
    return req.request(c.method(), c.path());
  }

  private static byte[] b(String s) {
    return s.getBytes(StandardCharsets.UTF_8);
  }
}
