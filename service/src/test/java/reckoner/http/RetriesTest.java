package reckoner.http;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

/** The parts of idempotent retries that need no server: keys in use, and request digests. */
final class RetriesTest {
  @Test
  void begin_keyInUse_isAConflictUntilClosed() {
    Retries retries = new Retries(null);
    Retries.Running first = retries.begin(Caller.ANONYMOUS, "k");
    ApiException e = assertThrows(ApiException.class, () -> retries.begin(Caller.ANONYMOUS, "k"));
    assertEquals("idempotency_conflict", e.error().code().wireName());
    assertEquals("1", e.headers().get("Retry-After"));
    retries.begin(Caller.ANONYMOUS, "other").close(); // other keys are free meanwhile
    first.close();
    retries.begin(Caller.ANONYMOUS, "k").close();
  }

  @Test
  void hash_partsCannotRunIntoEachOther() {
    assertNotEquals(Retries.hash("ab", "c"), Retries.hash("a", "bc"));
    assertNotEquals(Retries.hash("a", null), Retries.hash("a", ""));
    assertEquals(Retries.hash("a", 1, null), Retries.hash("a", 1, null));
    assertEquals(32, Retries.hash("x").length());
  }
}
