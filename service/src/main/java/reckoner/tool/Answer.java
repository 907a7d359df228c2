package reckoner.tool;

import java.time.Instant;
import java.util.Objects;
import java.util.Optional;

/**
 * A successful call's result: the one-line {@code text}, whether the same canonical arguments will
 * always give the same text ({@code cacheable}; false when the server clock was read), the
 * reference time used when the call read the clock, and the data version the answer came from
 * (fact sets). Immutable.
 */
public record Answer(String text, boolean cacheable, Optional<Instant> clockReadAt, Optional<String> dataVersion) {
  public Answer {
    Objects.requireNonNull(text, "text");
    Objects.requireNonNull(clockReadAt, "clockReadAt");
    Objects.requireNonNull(dataVersion, "dataVersion");
  }

  /** A deterministic answer: the same arguments always give this text. */
  public static Answer of(String text) {
    return new Answer(text, true, Optional.empty(), Optional.empty());
  }

  /** An answer that depended on the server clock, read at {@code instant}; never cached. */
  public static Answer fromClock(String text, Instant instant) {
    return new Answer(text, false, Optional.of(instant), Optional.empty());
  }

  /** A copy that names the data version it came from. This instance is unaffected. */
  public Answer withDataVersion(String version) {
    return new Answer(text, cacheable, clockReadAt, Optional.of(version));
  }
}
