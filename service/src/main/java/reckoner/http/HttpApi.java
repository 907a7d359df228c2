package reckoner.http;

import io.javalin.Javalin;
import io.javalin.http.Context;
import io.javalin.http.HttpResponseException;
import io.javalin.http.Handler;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.ExecutorService;
import java.util.function.BooleanSupplier;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import reckoner.access.KeyStore;
import reckoner.access.RateLimits;
import reckoner.access.StreamLimits;
import reckoner.call.Invoker;
import reckoner.config.ServiceConfig;
import reckoner.facts.FactStore;
import reckoner.ledger.LedgerStore;
import reckoner.search.SearchStore;
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

  /** What the routes need, made by {@code Service}. */
  public record Settings(long maxBodyBytes, long maxBatchBytes, Markup markup, ObjectNode openApi, BooleanSupplier ready,
      ExecutorService callExecutor, FactStore facts, LedgerStore ledger, SearchStore search, KeyStore keys, RateLimits rates,
      StreamLimits streams, ServiceConfig.Bounds bounds, String build) {}

  /** One route: method, path, what it needs of its caller, and its handler. */
  record Route(String method, String path, Need need, Handler handler) {}

  /** A route as the outside sees it: method, path, and the scope it needs ({@code open} for none). */
  public record RouteInfo(String method, String path, String scope) {}

  /**
   * The server, not yet started, the routes it serves, and how to drain its NDJSON streams before it
   * stops: they read no further lines, answer what they read, and write their trailers; the function
   * returns the streams still open after the time given.
   */
  public record Built(Javalin app, List<RouteInfo> routes, java.util.function.ToIntFunction<java.time.Duration> drain) {}

  private HttpApi() {}

  public static Built create(Invoker invoker, Monitoring monitoring, JsonMapper json, Settings settings) {
    Responses responses = new Responses(json);
    Access access = new Access(settings.keys(), settings.rates(), settings.streams());
    Bodies bodies = new Bodies(settings.maxBodyBytes());
    CallMetrics callMetrics = monitoring.calls();
    Retries retries = new Retries(settings.ledger());
    ToolRoutes tools = new ToolRoutes(invoker, responses, callMetrics, bodies, access, retries);
    BatchRoutes batch = new BatchRoutes(invoker, responses, callMetrics, new Bodies(settings.maxBatchBytes()),
        settings.callExecutor(), access, retries, settings.bounds().maxBatchCalls());
    FactsRoutes facts = new FactsRoutes(settings.facts(), responses);
    KeysRoutes keys = new KeysRoutes(settings.keys(), responses);
    LedgerRoutes ledger = new LedgerRoutes(settings.ledger(), responses,
        () -> new reckoner.audit.Audit(invoker.catalog(), json), settings.build());
    SearchRoutes search = new SearchRoutes(settings.search(), responses);
    // The monitoring routes' handlers exist once the tracker is installed in the configuration below.
    java.util.concurrent.atomic.AtomicReference<Monitoring.Handlers> watch = new java.util.concurrent.atomic.AtomicReference<>();
    SpliceRoutes splice = new SpliceRoutes(new Filler(invoker), responses, callMetrics, new Bodies(settings.maxBatchBytes()),
        settings.markup(), access, retries);
    java.util.concurrent.atomic.AtomicReference<byte[]> openApi = new java.util.concurrent.atomic.AtomicReference<>();
    // Every route, with what it needs of its caller: the one table the server, its OpenAPI document
    // and the access tests read.
    List<Route> routes = List.of(
        new Route("GET", "/v1/tools", Need.OPEN, tools::list),
        new Route("GET", "/v1/tools/{name}/{version}", Need.OPEN, tools::describe),
        new Route("POST", "/v1/tools/{name}/{version}/invoke", Need.INVOKE, tools::invoke),
        new Route("POST", "/v1/batch", Need.INVOKE, batch::batch),
        new Route("POST", "/v1/splice", Need.INVOKE, splice::splice),
        new Route("POST", "/v1/fill", Need.INVOKE, splice::fill),
        new Route("GET", "/v1/invocations", Need.LEDGER_READ, ledger::query),
        new Route("GET", "/v1/invocations/export", Need.LEDGER_READ, ledger::export),
        new Route("POST", "/v1/admin/audit", Need.ADMIN, ledger::audit),
        new Route("GET", "/v1/admin/facts", Need.ADMIN, facts::show),
        new Route("POST", "/v1/admin/facts/reload", Need.ADMIN, facts::reload),
        new Route("GET", "/v1/admin/keys", Need.ADMIN, keys::show),
        new Route("POST", "/v1/admin/keys/reload", Need.ADMIN, keys::reload),
        new Route("GET", "/v1/admin/search", Need.ADMIN, search::show),
        new Route("POST", "/v1/admin/search/reload", Need.ADMIN, search::reload),
        new Route("GET", "/status", Need.ADMIN, ctx -> watch.get().status().handle(ctx)),
        new Route("GET", "/status.json", Need.ADMIN, ctx -> watch.get().statusJson().handle(ctx)),
        new Route("GET", "/openapi.json", Need.OPEN, ctx -> ctx.contentType(MediaTypes.JSON).result(openApi.get())),
        new Route("GET", "/health/live", Need.OPEN, ctx -> responses.json(ctx, 200, responses.object().put("status", "up"))),
        new Route("GET", "/health/ready", Need.OPEN, ctx -> ready(ctx, responses, settings.ready())),
        new Route("GET", "/metrics", Need.OPEN, ctx -> watch.get().metrics().handle(ctx)),
        new Route("GET", "/problems/{code}", Need.OPEN, ctx -> problemType(ctx, responses)));

    java.util.concurrent.atomic.AtomicReference<Javalin> started = new java.util.concurrent.atomic.AtomicReference<>();
    Javalin app = Javalin.create(config -> {
      config.startup.showJavalinBanner = false;
      watch.set(monitoring.install(config, responses)); // request ids, HTTP metrics, access log, status history
      config.http.maxRequestSize = Math.max(settings.maxBodyBytes(), settings.maxBatchBytes());
      config.http.prefer405over404 = true;
      config.router.ignoreTrailingSlashes = true;
      config.jetty.modifyHttpConfiguration(http -> http.setRequestHeaderSize(settings.bounds().maxHeaderBytes()));
      config.jetty.modifyServer(server -> server.setErrorHandler(new JettyErrors(responses)));
      config.events.serverStarted(() -> idleTimeout(started.get(), settings.bounds().httpIdleTimeoutMillis()));

      config.routes.beforeMatched(access::check);
      for (Route r : routes) {
        switch (r.method()) {
          case "GET" -> config.routes.get(r.path(), r.handler(), r.need());
          case "POST" -> config.routes.post(r.path(), r.handler(), r.need());
          default -> throw new IllegalStateException("no such method in the route table: " + r.method());
        }
      }

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
    List<RouteInfo> infos = routes.stream().map(r -> new RouteInfo(r.method(), r.path(),
        r.need().scope().map(reckoner.access.Scope::wireName).orElse("open"))).toList();
    started.set(app);
    ObjectNode document = settings.openApi().deepCopy();
    OpenApiSecurity.document(document, infos, settings.keys() != null);
    openApi.set(json.writeValueAsBytes(document));
    return new Built(app, infos, batch::drain);
  }

  /** Closes connections that stay silent this long (slow or stalled clients); set once the connectors exist. */
  private static void idleTimeout(Javalin app, long millis) {
    for (org.eclipse.jetty.server.Connector c : app.jettyServer().server().getConnectors()) {
      if (c instanceof org.eclipse.jetty.server.AbstractConnector connector) {
        connector.setIdleTimeout(millis);
      }
    }
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
