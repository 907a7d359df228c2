package reckoner.ledger;

import java.time.Instant;
import java.util.Optional;
import java.util.UUID;
import java.util.regex.Pattern;

/**
 * Turns a query's time and prefix filters into index ranges. Time filters become id ranges: a
 * UUIDv7 begins with its Unix millisecond (RFC 9562, section 5.7), so "arrived at or after t" is
 * "id at or above the smallest id of t's millisecond", and the id index serves every time filter.
 * Pure functions.
 */
final class IdBounds {
  private static final Pattern UUID_TEXT =
      Pattern.compile("[0-9a-fA-F]{8}-[0-9a-fA-F]{4}-[0-9a-fA-F]{4}-[0-9a-fA-F]{4}-[0-9a-fA-F]{12}");
  /** The largest Unix millisecond a UUIDv7 can hold (48 bits). */
  static final long MAX_MILLIS = (1L << 48) - 1;

  private IdBounds() {}

  static boolean isUuid(String s) {
    return UUID_TEXT.matcher(s).matches();
  }

  /** Compares two UUID strings as unsigned 128-bit numbers (which {@link UUID#compareTo} does not). */
  static int compare(String a, String b) {
    UUID x = UUID.fromString(a);
    UUID y = UUID.fromString(b);
    int c = Long.compareUnsigned(x.getMostSignificantBits(), y.getMostSignificantBits());
    return c != 0 ? c : Long.compareUnsigned(x.getLeastSignificantBits(), y.getLeastSignificantBits());
  }

  /**
   * The smallest id whose millisecond is at or after {@code t}: every id at or above it arrived at
   * or after {@code t}, every id below it before. Instants before 1970 give the zero id; instants
   * beyond the 48-bit range give empty (no id reaches them).
   */
  static Optional<UUID> firstIdAtOrAfter(Instant t) {
    long ms = ceilMillis(t);
    if (ms > MAX_MILLIS) {
      return Optional.empty();
    }
    return Optional.of(new UUID(ms << 16, 0L));
  }

  /** {@code t} in Unix milliseconds, rounded up, clamped to {@code [0, MAX_MILLIS + 1]}. */
  static long ceilMillis(Instant t) {
    if (t.getEpochSecond() < 0) {
      return 0;
    }
    if (t.getEpochSecond() > MAX_MILLIS / 1000 + 1) {
      return MAX_MILLIS + 1;
    }
    long ms = t.getEpochSecond() * 1000 + t.getNano() / 1_000_000;
    return Math.min(MAX_MILLIS + 1, t.getNano() % 1_000_000 == 0 ? ms : ms + 1);
  }

  /**
   * The least string greater than every string that starts with {@code prefix}, in code point
   * order (which is UTF-8 byte order, SQLite's BINARY collation and PostgreSQL's "C"): the prefix
   * with its last code point incremented, skipping the surrogate range. Empty when no such string
   * exists (the prefix is all U+10FFFF).
   */
  static Optional<String> prefixEnd(String prefix) {
    int end = prefix.length();
    while (end > 0) {
      int last = prefix.codePointBefore(end);
      int start = end - Character.charCount(last);
      if (last < Character.MAX_CODE_POINT) {
        int next = last + 1 == Character.MIN_SURROGATE ? Character.MAX_SURROGATE + 1 : last + 1;
        return Optional.of(new StringBuilder(prefix.substring(0, start)).appendCodePoint(next).toString());
      }
      end = start;
    }
    return Optional.empty();
  }

  /** Parses a UUID in canonical form (8-4-4-4-12 hex digits, as {@link Invocation} holds them), quickly. */
  static UUID parse(String id) {
    if (id.length() != 36 || id.charAt(8) != '-' || id.charAt(13) != '-' || id.charAt(18) != '-' || id.charAt(23) != '-') {
      return UUID.fromString(id);
    }
    long msb = hex(id, 0, 8) << 32 | hex(id, 9, 13) << 16 | hex(id, 14, 18);
    long lsb = hex(id, 19, 23) << 48 | hex(id, 24, 36);
    return new UUID(msb, lsb);
  }

  private static long hex(String s, int from, int to) {
    long v = 0;
    for (int i = from; i < to; i++) {
      int d = Character.digit(s.charAt(i), 16);
      if (d < 0) {
        throw new IllegalArgumentException("not a UUID: " + s);
      }
      v = v << 4 | d;
    }
    return v;
  }

  /** The 16 bytes of {@code id}, big-endian: their unsigned order is the ids' order. */
  static byte[] bytes(UUID id) {
    byte[] b = new byte[16];
    long msb = id.getMostSignificantBits();
    long lsb = id.getLeastSignificantBits();
    for (int i = 0; i < 8; i++) {
      b[i] = (byte) (msb >>> (56 - 8 * i));
      b[8 + i] = (byte) (lsb >>> (56 - 8 * i));
    }
    return b;
  }

  static UUID fromBytes(byte[] b) {
    if (b == null || b.length != 16) {
      throw new IllegalArgumentException("an id is 16 bytes");
    }
    long msb = 0;
    long lsb = 0;
    for (int i = 0; i < 8; i++) {
      msb = msb << 8 | (b[i] & 0xFF);
      lsb = lsb << 8 | (b[8 + i] & 0xFF);
    }
    return new UUID(msb, lsb);
  }
}
