package reckoner.ledger;

import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.util.Objects;
import java.util.Optional;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import java.util.function.IntSupplier;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Keeps the ledger within its retention: deletes records older than {@link Policy#maxAge()} and,
 * beyond the newest {@link Policy#maxRecords()} or beyond {@link Policy#maxBytes()} of stored
 * records, the oldest. Runs on a thread of its own, and
 * deletes in small batches, each its own short transaction with a pause after it, so writers wait
 * at most one batch. Thread-safe.
 */
public final class Retention implements AutoCloseable {
  private static final Logger LOG = LoggerFactory.getLogger(Retention.class);
  /** Records deleted per transaction. */
  static final int BATCH = 1_000;
  private static final long PAUSE_MILLIS = 5;

  /**
   * How much of the ledger to keep. Immutable.
   *
   * @param maxAge records older than this are deleted; null keeps every age
   * @param maxRecords at most this many of the newest records are kept; 0 keeps every count
   * @param maxBytes the newest records are kept while they take at most this many bytes in the
   *     store ({@link LedgerStore#footprint()}); 0 keeps every size
   */
  public record Policy(Duration maxAge, long maxRecords, long maxBytes) {
    public Policy {
      if (maxAge != null && (maxAge.isNegative() || maxAge.isZero())) {
        throw new IllegalArgumentException("maxAge must be positive: " + maxAge);
      }
      if (maxRecords < 0) {
        throw new IllegalArgumentException("maxRecords must not be negative: " + maxRecords);
      }
      if (maxBytes < 0) {
        throw new IllegalArgumentException("maxBytes must not be negative: " + maxBytes);
      }
    }

    public Policy(Duration maxAge, long maxRecords) {
      this(maxAge, maxRecords, 0);
    }

    /** Keep everything. */
    public static Policy keepAll() {
      return new Policy(null, 0, 0);
    }

    public boolean keepsAll() {
      return maxAge == null && maxRecords == 0 && maxBytes == 0;
    }
  }

  /** What one pass deleted: by age, by count, and by bytes. */
  public record Pass(long deletedByAge, long deletedBySize, long deletedByBytes) {}

  private final LedgerStore store;
  private final Policy policy;
  private final Clock clock;
  private final ScheduledExecutorService scheduler;
  private volatile boolean closed;

  private Retention(LedgerStore store, Policy policy, Clock clock, ScheduledExecutorService scheduler) {
    this.store = Objects.requireNonNull(store, "store");
    this.policy = Objects.requireNonNull(policy, "policy");
    this.clock = Objects.requireNonNull(clock, "clock");
    this.scheduler = scheduler;
  }

  /** A retention that runs only when {@link #runOnce()} is called (tests, tools). */
  public static Retention manual(LedgerStore store, Policy policy, Clock clock) {
    return new Retention(store, policy, clock, null);
  }

  /** Starts passes every {@code every}, the first one right away, on a daemon thread of its own. */
  public static Retention start(LedgerStore store, Policy policy, Clock clock, Duration every) {
    ScheduledExecutorService scheduler = Executors.newSingleThreadScheduledExecutor(r -> {
      Thread t = new Thread(r, "ledger-retention");
      t.setDaemon(true);
      return t;
    });
    Retention retention = new Retention(store, policy, clock, scheduler);
    if (!policy.keepsAll()) {
      scheduler.scheduleWithFixedDelay(retention::runLogged, 0, every.toMillis(), TimeUnit.MILLISECONDS);
    }
    return retention;
  }

  /** Deletes what the policy no longer keeps, batch by batch, and returns how much. */
  public Pass runOnce() {
    long byAge = 0;
    if (policy.maxAge() != null) {
      Instant cutoff = clock.instant().minus(policy.maxAge());
      byAge = inBatches(() -> store.deleteBefore(cutoff, BATCH));
    }
    long bySize = 0;
    if (policy.maxRecords() > 0) {
      Optional<String> newest = store.newestBeyond(policy.maxRecords());
      if (newest.isPresent()) {
        bySize = inBatches(() -> store.deleteThrough(newest.get(), BATCH));
      }
    }
    long byBytes = 0;
    if (policy.maxBytes() > 0) {
      LedgerStore.Footprint f = store.footprint();
      if (f.bytes() > policy.maxBytes() && f.records() > 0) {
        // Keep the share of the records that fits, at the mean size of a record now.
        long keep = (long) Math.floor((double) f.records() * policy.maxBytes() / f.bytes());
        Optional<String> newest = store.newestBeyond(keep);
        if (newest.isPresent()) {
          byBytes = inBatches(() -> store.deleteThrough(newest.get(), BATCH));
        }
      }
    }
    return new Pass(byAge, bySize, byBytes);
  }

  private long inBatches(IntSupplier batch) {
    long total = 0;
    while (!closed) {
      int n = batch.getAsInt();
      total += n;
      if (n < BATCH) {
        break;
      }
      sleep(); // let the writer in between batches
    }
    return total;
  }

  private void runLogged() {
    try {
      Pass pass = runOnce();
      if (pass.deletedByAge() + pass.deletedBySize() + pass.deletedByBytes() > 0) {
        LOG.info("ledger retention deleted {} records by age, {} by count and {} by size", pass.deletedByAge(),
            pass.deletedBySize(), pass.deletedByBytes());
      }
    } catch (RuntimeException e) {
      LOG.warn("ledger retention pass failed; the next pass retries", e); // a failed pass must not end the schedule
    }
  }

  private static void sleep() {
    try {
      Thread.sleep(PAUSE_MILLIS);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
  }

  /** Stops the schedule; a pass under way ends after its current batch. */
  @Override
  public void close() {
    closed = true;
    if (scheduler != null) {
      scheduler.shutdown();
      try {
        scheduler.awaitTermination(10, TimeUnit.SECONDS);
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
      }
    }
  }
}
