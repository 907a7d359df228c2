package reckoner.ledger;

import java.time.Duration;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.LinkedBlockingQueue;
import java.util.concurrent.Semaphore;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import java.util.concurrent.atomic.AtomicLong;
import java.util.concurrent.locks.LockSupport;
import java.util.stream.Collectors;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import reckoner.ledger.LedgerUnavailableException.Reason;

/**
 * Group commit in front of a {@link LedgerStore}: calls hand their record to a bounded queue, and
 * one writer thread commits whatever has gathered in one transaction, up to
 * {@link Settings#maxBatch()} records (and, if {@link Settings#linger()} is set, waiting that long
 * for more). A batch of {@code async} records only, which no caller waits for, waits up to
 * {@link Settings#asyncLinger()} for company (5 ms by default), and stops waiting when a
 * {@code commit} record arrives: under async load, commits are fewer and larger, each a sync less.
 *
 * <p>Two ways in, one per durability mode. {@link #append} ({@code commit}): the future completes
 * when the record is committed, or fails with {@link LedgerUnavailableException} when it cannot be
 * (store down, queue full, closed); a failed record is not written later, so the caller's 503 is
 * the whole truth. {@link #offer} ({@code async}): the record is accepted into the queue, or
 * refused at once ({@code false}, answer 503 with {@code Retry-After}) when the queue is full; an
 * accepted record is kept, through store outages, until it is written.
 *
 * <p>When a write fails the writer turns unhealthy ({@link #isHealthy()}: readiness false), fails
 * the waiting {@code commit} records, keeps the {@code async} ones, and retries on its own with
 * exponential backoff; while it waits, new {@code commit} appends fail at once. The first write
 * that succeeds makes it healthy again. {@link #close()} stops intake and drains the queue
 * (retrying through an outage for up to {@link Settings#drainTimeout()}). Nothing is dropped
 * silently: every refused or failed record is counted, and records that could not be written
 * before the drain ended are logged by id.
 *
 * <p>Thread-safe. Call {@link #close()} at shutdown (the writer thread is a daemon).
 */
public final class LedgerWriter implements LedgerStats, AutoCloseable {
  private static final Logger LOG = LoggerFactory.getLogger(LedgerWriter.class);
  private static final long IDLE_POLL_NANOS = TimeUnit.MILLISECONDS.toNanos(100);

  /**
   * How the writer batches and retries. Immutable.
   *
   * @param queueCapacity records held at most, queued or awaiting a retry
   * @param maxBatch records committed at most in one transaction
   * @param linger how long a batch waits for more records once it has one (zero: commit what has
   *     gathered at once; batches still grow under load, while the previous commit runs)
   * @param appendWait how long {@link #append} waits for room in a full queue before failing
   * @param minBackoff the first wait after a failed write
   * @param maxBackoff the longest wait between retries
   * @param drainTimeout how long {@link #close()} keeps retrying to write what is queued
   */
  public record Settings(int queueCapacity, int maxBatch, Duration linger, Duration asyncLinger, Duration appendWait,
      Duration minBackoff, Duration maxBackoff, Duration drainTimeout) {
    public Settings {
      if (queueCapacity < 1 || maxBatch < 1) {
        throw new IllegalArgumentException("queueCapacity and maxBatch must be positive: " + queueCapacity + ", " + maxBatch);
      }
      for (Duration d : List.of(linger, asyncLinger, appendWait, minBackoff, maxBackoff, drainTimeout)) {
        if (d.isNegative()) {
          throw new IllegalArgumentException("durations must not be negative: " + d);
        }
      }
      if (minBackoff.isZero() || maxBackoff.compareTo(minBackoff) < 0) {
        throw new IllegalArgumentException("backoff must be positive, max at least min: " + minBackoff + ", " + maxBackoff);
      }
    }

    /**
     * 65,536 queued, batches of up to 4,096, no linger (5 ms for a batch of async records only), 1 s
     * append wait, backoff 50 ms to 2 s, 30 s drain.
     */
    public static Settings defaults() {
      return new Settings(65_536, 4_096, Duration.ZERO, Duration.ofMillis(5), Duration.ofSeconds(1), Duration.ofMillis(50),
          Duration.ofSeconds(2), Duration.ofSeconds(30));
    }

    public Settings withQueueCapacity(int queueCapacity) {
      return new Settings(queueCapacity, maxBatch, linger, asyncLinger, appendWait, minBackoff, maxBackoff, drainTimeout);
    }

    public Settings withMaxBatch(int maxBatch) {
      return new Settings(queueCapacity, maxBatch, linger, asyncLinger, appendWait, minBackoff, maxBackoff, drainTimeout);
    }

    public Settings withLinger(Duration linger) {
      return new Settings(queueCapacity, maxBatch, linger, asyncLinger, appendWait, minBackoff, maxBackoff, drainTimeout);
    }

    /** How long a batch that holds only async records waits for more (nobody waits for its commit). */
    public Settings withAsyncLinger(Duration asyncLinger) {
      return new Settings(queueCapacity, maxBatch, linger, asyncLinger, appendWait, minBackoff, maxBackoff, drainTimeout);
    }

    public Settings withAppendWait(Duration appendWait) {
      return new Settings(queueCapacity, maxBatch, linger, asyncLinger, appendWait, minBackoff, maxBackoff, drainTimeout);
    }

    public Settings withBackoff(Duration minBackoff, Duration maxBackoff) {
      return new Settings(queueCapacity, maxBatch, linger, asyncLinger, appendWait, minBackoff, maxBackoff, drainTimeout);
    }

    public Settings withDrainTimeout(Duration drainTimeout) {
      return new Settings(queueCapacity, maxBatch, linger, asyncLinger, appendWait, minBackoff, maxBackoff, drainTimeout);
    }
  }

