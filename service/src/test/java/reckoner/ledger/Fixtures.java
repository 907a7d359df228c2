package reckoner.ledger;

import java.time.Instant;
import java.util.UUID;

/**
 * Test records from one invented scenario: an orchard survey whose runs tag calls by plot and row.
 * Ids are UUIDv7 built from a millisecond and a sequence, so every test knows its ids exactly.
 */
final class Fixtures {
  static final Instant T0 = Instant.parse("2031-05-17T09:30:00Z");
  static final String HERON = "key-heron";
  static final String OTTER = "key-otter";

  private Fixtures() {}

  /** The UUIDv7 of millisecond {@code T0 + ms} with sequence {@code seq} (RFC 9562, section 5.7 layout). */
  static String id(long ms, int seq) {
    long millis = T0.toEpochMilli() + ms;
    long msb = millis << 16 | 0x7000L | (seq & 0xFFF);
    long lsb = 0x8000000000000000L | (0x5EED_0000L + seq);
    return new UUID(msb, lsb).toString();
  }

  /** An ok arith call under {@code key}, at {@code T0 + ms}. */
  static Invocation.Builder call(long ms, int seq, String key) {
    return Invocation.builder(id(ms, seq)).keyId(key).tool("arith").version(1)
        .args("{\"expr\":\"1250/4000\",\"places\":2,\"rounding\":\"half_even\"}").text("0.31").elapsedUs(42);
  }
}
