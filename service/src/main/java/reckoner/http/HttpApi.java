package reckoner.http;

import io.javalin.Javalin;
import io.javalin.http.Context;
import io.javalin.http.HttpResponseException;
import java.util.Arrays;
import java.util.Optional;
import java.util.concurrent.ExecutorService;
import java.util.function.BooleanSupplier;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import reckoner.call.Invoker;
import reckoner.facts.FactStore;
import reckoner.ledger.LedgerStore;
import reckoner.splice.Filler;
import reckoner.splice.Markup;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolError;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;

/**
 * The HTTP surface: every route in {@link #create}, every error mapped to one problem shape in
 * one place. No stack trace ever reaches a caller.
 */
public final class HttpApi {
  private static final Logger LOG = LoggerFactory.getLogger(HttpApi.class);

  /** What the routes need, made by {@code Main}. */
  public record Settings(long maxBodyBytes, long maxBatchBytes, Markup markup, ObjectNode openApi, BooleanSupplier ready,
      ExecutorService callExecutor, FactStore facts, LedgerStore ledger) {}

  private HttpApi() {}

  public static Javalin create(Invoker invoker, Monitoring monitoring, JsonMapper json, Settings settings) {
    Responses responses = new Responses(json);
    Bodies bodies = new Bodies(settings.maxBodyBytes());
    CallMetrics callMetrics = monitoring.calls();
    ToolRoutes tools = new ToolRoutes(invoker, responses, callMetrics, bodies);
    BatchRoutes batch = new BatchRoutes(invoker, responses, callMetrics, new Bodies(settings.maxBatchBytes()),
        settings.callExecutor());
    FactsRoutes facts = new FactsRoutes(settings.facts(), responses);
    LedgerRoutes ledger = new LedgerRoutes(settings.ledger(), responses);
    SpliceRoutes splice = new SpliceRoutes(new Filler(invoker), responses, callMetrics, new Bodies(settings.maxBatchBytes()),
        settings.markup());
    byte[] openApi = json.writeValueAsBytes(settings.openApi());

    return Javalin.create(config -> {
      config.startup.showJavalinBanner = false;
      config.http.maxRequestSize = Math.max(settings.maxBodyBytes(), settings.maxBatchBytes());
      config.http.prefer405over404 = true;
      config.router.ignoreTrailingSlashes = true;
      monitoring.install(config, responses); // request ids, HTTP metrics, access log; /metrics, /status, /status.json

      config.routes.get("/v1/tools", tools::list);
      config.routes.get("/v1/tools/{name}/{version}", tools::describe);
      config.routes.post("/v1/tools/{name}/{version}/invoke", tools::invoke);
      config.routes.post("/v1/batch", batch::batch);
      config.routes.post("/v1/splice", splice::splice);
      config.routes.post("/v1/fill", splice::fill);
      config.routes.get("/openapi.json", ctx -> ctx.contentType(MediaTypes.JSON).result(openApi));
      config.routes.get("/health/live", ctx -> responses.json(ctx, 200, responses.object().put("status", "up")));
      config.routes.get("/health/ready", ctx -> ready(ctx, responses, settings.ready()));
      config.routes.get("/v1/invocations", ledger::query);
      config.routes.get("/v1/invocations/export", ledger::export);
      config.routes.get("/v1/admin/facts", facts::show);
      config.routes.post("/v1/admin/facts/reload", facts::reload);
      config.routes.get("/problems/{code}", ctx -> problemType(ctx, responses));

      config.routes.exception(ApiException.class, (e, ctx) -> responses.problem(ctx, e.error(), e.headers()));
      config.routes.exception(HttpResponseException.class, (e, ctx) -> httpProblem(ctx, responses, e.getStatus(), e.getMessage()));
      config.routes.exception(Exception.class, (e, ctx) -> {
        LOG.error("unhandled failure on {} {}", ctx.method(), ctx.path(), e);
        responses.problem(ctx, ToolError.of(ErrorCode.INTERNAL_ERROR, "the server failed unexpectedly; the failure is logged"),
            java.util.Map.of());
      });
      config.routes.error(404, ctx -> {
        if (ctx.resultInputStream() == null) { // a route's own 404 (unknown tool) already has its body
          responses.problem(ctx, ToolError.of(ErrorCode.UNKNOWN_ENDPOINT,
              "no endpoint " + ctx.method() + " " + MediaTypes.clip(ctx.path()) + "; see GET /openapi.json"), java.util.Map.of());
        }
      });
    });
  }

  private static void ready(Context ctx, Responses responses, BooleanSupplier ready) {
    boolean ok = ready.getAsBoolean();
    responses.json(ctx, ok ? 200 : 503, responses.object().put("status", ok ? "ready" : "not_ready"));
  }

  private static void problemType(Context ctx, Responses responses) {
    String wire = ctx.pathParam("code");
    Optional<ErrorCode> code = Arrays.stream(ErrorCode.values()).filter(c -> c.wireName().equals(wire)).findFirst();
    if (code.isEmpty()) {
      throw new ApiException(ErrorCode.UNKNOWN_ENDPOINT, "no problem type '" + MediaTypes.clip(wire) + "'");
    }
    ObjectNode body = responses.object();
    body.put("code", code.get().wireName());
    body.put("title", Problem.title(code.get()));
    body.put("status", Problem.status(code.get()));
    responses.json(ctx, 200, body);
  }

  private static void httpProblem(Context ctx, Responses responses, int status, String message) {
    ErrorCode code = switch (status) {
      case 404 -> ErrorCode.UNKNOWN_ENDPOINT;
      case 405 -> ErrorCode.METHOD_NOT_ALLOWED;
      case 406 -> ErrorCode.NOT_ACCEPTABLE;
      case 413 -> ErrorCode.PAYLOAD_TOO_LARGE;
      case 415 -> ErrorCode.UNSUPPORTED_MEDIA_TYPE;
      default -> status >= 500 ? ErrorCode.INTERNAL_ERROR : ErrorCode.INVALID_ARGUMENT;
    };
    String detail = switch (code) {
      case METHOD_NOT_ALLOWED -> "method " + ctx.method() + " is not allowed on " + MediaTypes.clip(ctx.path());
      case UNKNOWN_ENDPOINT -> "no endpoint " + ctx.method() + " " + MediaTypes.clip(ctx.path()) + "; see GET /openapi.json";
      default -> MediaTypes.clip(message == null ? Problem.title(code) : message);
    };
    responses.problem(ctx, ToolError.of(code, detail), java.util.Map.of());
  }
}
