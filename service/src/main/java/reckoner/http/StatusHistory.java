package reckoner.http;

import com.github.benmanes.caffeine.cache.Cache;
import com.github.benmanes.caffeine.cache.stats.CacheStats;
import java.time.Clock;
import java.time.Duration;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeSet;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import reckoner.ledger.LedgerStats;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;

/**
 * The recent past of the numbers the status page shows: every {@code interval} a daemon thread
 * takes a sample of the running totals (calls by tool and outcome, the call time histogram, the
 * ledger's and the answer cache's counters), and the last {@code window} of samples is kept. A
 * report turns consecutive samples into per-interval series (calls and errors per second, p50 and
 * p99 call time estimated from the histogram's buckets, ledger records per second and queue
 * depth, cache hit ratio), and the newest minute into headline figures. An interval with no calls
 * has no percentiles ({@code null}), never a zero.
 *
 * <p>The thread ends with {@link #stop()}; a stopped history still reports, from the samples it
 * kept and a fresh reading. Thread-safe.
 */
final class StatusHistory {
  static final String THREAD_NAME = "reckoner-status-sampler";
  private static final long HEADLINE_MILLIS = 60_000;

  /** The running totals at one instant. */
  record Sample(long atMillis, Map<String, CallMetrics.ToolStats> tools, long ledgerWritten, long ledgerRefused,
      int queueDepth, long commits, long commitNanos, long cacheHits, long cacheRequests) {}

  private final CallMetrics calls;
  private final LedgerStats ledger;
  private final Cache<?, ?> cache; // null when the cache is off
  private final Clock clock;
  private final Duration interval;
  private final int capacity;
  private final Deque<Sample> samples = new ArrayDeque<>();
  private ScheduledExecutorService sampler;

  StatusHistory(CallMetrics calls, LedgerStats ledger, Cache<?, ?> cache, Clock clock, Duration interval, Duration window) {
    this.calls = calls;
    this.ledger = ledger;
    this.cache = cache;
    this.clock = clock;
    this.interval = interval;
    this.capacity = (int) (window.toMillis() / interval.toMillis()) + 1;
  }

  /** Starts sampling every interval, beginning now. */
  synchronized StatusHistory start() {
    if (sampler == null) {
      sampler = Executors.newSingleThreadScheduledExecutor(r -> {
        Thread t = new Thread(r, THREAD_NAME);
        t.setDaemon(true);
        return t;
      });
      sampler.scheduleAtFixedRate(this::sample, 0, interval.toMillis(), TimeUnit.MILLISECONDS);
    }
    return this;
  }

  /** Ends the sampling thread. */
  synchronized void stop() {
    if (sampler != null) {
      sampler.shutdownNow();
    }
  }

  /** Takes a sample now and keeps it (dropping the oldest beyond the window). */
  synchronized void sample() {
    samples.addLast(read());
    while (samples.size() > capacity) {
      samples.removeFirst();
    }
  }

  private Sample read() {
    Map<String, CallMetrics.ToolStats> tools = new LinkedHashMap<>();
    for (CallMetrics.ToolStats s : calls.snapshot()) {
      tools.put(s.key(), s);
    }
    CacheStats c = cache == null ? CacheStats.empty() : cache.stats();
    return new Sample(clock.millis(), tools, ledger.recordsWritten(), ledger.recordsRefused(), ledger.queueDepth(),
        ledger.commits(), ledger.commitNanos(), c.hitCount(), c.requestCount());
  }

