package reckoner;

import io.javalin.Javalin;
import io.micrometer.prometheusmetrics.PrometheusMeterRegistry;
import java.time.Clock;
import java.time.Instant;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import reckoner.config.ServiceConfig;
import reckoner.facts.FactsWatcher;
import reckoner.ledger.LedgerWriter;
import reckoner.http.HttpApi;
import reckoner.http.Monitoring;
import reckoner.spec.Json;
import reckoner.spec.OpenApi;
import reckoner.spec.ToolCatalog;
import tools.jackson.databind.json.JsonMapper;

/**
 * The running service: wiring only. Builds every part with {@code new}, starts HTTP, and stops in
 * reverse order. Tests start it in-process on port 0.
 */
public final class Service implements AutoCloseable {
  private static final Logger LOG = LoggerFactory.getLogger(Service.class);
  /** The service's own version, shown in the OpenAPI document. */
  public static final String VERSION = "1.0.0";

  private final Javalin http;
  private final ExecutorService calls;
  private final FactsWatcher watcher; // null when polling is off
  private final Engine engine;
  private final Monitoring monitoring;

  private Service(Javalin http, ExecutorService calls, FactsWatcher watcher, Engine engine, Monitoring monitoring) {
    this.http = http;
    this.calls = calls;
    this.watcher = watcher;
    this.engine = engine;
    this.monitoring = monitoring;
  }

  public static Service start(ServiceConfig config, Clock clock) {
    Instant started = clock.instant();
    JsonMapper json = Json.newMapper();
    PrometheusMeterRegistry metrics = ServiceMetrics.registry();
    Engine engine = Engine.build(config, clock, json, ServiceMetrics.commits(metrics));
    ToolCatalog catalog = engine.catalog();
    ExecutorService calls = Executors.newFixedThreadPool(Engine.callThreads(config), daemonThreads("reckoner-call-"));
    ServiceMetrics.bind(metrics, engine, VERSION);
    FactsWatcher watcher = config.factsPollMillis() > 0
        ? FactsWatcher.over(engine.facts(), java.time.Duration.ofMillis(config.factsPollMillis())).start()
        : null;

    HttpApi.Settings settings = new HttpApi.Settings(config.maxBodyBytes(), config.maxBatchBytes(), engine.markup(),
        OpenApi.assemble(catalog, json, VERSION), engine::isReady, calls, engine.facts(), engine.ledger());
    Monitoring monitoring = new Monitoring(metrics, engine.writer(), config.cacheSize() > 0 ? engine.cache().caffeine() : null,
        new Monitoring.About(VERSION, instanceName(config), config.ledger(), started), config.accessLog(), clock);
    Javalin http = HttpApi.create(engine.invoker(), monitoring, json, settings);
    http.start(config.host(), config.port());
    LOG.info("serving {} tool versions on http://{}:{} (data dir {})", catalog.all().size(), config.host(), http.port(),
        config.dataDir());
    if (config.openAccess()) {
      LOG.warn("open-access is on: every caller who can reach {} may call every tool", config.host());
    } else {
      LOG.info("no API keys configured: listening on loopback only");
    }
    return new Service(http, calls, watcher, engine, monitoring);
  }

  /** The host name, as the status page names this process (a pod's name on Kubernetes). */
  private static String instanceName(ServiceConfig config) {
    try {
      return java.net.InetAddress.getLocalHost().getHostName();
    } catch (java.net.UnknownHostException e) {
      return config.host();
    }
  }

  static java.util.concurrent.ThreadFactory daemonThreads(String prefix) {
    java.util.concurrent.atomic.AtomicInteger n = new java.util.concurrent.atomic.AtomicInteger();
    return r -> {
      Thread t = new Thread(r, prefix + n.incrementAndGet());
      t.setDaemon(true);
      return t;
    };
  }

  /** The bound port (useful with port 0). */
  public int port() {
    return http.port();
  }

  /** Stops taking requests, lets those in flight finish, drains the ledger queue, and logs what it drained. */
  @Override
  public void close() {
    LedgerWriter writer = engine.writer();
    int inFlight = monitoring.requestsInFlight();
    int queuedAtStart = writer.queueDepth();
    LOG.atInfo().addKeyValue("http_in_flight", inFlight).addKeyValue("ledger_queued", queuedAtStart)
        .log("stopping: draining {} HTTP requests in flight and {} ledger records queued", inFlight, queuedAtStart);
    long start = System.nanoTime();
    long writtenBefore = writer.recordsWritten();
    if (watcher != null) {
      watcher.close();
    }
    http.stop(); // no new calls; calls in flight finish
    calls.shutdown();
    int queued = writer.queueDepth();
    engine.close(); // drains the ledger queue before returning
    long written = writer.recordsWritten() - writtenBefore;
    long millis = (System.nanoTime() - start) / 1_000_000;
    LOG.atInfo().addKeyValue("ledger_written_in_drain", written).addKeyValue("ledger_queued_after_http", queued)
        .addKeyValue("ledger_not_written", writer.recordsLost()).addKeyValue("drain_ms", millis)
        .log("stopped in {} ms: {} ledger records written while draining ({} were queued when HTTP stopped), {} not written",
            millis, written, queued, writer.recordsLost());
  }
}
