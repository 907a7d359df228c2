package reckoner;

import io.micrometer.core.instrument.DistributionSummary;
import io.micrometer.core.instrument.FunctionCounter;
import io.micrometer.core.instrument.Gauge;
import io.micrometer.core.instrument.MeterRegistry;
import io.micrometer.core.instrument.Timer;
import io.micrometer.core.instrument.binder.cache.CaffeineCacheMetrics;
import io.micrometer.core.instrument.binder.jvm.JvmGcMetrics;
import io.micrometer.core.instrument.binder.jvm.JvmMemoryMetrics;
import io.micrometer.core.instrument.binder.jvm.JvmThreadMetrics;
import io.micrometer.core.instrument.binder.system.ProcessorMetrics;
import io.micrometer.core.instrument.binder.system.UptimeMetrics;
import io.micrometer.core.instrument.config.MeterFilter;
import io.micrometer.prometheusmetrics.PrometheusConfig;
import io.micrometer.prometheusmetrics.PrometheusMeterRegistry;
import java.time.Duration;
import java.util.concurrent.TimeUnit;
import reckoner.ledger.LedgerStats;
import reckoner.ledger.LedgerWriter;

/**
 * The meters that are not per request: the JVM's and the process's, the ledger's, the answer
 * cache's and the fact store's. Wiring only.
 *
 * <p>Every name passes {@code promtool check metrics}: Micrometer's {@code system.cpu.count} (a
 * gauge ending in {@code _count}) and {@code process.cpu.time} (a unit abbreviated as {@code ns})
 * are left out. Histograms have fixed buckets: the ledger's commit time 100 µs to 10 s (a group
 * commit syncs a file or makes a round trip to PostgreSQL), its batch sizes the powers of two up
 * to the writer's largest batch.
 */
final class ServiceMetrics {
  static final double[] COMMIT_SECONDS = {
      0.000_100, 0.000_250, 0.000_500, 0.001, 0.002_5, 0.005, 0.010, 0.025, 0.050, 0.100,
      0.250, 0.500, 1.0, 2.5, 5.0, 10.0};

  private ServiceMetrics() {}

  /** A registry with the filters above. */
  static PrometheusMeterRegistry registry() {
    PrometheusMeterRegistry registry = new PrometheusMeterRegistry(PrometheusConfig.DEFAULT);
    registry.config()
        .meterFilter(MeterFilter.denyNameStartsWith("system.cpu.count"))
        .meterFilter(MeterFilter.denyNameStartsWith("process.cpu.time"));
    return registry;
  }

  /** Records each group commit's time and size in histograms. */
  static LedgerStats.CommitListener commits(MeterRegistry registry) {
    Duration[] bounds = new Duration[COMMIT_SECONDS.length];
    for (int i = 0; i < bounds.length; i++) {
      bounds[i] = Duration.ofNanos(Math.round(COMMIT_SECONDS[i] * 1e9));
    }
    Timer time = Timer.builder("reckoner.ledger.commit").description("Time to commit one group of invocations")
        .serviceLevelObjectives(bounds).register(registry);
    int largest = LedgerWriter.Settings.defaults().maxBatch();
    double[] sizes = new double[Integer.numberOfTrailingZeros(Integer.highestOneBit(largest)) + 1];
    for (int i = 0; i < sizes.length; i++) {
      sizes[i] = 1 << i;
    }
    DistributionSummary size = DistributionSummary.builder("reckoner.ledger.commit.records")
        .description("Invocations per group commit").serviceLevelObjectives(sizes).register(registry);
    return (records, nanos) -> {
      time.record(nanos, TimeUnit.NANOSECONDS);
      size.record(records);
    };
  }

  /** Binds the JVM, process, cache, facts, search and ledger meters of {@code engine}. */
  static void bind(MeterRegistry registry, Engine engine, String version) {
    new JvmMemoryMetrics().bindTo(registry);
    new JvmGcMetrics().bindTo(registry);
    new JvmThreadMetrics().bindTo(registry);
    new ProcessorMetrics().bindTo(registry);
    new UptimeMetrics().bindTo(registry);
    Gauge.builder("reckoner.build.info", () -> 1).description("Always 1; the version label says which build runs")
        .tag("version", version).register(registry);
    Gauge.builder("reckoner.ready", engine, e -> e.isReady() ? 1 : 0)
        .description("1 while GET /health/ready answers 200: tools loaded and the ledger taking writes").register(registry);
    CaffeineCacheMetrics.monitor(registry, engine.cache().caffeine(), "answers");
    FunctionCounter.builder("reckoner.facts.reloads", engine.facts(), f -> f.reloadSuccesses())
        .description("Fact reloads applied").tag("result", "applied").register(registry);
    FunctionCounter.builder("reckoner.facts.reloads", engine.facts(), f -> f.reloadFailures())
        .description("Fact reloads refused (a bad file; the old data kept serving)").tag("result", "refused").register(registry);
    FunctionCounter.builder("reckoner.search.reloads", engine.search(), s -> s.reloadSuccesses())
        .description("Search collection reloads applied").tag("result", "applied").register(registry);
    FunctionCounter.builder("reckoner.search.reloads", engine.search(), s -> s.reloadFailures())
        .description("Search collection reloads refused (a bad file; the old collections kept serving)").tag("result", "refused")
        .register(registry);
    LedgerWriter w = engine.writer();
    Gauge.builder("reckoner.ledger.queue.depth", w, LedgerWriter::queueDepth)
        .description("Invocations waiting to be committed").register(registry);
    Gauge.builder("reckoner.ledger.queue.capacity", w, LedgerWriter::queueCapacity)
        .description("Invocations the ledger's queue holds at most").register(registry);
    Gauge.builder("reckoner.ledger.healthy", w, x -> x.isHealthy() ? 1 : 0)
        .description("1 while the ledger takes writes, 0 while writes fail").register(registry);
    FunctionCounter.builder("reckoner.ledger.records.written", w, LedgerWriter::recordsWritten)
        .description("Invocations committed").register(registry);
    FunctionCounter.builder("reckoner.ledger.write.failures", w, LedgerWriter::writeFailures)
        .description("Ledger write attempts that failed").register(registry);
    FunctionCounter.builder("reckoner.ledger.records.refused", w, LedgerWriter::recordsRefused)
        .description("Invocations refused (queue full, store down, closed); their calls were answered 503").register(registry);
    FunctionCounter.builder("reckoner.ledger.records.lost", w, LedgerWriter::recordsLost)
        .description("Accepted async invocations that a shutdown could not write (each logged by id)").register(registry);
  }
}
