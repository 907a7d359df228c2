package reckoner.conformance;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reckoner.spec.Json;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * README, section "Errors", and the contract's "Endpoints" paragraph on errors: every refusal is an
 * RFC 9457 problem with a stable code and a one-line text; with {@code Accept: text/plain} it is that
 * line alone, with the code in {@code Reckoner-Error-Code}, on every endpoint and for every status.
 */
final class ReadmeErrorsIT {
  private static final JsonMapper JSON = Json.newMapper();
  private static final JarServer SERVER = JarServer.shared();

  /** One way to be refused: how to ask, and the status and code that must come back. */
  record Refusal(String name, String method, String path, Map<String, String> headers, byte[] body, int status, String code) {
    @Override
    public String toString() {
      return name + " -> " + status + " " + code;
    }
  }

  private static Refusal refusal(String name, String method, String path, String contentType, String body, int status,
      String code, String... headers) {
    Map<String, String> h = new LinkedHashMap<>();
    if (contentType != null) {
      h.put("Content-Type", contentType);
    }
    for (int i = 0; i + 1 < headers.length; i += 2) {
      h.put(headers[i], headers[i + 1]);
    }
    return new Refusal(name, method, path, h, body == null ? null : body.getBytes(StandardCharsets.UTF_8), status, code);
  }

  static Stream<Refusal> refusals() {
    String invoke = "/v1/tools/arith/1/invoke";
    byte[] badUtf8 = {'{', '"', 'e', 'x', 'p', 'r', '"', ':', '"', (byte) 0xff, '"', '}'};
    return Stream.of(
        refusal("bad JSON", "POST", invoke, "application/json", "{bad", 400, "invalid_argument"),
        refusal("empty body", "POST", invoke, "application/json", "", 400, "invalid_argument"),
        refusal("unknown argument", "POST", invoke, "application/json", "{\"expr\":\"1\",\"precision\":3}", 400, "invalid_argument"),
        new Refusal("invalid UTF-8", "POST", invoke, Map.of("Content-Type", "application/json"), badUtf8, 400, "invalid_argument"),
        refusal("a bad Reckoner-Run header", "POST", invoke, "application/json", "{\"expr\":\"1\"}", 400, "invalid_argument",
            "Reckoner-Run", "x".repeat(201)),
        refusal("a bad Reckoner-Ref header", "POST", invoke, "application/json", "{\"expr\":\"1\"}", 400, "invalid_argument",
            "Reckoner-Ref", "x".repeat(300)),
        refusal("bad markup", "POST", "/v1/splice", "application/json",
            "{\"call\":\"arith(1)\",\"markup\":{\"open\":\"" + "<".repeat(65) + "\"}}", 400, "invalid_argument"),
        refusal("bad JSON to splice", "POST", "/v1/splice", "application/json", "[", 400, "invalid_argument"),
        refusal("bad JSON to fill", "POST", "/v1/fill", "application/json", "{\"document\":1}", 400, "invalid_argument"),
        refusal("bad JSON batch", "POST", "/v1/batch", "application/json", "{\"calls\":{}}", 400, "invalid_argument"),
        refusal("bad ledger filter", "GET", "/v1/invocations?runn=x", null, null, 400, "invalid_argument"),
        refusal("a page over the maximum", "GET", "/v1/invocations?limit=5000", null, null, 400, "invalid_argument"),
        refusal("unknown endpoint", "GET", "/v1/nothing-here", null, null, 404, "unknown_endpoint"),
        refusal("unknown tool", "POST", "/v1/tools/abacus/1/invoke", "application/json", "{}", 404, "unknown_tool"),
        refusal("unknown version", "GET", "/v1/tools/arith/99", null, null, 404, "unknown_tool"),
        refusal("unknown problem type", "GET", "/problems/no_such_code", null, null, 404, "unknown_endpoint"),
        refusal("wrong method", "DELETE", "/v1/batch", null, null, 405, "method_not_allowed"),
        refusal("wrong method on a tool", "GET", invoke, null, null, 405, "method_not_allowed"),
        refusal("too large", "POST", invoke, "application/json", "{\"expr\":\"" + "1".repeat(1_100_000) + "\"}", 413,
            "payload_too_large"),
        refusal("no media type", "POST", invoke, null, "{\"expr\":\"1\"}", 415, "unsupported_media_type"),
        refusal("wrong media type", "POST", invoke, "application/xml", "<expr>1</expr>", 415, "unsupported_media_type"),
        refusal("wrong charset", "POST", invoke, "application/json; charset=latin1", "{\"expr\":\"1\"}", 415,
            "unsupported_media_type"),
        refusal("wrong media type to batch", "POST", "/v1/batch", "text/csv", "a,b", 415, "unsupported_media_type"),
        refusal("a tool that cannot compute", "POST", invoke, "application/json", "{\"expr\":\"1/0\"}", 422, "domain_error"),
        refusal("text that does not parse", "POST", invoke, "text/plain", "(1", 422, "syntax_error"),
        refusal("a fact that is not there", "POST", "/v1/tools/facts/1/invoke", "application/json", "{\"key\":\"presidnet\"}",
            404, "not_found"),
        refusal("an answer that cannot be spliced", "POST", "/v1/splice", "application/json",
            "{\"call\":\"arith(10^30)\",\"markup\":{\"open\":\"<<\",\"separator\":\"e+\",\"close\":\">>\"}}", 422, "unspliceable"));
  }

