package reckoner.http;

import io.micrometer.core.instrument.Counter;
import io.micrometer.core.instrument.MeterRegistry;
import io.micrometer.core.instrument.Timer;
import io.micrometer.core.instrument.distribution.CountAtBucket;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.TimeUnit;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import reckoner.call.Outcome;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolId;

/**
 * Per-tool call metrics: {@code reckoner_calls_total{tool,version,outcome}}, the call time
 * histogram {@code reckoner_call_duration_seconds{tool,version}} and
 * {@code reckoner_calls_cached_total}. An observer: a failure here is logged and never breaks a
 * call. Thread-safe.
 *
 * <p>The histogram has the fixed buckets of {@link #CALL_BUCKETS}, chosen for calls that take
 * microseconds: 15 bounds from 10 µs to 1 s, among them the 1 ms bound of the call latency
 * objective that the alert rules in {@code ops/prometheus} watch.
 */
public final class CallMetrics {
  private static final Logger LOG = LoggerFactory.getLogger(CallMetrics.class);

  /** The call time histogram's upper bounds, in seconds (plus +Inf). */
  static final double[] CALL_BUCKETS = {
      0.000_010, 0.000_025, 0.000_050, 0.000_100, 0.000_250, 0.000_500,
      0.001, 0.002_5, 0.005, 0.010, 0.025, 0.050, 0.100, 0.250, 1.0};

  private final MeterRegistry registry;
  private final Counter cacheHits;
  /** The meters of one label set, found without building a string key on every call. */
  private final ConcurrentHashMap<Labels, Meters> byLabels = new ConcurrentHashMap<>();
  private final ConcurrentHashMap<ToolLabels, Timer> timers = new ConcurrentHashMap<>();

  /** A tool version (null for an unknown tool) and an outcome (null for ok). */
  private record Labels(ToolId tool, ErrorCode code) {}

  /** The tool and version labels of one tool version. */
  private record ToolLabels(String tool, String version) {}

  /** The counter of one label set and the timer of its tool version. */
  private record Meters(Counter calls, Timer duration) {}

  public CallMetrics(MeterRegistry registry) {
    this.registry = registry;
    this.cacheHits = Counter.builder("reckoner.calls.cached").description("Calls answered from the answer cache")
        .register(registry);
  }

  /**
   * Per tool version, the totals so far: calls by outcome ({@code ok} or the error code), and the
   * call time histogram as cumulative counts per bucket of {@link #CALL_BUCKETS} (the last entry
   * counts every call, the +Inf bucket).
   */
  record ToolStats(String tool, String version, Map<String, Long> callsByOutcome, long[] buckets) {
    ToolStats {
      callsByOutcome = Map.copyOf(callsByOutcome);
      buckets = buckets.clone();
    }

    String key() {
      return tool + "@" + version;
    }

    long calls() {
      return callsByOutcome.values().stream().mapToLong(Long::longValue).sum();
    }

    long errors() {
      return calls() - callsByOutcome.getOrDefault("ok", 0L);
    }
  }

  /** A snapshot of every tool version seen so far, sorted by tool and version. */
  List<ToolStats> snapshot() {
    Map<ToolLabels, Map<String, Long>> outcomes = new TreeMap<>(
        java.util.Comparator.comparing(ToolLabels::tool).thenComparing(ToolLabels::version));
    byLabels.forEach((labels, meters) -> outcomes.computeIfAbsent(toolLabels(labels), k -> new TreeMap<>())
        .merge(outcome(labels), (long) meters.calls().count(), Long::sum));
    List<ToolStats> out = new ArrayList<>();
    outcomes.forEach((tool, byOutcome) -> out.add(new ToolStats(tool.tool(), tool.version(), byOutcome, buckets(timers.get(tool)))));
    return out;
  }

  private static long[] buckets(Timer timer) {
    long[] counts = new long[CALL_BUCKETS.length + 1];
    if (timer == null) {
      return counts;
    }
    CountAtBucket[] histogram = timer.takeSnapshot().histogramCounts();
    for (int i = 0; i < CALL_BUCKETS.length && i < histogram.length; i++) {
      counts[i] = (long) histogram[i].count();
    }
    counts[CALL_BUCKETS.length] = timer.count();
    return counts;
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

  private static ToolLabels toolLabels(Labels labels) {
    return labels.tool() == null ? new ToolLabels("unknown", "none")
        : new ToolLabels(labels.tool().name(), Integer.toString(labels.tool().version()));
  }

  private static String outcome(Labels labels) {
    return labels.code() == null ? "ok" : labels.code().wireName();
  }

  /** Meters are looked up once per label set: registering on every call costs more than the call. */
  private Meters register(Labels labels) {
    ToolLabels tool = toolLabels(labels);
    Counter calls = Counter.builder("reckoner.calls")
        .description("Tool calls by outcome: ok or the error code")
        .tags("tool", tool.tool(), "version", tool.version(), "outcome", outcome(labels))
        .register(registry);
    return new Meters(calls, timers.computeIfAbsent(tool, this::registerTimer));
  }

  private Timer registerTimer(ToolLabels tool) {
    return Timer.builder("reckoner.call.duration")
        .description("Time to run one call inside the service, from arguments to answer")
        .tags("tool", tool.tool(), "version", tool.version())
        .serviceLevelObjectives(durations(CALL_BUCKETS))
        .register(registry);
  }

  static Duration[] durations(double[] seconds) {
    Duration[] out = new Duration[seconds.length];
    for (int i = 0; i < seconds.length; i++) {
      out[i] = Duration.ofNanos(Math.round(seconds[i] * 1e9));
    }
    return out;
  }
}
