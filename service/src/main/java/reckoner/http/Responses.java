package reckoner.http;

import io.javalin.http.Context;
import java.nio.charset.StandardCharsets;
import java.util.Map;
import reckoner.tool.ToolError;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;

/** Writes answers and problems. Jackson stays here and in the spec package. */
final class Responses {
  /** Header naming the error code on a text/plain error answer, where there is no JSON body. */
  static final String ERROR_CODE_HEADER = "Reckoner-Error-Code";
  /** Header naming the invocation of a call's answer or refusal, in either form. */
  static final String INVOCATION_ID_HEADER = "Reckoner-Invocation-Id";

  private final JsonMapper json;

  Responses(JsonMapper json) {
    this.json = json;
  }

  JsonMapper json() {
    return json;
  }

  ObjectNode object() {
    return json.createObjectNode();
  }

  void json(Context ctx, int status, JsonNode body) {
    ctx.status(status).contentType(MediaTypes.JSON).result(json.writeValueAsBytes(body));
  }

  void text(Context ctx, int status, String text) {
    ctx.status(status).contentType(MediaTypes.TEXT).result(text.getBytes(StandardCharsets.UTF_8));
  }

  /** An RFC 9457 problem, or with {@code asText} the one-line error text and its code in a header. */
  void problem(Context ctx, ToolError error, boolean asText, String invocationId) {
    int status = Problem.status(error.code());
    ctx.header(ERROR_CODE_HEADER, error.code().wireName());
    if (invocationId != null) {
      ctx.header(INVOCATION_ID_HEADER, invocationId);
    }
    if (asText) {
      text(ctx, status, error.text());
      return;
    }
    ctx.status(status).contentType(MediaTypes.PROBLEM).result(json.writeValueAsBytes(problemBody(error, invocationId)));
  }

  /** A refusal in the form the caller's {@code Accept} prefers, with {@code headers} (such as Retry-After). */
  void problem(Context ctx, ToolError error, Map<String, String> headers) {
    headers.forEach(ctx::header);
    problem(ctx, error, MediaTypes.refusalAsText(ctx.header("Accept")), null);
  }

  ObjectNode problemBody(ToolError error, String invocationId) {
    ObjectNode body = object();
    body.put("type", Problem.type(error.code()));
    body.put("title", Problem.title(error.code()));
    body.put("status", Problem.status(error.code()));
    body.put("detail", error.detail());
    body.put("code", error.code().wireName());
    body.put("text", error.text());
    if (!error.suggestions().isEmpty()) {
      body.putArray("suggestions").addAll(error.suggestions().stream().map(json.getNodeFactory()::stringNode).toList());
    }
    if (invocationId != null) {
      body.put("invocation_id", invocationId);
    }
    return body;
  }
}
