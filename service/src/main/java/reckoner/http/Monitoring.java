package reckoner.http;

import com.github.benmanes.caffeine.cache.Cache;
import io.javalin.config.JavalinConfig;
import io.javalin.http.Context;
import io.javalin.http.Handler;
import io.micrometer.prometheusmetrics.PrometheusMeterRegistry;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.util.Objects;
import reckoner.ledger.LedgerStats;

/**
 * What ops staff watch, as HTTP: the request tracker (request ids, HTTP metrics, access log),
 * {@code GET /metrics} (Prometheus text, or OpenMetrics when the scraper asks for it),
 * {@code GET /status} and {@code GET /status.json}. Made by the wiring, installed by
 * {@link HttpApi#create}. Thread-safe.
 */
public final class Monitoring {
  /**
   * What the status page says of the process.
   *
   * @param version the service's version
   * @param instance which process this is: its host name (a pod name on Kubernetes)
   * @param ledgerBackend {@code sqlite} or {@code postgresql}
   * @param started when the process started
   */
  public record About(String version, String instance, String ledgerBackend, Instant started) {
    public About {
      Objects.requireNonNull(version, "version");
      Objects.requireNonNull(instance, "instance");
      Objects.requireNonNull(ledgerBackend, "ledgerBackend");
      Objects.requireNonNull(started, "started");
    }
  }

  static final String OPENMETRICS = "application/openmetrics-text";
  private static final String OPENMETRICS_TYPE = "application/openmetrics-text; version=1.0.0; charset=utf-8";
  private static final String PROMETHEUS_TYPE = "text/plain; version=0.0.4; charset=utf-8";

  private final PrometheusMeterRegistry registry;
  private final CallMetrics calls;
  private final RequestTracker requests;
  private final StatusHistory history;
  private final About about;
  private final Clock clock;

  /**
   * @param cache the answer cache, or null when caching is off
   * @param accessLog whether every request is logged as one line
   */
  public Monitoring(PrometheusMeterRegistry registry, LedgerStats ledger, Cache<?, ?> cache, About about, boolean accessLog,
      Clock clock) {
    this.registry = registry;
    this.calls = new CallMetrics(registry);
    this.requests = new RequestTracker(registry, accessLog);
    this.history = new StatusHistory(calls, ledger, cache, clock, Duration.ofSeconds(5), Duration.ofMinutes(15));
    this.about = about;
    this.clock = clock;
  }

  /** HTTP requests being answered now (for the shutdown's account of what it drains). */
  public int requestsInFlight() {
    return requests.inFlight();
  }

  CallMetrics calls() {
    return calls;
  }

  /** The handlers of the monitoring routes, which the route table places with what each needs. */
  record Handlers(Handler metrics, Handler status, Handler statusJson) {}

  /** Registers the request tracker, samples for the status page until the server stops, and returns the routes' handlers. */
  Handlers install(JavalinConfig config, Responses responses) {
    requests.install(config);
    StatusPage page = new StatusPage(history, about, responses, clock);
    history.start();
    config.events.serverStopped(history::stop);
    return new Handlers(this::metrics, page::show, page::json);
  }

  /** Prometheus text format 0.0.4, or OpenMetrics 1.0 when the Accept header names it. */
  private void metrics(Context ctx) {
    String accept = ctx.header("Accept");
    String type = accept != null && accept.contains(OPENMETRICS)
        ? OPENMETRICS_TYPE : PROMETHEUS_TYPE;
    ctx.header("Vary", "Accept");
    ctx.contentType(type).result(registry.scrape(type));
  }
}