  /** A queued record; {@code done} is null for an {@code async} record. */
  private record Entry(Invocation invocation, CompletableFuture<Void> done) {}

  private final LedgerStore store;
  private final Settings settings;
  private final CommitListener listener;
  private final LinkedBlockingQueue<Entry> queue = new LinkedBlockingQueue<>();
  private final Semaphore room;
  private final Thread thread;
  /** True while the writer thread sleeps on a batch of async records only; a commit record wakes it. */
  private volatile boolean lingering;
  /** Commit records queued for the writer thread, ever: a change ends an async linger. */
  private final AtomicLong commitArrivals = new AtomicLong();
  /** Held while a batch is written: by the writer thread, or by a caller committing its own record ({@link #commitHere}). */
  private final java.util.concurrent.locks.ReentrantLock commitLock = new java.util.concurrent.locks.ReentrantLock();
  /** Async records kept through a failure, oldest first; touched by the writer thread only. */
  private final ArrayDeque<Entry> held = new ArrayDeque<>();

  private volatile boolean healthy = true;
  private volatile boolean closing;
  private volatile long closeDeadline;
  private volatile long retryAt; // System.nanoTime() before which commit appends fail fast, while unhealthy
  private volatile String lastFailure = "";

  private final AtomicLong written = new AtomicLong();
  private final AtomicLong commits = new AtomicLong();
  private final AtomicLong commitNanos = new AtomicLong();
  private final AtomicLong failures = new AtomicLong();
  private final AtomicLong refused = new AtomicLong();
  private final AtomicLong lost = new AtomicLong();

  private LedgerWriter(LedgerStore store, Settings settings, CommitListener listener) {
    this.store = Objects.requireNonNull(store, "store");
    this.settings = Objects.requireNonNull(settings, "settings");
    this.listener = Objects.requireNonNull(listener, "listener");
    this.room = new Semaphore(settings.queueCapacity());
    this.thread = new Thread(this::run, "ledger-writer");
    thread.setDaemon(true);
  }

  /** Starts a writer for {@code store}; its thread runs until {@link #close()}. */
  public static LedgerWriter start(LedgerStore store, Settings settings, CommitListener listener) {
    LedgerWriter writer = new LedgerWriter(store, settings, listener);
    writer.thread.start();
    return writer;
  }

  /** Starts a writer with {@link Settings#defaults()} and no listener. */
  public static LedgerWriter start(LedgerStore store) {
    return start(store, Settings.defaults(), CommitListener.none());
  }

  // ---- intake ----

  /**
   * Durability {@code commit}: queues {@code invocation} and returns a future that completes when
   * it is committed, or completes exceptionally with a {@link LedgerUnavailableException} (store
   * failing, queue full after {@link Settings#appendWait()}, or closed), in which case the record
   * is not written. Waits for room at most {@code appendWait}; never blocks otherwise.
   */
  public CompletableFuture<Void> append(Invocation invocation) {
    Objects.requireNonNull(invocation, "invocation");
    CompletableFuture<Void> refused = admit();
    if (refused != null) {
      return refused;
    }
    return enqueue(new Entry(invocation, new CompletableFuture<>()));
  }

  /** Queues a commit record for the writer thread, waking it if it lingers over async records. */
  private CompletableFuture<Void> enqueue(Entry entry) {
    queue.add(entry);
    wakeIfLingering();
    return entry.done();
  }

