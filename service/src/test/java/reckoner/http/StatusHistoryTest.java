package reckoner.http;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import io.micrometer.prometheusmetrics.PrometheusConfig;
import io.micrometer.prometheusmetrics.PrometheusMeterRegistry;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.ZoneId;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import reckoner.call.Outcome;
import reckoner.ledger.LedgerStats;
import reckoner.tool.Answer;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolError;
import reckoner.tool.ToolId;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;

final class StatusHistoryTest {
  /** A clock the test moves by hand. */
  private static final class HandClock extends Clock {
    long millis = 1_800_000_000_000L;

    @Override
    public ZoneId getZone() {
      return ZoneId.of("UTC");
    }

    @Override
    public Clock withZone(ZoneId zone) {
      return this;
    }

    @Override
    public Instant instant() {
      return Instant.ofEpochMilli(millis);
    }
  }

  private static final LedgerStats LEDGER = new LedgerStats() {
    public int queueDepth() { return 3; }
    public int queueCapacity() { return 100; }
    public long recordsWritten() { return 0; }
    public long commits() { return 0; }
    public long commitNanos() { return 0; }
    public long writeFailures() { return 0; }
    public long recordsRefused() { return 0; }
    public boolean isHealthy() { return true; }
  };

  private final HandClock clock = new HandClock();
  private final CallMetrics calls = new CallMetrics(new PrometheusMeterRegistry(PrometheusConfig.DEFAULT));
  private final StatusHistory history = new StatusHistory(calls, LEDGER, null, clock, Duration.ofSeconds(5), Duration.ofSeconds(20));

  private void call(long micros, boolean ok) {
    ToolId arith = ToolId.parse("arith@1");
    Outcome outcome = ok
        ? new Outcome("id", Optional.of(arith), Optional.empty(), Optional.of(Answer.of("2")), Optional.empty(), false, micros * 1000)
        : new Outcome("id", Optional.of(arith), Optional.empty(), Optional.empty(),
            Optional.of(ToolError.of(ErrorCode.DOMAIN_ERROR, "division by zero")), false, micros * 1000);
    calls.record(outcome);
  }

  private JsonNode report() {
    ObjectNode body = JsonMapper.builder().build().createObjectNode();
    history.report(body);
    return body;
  }

  // ---- quantile ----

  /**
   * Linear interpolation inside the bucket that holds the rank, the first bucket starting at 0, as
   * the Prometheus documentation describes histogram_quantile (from memory).
   */
  @Test
  void quantile_interpolatesInsideTheBucket() {
    long[] cumulative = new long[CallMetrics.CALL_BUCKETS.length + 1];
    // 100 calls, all in (25 µs, 50 µs]: the median is halfway, 37.5 µs
    for (int i = 2; i < cumulative.length; i++) {
      cumulative[i] = 100;
    }
    assertEquals(37.5e-6, StatusHistory.quantile(0.5, cumulative), 1e-12);
    assertEquals(49.75e-6, StatusHistory.quantile(0.99, cumulative), 1e-12);
  }

  @Test
  void quantile_inTheFirstBucket_startsAtZero() {
    long[] cumulative = new long[CallMetrics.CALL_BUCKETS.length + 1];
    java.util.Arrays.fill(cumulative, 10);
    assertEquals(5e-6, StatusHistory.quantile(0.5, cumulative), 1e-12);
  }

  @Test
  void quantile_inTheInfBucket_isTheHighestFiniteBound() {
    long[] cumulative = new long[CallMetrics.CALL_BUCKETS.length + 1];
    cumulative[cumulative.length - 1] = 4;
    assertEquals(1.0, StatusHistory.quantile(0.99, cumulative));
  }

  @Test
  void quantile_noCalls_isNaN() {
    assertTrue(Double.isNaN(StatusHistory.quantile(0.5, new long[CallMetrics.CALL_BUCKETS.length + 1])));
  }

  // ---- series ----

  @Test
  void report_ratesPerInterval_andNoPercentilesForAnIdleInterval() {
    history.sample();                                  // t = 0
    for (int i = 0; i < 10; i++) {
      call(30, i != 0);                                // 10 calls, 1 error, each 30 µs
    }
    clock.millis += 5_000;
    history.sample();                                  // t = 5 s
    clock.millis += 5_000;
    history.sample();                                  // t = 10 s, nothing happened in between
    JsonNode tool = report().get("tools").get(0);
    assertEquals("arith", tool.get("tool").asString());
    JsonNode series = tool.get("series");
    assertEquals("[2.0,0.0]", series.get("calls_per_second").toString());
    assertEquals("[0.2,0.0]", series.get("errors_per_second").toString());
    assertEquals(37.5e-6, series.get("p50_seconds").get(0).asDouble(), 1e-12);
    assertTrue(series.get("p50_seconds").get(1).isNull(), "an idle interval has no percentile, not 0");
    assertTrue(series.get("p99_seconds").get(1).isNull());
  }

  @Test
  void report_headline_isTheLastMinute() {
    history.sample();
    for (int i = 0; i < 30; i++) {
      call(30, true);
    }
    clock.millis += 10_000;
    JsonNode tool = report().get("tools").get(0);
    assertEquals(3.0, tool.get("calls_per_second").asDouble(), 1e-9);
    assertEquals(0.0, tool.get("errors_per_second").asDouble());
    assertEquals(30, tool.get("calls").asLong());
  }

  @Test
  void report_idleTool_hasNullPercentiles() {
    call(30, true);
    history.sample();
    clock.millis += 5_000;
    JsonNode tool = report().get("tools").get(0);
    assertEquals(0.0, tool.get("calls_per_second").asDouble());
    assertTrue(tool.get("p50_seconds").isNull());
    assertTrue(tool.get("p99_seconds").isNull());
  }

  @Test
  void report_toolFirstCalledJustAfterASample_isListed() {
    history.sample();
    call(30, true);
    clock.millis += 200; // under a second since the sample: no partial interval is drawn
    JsonNode body = report();
    assertEquals(0, body.get("times").size());
    JsonNode tool = body.get("tools").get(0);
    assertEquals("arith", tool.get("tool").asString());
    assertEquals(1, tool.get("calls").asLong());
    assertEquals(0, tool.get("series").get("calls_per_second").size());
  }

  @Test
  void sample_keepsOnlyTheWindow() {
    for (int i = 0; i < 10; i++) {
      history.sample();
      clock.millis += 5_000;
    }
    JsonNode body = report();
    // a 20 s window at 5 s keeps 5 samples: 4 intervals, and the partial one up to now
    assertEquals(5, body.get("times").size());
    assertEquals(20.0, body.get("window_seconds").asDouble());
  }

  @Test
  void report_ledgerAndCache() {
    history.sample();
    clock.millis += 5_000;
    JsonNode body = report();
    assertEquals(3, body.get("ledger").get("queue_depth").asInt());
    assertEquals(100, body.get("ledger").get("queue_capacity").asInt());
    assertTrue(body.get("ledger").get("healthy").asBoolean());
    assertTrue(body.get("ledger").get("commit_seconds_mean").isNull());
    assertEquals(false, body.get("cache").get("enabled").asBoolean());
    assertTrue(body.get("cache").get("hit_ratio").isNull());
  }
}
