package reckoner.ledger;

import java.io.IOException;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;

/**
 * An in-memory store for writer tests: records every batch, can be made to fail, and can hold a
 * write until released, so tests decide exactly what queues up behind it.
 */
final class FakeStore implements LedgerStore {
  final List<List<Invocation>> batches = new ArrayList<>();
  volatile boolean failing;
  /** Fail as some drivers do when a connection drops mid-batch: with an Error, not an exception. */
  volatile boolean failingWithError;
  volatile int probes;
  private volatile CountDownLatch gate = new CountDownLatch(0);
  private final CountDownLatch entered = new CountDownLatch(1);

  /** The next writes wait until {@link #open()}. */
  void hold() {
    gate = new CountDownLatch(1);
  }

  void open() {
    gate.countDown();
  }

  /** Waits until a write has reached the store (and is held there, if held). */
  void awaitFirstWrite() throws InterruptedException {
    if (!entered.await(10, TimeUnit.SECONDS)) {
      throw new AssertionError("no write reached the store");
    }
  }

  synchronized List<String> ids() {
    List<String> ids = new ArrayList<>();
    batches.forEach(b -> b.forEach(i -> ids.add(i.id())));
    return ids;
  }

  synchronized List<Integer> sizes() {
    return batches.stream().map(List::size).toList();
  }

  @Override
  public java.util.Set<String> append(List<Invocation> invocations) {
    entered.countDown();
    try {
      if (!gate.await(30, TimeUnit.SECONDS)) {
        throw new AssertionError("the test never opened the gate");
      }
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
    if (failingWithError) {
      throw new AssertionError("driver assertion on a dropped connection");
    }
    if (failing) {
      throw new LedgerUnavailableException(LedgerUnavailableException.Reason.STORE_FAILED, "fake store: disk full",
          Duration.ofSeconds(1), null);
    }
    synchronized (this) {
      batches.add(List.copyOf(invocations));
    }
    return java.util.Set.of();
  }

  @Override
  public java.util.Map<String, Invocation> findByIdempotencyKeys(String keyId, java.util.Collection<String> keys) {
    java.util.Map<String, Invocation> found = new java.util.HashMap<>();
    synchronized (this) {
      batches.forEach(b -> b.forEach(i -> {
        if (i.keyId().equals(keyId) && i.idempotencyKey() != null && keys.contains(i.idempotencyKey())) {
          found.put(i.idempotencyKey(), i);
        }
      }));
    }
    return found;
  }

  @Override
  public List<Invocation> findByIdempotencyPrefix(String keyId, String prefix, int limit) {
    List<Invocation> found = new ArrayList<>();
    synchronized (this) {
      batches.forEach(b -> b.forEach(i -> {
        if (i.keyId().equals(keyId) && i.idempotencyKey() != null && i.idempotencyKey().startsWith(prefix)) {
          found.add(i);
        }
      }));
    }
    return found.subList(0, Math.min(limit, found.size()));
  }

  @Override
  public void probe() {
    probes++;
    if (failing) {
      throw new LedgerUnavailableException(LedgerUnavailableException.Reason.STORE_FAILED, "fake store: disk full",
          Duration.ofSeconds(1), null);
    }
  }

  @Override
  public InvocationPage query(InvocationQuery query) {
    throw new UnsupportedOperationException();
  }

  @Override
  public long forEach(InvocationQuery query, Sink sink) throws IOException {
    throw new UnsupportedOperationException();
  }

  @Override
  public int deleteBefore(Instant cutoff, int batch) {
    throw new UnsupportedOperationException();
  }

  @Override
  public Optional<String> newestBeyond(long keep) {
    throw new UnsupportedOperationException();
  }

  @Override
  public int deleteThrough(String id, int batch) {
    throw new UnsupportedOperationException();
  }

  @Override
  public Footprint footprint() {
    return new Footprint(0, 0);
  }

  @Override
  public void close() {}
}
