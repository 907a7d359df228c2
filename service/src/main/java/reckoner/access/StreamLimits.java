package reckoner.access;

import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicInteger;

/** How many NDJSON streams each key has open, and the bound on it. Thread-safe. */
public final class StreamLimits {
  private final int perKey;
  private final ConcurrentHashMap<String, AtomicInteger> open = new ConcurrentHashMap<>();

  public StreamLimits(int perKey) {
    if (perKey < 1) {
      throw new IllegalArgumentException("streams per key must be positive: " + perKey);
    }
    this.perKey = perKey;
  }

  public int perKey() {
    return perKey;
  }

  /** A slot for one more stream of {@code keyId}, to close when the stream ends; empty when the key has all its streams open. */
  public Optional<AutoCloseable> open(String keyId) {
    AtomicInteger n = open.computeIfAbsent(keyId, k -> new AtomicInteger());
    if (n.incrementAndGet() > perKey) {
      n.decrementAndGet();
      return Optional.empty();
    }
    return Optional.of(new AutoCloseable() {
      private boolean closed;

      @Override
      public synchronized void close() {
        if (!closed) {
          closed = true;
          n.decrementAndGet();
        }
      }
    });
  }
}
