package reckoner.http;

import io.javalin.config.JavalinConfig;
import io.javalin.http.Context;
import io.javalin.router.Endpoint;
import io.micrometer.core.instrument.Counter;
import io.micrometer.core.instrument.Gauge;
import io.micrometer.core.instrument.MeterRegistry;
import io.micrometer.core.instrument.Timer;
import java.util.Locale;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ThreadLocalRandom;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.regex.Pattern;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.slf4j.MDC;

/**
 * What every HTTP request leaves behind, whatever its route and outcome: a request id (the
 * caller's {@code X-Request-Id} when it is sane, else a new one, echoed in the response and put in
 * the logging context as {@code request_id}), the HTTP metrics
 * ({@code reckoner_http_requests_total{method,route,status}} by status class,
 * {@code reckoner_http_problems_total{route,status,code}} for every refusal by its stable code,
 * {@code reckoner_http_request_duration_seconds{method,route}} and
 * {@code reckoner_http_requests_in_flight}), and, when turned on, one access log line.
 *
 * <p>Labels stay bounded: a route is the matched route's template ({@code /v1/tools/{name}/...}),
 * or {@code unmatched}; never the raw path. The access log holds the method, route, path, status,
 * error code, duration, body size and peer address; never a header's value (an
 * {@code Authorization} header stays out), a query string or a body. Thread-safe.
 */
final class RequestTracker {
  static final String REQUEST_ID_HEADER = "X-Request-Id";
  private static final Logger ACCESS = LoggerFactory.getLogger("reckoner.access");
  private static final Logger LOG = LoggerFactory.getLogger(RequestTracker.class);
  private static final Pattern SANE_ID = Pattern.compile("[A-Za-z0-9._:+=/-]{1,128}");
  private static final String STARTED = "reckoner.started-nanos";
  private static final String ID = "reckoner.request-id";
  private static final java.util.Set<String> KNOWN_METHODS =
      java.util.Set.of("GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS");

  /** The HTTP request time histogram's upper bounds, in seconds: 100 µs to 30 s (batches stream for long). */
  static final double[] REQUEST_BUCKETS = {
      0.000_100, 0.000_250, 0.000_500, 0.001, 0.002_5, 0.005, 0.010, 0.025, 0.050, 0.100,
      0.250, 0.500, 1.0, 2.5, 5.0, 10.0, 30.0};

  private record Route(String method, String route) {}

  private record Answered(Route route, int statusClass) {}

  private record Problem(String route, int status, String code) {}

  private final MeterRegistry registry;
  private final boolean accessLog;
  private final AtomicInteger inFlight = new AtomicInteger();
  private final ConcurrentHashMap<Answered, Counter> requests = new ConcurrentHashMap<>();
  private final ConcurrentHashMap<Route, Timer> durations = new ConcurrentHashMap<>();
  private final ConcurrentHashMap<Problem, Counter> problems = new ConcurrentHashMap<>();

  RequestTracker(MeterRegistry registry, boolean accessLog) {
    this.registry = registry;
    this.accessLog = accessLog;
    Gauge.builder("reckoner.http.requests.in.flight", inFlight, AtomicInteger::get)
        .description("HTTP requests being answered now").register(registry);
  }

  /** Registers the tracker: a before-handler for every request and a request logger after it. */
  void install(JavalinConfig config) {
    config.routes.before(this::begin);
    config.requestLogger.http(this::end);
  }

  /** HTTP requests being answered now. */
  int inFlight() {
    return inFlight.get();
  }

  /** The request id of {@code ctx}: the caller's, if sane, else a new one (32 hex digits). */
  static String requestId(String offered) {
    if (offered != null && SANE_ID.matcher(offered).matches()) {
      return offered;
    }
    ThreadLocalRandom random = ThreadLocalRandom.current();
    return String.format(Locale.ROOT, "%016x%016x", random.nextLong(), random.nextLong());
  }

  private void begin(Context ctx) {
    if (ctx.attribute(STARTED) != null) {
      return; // before-handlers run once per request; guard against a re-dispatch all the same
    }
    ctx.attribute(STARTED, System.nanoTime());
    inFlight.incrementAndGet();
    String id = requestId(ctx.header(REQUEST_ID_HEADER));
    ctx.attribute(ID, id);
    ctx.header(REQUEST_ID_HEADER, id);
    MDC.put("request_id", id);
  }

  private void end(Context ctx, Float millis) {
    try {
      Long started = ctx.attribute(STARTED);
      long nanos = started == null ? (long) (millis * 1e6) : System.nanoTime() - started;
      if (started != null) {
        inFlight.decrementAndGet();
      }
      String route = route(ctx);
      int status = ctx.statusCode();
      String code = ctx.res().getHeader(Responses.ERROR_CODE_HEADER);
      record(new Route(method(ctx), route), status, code, nanos);
      if (accessLog) {
        String id = ctx.attribute(ID);
        if (id != null) {
          MDC.put("request_id", id); // the logger may run on another thread than the handler
        }
        ACCESS.atInfo()
            .addKeyValue("method", method(ctx))
            .addKeyValue("route", route)
            .addKeyValue("path", MediaTypes.clip(ctx.path()))
            .addKeyValue("status", status)
            .addKeyValue("code", code)
            .addKeyValue("duration_ms", Math.round(nanos / 1e3) / 1e3)
            .addKeyValue("bytes_in", Math.max(0, ctx.req().getContentLengthLong()))
            .addKeyValue("peer", ctx.ip())
            .log("{} {} {}", method(ctx), MediaTypes.clip(ctx.path()), status);
      }
    } catch (RuntimeException e) {
      LOG.warn("request metrics failed; the request is unaffected", e); // an observer never breaks a request
    } finally {
      MDC.remove("request_id");
    }
  }

  /** The method as a label: one of the standard ones, else {@code other}, so that labels stay bounded. */
  private static String method(Context ctx) {
    String m = ctx.method().name();
    return KNOWN_METHODS.contains(m) ? m : "other";
  }

  private static String route(Context ctx) {
    Endpoint endpoint = ctx.endpoints().matchedHttpEndpoint();
    return endpoint == null ? "unmatched" : endpoint.path;
  }

  private void record(Route route, int status, String code, long nanos) {
    int kind = status / 100;
    if (kind < 1 || kind > 5) {
      kind = 5;
    }
    requests.computeIfAbsent(new Answered(route, kind), a -> Counter.builder("reckoner.http.requests")
        .description("HTTP requests answered, by route and status class")
        .tags("method", a.route().method(), "route", a.route().route(), "status", a.statusClass() + "xx")
        .register(registry)).increment();
    durations.computeIfAbsent(route, r -> Timer.builder("reckoner.http.request.duration")
        .description("Time to answer one HTTP request, from its first byte read to its last byte written")
        .tags("method", r.method(), "route", r.route())
        .serviceLevelObjectives(CallMetrics.durations(REQUEST_BUCKETS))
        .register(registry)).record(nanos, TimeUnit.NANOSECONDS);
    if (code != null && status >= 400) {
      problems.computeIfAbsent(new Problem(route.route(), status, code), p -> Counter.builder("reckoner.http.problems")
          .description("HTTP requests refused with a problem answer, by status and stable error code")
          .tags("route", p.route(), "status", Integer.toString(p.status()), "code", p.code())
          .register(registry)).increment();
    }
  }
}
