package reckoner.http;

import io.javalin.http.Context;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import reckoner.results.ResultJson;
import reckoner.splice.Filler;
import reckoner.splice.Markup;
import reckoner.splice.OnError;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;
import tools.jackson.core.JacksonException;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;

/** {@code POST /v1/splice} (one call as written) and {@code POST /v1/fill} (every call of a document). */
final class SpliceRoutes {
  private final Filler filler;
  private final Responses responses;
  private final CallMetrics metrics;
  private final Bodies bodies;
  private final Markup serverMarkup;
  private final Access access;
  private final Retries retries;

  SpliceRoutes(Filler filler, Responses responses, CallMetrics metrics, Bodies bodies, Markup serverMarkup, Access access,
      Retries retries) {
    this.filler = filler;
    this.responses = responses;
    this.metrics = metrics;
    this.bodies = bodies;
    this.serverMarkup = serverMarkup;
    this.access = access;
    this.retries = retries;
  }

  /** The records an earlier attempt of this request made, by position, when it carries a key; checked for content. */
  private static Filler.Replay replay(Map<String, reckoner.ledger.Invocation> before, Filler.Tags tags) {
    if (tags.idempotencyKey() == null || before.isEmpty()) {
      return Filler.Replay.NONE;
    }
    return position -> java.util.Optional.ofNullable(before.get(tags.idempotencyKeyAt(position)))
        .map(inv -> new reckoner.call.Recorded(inv.toOutcome(), java.util.concurrent.CompletableFuture.completedFuture(null)));
  }

  private static void requireSameRequest(Map<String, reckoner.ledger.Invocation> before, String hash) {
    for (reckoner.ledger.Invocation inv : before.values()) {
      Retries.requireSameRequest(inv, hash);
    }
  }

  /** Keeps the records of a keyed fill's or splice's new calls for quick retries. */
  private void remember(Filler.Tags tags, Caller caller, Filler.Spliced s) {
    if (!s.replayed() && tags.idempotencyKey() != null) {
      reckoner.call.CallRequest request = new reckoner.call.CallRequest(s.call().tool(), s.call().version(),
          reckoner.call.Invoker.textArguments(s.call().input()), tags.asOf(), tags.run(), null, tags.keyId(),
          tags.idempotencyKeyAt(s.position()), tags.requestHash());
      retries.remember(reckoner.ledger.Invocation.of(request, s.outcome(), caller.keyId(), s.outcome().cached()));
    }
  }

  /** Body: {@code {"call":"arith(1250/4000)","markup":{...}}}, or the call itself as text/plain. */
  void splice(Context ctx) {
    boolean asText = MediaTypes.wantsText(ctx.header("Accept"));
    Request r = read(ctx, "call");
    Filler.Tags tags = tags(ctx);
    Caller caller = Access.caller(ctx);
    String key = Retries.key(ctx);
    try (Retries.Running running = key == null ? null : retries.begin(caller, key)) {
      Map<String, reckoner.ledger.Invocation> before = Map.of();
      if (key != null) {
        tags = tags.withIdempotency(key, Retries.hash("splice", r.text, r.markup, tags.run(), tags.ref(), tags.asOf()));
        before = retries.recorded(caller, List.of(tags.idempotencyKeyAt(0)));
        requireSameRequest(before, tags.requestHash());
      }
      if (before.isEmpty()) {
        access.takeOrRefuse(caller, 1);
      }
      Filler.Spliced s;
      try {
        s = filler.splice(r.text, r.markup, tags, replay(before, tags));
      } catch (ToolException e) {
        responses.problem(ctx, e.error(), asText, null);
        return;
      }
      remember(tags, caller, s);
      answer(ctx, s, asText);
    }
  }

  private void answer(Context ctx, Filler.Spliced s, boolean asText) {
    if (s.replayed()) {
      ctx.header(Retries.REPLAYED_HEADER, "true");
    }
    metrics.record(s.outcome());
    ApiException unrecorded = Durable.failure(s.durable());
    if (unrecorded != null) {
      unrecorded.headers().forEach(ctx::header);
      responses.problem(ctx, unrecorded.error(), asText, null);
      return;
    }
    if (asText) { // the line the document would hold: never a markup string, so an inference server can splice it as is
      String line = s.line() == null ? "" : s.line();
      if (!s.isOk()) {
        ctx.header(Responses.ERROR_CODE_HEADER, s.outcome().error().get().code().wireName());
      }
      ctx.header(Responses.INVOCATION_ID_HEADER, s.outcome().invocationId());
      responses.text(ctx, s.isOk() ? 200 : Problem.status(s.outcome().error().get().code()), line);
      return;
    }
    if (!s.isOk()) {
      ObjectNode problem = responses.problemBody(s.outcome().error().get(), s.outcome().invocationId());
      problem.put("call", s.call().toString());
      problem.put("spliced", s.spliced());
      if (s.replayed()) {
        problem.put("replayed", true);
      }
      ctx.header(Responses.ERROR_CODE_HEADER, s.outcome().error().get().code().wireName());
      ctx.status(Problem.status(s.outcome().error().get().code())).contentType(MediaTypes.PROBLEM)
          .result(responses.json().writeValueAsBytes(problem));
      return;
    }
    ObjectNode body = ResultJson.outcome(responses.object(), null, s.outcome());
    body.put("call", s.call().toString());
    body.put("spliced", s.spliced());
    if (s.replayed()) {
      body.put("replayed", true);
    }
    responses.json(ctx, 200, body);
  }

