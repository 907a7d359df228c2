package reckoner;

import io.javalin.Javalin;
import io.micrometer.core.instrument.binder.jvm.JvmGcMetrics;
import io.micrometer.core.instrument.binder.jvm.JvmMemoryMetrics;
import io.micrometer.core.instrument.binder.jvm.JvmThreadMetrics;
import io.micrometer.core.instrument.binder.system.ProcessorMetrics;
import io.micrometer.core.instrument.binder.system.UptimeMetrics;
import io.micrometer.prometheusmetrics.PrometheusConfig;
import io.micrometer.prometheusmetrics.PrometheusMeterRegistry;
import io.micrometer.core.instrument.binder.cache.CaffeineCacheMetrics;
import java.time.Clock;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import reckoner.call.AnswerCache;
import reckoner.call.Invoker;
import reckoner.config.ConfigException;
import reckoner.splice.Markup;
import reckoner.config.ServiceConfig;
import reckoner.http.HttpApi;
import reckoner.spec.Json;
import reckoner.spec.OpenApi;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.tool.ToolRegistry;
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

  private Service(Javalin http, ExecutorService calls) {
    this.http = http;
    this.calls = calls;
  }

  public static Service start(ServiceConfig config, Clock clock) {
    JsonMapper json = Json.newMapper();
    ToolCatalog catalog = ToolCatalog.of(ToolRegistry.of(Tools.standard()), new SpecLoader(json));
    AnswerCache cache = AnswerCache.ofMaximumSize(config.cacheSize());
    Invoker invoker = new Invoker(catalog, clock, cache);
    Markup markup;
    try {
      markup = new Markup(config.markupOpen(), config.markupSeparator(), config.markupClose());
    } catch (IllegalArgumentException e) {
      throw new ConfigException("markup-open, markup-separator, markup-close: " + e.getMessage());
    }
    int threads = config.callThreads() == 0 ? Runtime.getRuntime().availableProcessors() : config.callThreads();
    ExecutorService calls = Executors.newFixedThreadPool(threads, daemonThreads("reckoner-call-"));

    PrometheusMeterRegistry metrics = new PrometheusMeterRegistry(PrometheusConfig.DEFAULT);
    new JvmMemoryMetrics().bindTo(metrics);
    new JvmGcMetrics().bindTo(metrics);
    new JvmThreadMetrics().bindTo(metrics);
    new ProcessorMetrics().bindTo(metrics);
    new UptimeMetrics().bindTo(metrics);
    CaffeineCacheMetrics.monitor(metrics, cache.caffeine(), "answers");

    HttpApi.Settings settings = new HttpApi.Settings(config.maxBodyBytes(), config.maxBatchBytes(), markup,
        OpenApi.assemble(catalog, json, VERSION), () -> !catalog.all().isEmpty(), calls);
    Javalin http = HttpApi.create(invoker, metrics, json, settings);
    http.start(config.host(), config.port());
    LOG.info("serving {} tool versions on http://{}:{} (data dir {})", catalog.all().size(), config.host(), http.port(),
        config.dataDir());
    if (config.openAccess()) {
      LOG.warn("open-access is on: every caller who can reach {} may call every tool", config.host());
    } else {
      LOG.info("no API keys configured: listening on loopback only");
    }
    return new Service(http, calls);
  }

  private static java.util.concurrent.ThreadFactory daemonThreads(String prefix) {
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

  @Override
  public void close() {
    http.stop();
    calls.shutdown();
  }
}
