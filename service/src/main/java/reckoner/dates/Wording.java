package reckoner.dates;

import com.ibm.icu.text.DateFormat;
import com.ibm.icu.text.DateFormatSymbols;
import com.ibm.icu.util.Calendar;
import com.ibm.icu.util.GregorianCalendar;
import com.ibm.icu.util.SimpleTimeZone;
import com.ibm.icu.util.TimeZone;
import com.ibm.icu.util.ULocale;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.ZoneOffset;
import java.util.Date;
import java.util.Optional;
import java.util.regex.Pattern;

/**
 * {@code style=long}: dates, weekdays, quarters and date-times in words, by ICU4J's CLDR patterns
 * for an explicit locale (never the JVM's). ISO dates are written in the proleptic Gregorian
 * calendar whatever calendar the locale prefers; years before 1 carry their era ({@code 587 BC}).
 * Offsets come from java.time and are written as a localized GMT offset. Bidirectional marks are
 * dropped so that the one-line rules do not turn them into spaces. Thread-safe: formats are made
 * per call.
 */
final class Wording {
  private static final Pattern BIDI_MARKS = Pattern.compile("[\\u200E\\u200F\\u061C\\u2066-\\u2069]");
  private static final long MILLIS_PER_DAY = 86_400_000L;

  private Wording() {}

  /** {@code Friday, March 1, 2024} (en-US), {@code vendredi 1 mars 2024} (fr-FR). */
  static String date(LocalDate date, ULocale locale) {
    Calendar calendar = gregorian(TimeZone.GMT_ZONE, date.toEpochDay() * MILLIS_PER_DAY);
    DateFormat format = date.getYear() < 1
        ? DateFormat.getInstanceForSkeleton(calendar, "GyMMMMEEEEd", locale)
        : DateFormat.getDateInstance(calendar, DateFormat.FULL, locale);
    return clean(format.format(calendar.getTime()));
  }

  /** The stand-alone wide weekday name: {@code Friday}, {@code vendredi}. */
  static String weekday(LocalDate date, ULocale locale) {
    Calendar calendar = gregorian(TimeZone.GMT_ZONE, date.toEpochDay() * MILLIS_PER_DAY);
    String[] names = new DateFormatSymbols(calendar, locale).getWeekdays(DateFormatSymbols.STANDALONE, DateFormatSymbols.WIDE);
    return clean(names[calendar.get(Calendar.DAY_OF_WEEK)]);
  }

  /** {@code 1st quarter 2024}, {@code 1er trimestre 2024}. */
  static String quarter(LocalDate date, ULocale locale) {
    Calendar calendar = gregorian(TimeZone.GMT_ZONE, date.toEpochDay() * MILLIS_PER_DAY);
    String skeleton = date.getYear() < 1 ? "GyQQQQ" : "yQQQQ";
    return clean(DateFormat.getInstanceForSkeleton(calendar, skeleton, locale).format(calendar.getTime()));
  }

  /**
   * A date-time in words, to the second, with its offset when it has one:
   * {@code Sunday, March 10, 2024 at 3:30 AM GMT-4}.
   */
  static String dateTime(LocalDateTime local, Optional<ZoneOffset> offset, ULocale locale) {
    int offsetSeconds = offset.map(ZoneOffset::getTotalSeconds).orElse(0);
    TimeZone zone = new SimpleTimeZone(offsetSeconds * 1000, "offset");
    long millis = Math.addExact(Math.multiplyExact(local.toEpochSecond(ZoneOffset.UTC) - offsetSeconds, 1000L),
        local.getNano() / 1_000_000);
    Calendar calendar = gregorian(zone, millis);
    String skeleton = (local.getYear() < 1 ? "G" : "") + "yMMMMEEEEdjmm" + (local.getSecond() != 0 || local.getNano() != 0 ? "ss" : "")
        + (offset.isPresent() ? "O" : "");
    return clean(DateFormat.getInstanceForSkeleton(calendar, skeleton, locale).format(calendar.getTime()));
  }

  /** A date of another calendar system, by that calendar's CLDR full date pattern. */
  static String calendarDate(Calendar calendar, ULocale locale) {
    return clean(DateFormat.getDateInstance(calendar, DateFormat.FULL, locale).format(calendar.getTime()));
  }

  private static Calendar gregorian(TimeZone zone, long millis) {
    GregorianCalendar calendar = new GregorianCalendar(zone, ULocale.ROOT);
    calendar.setGregorianChange(new Date(Long.MIN_VALUE));
    calendar.setTimeInMillis(millis);
    return calendar;
  }

  private static String clean(String text) {
    return BIDI_MARKS.matcher(text).replaceAll("");
  }
}
