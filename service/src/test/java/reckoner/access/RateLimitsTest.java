package reckoner.access;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.util.Set;
import org.junit.jupiter.api.Test;

/** Per-key token buckets: a burst of the rate, then refusals with a wait, and keys that share nothing. */
final class RateLimitsTest {
  private static ApiKey key(String id, double rate) {
    return new ApiKey(id, new byte[32], Set.of(Scope.INVOKE), rate);
  }

  @Test
  void tryTake_spendsTheBurst_thenSaysHowLongToWait() {
    RateLimits limits = new RateLimits(1);
    ApiKey a = key("a", 10);
    for (int i = 0; i < 10; i++) {
      assertEquals(Duration.ZERO, limits.tryTake(a, 1), "call " + i);
    }
    Duration wait = limits.tryTake(a, 1);
    assertFalse(wait.isZero());
    assertTrue(wait.compareTo(Duration.ofMillis(101)) <= 0, "one token of ten a second comes within 100 ms: " + wait);
  }

  @Test
  void oneKeyOverItsRate_neverTakesFromAnother() {
    RateLimits limits = new RateLimits(1);
    ApiKey a = key("a", 5);
    ApiKey b = key("b", 5);
    while (limits.tryTake(a, 1).isZero()) {
      // spend all of a's burst
    }
    for (int i = 0; i < 5; i++) {
      assertEquals(Duration.ZERO, limits.tryTake(b, 1));
    }
  }

  @Test
  void noRate_noLimit() {
    RateLimits limits = new RateLimits(1);
    ApiKey free = key("free", 0);
    for (int i = 0; i < 100_000; i++) {
      assertEquals(Duration.ZERO, limits.tryTake(free, 1));
    }
    assertEquals(Long.MAX_VALUE, limits.burst(free));
  }

  @Test
  void burst_isTheRateTimesTheBurstSeconds_atLeastOne() {
    assertEquals(10, new RateLimits(1).burst(key("a", 10)));
    assertEquals(25, new RateLimits(2.5).burst(key("a", 10)));
    assertEquals(1, new RateLimits(1).burst(key("a", 0.5)));
  }

  @Test
  void take_waitsForTheRate_inPiecesNoLargerThanTheBucket() throws InterruptedException {
    RateLimits limits = new RateLimits(1);
    ApiKey a = key("a", 1000);
    long start = System.nanoTime();
    limits.take(a, 1500); // 1,000 at once, then 500 more at 1,000 a second
    long millis = (System.nanoTime() - start) / 1_000_000;
    assertTrue(millis >= 400, "waited for the rate: " + millis + " ms");
  }
}
