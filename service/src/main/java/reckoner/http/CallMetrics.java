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

  public CallMetrics(MeterRegistry registry) {
    this.registry = registry;
  }

  public void record(Outcome outcome) {
    try {
      String tool = outcome.tool().map(t -> t.name()).orElse("unknown");
      String version = outcome.tool().map(t -> Integer.toString(t.version())).orElse("none");
      String result = outcome.isOk() ? "ok" : outcome.error().get().code().wireName();
      Counter.builder("reckoner.calls")
          .description("Tool calls by outcome: ok or the error code")
          .tags("tool", tool, "version", version, "outcome", result)
          .register(registry)
          .increment();
      Timer.builder("reckoner.call.duration")
          .description("Time to run one call inside the service, from arguments to answer")
          .tags("tool", tool, "version", version)
          .publishPercentileHistogram()
          .minimumExpectedValue(Duration.ofNanos(1_000))
          .maximumExpectedValue(Duration.ofSeconds(1))
          .register(registry)
          .record(outcome.elapsedNanos(), TimeUnit.NANOSECONDS);
    } catch (RuntimeException e) {
      LOG.warn("metrics failed; the call is unaffected", e);
    }
  }
}
