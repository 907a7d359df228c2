package reckoner.dates;

import com.ibm.icu.util.Calendar;
import com.ibm.icu.util.ULocale;
import java.math.BigDecimal;
import java.time.Instant;
import java.time.LocalDate;
import java.time.Year;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.time.ZonedDateTime;
import java.time.temporal.IsoFields;
import java.util.Optional;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.DecimalText;
import reckoner.tool.ToolException;

/**
 * Computes the answer to canonical arguments, one method per op. Reads the clock only for
 * {@code today} and {@code ago} without {@code as_of}, once, and then marks the answer as read from
 * the clock so it is never cached. Pure functions otherwise; thread-safe.
 */
final class Answers {
  private Answers() {}

  static Answer of(Arguments canonical, CallContext context) throws ToolException {
    Op op = Op.of(canonical.requireString(CanonicalForm.OP));
    Optional<ULocale> words = canonical.string(CanonicalForm.STYLE).filter(CanonicalForm.LONG::equals).isPresent()
        ? Optional.of(Locales.of(canonical.requireString(CanonicalForm.LOCALE)))
        : Optional.empty();
    if (op.readsReferenceTime()) {
      return fromReferenceTime(op, canonical, context, words);
    }
    return Answer.of(switch (op) {
      case ADD, SUBTRACT -> shift(op, canonical, words);
      case BETWEEN -> number(Spans.between(date(canonical, CanonicalForm.DATE), date(canonical, CanonicalForm.TO),
          Spans.Unit.of(canonical.requireString(CanonicalForm.UNIT))));
      case WEEKDAY -> words.isPresent()
          ? Wording.weekday(date(canonical, CanonicalForm.DATE), words.get())
          : IsoText.weekdayName(date(canonical, CanonicalForm.DATE).getDayOfWeek());
      case ISO_WEEK -> IsoText.weekDate(date(canonical, CanonicalForm.DATE));
      case DAY_OF_YEAR -> number(date(canonical, CanonicalForm.DATE).getDayOfYear());
      case LEAP_YEAR -> Year.isLeap(IsoText.yearOf(canonical.requireString(CanonicalForm.DATE))) ? "yes" : "no";
      case DAYS_IN_MONTH -> number(IsoText.yearMonthOf(canonical.requireString(CanonicalForm.DATE)).lengthOfMonth());
      case QUARTER -> quarter(date(canonical, CanonicalForm.DATE), words);
      case CONVERT_ZONE -> convertZone(canonical, words);
      case TO_CALENDAR -> toCalendar(canonical, words);
      case FROM_CALENDAR -> fromCalendar(canonical, words);
      default -> throw new IllegalStateException("op without an answer: " + op);
    });
  }

  /* ------------------------------------------------ today, ago ------------------------------------------------ */

  private static Answer fromReferenceTime(Op op, Arguments canonical, CallContext context, Optional<ULocale> words)
      throws ToolException {
    Optional<ZoneId> zone = zone(canonical);
    Optional<String> asOf = canonical.string(CanonicalForm.AS_OF);
    Instant clockRead = null;
    Moment reference;
    if (asOf.isPresent()) {
      IsoStamp stamp = IsoText.stamp(asOf.get());
      reference = stamp.offset().isPresent() && zone.isPresent()
          ? Moment.of(stamp, Optional.empty()).in(zone.get()) // that instant, seen in the zone
          : Moment.of(stamp, zone);
    } else {
      clockRead = context.clock().instant(); // read once
      reference = Moment.of(ZonedDateTime.ofInstant(clockRead, zone.orElse(ZoneOffset.UTC)));
    }
    IsoText.checked(reference.date()); // an offset or zone can carry the edge of the range over it
    String text;
    if (op == Op.TODAY) {
      text = dateText(reference.date(), words);
    } else {
      IsoDuration back = IsoDuration.parse(canonical.requireString(CanonicalForm.DURATION)).negated();
      if (back.hasTime()) {
        if (!reference.hasTime()) {
          throw Problems.invalidArgument("as_of " + asOf.orElse("") + " is a date without a time of day, so "
              + back.negated() + " ago cannot be told; give as_of as a date-time");
        }
        Moment then = reference.plus(back);
        text = words.isPresent() ? then.words(words.get()) : then.isoText();
      } else {
        text = dateText(Moment.of(reference.date()).plus(back).date(), words);
      }
    }
    return clockRead == null ? Answer.of(text) : Answer.fromClock(text, clockRead);
  }

  /* ------------------------------------------------ the other ops ------------------------------------------------ */

  private static String shift(Op op, Arguments canonical, Optional<ULocale> words) throws ToolException {
    IsoDuration amount = IsoDuration.parse(canonical.requireString(CanonicalForm.DURATION));
    Moment start = Moment.of(IsoText.stamp(canonical.requireString(CanonicalForm.DATE)), zone(canonical));
    Moment end = start.plus(op == Op.ADD ? amount : amount.negated());
    return words.isPresent() ? end.words(words.get()) : end.isoText();
  }

  private static String quarter(LocalDate date, Optional<ULocale> words) {
    if (words.isPresent()) {
      return Wording.quarter(date, words.get());
    }
    return IsoText.yearText(date.getYear()) + "-Q" + date.get(IsoFields.QUARTER_OF_YEAR);
  }

  private static String convertZone(Arguments canonical, Optional<ULocale> words) throws ToolException {
    Moment source = Moment.of(IsoText.stamp(canonical.requireString(CanonicalForm.DATE)), zone(canonical));
    Moment target = source.in(Zones.of(canonical.requireString(CanonicalForm.TO)));
    return words.isPresent() ? target.words(words.get()) : target.isoText();
  }

  private static String toCalendar(Arguments canonical, Optional<ULocale> words) throws ToolException {
    CalendarSystem calendar = CalendarSystem.of(canonical.requireString(CanonicalForm.CALENDAR));
    LocalDate date = date(canonical, CanonicalForm.DATE);
    if (words.isPresent()) {
      Calendar at = calendar.at(date);
      return Wording.calendarDate(at, words.get());
    }
    return calendar.toCalendar(date).toString();
  }

  private static String fromCalendar(Arguments canonical, Optional<ULocale> words) throws ToolException {
    CalendarSystem calendar = CalendarSystem.of(canonical.requireString(CanonicalForm.CALENDAR));
    LocalDate iso = calendar.toIso(calendar.parse(canonical.requireString(CanonicalForm.DATE)));
    return dateText(iso, words);
  }

  /* ------------------------------------------------ helpers ------------------------------------------------ */

  private static String dateText(LocalDate date, Optional<ULocale> words) {
    return words.isPresent() ? Wording.date(date, words.get()) : date.toString();
  }

  private static LocalDate date(Arguments canonical, String name) throws ToolException {
    return IsoText.date(canonical.requireString(name));
  }

  private static Optional<ZoneId> zone(Arguments canonical) throws ToolException {
    Optional<String> zone = canonical.string(CanonicalForm.ZONE);
    return zone.isPresent() ? Optional.of(Zones.of(zone.get())) : Optional.empty();
  }

  private static String number(long value) {
    return DecimalText.format(BigDecimal.valueOf(value), false);
  }
}
