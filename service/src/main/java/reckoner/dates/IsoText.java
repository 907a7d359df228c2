package reckoner.dates;

import java.time.DateTimeException;
import java.time.DayOfWeek;
import java.time.LocalDate;
import java.time.LocalTime;
import java.time.Month;
import java.time.Year;
import java.time.YearMonth;
import java.time.ZoneOffset;
import java.time.temporal.ChronoField;
import java.time.temporal.IsoFields;
import java.util.Locale;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import reckoner.tool.ToolException;

/**
 * Reads and writes the ISO 8601 values of this tool: calendar dates (also ordinal and week dates
 * on input), date-times with optional offset and bracketed zone, years and year-months, all in the
 * extended format, with years from {@value #MIN_YEAR} to {@value #MAX_YEAR}. Output is what
 * java.time writes ({@code 2024-03-01}, {@code -0044-03-15}, {@code +10000-01-01}). Pure
 * functions; locale-free; thread-safe.
 */
final class IsoText {
  static final int MIN_YEAR = -999_999;
  static final int MAX_YEAR = 999_999;
  /** Four or more digits in a date (more than six give out_of_range, not a parse error). */
  private static final String YEAR = "([+-]?\\d{4,})";
  private static final Pattern CALENDAR_DATE = Pattern.compile(
      YEAR + "-(\\d{2})-(\\d{2})"
          + "(?:T(\\d{2}):(\\d{2})(?::(\\d{2})(?:[.,](\\d{1,9}))?)?(Z|[+-]\\d{2}:\\d{2})?(?:\\[([^\\]]{1,64})\\])?)?",
      Pattern.CASE_INSENSITIVE);
  private static final Pattern WEEK_DATE = Pattern.compile(YEAR + "-W(\\d{2})-(\\d)", Pattern.CASE_INSENSITIVE);
  private static final Pattern ORDINAL_DATE = Pattern.compile(YEAR + "-(\\d{3})");
  private static final Pattern YEAR_ONLY = Pattern.compile("([+-]?\\d+)");
  private static final Pattern YEAR_MONTH = Pattern.compile(YEAR + "-(\\d{2})");

  private IsoText() {}

  /* ------------------------------------------------ reading ------------------------------------------------ */

  /** A calendar, ordinal or week date, or a date-time with optional offset and zone. */
  static IsoStamp stamp(String text) throws ToolException {
    String s = text.strip();
    Matcher m = CALENDAR_DATE.matcher(s);
    if (m.matches()) {
      LocalDate date = date(year(m.group(1), s), m.group(2), m.group(3), s);
      if (m.group(4) == null) {
        return IsoStamp.ofDate(date);
      }
      LocalTime time = time(m.group(4), m.group(5), m.group(6), m.group(7), s);
      Optional<ZoneOffset> offset = m.group(8) == null ? Optional.empty() : Optional.of(offset(m.group(8), s));
      return new IsoStamp(date, Optional.of(time), offset, Optional.ofNullable(m.group(9)));
    }
    m = WEEK_DATE.matcher(s);
    if (m.matches()) {
      return IsoStamp.ofDate(weekDate(year(m.group(1), s), Integer.parseInt(m.group(2)), Integer.parseInt(m.group(3)), s));
    }
    m = ORDINAL_DATE.matcher(s);
    if (m.matches()) {
      int year = year(m.group(1), s);
      int day = Integer.parseInt(m.group(2));
      int length = Year.isLeap(year) ? 366 : 365;
      if (day < 1 || day > length) {
        throw Problems.invalidDate(Problems.quote(s) + " is not a date: year " + yearText(year) + " has days 001 to " + length);
      }
      return IsoStamp.ofDate(LocalDate.ofYearDay(year, day));
    }
    throw Problems.invalidDate("expected an ISO 8601 date YYYY-MM-DD or date-time YYYY-MM-DDThh:mm[:ss] but found "
        + Problems.quote(s));
  }

  /** A calendar date alone: a date-time is refused, so a time of day is never silently dropped. */
  static LocalDate date(String text) throws ToolException {
    IsoStamp stamp = stamp(text);
    if (stamp.hasTime()) {
      throw Problems.invalidDate("expected a date YYYY-MM-DD but found the date-time " + Problems.quote(text)
          + "; give the date alone");
    }
    return stamp.date();
  }

  /** A year ({@code 2024}, {@code -0044}) or any date, of which the year is taken. */
  static int yearOf(String text) throws ToolException {
    String s = text.strip();
    Matcher m = YEAR_ONLY.matcher(s);
    return m.matches() ? year(m.group(1), s) : date(s).getYear();
  }

  /** A year-month ({@code 2024-02}) or any date, of which the year and month are taken. */
  static YearMonth yearMonthOf(String text) throws ToolException {
    String s = text.strip();
    Matcher m = YEAR_MONTH.matcher(s);
    if (m.matches()) {
      int month = Integer.parseInt(m.group(2));
      int year = year(m.group(1), s);
      if (month < 1 || month > 12) {
        throw Problems.invalidDate(Problems.quote(s) + " is not a month: month " + month + " does not exist (months run 01 to 12)");
      }
      return YearMonth.of(year, month);
    }
    return YearMonth.from(date(s));
  }

