package reckoner.dates;

import com.ibm.icu.util.ULocale;
import java.time.DateTimeException;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.time.ZonedDateTime;
import java.time.temporal.Temporal;
import java.util.Objects;
import java.util.Optional;
import reckoner.tool.ToolException;

/**
 * A point on one of four time-lines: a date, a local date-time, a date-time at a fixed offset, or
 * a date-time in an IANA zone. Local times in a zone follow the contract: a time in a gap (spring
 * forward) moves forward by the gap's length, a time in an overlap (fall back) takes the earlier
 * offset. Immutable.
 */
final class Moment {
  private final Temporal value;

  private Moment(Temporal value) {
    this.value = Objects.requireNonNull(value, "value");
  }

  static Moment of(LocalDate date) {
    return new Moment(date);
  }

  static Moment of(ZonedDateTime time) {
    return new Moment(time);
  }

  /** The moment a stamp names, placed in {@code zone} when one is given. */
  static Moment of(IsoStamp stamp, Optional<ZoneId> zone) throws ToolException {
    if (!stamp.hasTime()) {
      return new Moment(stamp.date());
    }
    LocalDateTime local = stamp.toLocalDateTime();
    if (stamp.offset().isPresent()) {
      ZoneOffset offset = stamp.offset().get();
      if (zone.isEmpty()) {
        return new Moment(OffsetDateTime.of(local, offset));
      }
      ZonedDateTime strict = ZonedDateTime.ofLocal(local, zone.get(), offset);
      if (!strict.getOffset().equals(offset)) {
        throw Problems.invalidDate("the offset " + offset + " is not in use in " + zone.get().getId() + " at " + local
            + " (it is " + strict.getOffset() + ")");
      }
      return new Moment(strict);
    }
    return new Moment(zone.isPresent() ? ZonedDateTime.of(local, zone.get()) : local);
  }

  boolean hasTime() {
    return !(value instanceof LocalDate);
  }

  LocalDate date() {
    return LocalDate.from(value);
  }

  /**
   * Adds {@code amount}: years and months together (clamped to the month's last day), then weeks
   * and days on the calendar (local time-line), then the time part as elapsed time.
   */
  Moment plus(IsoDuration amount) throws ToolException {
    long months = amount.totalMonths();
    long days = amount.totalDays();
    try {
      if (value instanceof LocalDate date) {
        if (amount.hasTime()) {
          throw Problems.invalidDuration("the date " + date + " has no time of day, so " + amount
              + " cannot be added; give a date-time such as " + date + "T00:00");
        }
        return new Moment(IsoText.checked(date.plusMonths(months).plusDays(days)));
      }
      if (value instanceof LocalDateTime local) {
        return checked(new Moment(local.plusMonths(months).plusDays(days).plus(amount.timePart())));
      }
      if (value instanceof OffsetDateTime fixed) {
        return checked(new Moment(fixed.plusMonths(months).plusDays(days).plus(amount.timePart())));
      }
      ZonedDateTime zoned = (ZonedDateTime) value;
      if (months != 0 || days != 0) {
        zoned = ZonedDateTime.of(zoned.toLocalDateTime().plusMonths(months).plusDays(days), zoned.getZone());
      }
      return checked(new Moment(zoned.plus(amount.timePart())));
    } catch (DateTimeException | ArithmeticException e) {
      throw amount.tooLarge();
    }
  }

  private static Moment checked(Moment m) throws ToolException {
    IsoText.checked(m.date());
    return m;
  }

  /**
   * The moment in {@code zone}: the same instant; a local date-time must have been placed first.
   * out_of_range if the local date there leaves the supported years.
   */
  Moment in(ZoneId zone) throws ToolException {
    if (value instanceof OffsetDateTime fixed) {
      return checked(new Moment(fixed.atZoneSameInstant(zone)));
    }
    if (value instanceof ZonedDateTime zoned) {
      return checked(new Moment(zoned.withZoneSameInstant(zone)));
    }
    throw new IllegalStateException("a local date or date-time is no instant: " + value);
  }

  /** ISO 8601 as java.time writes it; a zoned time in RFC 9557 form, {@code 2024-03-10T03:30-04:00[America/New_York]}. */
  String isoText() {
    return value.toString();
  }

  /** The moment in words ({@code style=long}). */
  String words(ULocale locale) {
    if (value instanceof LocalDate date) {
      return Wording.date(date, locale);
    }
    if (value instanceof LocalDateTime local) {
      return Wording.dateTime(local, Optional.empty(), locale);
    }
    if (value instanceof OffsetDateTime fixed) {
      return Wording.dateTime(fixed.toLocalDateTime(), Optional.of(fixed.getOffset()), locale);
    }
    ZonedDateTime zoned = (ZonedDateTime) value;
    return Wording.dateTime(zoned.toLocalDateTime(), Optional.of(zoned.getOffset()), locale);
  }
}