  static Stream<Arguments> refusalsAsJson() {
    return refusals().map(Arguments::of);
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("refusalsAsJson")
  @DisplayName("Errors: every refusal is an RFC 9457 problem with a stable code and its one-line text")
  void refusal_isAProblem(Refusal r) {
    HttpResponse<String> response = SERVER.send(r.method(), r.path(), r.headers(), r.body());
    assertEquals(r.status(), response.statusCode(), response.body());
    assertEquals("application/problem+json", response.headers().firstValue("Content-Type").orElse(""));
    JsonNode p = JSON.readTree(response.body());
    assertEquals("/problems/" + r.code(), p.get("type").asString());
    assertEquals(r.status(), p.get("status").asInt());
    assertEquals(r.code(), p.get("code").asString());
    assertFalse(p.get("title").asString().isBlank());
    assertEquals("error: " + r.code() + ": " + p.get("detail").asString(), p.get("text").asString().replaceAll(" \\(did you mean: .*\\)$", ""));
    assertEquals(r.code(), response.headers().firstValue("Reckoner-Error-Code").orElse(""));
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("refusalsAsJson")
  @DisplayName("Errors: with Accept: text/plain a refusal is its one line, with the code in Reckoner-Error-Code")
  void refusal_asText_isOneLine(Refusal r) {
    for (String accept : List.of("text/plain", "text/plain, application/json;q=0.5", "application/json;q=0.1, text/*")) {
      Map<String, String> headers = new LinkedHashMap<>(r.headers());
      headers.put("Accept", accept);
      HttpResponse<String> response = SERVER.send(r.method(), r.path(), headers, r.body());
      assertEquals(r.status(), response.statusCode(), accept + ": " + response.body());
      assertTrue(response.headers().firstValue("Content-Type").orElse("").startsWith("text/plain"), accept);
      assertEquals(r.code(), response.headers().firstValue("Reckoner-Error-Code").orElse(""), accept);
      String body = response.body();
      if (r.path().equals("/v1/splice") && r.code().equals("unspliceable")) {
        assertEquals("error: unspliceable", body.substring(0, Math.min(19, body.length())), accept);
      } else {
        assertTrue(body.startsWith("error: " + r.code() + ": "), accept + ": " + body);
      }
      assertFalse(body.contains("\n") || body.contains("\r"), "one line: " + body);
    }
  }

  @Test
  @DisplayName("Errors: each problem type is a URI this server answers, naming its title and status")
  void problemTypes_resolve() {
    for (String code : List.of("invalid_argument", "unknown_tool", "payload_too_large", "domain_error", "unspliceable",
        "not_found", "unavailable", "rate_limited", "unauthorized", "forbidden")) {
      HttpResponse<String> r = SERVER.get("/problems/" + code);
      assertEquals(200, r.statusCode(), code);
      JsonNode body = JSON.readTree(r.body());
      assertEquals(code, body.get("code").asString());
      assertTrue(body.get("status").asInt() >= 400);
    }
  }

  @Test
  @DisplayName("Errors: an Accept that allows neither JSON nor text is 406, answered as a JSON problem")
  void acceptNeither_is406() {
    HttpResponse<String> r = SERVER.send("POST", "/v1/tools/arith/1/invoke",
        Map.of("Content-Type", "application/json", "Accept", "image/png"), "{\"expr\":\"1\"}".getBytes(StandardCharsets.UTF_8));
    assertEquals(406, r.statusCode());
    assertEquals("not_acceptable", JSON.readTree(r.body()).get("code").asString());
  }

  @Test
  @DisplayName("Errors: a tag header that is not printable ASCII (raw UTF-8 bytes) is refused in either form")
  void nonAsciiTagHeader_isRefused() {
    for (String accept : List.of("application/json", "text/plain")) {
      String body = "{\"expr\":\"1\"}";
      byte[] head = ("POST /v1/tools/arith/1/invoke HTTP/1.1\r\nHost: 127.0.0.1\r\nConnection: close\r\nAccept: " + accept
          + "\r\nContent-Type: application/json\r\nContent-Length: " + body.length() + "\r\nReckoner-Ref: caf").getBytes(StandardCharsets.US_ASCII);
      byte[] tail = ("\r\n\r\n" + body).getBytes(StandardCharsets.US_ASCII);
      byte[] request = new byte[head.length + 2 + tail.length];
      System.arraycopy(head, 0, request, 0, head.length);
      request[head.length] = (byte) 0xc3; // é in UTF-8
      request[head.length + 1] = (byte) 0xa9;
      System.arraycopy(tail, 0, request, head.length + 2, tail.length);
      String response = SERVER.raw(request);
      assertTrue(response.startsWith("HTTP/1.1 400"), response);
      assertTrue(response.contains("Reckoner-Error-Code: invalid_argument"), response);
      assertTrue(response.contains(accept.equals("text/plain") ? "\r\n\r\nerror: invalid_argument: Reckoner-Ref must be"
          : "\"code\":\"invalid_argument\""), response);
    }
  }

  @Test
  @DisplayName("Errors: bad input never harms the next request")
  void afterEveryRefusal_anOrdinaryCallIsAnswered() {
    refusals().forEach(r -> {
      SERVER.send(r.method(), r.path(), r.headers(), r.body());
      HttpResponse<String> ok = SERVER.postJson("/v1/tools/arith/1/invoke", "{\"expr\":\"1250/4000\"}", "Accept", "text/plain");
      assertEquals(200, ok.statusCode(), "after " + r);
      assertEquals("0.31", ok.body());
    });
  }
}