  static int year(String digits, String whole) throws ToolException {
    String unsigned = digits.startsWith("+") || digits.startsWith("-") ? digits.substring(1) : digits;
    long value = unsigned.length() > 9 ? Long.MAX_VALUE : Long.parseLong(unsigned);
    if (digits.startsWith("-")) {
      value = -value;
    }
    if (value < MIN_YEAR || value > MAX_YEAR) {
      throw Problems.outOfRange("the year in " + Problems.quote(whole) + " is outside the supported range "
          + MIN_YEAR + " to " + MAX_YEAR);
    }
    return (int) value;
  }

  private static LocalDate date(int year, String monthText, String dayText, String whole) throws ToolException {
    int month = Integer.parseInt(monthText);
    int day = Integer.parseInt(dayText);
    if (month < 1 || month > 12) {
      throw Problems.invalidDate(Problems.quote(whole) + " is not a date: month " + month + " does not exist (months run 01 to 12)");
    }
    int length = YearMonth.of(year, month).lengthOfMonth();
    if (day < 1 || day > length) {
      throw Problems.invalidDate(Problems.quote(whole) + " is not a date: " + monthName(Month.of(month)) + " "
          + yearText(year) + " has " + length + " days");
    }
    return LocalDate.of(year, month, day);
  }

  private static LocalTime time(String h, String m, String s, String fraction, String whole) throws ToolException {
    int hour = Integer.parseInt(h);
    int minute = Integer.parseInt(m);
    int second = s == null ? 0 : Integer.parseInt(s);
    if (hour == 24) {
      throw Problems.invalidDate(Problems.quote(whole) + ": hour 24 is not accepted; write 00:00 of the next day");
    }
    if (second == 60) {
      throw Problems.invalidDate(Problems.quote(whole) + ": leap seconds (second 60) are not supported");
    }
    if (hour > 23 || minute > 59 || second > 59) {
      throw Problems.invalidDate(Problems.quote(whole) + " is not a time of day: hours run 00 to 23, minutes and seconds 00 to 59");
    }
    int nanos = fraction == null ? 0 : Integer.parseInt((fraction + "000000000").substring(0, 9));
    return LocalTime.of(hour, minute, second, nanos);
  }

  /** An offset {@code Z} or {@code ±hh:mm}, at most 18 hours. */
  static ZoneOffset offset(String text, String whole) throws ToolException {
    if (text.equalsIgnoreCase("Z")) {
      return ZoneOffset.UTC;
    }
    try {
      return ZoneOffset.of(text);
    } catch (DateTimeException e) {
      throw Problems.invalidDate(Problems.quote(whole) + ": the offset " + text + " is not valid (offsets run -18:00 to +18:00)");
    }
  }

  private static LocalDate weekDate(int year, int week, int day, String whole) throws ToolException {
    LocalDate mid = LocalDate.of(year, 6, 1);
    long weeks = mid.range(IsoFields.WEEK_OF_WEEK_BASED_YEAR).getMaximum();
    if (week < 1 || week > weeks || day < 1 || day > 7) {
      throw Problems.invalidDate(Problems.quote(whole) + " is not a week date: ISO week-year " + yearText(year) + " has weeks W01 to W"
          + weeks + " and days 1 (Monday) to 7 (Sunday)");
    }
    LocalDate result = mid.with(IsoFields.WEEK_OF_WEEK_BASED_YEAR, week).with(ChronoField.DAY_OF_WEEK, day);
    if (result.getYear() < MIN_YEAR || result.getYear() > MAX_YEAR) {
      throw Problems.outOfRange(Problems.quote(whole) + " falls outside the supported years " + MIN_YEAR + " to " + MAX_YEAR);
    }
    return result;
  }

  /* ------------------------------------------------ writing ------------------------------------------------ */

  /** A year as java.time writes it in a date: at least four digits, {@code +} above 9999, {@code -} below 0. */
  static String yearText(long year) {
    if (year > 9999) {
      return "+" + year;
    }
    String digits = String.format(Locale.ROOT, "%04d", Math.abs(year));
    return year < 0 ? "-" + digits : digits;
  }

  /** The ISO 8601 week date, e.g. {@code 2020-W53-4}. */
  static String weekDate(LocalDate date) {
    return yearText(date.get(IsoFields.WEEK_BASED_YEAR)) + "-W"
        + String.format(Locale.ROOT, "%02d", date.get(IsoFields.WEEK_OF_WEEK_BASED_YEAR)) + "-" + date.getDayOfWeek().getValue();
  }

  /** {@code February}: the English name, whatever the JVM's locale. */
  static String monthName(Month month) {
    return capitalised(month.name());
  }

  /** {@code Friday}: the English name, whatever the JVM's locale. */
  static String weekdayName(DayOfWeek day) {
    return capitalised(day.name());
  }

  private static String capitalised(String upper) {
    return upper.charAt(0) + upper.substring(1).toLowerCase(Locale.ROOT);
  }

  /** Fails with out_of_range unless {@code date} lies in the supported years. */
  static LocalDate checked(LocalDate date) throws ToolException {
    if (date.getYear() < MIN_YEAR || date.getYear() > MAX_YEAR) {
      throw Problems.outOfRange("the result falls in the year " + date.getYear() + ", outside the supported range "
          + MIN_YEAR + " to " + MAX_YEAR);
    }
    return date;
  }
}
