package reckoner.call;

import java.util.concurrent.ThreadLocalRandom;
import java.util.concurrent.atomic.AtomicLong;
import java.time.Clock;
import java.util.UUID;

/**
 * Time-ordered invocation ids: UUID version 7 (RFC 9562, section 5.7), with the 12-bit
 * {@code rand_a} field used as a counter within one millisecond (method 1 of section 6.2), so ids
 * made by one generator sort in the order they were made. Thread-safe.
 */
public final class InvocationIds {
  private final Clock clock;
  /** The last id's {@code millis << 12 | counter}; advanced by compare-and-set, so no lock is held. */
  private final AtomicLong last = new AtomicLong();

  public InvocationIds(Clock clock) {
    this.clock = clock;
  }

  /**
   * Makes every later id greater than {@code id}: a generator that continues a ledger starts after
   * its newest record, even if the clock now reads earlier than that record's time.
   */
  public void startAfter(UUID id) {
    long msb = id.getMostSignificantBits();
    long position = (msb >>> 16) << 12 | (msb & 0xFFF);
    last.accumulateAndGet(position, Math::max);
  }

  /** Returns the next id. */
  public UUID next() {
    long now = clock.millis() << 12;
    long prev;
    long next;
    do {
      prev = last.get();
      // A new millisecond starts its counter at a random point in the lower quarter, leaving
      // headroom; within a millisecond (or if the clock stepped back) the counter goes up by one
      // and carries into the millisecond, so ids never go backwards.
      next = now > prev ? now | ThreadLocalRandom.current().nextInt(0x400) : prev + 1;
    } while (!last.compareAndSet(prev, next));
    long millis = next >>> 12;
    long seq = next & 0xFFF;
    long msb = (millis << 16) | 0x7000L | seq;
    // Ids must be unique, not secret: a fast per-thread generator fills the 62 random bits.
    long lsb = (ThreadLocalRandom.current().nextLong() & 0x3FFFFFFFFFFFFFFFL) | 0x8000000000000000L;
    return new UUID(msb, lsb);
  }
}
