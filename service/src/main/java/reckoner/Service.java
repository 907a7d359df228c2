package reckoner;

import io.javalin.Javalin;
import io.micrometer.prometheusmetrics.PrometheusMeterRegistry;
import java.time.Clock;
import java.time.Instant;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import reckoner.access.KeyStore;
import reckoner.access.KeysFileException;
import reckoner.access.RateLimits;
import reckoner.access.StreamLimits;
import reckoner.config.ConfigException;
import reckoner.config.ServiceConfig;
import reckoner.data.DataWatcher;
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
  private final DataWatcher watcher; // null when polling is off
  private final DataWatcher searchWatcher; // likewise
  private final Engine engine;
  private final KeyStore keys; // null: no keys file
  private final java.util.List<HttpApi.RouteInfo> routes;
  private final Monitoring monitoring;
  private final java.util.function.ToIntFunction<java.time.Duration> drainStreams;
  /** How long a stop waits for NDJSON streams to answer what they read and write their trailers. */
  static final java.time.Duration STREAM_DRAIN = java.time.Duration.ofSeconds(20);

  private Service(Javalin http, ExecutorService calls, DataWatcher watcher, DataWatcher searchWatcher, Engine engine,
      KeyStore keys, java.util.List<HttpApi.RouteInfo> routes, Monitoring monitoring,
      java.util.function.ToIntFunction<java.time.Duration> drainStreams) {
    this.http = http;
    this.calls = calls;
    this.watcher = watcher;
    this.searchWatcher = searchWatcher;
    this.engine = engine;
    this.keys = keys;
    this.routes = routes;
    this.monitoring = monitoring;
    this.drainStreams = drainStreams;
  }

  /** The keys file's keys, watched for changes; null when there is no keys file. A bad file stops the start. */
  private static KeyStore openKeys(ServiceConfig.Access access, JsonMapper json) {
    if (access.keysFile() == null) {
      return null;
    }
    try {
      return KeyStore.open(access.keysFile(), json).startWatching(java.time.Duration.ofMillis(access.keysPollMillis()));
    } catch (KeysFileException e) {
      throw new ConfigException("keys-file: " + e.getMessage());
    }
  }

  /** Every route the server serves, with the scope it needs. */
  public java.util.List<HttpApi.RouteInfo> routes() {
    return routes;
  }

  public static Service start(ServiceConfig config, Clock clock) {
    requirePortFree(config.host(), config.port()); // before the ledger opens: a second start changes nothing
    JsonMapper json = Json.newMapper();
    KeyStore keys = openKeys(config.access(), json); // likewise: a bad keys file stops the start before anything opens
    Instant started = clock.instant();
    PrometheusMeterRegistry metrics = ServiceMetrics.registry();
    Engine engine = Engine.build(config, clock, json, ServiceMetrics.commits(metrics));
    ToolCatalog catalog = engine.catalog();
    ExecutorService calls = Executors.newFixedThreadPool(Engine.callThreads(config), daemonThreads("reckoner-call-"));

    ServiceMetrics.bind(metrics, engine, VERSION);
    DataWatcher watcher = config.factsPollMillis() > 0
        ? DataWatcher.over(engine.facts().data(), java.time.Duration.ofMillis(config.factsPollMillis())).start()
        : null;
    DataWatcher searchWatcher = config.searchPollMillis() > 0
        ? DataWatcher.over(engine.search().data(), java.time.Duration.ofMillis(config.searchPollMillis())).start()
        : null;

    HttpApi.Settings settings = new HttpApi.Settings(config.maxBodyBytes(), config.maxBatchBytes(), engine.markup(),
        OpenApi.assemble(catalog, json, VERSION), engine::isReady, calls, engine.facts(), engine.ledger(), engine.search(), keys,
        new RateLimits(config.access().rateBurstSeconds()), new StreamLimits(config.access().maxStreamsPerKey()),
        config.bounds(), VERSION);
    Monitoring monitoring = new Monitoring(metrics, engine.writer(), config.cacheSize() > 0 ? engine.cache().caffeine() : null,
        new Monitoring.About(VERSION, instanceName(config), config.ledger(), started), config.accessLog(), clock);
    HttpApi.Built built = HttpApi.create(engine.invoker(), monitoring, json, settings);
    Javalin http = built.app();
    try {
      http.start(config.host(), config.port());
    } catch (RuntimeException e) { // the port was taken between the check and the start
      calls.shutdown();
      engine.close();
      if (keys != null) {
        keys.close();
      }
      throw new ConfigException(cannotListen(config.host(), config.port(), e));
    }
    LOG.info("serving {} tool versions on http://{}:{} (data dir {})", catalog.all().size(), config.host(), http.port(),
        config.dataDir());
    Thread warmUp = new Thread(() -> catalog.all().forEach(e -> e.tool().warmUp()), "reckoner-warm-up");
    warmUp.setDaemon(true);
    warmUp.start(); // after the port is open: readiness does not wait for it
    if (keys != null) {
      LOG.info("API keys in force from {}; every endpoint but health, metrics, the OpenAPI document, tool specs and "
          + "problem types needs one", keys.file());
    } else if (config.openAccess()) {
      LOG.warn("open-access is on: every caller who can reach {} may call every tool", config.host());
    } else {
      LOG.info("no API keys configured: listening on loopback only");
    }
    return new Service(http, calls, watcher, searchWatcher, engine, keys, built.routes(), monitoring, built.drain());
  }

  /** The host name, as the status page names this process (a pod's name on Kubernetes). */
  private static String instanceName(ServiceConfig config) {
    try {
      return java.net.InetAddress.getLocalHost().getHostName();
    } catch (java.net.UnknownHostException e) {
      return config.host();
    }
  }

  /** Fails with one line naming the address when it cannot be bound (in use, not an address of this host). */
  private static void requirePortFree(String host, int port) {
    if (port == 0) {
      return;
    }
    try (java.net.ServerSocket probe = new java.net.ServerSocket()) {
      probe.setReuseAddress(true); // as Jetty binds: a port in TIME_WAIT is free
      probe.bind(new java.net.InetSocketAddress(host, port));
    } catch (java.io.IOException e) {
      throw new ConfigException(cannotListen(host, port, e));
    }
  }

  private static String cannotListen(String host, int port, Exception e) {
    Throwable root = e;
    while (root.getCause() != null) {
      root = root.getCause();
    }
    String why = root instanceof java.net.BindException && String.valueOf(root.getMessage()).contains("in use")
        ? "the port is in use by another process; stop it or choose another with --port"
        : String.valueOf(root.getMessage());
    return "cannot listen on " + host + ":" + port + ": " + why;
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
    if (searchWatcher != null) {
      searchWatcher.close();
    }
    if (keys != null) {
      keys.close();
    }
    int streamsLeft = drainStreams.applyAsInt(STREAM_DRAIN); // streams stop reading, answer what they read, end with a trailer
    if (streamsLeft > 0) {
      LOG.warn("{} NDJSON streams were still answering after {} s; they are cut", streamsLeft, STREAM_DRAIN.toSeconds());
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