  /**
   * Durability {@code commit}, for a caller that waits for the returned future on this thread at
   * once (one call answered over HTTP): when no batch is being written, this thread writes its
   * record, with whatever else is queued, itself, and the future is complete when this returns;
   * otherwise the record is queued as by {@link #append}. One call at a time thus costs one commit
   * and no hand-off to the writer thread and back (each a wake-up of a sleeping thread).
   */
  public CompletableFuture<Void> commitHere(Invocation invocation) {
    Objects.requireNonNull(invocation, "invocation");
    CompletableFuture<Void> refused = admit();
    if (refused != null) {
      return refused;
    }
    Entry entry = new Entry(invocation, new CompletableFuture<>());
    if (!commitLock.tryLock()) {
      return enqueue(entry);
    }
    try {
      List<Entry> batch = new ArrayList<>();
      batch.add(entry);
      queue.drainTo(batch, settings.maxBatch() - 1);
      if (!write(batch)) {
        for (Entry e : batch) {
          if (e.done() == null) {
            queue.add(e); // an async record goes back, for the writer thread to keep and retry
          } else {
            hold(e, null);
          }
        }
      }
    } finally {
      commitLock.unlock();
    }
    return entry.done();
  }

  /** Null when a commit record may enter (room taken), else the refusal to return. */
  private CompletableFuture<Void> admit() {
    if (closing) {
      return refuse(unavailable(Reason.CLOSED, "the ledger writer is closed", null));
    }
    long now = System.nanoTime();
    if (!healthy && now - retryAt < 0) {
      return refuse(unavailable(Reason.STORE_FAILED, "the ledger cannot be written: " + lastFailure, null));
    }
    try {
      if (!room.tryAcquire(settings.appendWait().toNanos(), TimeUnit.NANOSECONDS)) {
        return refuse(unavailable(Reason.QUEUE_FULL,
            "the ledger's queue is full (" + settings.queueCapacity() + " records)", null));
      }
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      return refuse(unavailable(Reason.CLOSED, "interrupted while waiting for room in the ledger's queue", e));
    }
    return null;
  }

  /**
   * Durability {@code commit}, blocking: returns once {@code invocation} is committed, or throws.
   * Waits at most {@code timeout} for the commit; a record that times out may still be committed
   * afterwards (the caller has been told 503, and the ledger holds the call it made).
   *
   * @throws LedgerUnavailableException when the record is not committed (store failing, queue full,
   *     closed, or timed out)
   */
  public void commit(Invocation invocation, Duration timeout) {
    try {
      commitHere(invocation).get(timeout.toNanos(), TimeUnit.NANOSECONDS);
    } catch (ExecutionException e) {
      if (e.getCause() instanceof LedgerUnavailableException u) {
        throw u;
      }
      throw unavailable(Reason.STORE_FAILED, "the ledger write failed: " + e.getCause(), e.getCause());
    } catch (TimeoutException e) {
      throw unavailable(Reason.STORE_FAILED, "the ledger did not commit within " + timeout, e);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw unavailable(Reason.CLOSED, "interrupted while waiting for the ledger", e);
    }
  }

  /**
   * Durability {@code async}: accepts {@code invocation} into the queue and returns true, or
   * returns false at once when the queue is full or the writer is closed (the caller answers 503
   * with {@code Retry-After}). An accepted record is written even if the store fails for a while.
   */
  public boolean offer(Invocation invocation) {
    Objects.requireNonNull(invocation, "invocation");
    if (closing || !room.tryAcquire()) {
      refused.incrementAndGet();
      return false;
    }
    queue.add(new Entry(invocation, null));
    return true;
  }

  /** How long a refused caller should wait: the time to the next retry while failing, else a second. */
  public Duration retryAfter() {
    long wait = retryAt - System.nanoTime();
    return !healthy && wait > 0 ? Duration.ofNanos(wait).plusSeconds(1) : Duration.ofSeconds(1);
  }

  // ---- stats ----

  @Override
  public boolean isHealthy() {
    return healthy;
  }

  @Override
  public int queueDepth() {
    return settings.queueCapacity() - room.availablePermits();
  }

  @Override
  public int queueCapacity() {
    return settings.queueCapacity();
  }

  @Override
  public long recordsWritten() {
    return written.get();
  }

  @Override
  public long commits() {
    return commits.get();
  }

  @Override
  public long commitNanos() {
    return commitNanos.get();
  }

  @Override
  public long writeFailures() {
    return failures.get();
  }