  /**
   * Writes the report into {@code body}: {@code times} (the end of each interval, epoch millis),
   * {@code tools}, {@code ledger} and {@code cache}, each with headline figures and series.
   */
  void report(ObjectNode body) {
    List<Sample> kept;
    synchronized (this) {
      kept = new ArrayList<>(samples);
    }
    Sample now = read();
    List<Sample> points = new ArrayList<>(kept);
    if (kept.isEmpty() || now.atMillis() - kept.get(kept.size() - 1).atMillis() >= 1000) {
      points.add(now); // a partial interval at the end, when it is long enough to mean something
    }
    Sample base = headlineBase(kept, now);
    body.put("interval_seconds", interval.toMillis() / 1000.0);
    body.put("window_seconds", (capacity - 1) * interval.toMillis() / 1000.0);
    ArrayNode times = body.putArray("times");
    for (int i = 1; i < points.size(); i++) {
      times.add(points.get(i).atMillis());
    }
    tools(body.putArray("tools"), points, base, now);
    ledger(body.putObject("ledger"), points, base, now);
    cache(body.putObject("cache"), points, base, now);
  }

  /**
   * The sample the headline figures count from: the oldest kept one at most a minute old, or the
   * one before it when that is under a second old (a rate over a few milliseconds means nothing).
   */
  private static Sample headlineBase(List<Sample> kept, Sample now) {
    for (int i = 0; i < kept.size(); i++) {
      long age = now.atMillis() - kept.get(i).atMillis();
      if (age <= HEADLINE_MILLIS) {
        return age < 1000 && i > 0 ? kept.get(i - 1) : kept.get(i);
      }
    }
    return kept.isEmpty() ? null : kept.get(kept.size() - 1);
  }

  private static double seconds(Sample from, Sample to) {
    return Math.max(0.001, (to.atMillis() - from.atMillis()) / 1000.0);
  }

  private static void tools(ArrayNode out, List<Sample> points, Sample base, Sample now) {
    TreeSet<String> keys = new TreeSet<>(now.tools().keySet()); // a tool first called since the last sample too
    points.forEach(p -> keys.addAll(p.tools().keySet()));
    for (String key : keys) {
      CallMetrics.ToolStats total = now.tools().get(key);
      if (total == null) {
        continue;
      }
      ObjectNode t = out.addObject();
      t.put("tool", total.tool()).put("version", total.version());
      t.put("calls", total.calls()).put("errors", total.errors());
      ObjectNode outcomes = t.putObject("outcomes");
      total.callsByOutcome().forEach(outcomes::put);
      CallMetrics.ToolStats then = base == null ? null : base.tools().get(key);
      Interval last = Interval.between(then, total, base == null ? 0 : seconds(base, now));
      last.put(t, "");
      ObjectNode series = t.putObject("series");
      ArrayNode rate = series.putArray("calls_per_second");
      ArrayNode errors = series.putArray("errors_per_second");
      ArrayNode p50 = series.putArray("p50_seconds");
      ArrayNode p99 = series.putArray("p99_seconds");
      for (int i = 1; i < points.size(); i++) {
        Interval step = Interval.between(points.get(i - 1).tools().get(key), points.get(i).tools().get(key),
            seconds(points.get(i - 1), points.get(i)));
        rate.add(step.callsPerSecond());
        errors.add(step.errorsPerSecond());
        number(p50, step.p50());
        number(p99, step.p99());
      }
    }
  }

  /** One tool's calls between two samples. */
  private record Interval(double callsPerSecond, double errorsPerSecond, double p50, double p99) {
    static Interval between(CallMetrics.ToolStats from, CallMetrics.ToolStats to, double seconds) {
      if (to == null || seconds <= 0) {
        return new Interval(0, 0, Double.NaN, Double.NaN);
      }
      long calls = to.calls() - (from == null ? 0 : from.calls());
      long errors = to.errors() - (from == null ? 0 : from.errors());
      long[] buckets = to.buckets().clone();
      if (from != null) {
        for (int i = 0; i < buckets.length; i++) {
          buckets[i] -= from.buckets()[i];
        }
      }
      return new Interval(calls / seconds, errors / seconds, quantile(0.5, buckets), quantile(0.99, buckets));
    }