  /** Body: {@code {"document":"...","markup":{...},"on_error":"splice_error"}}, or the document as text/plain. */
  void fill(Context ctx) {
    boolean asText = MediaTypes.wantsText(ctx.header("Accept"));
    Request r = read(ctx, "document");
    Filler.Tags tags = tags(ctx);
    Caller caller = Access.caller(ctx);
    String key = Retries.key(ctx);
    int calls = Filler.countCalls(r.text, r.markup);
    Filler.Filled filled;
    try (Retries.Running running = key == null ? null : retries.begin(caller, key)) {
      Map<String, reckoner.ledger.Invocation> before = Map.of();
      if (key != null) {
        tags = tags.withIdempotency(key, Retries.hash("fill", r.text, r.markup, r.onError, tags.run(), tags.ref(), tags.asOf()));
        before = retries.recordedUnder(caller, key, calls + 1);
        requireSameRequest(before, tags.requestHash());
      }
      access.takeOrRefuse(caller, Math.max(1, calls - before.size())); // each call counts; a replayed one is free
      filled = filler.fill(r.text, r.markup, r.onError, tags, replay(before, tags));
      Filler.Tags keyed = tags;
      filled.calls().forEach(c -> remember(keyed, caller, c));
    }
    filled.calls().forEach(c -> metrics.record(c.outcome()));
    Durable.await(filled.durable()); // a fill is acknowledged whole, or not at all
    if (!filled.calls().isEmpty() && filled.calls().stream().allMatch(Filler.Spliced::replayed)) {
      ctx.header(Retries.REPLAYED_HEADER, "true");
    }
    if (asText) {
      responses.text(ctx, 200, filled.document());
      return;
    }
    ObjectNode body = ResultJson.filled(responses.object(), filled);
    responses.json(ctx, 200, body);
  }

  private record Request(String text, Markup markup, OnError onError) {}

  private Request read(Context ctx, String field) {
    String type = MediaTypes.baseType(ctx.contentType());
    MediaTypes.requireUtf8(ctx.contentType());
    byte[] bytes = bodies.read(ctx);
    if (type.equals("text/plain")) {
      return new Request(Bodies.utf8(bytes), serverMarkup, OnError.SPLICE_ERROR);
    }
    if (!type.equals(MediaTypes.JSON)) {
      throw new ApiException(ErrorCode.UNSUPPORTED_MEDIA_TYPE, "send application/json, or text/plain for the bare "
          + field + ", not " + (type.isEmpty() ? "no Content-Type" : MediaTypes.clip(type)));
    }
    JsonNode body;
    Bodies.requireUtf8(bytes);
    try {
      body = responses.json().readTree(bytes);
    } catch (JacksonException e) {
      throw new ApiException(ErrorCode.INVALID_ARGUMENT, "the body is not valid JSON: " + Bodies.describe(e));
    }
    if (body == null || !body.isObject() || !body.path(field).isString()) {
      throw new ApiException(ErrorCode.INVALID_ARGUMENT, "the body must be an object with \"" + field + "\", a string");
    }
    for (String name : body.propertyNames()) {
      if (!name.equals(field) && !name.equals("markup") && !(name.equals("on_error") && field.equals("document"))) {
        throw new ApiException(ErrorCode.INVALID_ARGUMENT, "unknown field '" + MediaTypes.clip(name) + "'");
      }
    }
    return new Request(body.get(field).stringValue(), markup(body.get("markup")), onError(body.get("on_error")));
  }

  private Markup markup(JsonNode node) {
    if (node == null || node.isNull()) {
      return serverMarkup;
    }
    if (!node.isObject()) {
      throw new ApiException(ErrorCode.INVALID_ARGUMENT, "markup must be an object {\"open\",\"separator\",\"close\"}");
    }
    for (String name : node.propertyNames()) {
      if (!name.equals("open") && !name.equals("separator") && !name.equals("close")) {
        throw new ApiException(ErrorCode.INVALID_ARGUMENT, "unknown markup field '" + MediaTypes.clip(name) + "'; known: open, separator, close");
      }
      if (!node.get(name).isString()) {
        throw new ApiException(ErrorCode.INVALID_ARGUMENT, "markup." + name + " must be a string");
      }
    }
    try {
      return new Markup(text(node, "open", serverMarkup.open()), text(node, "separator", serverMarkup.separator()),
          text(node, "close", serverMarkup.close()));
    } catch (IllegalArgumentException e) {
      throw new ApiException(ErrorCode.INVALID_ARGUMENT, "markup: " + e.getMessage());
    }
  }

  private static String text(JsonNode node, String field, String fallback) {
    return Optional.ofNullable(node.get(field)).map(JsonNode::stringValue).orElse(fallback);
  }

  private static OnError onError(JsonNode node) {
    if (node == null || node.isNull()) {
      return OnError.SPLICE_ERROR;
    }
    return OnError.parse(node.isString() ? node.stringValue() : "").orElseThrow(() ->
        new ApiException(ErrorCode.INVALID_ARGUMENT, "on_error must be splice_error, drop or keep"));
  }

  private static Filler.Tags tags(Context ctx) {
    return new Filler.Tags(ToolRoutes.tag(ctx, ToolRoutes.RUN_HEADER), ToolRoutes.tag(ctx, ToolRoutes.REF_HEADER),
        ToolRoutes.tag(ctx, ToolRoutes.AS_OF_HEADER), Access.caller(ctx).keyIdOrNull());
  }
}