  @Override
  public long recordsRefused() {
    return refused.get();
  }

  /** Accepted {@code async} records that could not be written before {@link #close()} gave up (each logged). */
  public long recordsLost() {
    return lost.get();
  }

  // ---- the writer thread ----

  private void run() {
    try {
      loop();
    } catch (RuntimeException | Error e) {
      // Not reached by store failures (write() catches them); a defect here must not leave callers waiting forever.
      LOG.error("the ledger writer stopped on an unexpected failure; failing what is queued", e);
      healthy = false;
      closing = true;
      for (Entry entry; (entry = queue.poll()) != null; ) {
        hold(entry, held);
      }
      abandon(held);
      throw e;
    }
  }

  private void loop() {
    long backoff = settings.minBackoff().toNanos();
    while (true) {
      List<Entry> batch = new ArrayList<>();
      while (!held.isEmpty() && batch.size() < settings.maxBatch()) {
        batch.add(held.poll());
      }
      if (batch.isEmpty()) {
        Entry first = poll(IDLE_POLL_NANOS);
        if (first == null) {
          if (closing && queue.isEmpty()) {
            return;
          }
          if (!healthy && System.nanoTime() - retryAt >= 0) {
            backoff = probe(backoff);
          }
          continue;
        }
        batch.add(first);
      }
      boolean written;
      commitLock.lock();
      try {
        gather(batch);
        written = write(batch);
      } finally {
        commitLock.unlock();
      }
      if (written) {
        backoff = settings.minBackoff().toNanos();
        continue;
      }
      for (Entry e : batch) {
        hold(e, held);
      }
      for (Entry e; (e = queue.poll()) != null; ) { // pending commit appends fail now, not after the wait
        hold(e, held);
      }
      if (closing && System.nanoTime() - closeDeadline >= 0) {
        abandon(held);
        return;
      }
      backoff = waitBeforeRetry(backoff);
    }
  }

  /** Adds what has queued up to {@code batch}, up to the batch size, lingering if so set. */
  private void gather(List<Entry> batch) {
    long arrivals = commitArrivals.get(); // before the drain: a commit record queued after it ends a linger
    queue.drainTo(batch, settings.maxBatch() - batch.size());
    long linger = settings.linger().toNanos();
    if (linger < settings.asyncLinger().toNanos() && batch.stream().allMatch(e -> e.done() == null)) {
      lingerForAsync(batch, arrivals);
      return;
    }
    if (linger == 0) {
      return;
    }
    long deadline = System.nanoTime() + linger;
    while (batch.size() < settings.maxBatch()) {
      long left = deadline - System.nanoTime();
      Entry next = left > 0 ? poll(left) : null;
      if (next == null) {
        return;
      }
      batch.add(next);
      queue.drainTo(batch, settings.maxBatch() - batch.size());
    }
  }

  /**
   * A batch of async records only: sleep up to the async linger (not on the queue, so the records
   * offered meanwhile wake nobody: under async load a wake-up per record was a tenth of the CPU),
   * then take what came. A commit record queued meanwhile wakes the writer at once.
   */
  private void lingerForAsync(List<Entry> batch, long arrivals) {
    long deadline = System.nanoTime() + settings.asyncLinger().toNanos();
    lingering = true;
    try {
      for (long left; queue.size() < settings.maxBatch() - batch.size() && (left = deadline - System.nanoTime()) > 0; ) {
        if (commitArrivals.get() != arrivals) {
          break;
        }
        LockSupport.parkNanos(this, left);
      }
    } finally {
      lingering = false;
    }
    queue.drainTo(batch, settings.maxBatch() - batch.size());
  }

  private void wakeIfLingering() {
    commitArrivals.incrementAndGet();
    if (lingering) {
      LockSupport.unpark(thread);
    }
  }

  private Entry poll(long nanos) {
    try {
      return queue.poll(nanos, TimeUnit.NANOSECONDS);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt(); // Nobody interrupts this thread; keep the flag if someone does.
      return null;
    }
  }

