package reckoner.access;

import io.github.bucket4j.Bucket;
import io.github.bucket4j.ConsumptionProbe;
import java.time.Duration;
import java.util.concurrent.ConcurrentHashMap;

/**
 * Per-key rate limits: one token bucket (Bucket4j) per key, refilled continuously at the key's
 * {@code rate_per_s} and holding at most {@code burstSeconds} of it (at least one call). Keys share
 * nothing: one key's empty bucket never slows another's calls. A key without a rate has no bucket.
 * Thread-safe.
 */
public final class RateLimits {
  private final double burstSeconds;
  private final ConcurrentHashMap<String, Limited> buckets = new ConcurrentHashMap<>();

  private record Limited(double rate, Bucket bucket) {}

  public RateLimits(double burstSeconds) {
    if (!(burstSeconds > 0)) {
      throw new IllegalArgumentException("the burst must be positive: " + burstSeconds);
    }
    this.burstSeconds = burstSeconds;
  }

  /** The most calls {@code key} may make at once (its burst), or {@code Long.MAX_VALUE} without a rate. */
  public long burst(ApiKey key) {
    return key.ratePerSecond() > 0 ? capacity(key.ratePerSecond()) : Long.MAX_VALUE;
  }

  /** Takes {@code calls} from the key's bucket now, or returns how long until they are there (zero: taken). */
  public Duration tryTake(ApiKey key, long calls) {
    if (key.ratePerSecond() <= 0) {
      return Duration.ZERO;
    }
    ConsumptionProbe probe = bucket(key).bucket().tryConsumeAndReturnRemaining(calls);
    return probe.isConsumed() ? Duration.ZERO : Duration.ofNanos(Math.max(1, probe.getNanosToWaitForRefill()));
  }

  /** Takes {@code calls} from the key's bucket, waiting until they are there (back-pressure for streams). */
  public void take(ApiKey key, long calls) throws InterruptedException {
    if (key.ratePerSecond() <= 0) {
      return;
    }
    Limited l = bucket(key);
    long left = calls;
    long capacity = capacity(l.rate());
    while (left > 0) { // in pieces no larger than the bucket, which could never hold more
      long piece = Math.min(left, capacity);
      l.bucket().asBlocking().consume(piece);
      left -= piece;
    }
  }

  private Limited bucket(ApiKey key) {
    Limited l = buckets.get(key.id());
    if (l == null || l.rate() != key.ratePerSecond()) { // new key, or its rate changed in a reload
      Limited fresh = new Limited(key.ratePerSecond(), build(key.ratePerSecond()));
      buckets.put(key.id(), fresh);
      return fresh;
    }
    return l;
  }

  private long capacity(double rate) {
    return Math.max(1, (long) Math.ceil(rate * burstSeconds));
  }

  private Bucket build(double rate) {
    // A rate of r a second refills round(1000 r) tokens every 1000 s, continuously ("greedy"):
    // fractional rates such as 0.5 a second are exact to a thousandth.
    long perKilosecond = Math.max(1, Math.round(rate * 1000));
    long capacity = capacity(rate);
    return Bucket.builder()
        .addLimit(limit -> limit.capacity(capacity).refillGreedy(perKilosecond, Duration.ofSeconds(1000)).initialTokens(capacity))
        .build();
  }
}