    void put(ObjectNode t, String prefix) {
      t.put(prefix + "calls_per_second", callsPerSecond);
      t.put(prefix + "errors_per_second", errorsPerSecond);
      putNumber(t, prefix + "p50_seconds", p50);
      putNumber(t, prefix + "p99_seconds", p99);
    }
  }

  /**
   * The {@code q} quantile of the calls counted in {@code cumulative} (cumulative counts per bucket
   * of {@link CallMetrics#CALL_BUCKETS}, the last entry the total), by linear interpolation inside
   * the bucket that holds it, as Prometheus's {@code histogram_quantile} does: the first bucket
   * starts at 0, and a quantile in the +Inf bucket is the highest finite bound. NaN when no call
   * was counted.
   */
  static double quantile(double q, long[] cumulative) {
    long total = cumulative[cumulative.length - 1];
    if (total <= 0) {
      return Double.NaN;
    }
    double rank = q * total;
    double[] bounds = CallMetrics.CALL_BUCKETS;
    long below = 0;
    for (int i = 0; i < bounds.length; i++) {
      if (cumulative[i] >= rank && cumulative[i] > below) {
        double lower = i == 0 ? 0 : bounds[i - 1];
        return lower + (bounds[i] - lower) * (rank - below) / (cumulative[i] - below);
      }
      below = cumulative[i];
    }
    return bounds[bounds.length - 1];
  }

  private void ledger(ObjectNode l, List<Sample> points, Sample base, Sample now) {
    l.put("healthy", ledger.isHealthy());
    l.put("queue_depth", now.queueDepth()).put("queue_capacity", ledger.queueCapacity());
    l.put("records_written", now.ledgerWritten()).put("records_refused", now.ledgerRefused());
    l.put("write_failures", ledger.writeFailures());
    l.put("records_per_second", base == null ? 0 : (now.ledgerWritten() - base.ledgerWritten()) / seconds(base, now));
    putNumber(l, "commit_seconds_mean", base == null ? Double.NaN : meanCommit(base, now));
    ObjectNode series = l.putObject("series");
    ArrayNode written = series.putArray("records_per_second");
    ArrayNode depth = series.putArray("queue_depth");
    ArrayNode commit = series.putArray("commit_seconds_mean");
    for (int i = 1; i < points.size(); i++) {
      Sample a = points.get(i - 1);
      Sample b = points.get(i);
      written.add((b.ledgerWritten() - a.ledgerWritten()) / seconds(a, b));
      depth.add(b.queueDepth());
      number(commit, meanCommit(a, b));
    }
  }

  private static double meanCommit(Sample a, Sample b) {
    long commits = b.commits() - a.commits();
    return commits <= 0 ? Double.NaN : (b.commitNanos() - a.commitNanos()) / 1e9 / commits;
  }

  private void cache(ObjectNode c, List<Sample> points, Sample base, Sample now) {
    c.put("enabled", cache != null);
    c.put("size", cache == null ? 0 : cache.estimatedSize());
    c.put("hits", now.cacheHits()).put("requests", now.cacheRequests());
    putNumber(c, "hit_ratio", base == null ? Double.NaN : hitRatio(base, now));
    ArrayNode ratio = c.putObject("series").putArray("hit_ratio");
    for (int i = 1; i < points.size(); i++) {
      number(ratio, hitRatio(points.get(i - 1), points.get(i)));
    }
  }

  private static double hitRatio(Sample a, Sample b) {
    long requests = b.cacheRequests() - a.cacheRequests();
    return requests <= 0 ? Double.NaN : (double) (b.cacheHits() - a.cacheHits()) / requests;
  }

  private static void number(ArrayNode a, double v) {
    if (Double.isFinite(v)) {
      a.add(v);
    } else {
      a.addNull();
    }
  }

  private static void putNumber(ObjectNode o, String name, double v) {
    if (Double.isFinite(v)) {
      o.put(name, v);
    } else {
      o.putNull(name);
    }
  }
}