  /** Commits {@code batch}; on success completes its futures and frees its room. */
  private boolean write(List<Entry> batch) {
    List<Invocation> records = batch.stream().map(Entry::invocation).collect(Collectors.toList());
    long start = System.nanoTime();
    java.util.Set<String> superseded;
    try {
      superseded = store.append(records);
    } catch (RuntimeException | Error e) { // a driver may throw an Error when its connection drops; the writer lives on
      failed(e);
      return false;
    }
    long nanos = System.nanoTime() - start;
    recovered(); // before the counters: whoever sees the records counted sees the writer healthy
    written.addAndGet(batch.size() - superseded.size());
    commits.incrementAndGet();
    commitNanos.addAndGet(nanos);
    room.release(batch.size());
    for (Entry e : batch) {
      if (superseded.contains(e.invocation().id())) {
        LOG.info("the record {} was not written: another record holds its idempotency key (a retry raced its first attempt)",
            e.invocation().id());
        if (e.done() != null) {
          e.done().completeExceptionally(new SupersededException(e.invocation().keyId(), e.invocation().idempotencyKey()));
        }
      } else if (e.done() != null) {
        e.done().complete(null);
      }
    }
    try {
      listener.committed(batch.size(), nanos);
    } catch (RuntimeException e) {
      LOG.warn("the ledger's commit listener failed; ignored", e); // an observer never breaks a write
    }
    return true;
  }

  /** A commit record fails back to its caller; an async record is kept for the retry. */
  private void hold(Entry e, ArrayDeque<Entry> held) {
    if (e.done() == null) {
      held.add(e); // never reached with held null: only commit records come from commitHere
      return;
    }
    room.release();
    refused.incrementAndGet();
    e.done().completeExceptionally(unavailable(Reason.STORE_FAILED, "the ledger cannot be written: " + lastFailure, null));
  }

  private long probe(long backoff) {
    try {
      store.probe();
      recovered();
      return settings.minBackoff().toNanos();
    } catch (RuntimeException | Error e) {
      failed(e);
      return waitBeforeRetry(backoff);
    }
  }

  private long waitBeforeRetry(long backoff) {
    retryAt = System.nanoTime() + backoff;
    long until = retryAt;
    if (closing && closeDeadline - until < 0) {
      until = closeDeadline; // a drain does not sleep past its deadline
    }
    for (long left; (left = until - System.nanoTime()) > 0; ) {
      LockSupport.parkNanos(left);
    }
    return Math.min(backoff * 2, settings.maxBackoff().toNanos());
  }

  private void failed(Throwable e) {
    failures.incrementAndGet();
    lastFailure = e.getMessage() == null ? e.getClass().getName() : e.getMessage();
    if (healthy) {
      LOG.error("ledger writes are failing; calls in commit mode answer 503 until they resume, retrying", e);
    } else {
      LOG.debug("ledger write failed again", e);
    }
    retryAt = System.nanoTime() + settings.minBackoff().toNanos();
    healthy = false;
  }

  private void recovered() {
    if (!healthy) {
      LOG.warn("ledger writes resumed after {} failed attempts in all", failures.get());
      healthy = true;
    }
  }

  /** The drain has ended with the store still failing: say which accepted records are not written. */
  private void abandon(ArrayDeque<Entry> held) {
    if (held.isEmpty()) {
      return;
    }
    lost.addAndGet(held.size());
    room.release(held.size());
    LOG.error("ledger closing with the store failing ({}): {} accepted records are NOT written: {}",
        lastFailure, held.size(), held.stream().map(e -> e.invocation().id()).collect(Collectors.joining(" ")));
    held.clear();
  }

  // ---- closing ----

  /**
   * Stops intake and waits until every queued record is written, or until the drain timeout has
   * passed with the store failing (then the records not written are logged by id and counted in
   * {@link #recordsLost()}, and waiting {@code commit} appends fail). Idempotent.
   */
  @Override
  public void close() {
    if (!closing) {
      closeDeadline = System.nanoTime() + settings.drainTimeout().toNanos();
      closing = true;
    }
    try {
      thread.join(settings.drainTimeout().plusSeconds(10).toMillis());
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
    if (thread.isAlive()) {
      LOG.error("the ledger writer did not finish draining in time; {} records still queued", queue.size());
      return;
    }
    // Records that raced with closing reach here after the thread has ended: one last try.
    List<Entry> left = new ArrayList<>();
    queue.drainTo(left);
    boolean written;
    commitLock.lock();
    try {
      written = left.isEmpty() || write(left);
    } finally {
      commitLock.unlock();
    }
    if (!written) {
      ArrayDeque<Entry> held = new ArrayDeque<>();
      left.forEach(e -> hold(e, held));
      abandon(held);
    }
  }

  private CompletableFuture<Void> refuse(LedgerUnavailableException e) {
    refused.incrementAndGet();
    return CompletableFuture.failedFuture(e);
  }

  private LedgerUnavailableException unavailable(Reason reason, String message, Throwable cause) {
    return new LedgerUnavailableException(reason, message, retryAfter(), cause);
  }
}
