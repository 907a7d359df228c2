package reckoner.http;

import io.micrometer.core.instrument.Counter;
import io.micrometer.core.instrument.MeterRegistry;
import io.micrometer.core.instrument.Timer;
import java.time.Duration;
import java.util.concurrent.TimeUnit;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import reckoner.call.Outcome;

/**
 * Per-tool call metrics: {@code reckoner_calls_total{tool,version,outcome}} and the latency
 * histogram {@code reckoner_call_duration_seconds{tool,version}}. An observer: a failure here is
 * logged and never breaks a call.
 */
public final class CallMetrics {
  private static final Logger LOG = LoggerFactory.getLogger(CallMetrics.class);
  private final MeterRegistry registry;
  private final java.util.concurrent.ConcurrentHashMap<String, Counter> counters = new java.util.concurrent.ConcurrentHashMap<>();
  private final java.util.concurrent.ConcurrentHashMap<String, Timer> timers = new java.util.concurrent.ConcurrentHashMap<>();
  private final Counter cacheHits;
  /** The meters of one label set, found without building their string key on every call. */
  private final java.util.concurrent.ConcurrentHashMap<Labels, Meters> byLabels = new java.util.concurrent.ConcurrentHashMap<>();

  /** A tool version (null for an unknown tool) and an outcome (null for ok). */
  private record Labels(reckoner.tool.ToolId tool, reckoner.tool.ErrorCode code) {}

  private record Meters(Counter calls, Timer duration) {}

  public CallMetrics(MeterRegistry registry) {
    this.registry = registry;
    this.cacheHits = Counter.builder("reckoner.calls.cached").description("Calls answered from the answer cache")
        .register(registry);
  }

  /** Per tool version: calls by outcome so far, and the call time percentiles (p50, p99) in seconds. */
  public record ToolStats(String tool, String version, java.util.Map<String, Long> callsByOutcome, double p50, double p99) {
    public long calls() {
      return callsByOutcome.values().stream().mapToLong(Long::longValue).sum();
    }

    public long errors() {
      return calls() - callsByOutcome.getOrDefault("ok", 0L);
    }
  }

  /** A snapshot of every tool version seen so far, sorted by tool and version. */
  public java.util.List<ToolStats> snapshot() {
    java.util.Map<String, java.util.Map<String, Long>> byTool = new java.util.TreeMap<>();
    counters.forEach((key, counter) -> {
      String[] parts = key.split("\u0000");
      byTool.computeIfAbsent(parts[0] + '\u0000' + parts[1], k -> new java.util.TreeMap<>()).put(parts[2], (long) counter.count());
    });
    java.util.List<ToolStats> out = new java.util.ArrayList<>();
    byTool.forEach((key, outcomes) -> {
      Timer timer = timers.get(key);
      double p50 = Double.NaN;
      double p99 = Double.NaN;
      if (timer != null) {
        for (io.micrometer.core.instrument.distribution.ValueAtPercentile v : timer.takeSnapshot().percentileValues()) {
          if (v.percentile() == 0.5) {
            p50 = v.value(TimeUnit.SECONDS);
          } else if (v.percentile() == 0.99) {
            p99 = v.value(TimeUnit.SECONDS);
          }
        }
      }
      String[] parts = key.split("\u0000");
      out.add(new ToolStats(parts[0], parts[1], outcomes, p50, p99));
    });
    return out;
  }

  public void record(Outcome outcome) {
    try {
      Labels labels = new Labels(outcome.tool().orElse(null), outcome.isOk() ? null : outcome.error().get().code());
      Meters meters = byLabels.get(labels);
      if (meters == null) {
        meters = byLabels.computeIfAbsent(labels, this::register);
      }
      meters.calls().increment();
      meters.duration().record(outcome.elapsedNanos(), TimeUnit.NANOSECONDS);
      if (outcome.cached()) {
        cacheHits.increment();
      }
    } catch (RuntimeException e) {
      LOG.warn("metrics failed; the call is unaffected", e);
    }
  }

  /** Meters are looked up once per label set: registering on every call costs more than the call. */
  private Meters register(Labels labels) {
    String tool = labels.tool() == null ? "unknown" : labels.tool().name();
    String version = labels.tool() == null ? "none" : Integer.toString(labels.tool().version());
    String result = labels.code() == null ? "ok" : labels.code().wireName();
    Counter calls = counters.computeIfAbsent(tool + '\u0000' + version + '\u0000' + result, k -> Counter.builder("reckoner.calls")
        .description("Tool calls by outcome: ok or the error code")
        .tags("tool", tool, "version", version, "outcome", result)
        .register(registry));
    Timer duration = timers.computeIfAbsent(tool + '\u0000' + version, k -> Timer.builder("reckoner.call.duration")
        .description("Time to run one call inside the service, from arguments to answer")
        .tags("tool", tool, "version", version)
        .publishPercentileHistogram()
        .publishPercentiles(0.5, 0.99) // for the status page, over Micrometer's decaying window
        .minimumExpectedValue(Duration.ofNanos(1_000))
        .maximumExpectedValue(Duration.ofSeconds(1))
        .register(registry));
    return new Meters(calls, duration);
  }
}
