package reckoner.call;

import java.util.concurrent.ThreadLocalRandom;
import java.time.Clock;
import java.util.UUID;

/**
 * Time-ordered invocation ids: UUID version 7 (RFC 9562, section 5.7), with the 12-bit
 * {@code rand_a} field used as a counter within one millisecond (method 1 of section 6.2), so ids
 * made by one generator sort in the order they were made. Thread-safe.
 */
public final class InvocationIds {
  private final Clock clock;
  private long lastMillis = -1;
  private int counter;

  public InvocationIds(Clock clock) {
    this.clock = clock;
  }

  /** Returns the next id. */
  public UUID next() {
    long millis;
    int seq;
    synchronized (this) {
      millis = Math.max(clock.millis(), lastMillis);
      if (millis == lastMillis) {
        counter++;
        if (counter > 0xFFF) { // counter exhausted: borrow the next millisecond, keep order
          millis++;
          counter = 0;
        }
      } else {
        counter = ThreadLocalRandom.current().nextInt(0x400); // leave headroom for ids within this millisecond
      }
      lastMillis = millis;
      seq = counter;
    }
    long msb = (millis << 16) | 0x7000L | seq;
    // Ids must be unique, not secret: a fast per-thread generator fills the 62 random bits.
    long lsb = (ThreadLocalRandom.current().nextLong() & 0x3FFFFFFFFFFFFFFFL) | 0x8000000000000000L;
    return new UUID(msb, lsb);
  }
}
