package reckoner.data;

import java.time.Duration;
import java.util.Objects;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Reloads a {@link DataStore} when its files change, by polling their names, sizes and
 * modification times every {@code interval}. A change is acted on once it has held still for one
 * whole interval, so a file caught half-written is not loaded (and if it were, the reload would
 * refuse it and keep the old data). Writing the new file elsewhere and renaming it into place is
 * still the safest way to publish. Stoppable with {@link #close()}; thread-safe.
 */
public final class DataWatcher implements AutoCloseable {
  private static final Logger LOG = LoggerFactory.getLogger(DataWatcher.class);

  private final DataStore<?> store;
  private final String threadName;
  private final Duration interval;
  private Object pending;  // a fingerprint unlike the last reload's, waiting to hold still
  private ScheduledExecutorService executor;
  private volatile Thread thread; // the polling thread, joined by close()

  private DataWatcher(DataStore<?> store, Duration interval) {
    this.store = store;
    this.interval = interval;
    this.threadName = store.kind().replace(' ', '-') + "-watcher";
  }

  /** A watcher over {@code store}, not yet started. */
  public static DataWatcher over(DataStore<?> store, Duration interval) {
    Objects.requireNonNull(store, "store");
    if (interval.isNegative() || interval.isZero()) {
      throw new IllegalArgumentException("interval must be positive: " + interval);
    }
    return new DataWatcher(store, interval);
  }

  /** Starts polling on a daemon thread named after the store's kind ({@code facts-watcher}). Idempotent. */
  public synchronized DataWatcher start() {
    if (executor == null) {
      executor = Executors.newSingleThreadScheduledExecutor(r -> {
        Thread t = new Thread(r, threadName);
        t.setDaemon(true);
        thread = t; // called under this lock: the executor makes its one thread on first use below
        return t;
      });
      long millis = Math.max(1, interval.toMillis());
      executor.scheduleWithFixedDelay(this::pollSafely, millis, millis, TimeUnit.MILLISECONDS);
    }
    return this;
  }

  /**
   * Checks the files once: returns the reload's report if a change has held still since the last
   * poll and a reload ran, else null. The polling thread calls this; tests call it directly.
   */
  public synchronized ReloadReport pollOnce() {
    Object now = store.currentFingerprint();
    if (now.equals(store.lastFingerprint())) { // also covers reloads asked for by an admin
      pending = null;
      return null;
    }
    if (!now.equals(pending)) {
      pending = now; // changed since the last look: wait one interval for it to settle
      return null;
    }
    pending = null;
    return store.reload();
  }

  /** Stops polling; when it returns, a reload in progress has finished and the thread has ended. */
  @Override
  public void close() {
    ScheduledExecutorService e;
    Thread t;
    synchronized (this) {
      e = executor;
      t = thread;
      executor = null;
      thread = null;
    }
    if (e == null) {
      return;
    }
    e.shutdown(); // no interrupt: a reload in progress finishes its reads
    try {
      if (!e.awaitTermination(30, TimeUnit.SECONDS)) {
        LOG.warn("the {} did not stop within 30 s", threadName);
      }
      if (t != null) {
        t.join(TimeUnit.SECONDS.toMillis(30));
      }
    } catch (InterruptedException ie) {
      Thread.currentThread().interrupt();
    }
  }

  private void pollSafely() {
    try {
      pollOnce();
    } catch (RuntimeException e) {
      LOG.warn("the {} failed to poll; it keeps polling", threadName, e); // an observer never stops serving
    }
  }
}
