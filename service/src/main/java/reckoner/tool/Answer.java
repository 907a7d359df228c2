package reckoner.tool;

import java.time.Instant;
import java.util.Objects;
import java.util.Optional;

/**
 * A successful call's result: the one-line {@code text}, whether the same canonical arguments will
 * always give the same text ({@code cacheable}; false when the server clock was read), the
 * reference time used when the call read the clock, the data version the answer came from (fact
 * sets), and an optional short {@code note} on how the call was read (units@2 states the reading
 * it took for a name such as {@code cup}). The note is derived from the canonical arguments alone,
 * so a cached answer carries the same note. Immutable.
 */
public record Answer(String text, boolean cacheable, Optional<Instant> clockReadAt, Optional<String> dataVersion,
    Optional<String> note) {
  public Answer {
    Objects.requireNonNull(text, "text");
    Objects.requireNonNull(clockReadAt, "clockReadAt");
    Objects.requireNonNull(dataVersion, "dataVersion");
    Objects.requireNonNull(note, "note");
  }

  /** An answer without a note. */
  public Answer(String text, boolean cacheable, Optional<Instant> clockReadAt, Optional<String> dataVersion) {
    this(text, cacheable, clockReadAt, dataVersion, Optional.empty());
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
    return new Answer(text, cacheable, clockReadAt, Optional.of(version), note);
  }

  /** A copy with a note on how the call was read. This instance is unaffected. */
  public Answer withNote(String note) {
    return new Answer(text, cacheable, clockReadAt, dataVersion, Optional.of(note));
  }
}
