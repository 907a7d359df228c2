package reckoner.http;

import io.javalin.http.Context;
import java.util.OptionalInt;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.call.Recorded;
import reckoner.ledger.Invocation;
import java.util.List;
import reckoner.spec.ToolCatalog;
import reckoner.spec.ToolSpec;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolId;
import tools.jackson.core.JacksonException;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;

/** The tool endpoints: list, describe, invoke. */
final class ToolRoutes {
  static final String RUN_HEADER = "Reckoner-Run";
  static final String REF_HEADER = "Reckoner-Ref";
  static final String AS_OF_HEADER = "Reckoner-As-Of";
  /** Longest run or ref tag accepted, in characters. */
  static final int MAX_TAG_LENGTH = 200;

  private final Invoker invoker;
  private final Responses responses;
  private final CallMetrics metrics;
  private final Bodies bodies;
  private final Access access;
  private final Retries retries;

  ToolRoutes(Invoker invoker, Responses responses, CallMetrics metrics, Bodies bodies, Access access, Retries retries) {
    this.invoker = invoker;
    this.responses = responses;
    this.metrics = metrics;
    this.bodies = bodies;
    this.access = access;
    this.retries = retries;
  }

  void list(Context ctx) {
    ToolCatalog catalog = invoker.catalog();
    ObjectNode body = responses.object();
    ArrayNode tools = body.putArray("tools");
    for (ToolCatalog.Entry e : catalog.all()) {
      ToolId id = e.tool().id();
      ObjectNode t = tools.addObject();
      t.put("id", id.toString());
      t.put("name", id.name());
      t.put("version", id.version());
      t.put("default", catalog.newest(id.name()).map(n -> n.tool().id().equals(id)).orElse(false));
      t.put("summary", e.spec().summary());
      t.put("text_form", e.spec().textForm());
      t.put("spec", "/v1/tools/" + id.name() + "/" + id.version());
      t.put("invoke", "/v1/tools/" + id.name() + "/" + id.version() + "/invoke");
    }
    responses.json(ctx, 200, body);
  }

  void describe(Context ctx) {
    ToolId id = toolId(ctx);
    ToolSpec spec = invoker.catalog().find(id).map(ToolCatalog.Entry::spec)
        .orElseThrow(() -> unknownTool(id));
    responses.json(ctx, 200, spec.document());
  }

  void invoke(Context ctx) {
    boolean asText = MediaTypes.wantsText(ctx.header("Accept"));
    ToolId id;
    try {
      id = toolId(ctx);
    } catch (ApiException e) {
      responses.problem(ctx, e.error(), asText, null);
      return;
    }
    JsonNode args = readArguments(ctx);
    Caller caller = Access.caller(ctx);
    CallRequest request = new CallRequest(id.name(), OptionalInt.of(id.version()), args,
        tag(ctx, AS_OF_HEADER), tag(ctx, RUN_HEADER), tag(ctx, REF_HEADER), caller.keyIdOrNull());
    String key = Retries.key(ctx);
    if (key == null) {
      access.takeOrRefuse(caller, 1);
      run(ctx, request, asText);
      return;
    }
    // One call named by the key: answered from its record when sent again, run once otherwise.
    String hash = Retries.hash("invoke", id, args, request.asOf(), request.run(), request.ref());
    try (Retries.Running running = retries.begin(caller, key)) {
      Invocation before = retries.recorded(caller, List.of(key)).get(key);
      if (before != null) {
        Retries.requireSameRequest(before, hash);
        reply(ctx, before.toOutcome(), asText, true);
        return;
      }
      access.takeOrRefuse(caller, 1);
      CallRequest keyed = request.withIdempotency(key, hash);
      Recorded recorded = run(ctx, keyed, asText);
      if (recorded != null) {
        retries.remember(Invocation.of(keyed, recorded.outcome(), caller.keyId(), recorded.outcome().cached()));
      }
    }
  }

  /** Runs the call and answers it; returns what was recorded, or null when the ledger could not take it. */
  private Recorded run(Context ctx, CallRequest request, boolean asText) {
    Recorded recorded = invoker.callHere(request); // the answer waits for its record right below
    Outcome outcome = recorded.outcome();
    metrics.record(outcome);
    if (request.idempotencyKey() != null && Durable.superseded(recorded.durable())) {
      // A retry of this call raced it on another replica and was recorded first: answer with that record.
      Invocation winner = retries.recorded(Access.caller(ctx), List.of(request.idempotencyKey())).get(request.idempotencyKey());
      if (winner != null) {
        reply(ctx, winner.toOutcome(), asText, true);
        return null;
      }
    }
    ApiException unrecorded = Durable.failure(recorded.durable());
    if (unrecorded != null) {
      unrecorded.headers().forEach(ctx::header);
      responses.problem(ctx, unrecorded.error(), asText, null);
      return null;
    }
    reply(ctx, outcome, asText, false);
    return recorded;
  }

