package reckoner.call;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.UUID;
import org.junit.jupiter.api.Test;

/** UUIDv7 layout (RFC 9562, section 5.7) and order, and continuing after a ledger's newest id. */
final class InvocationIdsTest {
  private static final Instant NOW = Instant.parse("2031-05-17T09:30:00Z");
  private final InvocationIds ids = new InvocationIds(Clock.fixed(NOW, ZoneOffset.UTC));

  private static int compareUnsigned(UUID a, UUID b) {
    int c = Long.compareUnsigned(a.getMostSignificantBits(), b.getMostSignificantBits());
    return c != 0 ? c : Long.compareUnsigned(a.getLeastSignificantBits(), b.getLeastSignificantBits());
  }

  @Test
  void next_carriesTheClockMillisecondVersionAndVariant() {
    UUID id = ids.next();
    assertEquals(NOW.toEpochMilli(), id.getMostSignificantBits() >>> 16);
    assertEquals(7, id.version());
    assertEquals(2, id.variant());
  }

  @Test
  void next_sameMillisecond_highHalvesStrictlyIncrease() {
    UUID prev = ids.next();
    for (int i = 0; i < 10_000; i++) { // more than the 12-bit counter holds: it carries into the millisecond
      UUID id = ids.next();
      assertTrue(id.getMostSignificantBits() > prev.getMostSignificantBits(), id + " after " + prev);
      prev = id;
    }
  }

  /** A ledger whose newest id is later than the clock (the clock stepped back across a restart). */
  @Test
  void startAfter_idAheadOfTheClock_laterIdsAreAboveIt() {
    UUID ahead = new UUID((NOW.toEpochMilli() + 60_000) << 16 | 0x7000L | 0xFFF, 0x8000000000000000L);
    ids.startAfter(ahead);
    UUID next = ids.next();
    assertTrue(compareUnsigned(next, ahead) > 0, next + " after " + ahead);
    assertTrue(next.getMostSignificantBits() > ahead.getMostSignificantBits());
  }

  @Test
  void startAfter_idBehindTheClock_changesNothing() {
    ids.startAfter(new UUID((NOW.toEpochMilli() - 60_000) << 16 | 0x7000L, 0x8000000000000000L));
    assertEquals(NOW.toEpochMilli(), ids.next().getMostSignificantBits() >>> 16);
  }
}
