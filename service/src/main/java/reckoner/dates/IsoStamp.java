package reckoner.dates;

import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.LocalTime;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.util.Objects;
import java.util.Optional;

/**
 * A date or a date-time as written in ISO 8601 extended format, with an optional UTC offset and an
 * optional zone written after it in brackets (RFC 9557: {@code 2024-03-09T12:00-05:00[America/New_York]}).
 * An offset or a zone comes only with a time. Immutable.
 */
record IsoStamp(LocalDate date, Optional<LocalTime> time, Optional<ZoneOffset> offset, Optional<String> zone) {
  IsoStamp {
    Objects.requireNonNull(date, "date");
    Objects.requireNonNull(time, "time");
    Objects.requireNonNull(offset, "offset");
    Objects.requireNonNull(zone, "zone");
    if (time.isEmpty() && (offset.isPresent() || zone.isPresent())) {
      throw new IllegalArgumentException("an offset or zone needs a time");
    }
  }

  static IsoStamp ofDate(LocalDate date) {
    return new IsoStamp(date, Optional.empty(), Optional.empty(), Optional.empty());
  }

  boolean hasTime() {
    return time.isPresent();
  }

  LocalDateTime toLocalDateTime() {
    return date.atTime(time.orElse(LocalTime.MIDNIGHT));
  }

  /** The stamp without its bracketed zone, in the canonical form java.time writes. */
  String withoutZone() {
    if (time.isEmpty()) {
      return date.toString();
    }
    LocalDateTime local = toLocalDateTime();
    return offset.isPresent() ? OffsetDateTime.of(local, offset.get()).toString() : local.toString();
  }
}
