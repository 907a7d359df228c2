package reckoner.ledger;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.util.Arrays;
import java.util.Optional;
import java.util.Random;
import java.util.UUID;
import org.junit.jupiter.api.Test;

final class IdBoundsTest {
  // ---- prefix ranges ----

  @Test
  void prefixEnd_incrementsTheLastCodePoint() {
    assertEquals(Optional.of("plot-12;"), IdBounds.prefixEnd("plot-12:"));
    assertEquals(Optional.of("\uE000"), IdBounds.prefixEnd("\uD7FF")); // skips U+D800..U+DFFF, not scalar values (Unicode 15, section 3.9, from memory)
    assertEquals(Optional.of("b"), IdBounds.prefixEnd("a\uDBFF\uDFFF")); // U+10FFFF has no successor
    assertEquals(Optional.empty(), IdBounds.prefixEnd("\uDBFF\uDFFF"));
    assertEquals(Optional.of("\uD83C\uDF34"), IdBounds.prefixEnd("\uD83C\uDF33")); // U+1F333 -> U+1F334
  }

  /**
   * For random strings s and prefixes p: s starts with p exactly when p <= s < prefixEnd(p) in UTF-8
   * byte order. That byte order is code point order (RFC 3629, section 1, from memory), which is
   * what SQLite's BINARY collation and PostgreSQL's "C" collation compare.
   */
  @Test
  void prefixEnd_randomStrings_rangeMatchesStartsWith() {
    Random random = new Random(1732);
    int[] alphabet = {'a', 'b', '-', ':', 0x7F, 0xE9, 0x7FF, 0x800, 0xD7FF, 0xE000, 0xFFFF, 0x10000, 0x10FFFF};
    for (int k = 0; k < 20_000; k++) {
      String p = randomString(random, alphabet, 1 + random.nextInt(3));
      String s = random.nextInt(3) == 0 ? p + randomString(random, alphabet, random.nextInt(3))
          : randomString(random, alphabet, random.nextInt(5));
      Optional<String> end = IdBounds.prefixEnd(p);
      boolean inRange = utf8Compare(p, s) <= 0 && (end.isEmpty() || utf8Compare(s, end.get()) < 0);
      assertEquals(s.startsWith(p), inRange, () -> "p=" + codePoints(p) + " s=" + codePoints(s));
    }
  }

  private static String randomString(Random random, int[] alphabet, int length) {
    StringBuilder sb = new StringBuilder();
    for (int i = 0; i < length; i++) {
      sb.appendCodePoint(alphabet[random.nextInt(alphabet.length)]);
    }
    return sb.toString();
  }

  private static int utf8Compare(String a, String b) {
    return Arrays.compareUnsigned(a.getBytes(StandardCharsets.UTF_8), b.getBytes(StandardCharsets.UTF_8));
  }

  private static String codePoints(String s) {
    return Arrays.toString(s.codePoints().mapToObj(Integer::toHexString).toArray());
  }

  // ---- time bounds ----

  /** The UUIDv7 layout: 48-bit Unix milliseconds, then version 7 (RFC 9562, section 5.7). */
  @Test
  void firstIdAtOrAfter_roundsUpToTheMillisecondAndClamps() {
    Instant t = Instant.parse("2031-05-17T09:30:00Z");
    assertEquals(Optional.of(new UUID(t.toEpochMilli() << 16, 0)), IdBounds.firstIdAtOrAfter(t));
    assertEquals(Optional.of(new UUID((t.toEpochMilli() + 1) << 16, 0)), IdBounds.firstIdAtOrAfter(t.plusNanos(1)));
    assertEquals(Optional.of(new UUID(0, 0)), IdBounds.firstIdAtOrAfter(Instant.parse("1960-01-01T00:00:00Z")));
    assertEquals(Optional.empty(), IdBounds.firstIdAtOrAfter(Instant.MAX));
    assertEquals(Optional.empty(), IdBounds.firstIdAtOrAfter(Instant.ofEpochMilli(IdBounds.MAX_MILLIS + 1)));
    assertTrue(IdBounds.firstIdAtOrAfter(Instant.ofEpochMilli(IdBounds.MAX_MILLIS)).isPresent());
  }

  @Test
  void compare_isUnsigned_unlikeUuidCompareTo() {
    String high = "f0000000-0000-7000-8000-000000000000";
    String low = "0f000000-0000-7000-8000-000000000000";
    assertTrue(IdBounds.compare(high, low) > 0);
    assertTrue(UUID.fromString(high).compareTo(UUID.fromString(low)) < 0); // the JDK's signed order, for contrast
  }

  @Test
  void bytes_roundTripAndKeepOrder() {
    Random random = new Random(99);
    for (int i = 0; i < 1000; i++) {
      UUID a = new UUID(random.nextLong(), random.nextLong());
      UUID b = new UUID(random.nextLong(), random.nextLong());
      assertEquals(a, IdBounds.fromBytes(IdBounds.bytes(a)));
      assertEquals(a, IdBounds.parse(a.toString()));
      assertEquals(Integer.signum(IdBounds.compare(a.toString(), b.toString())),
          Integer.signum(Arrays.compareUnsigned(IdBounds.bytes(a), IdBounds.bytes(b))));
    }
  }
}