  private void reply(Context ctx, Outcome outcome, boolean asText, boolean replayed) {
    if (replayed) {
      ctx.header(Retries.REPLAYED_HEADER, "true");
    }
    if (outcome.isOk()) {
      answer(ctx, outcome, asText, replayed);
    } else if (replayed && !asText) {
      ObjectNode problem = responses.problemBody(outcome.error().get(), outcome.invocationId());
      problem.put("replayed", true);
      ctx.header(Responses.ERROR_CODE_HEADER, outcome.error().get().code().wireName());
      ctx.header(Responses.INVOCATION_ID_HEADER, outcome.invocationId());
      ctx.status(Problem.status(outcome.error().get().code())).contentType(MediaTypes.PROBLEM)
          .result(responses.json().writeValueAsBytes(problem));
    } else {
      responses.problem(ctx, outcome.error().get(), asText, outcome.invocationId());
    }
  }

  private void answer(Context ctx, Outcome outcome, boolean asText, boolean replayed) {
    Answer answer = outcome.answer().get();
    ctx.header(Responses.INVOCATION_ID_HEADER, outcome.invocationId());
    if (asText) {
      responses.text(ctx, 200, answer.text());
      return;
    }
    ObjectNode body = responses.object();
    ToolId id = outcome.tool().get();
    body.put("tool", id.name());
    body.put("version", id.version());
    body.put("text", answer.text());
    body.put("cached", outcome.cached());
    body.put("invocation_id", outcome.invocationId());
    answer.dataVersion().ifPresent(v -> body.put("data_version", v));
    answer.clockReadAt().ifPresent(t -> body.put("as_of", t.toString()));
    answer.note().ifPresent(n -> body.put("reading", n));
    if (replayed) {
      body.put("replayed", true);
    }
    responses.json(ctx, 200, body);
  }

  /** JSON arguments, or with {@code Content-Type: text/plain} the body as the free-text form. */
  private JsonNode readArguments(Context ctx) {
    String type = MediaTypes.baseType(ctx.contentType());
    MediaTypes.requireUtf8(ctx.contentType());
    byte[] body = bodies.read(ctx);
    switch (type) {
      case "application/json":
        if (body.length == 0) {
          throw new ApiException(ErrorCode.INVALID_ARGUMENT, "the request body is empty; send the arguments as a JSON object");
        }
        Bodies.requireUtf8(body);
        try {
          return responses.json().readTree(body);
        } catch (JacksonException e) {
          throw new ApiException(ErrorCode.INVALID_ARGUMENT, "the body is not valid JSON: " + Bodies.describe(e));
        }
      case "text/plain":
        String text = Bodies.utf8(body);
        ObjectNode args = responses.object();
        args.put(Arguments.TEXT, text.strip());
        return args;
      case "":
        throw new ApiException(ErrorCode.UNSUPPORTED_MEDIA_TYPE,
            "missing Content-Type: send application/json arguments, or text/plain for the text form");
      default:
        throw new ApiException(ErrorCode.UNSUPPORTED_MEDIA_TYPE,
            "Content-Type " + MediaTypes.clip(type) + " is not accepted: send application/json, or text/plain for the text form");
    }
  }

  static String tag(Context ctx, String header) {
    String v = ctx.header(header);
    if (v == null) {
      return null;
    }
    if (v.length() > MAX_TAG_LENGTH || v.isEmpty() || !v.chars().allMatch(c -> c >= 0x20 && c < 0x7f)) {
      throw new ApiException(ErrorCode.INVALID_ARGUMENT,
          header + " must be 1 to " + MAX_TAG_LENGTH + " printable ASCII characters");
    }
    return v;
  }

  private ToolId toolId(Context ctx) {
    String name = ctx.pathParam("name");
    String version = ctx.pathParam("version");
    if (!ToolId.isValidName(name)) {
      throw new ApiException(ErrorCode.UNKNOWN_TOOL, "no tool named '" + MediaTypes.clip(name) + "'");
    }
    try {
      return ToolId.of(name, ToolId.parseVersion(version));
    } catch (IllegalArgumentException e) {
      throw new ApiException(ErrorCode.UNKNOWN_TOOL,
          "version must be a positive whole number, as in /v1/tools/" + name + "/1, but was '" + MediaTypes.clip(version) + "'");
    }
  }

  private ApiException unknownTool(ToolId id) {
    return new ApiException(ErrorCode.UNKNOWN_TOOL, "no tool " + id + "; served versions of '" + id.name() + "': "
        + invoker.catalog().versions(id.name()));
  }
}
