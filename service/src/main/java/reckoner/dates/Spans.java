package reckoner.dates;

import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.Locale;

/**
 * The distance from one date to another, in whole units, signed (negative when {@code to} is
 * earlier). Days and weeks are elapsed days (weeks truncated toward zero). Months and years are
 * counted as {@link Moment#plus} adds them: the largest {@code n} with {@code from + n months <= to}
 * (from an earlier date; symmetrically from a later one), with the same month-end clamping, so
 * 2024-01-31 to 2024-02-29 is one month. Business days are Monday to Friday, counting the end date
 * and not the start date, with no public holidays. Pure functions; thread-safe.
 */
final class Spans {
  /** 1970-01-05, a Monday, as an epoch day: business days are counted in weeks from it. */
  private static final long A_MONDAY = 4;

  enum Unit {
    DAYS, WEEKS, MONTHS, YEARS, BUSINESS_DAYS;

    private final String wireName = name().toLowerCase(Locale.ROOT);

    String wireName() {
      return wireName;
    }

    static Unit of(String text) throws reckoner.tool.ToolException {
      String s = text.strip().toLowerCase(Locale.ROOT).replace(' ', '_');
      for (Unit u : values()) {
        if (u.wireName.equals(s)) {
          return u;
        }
      }
      throw Problems.invalidArgument("unit must be one of days, weeks, months, years, business_days but was " + Problems.quote(text));
    }
  }

  private Spans() {}

  static long between(LocalDate from, LocalDate to, Unit unit) {
    return switch (unit) {
      case DAYS -> days(from, to);
      case WEEKS -> days(from, to) / 7;
      case MONTHS -> months(from, to);
      case YEARS -> years(from, to);
      case BUSINESS_DAYS -> businessDays(from, to);
    };
  }

  static long days(LocalDate from, LocalDate to) {
    return to.toEpochDay() - from.toEpochDay();
  }

  static long months(LocalDate from, LocalDate to) {
    long n = ChronoUnit.MONTHS.between(from, to); // whole months by day of month; clamping may allow one more
    if (!to.isBefore(from)) {
      while (n > 0 && from.plusMonths(n).isAfter(to)) {
        n--;
      }
      while (!from.plusMonths(n + 1).isAfter(to)) {
        n++;
      }
    } else {
      while (n < 0 && from.plusMonths(n).isBefore(to)) {
        n++;
      }
      while (!from.plusMonths(n - 1).isBefore(to)) {
        n--;
      }
    }
    return n;
  }

  static long years(LocalDate from, LocalDate to) {
    long n = ChronoUnit.YEARS.between(from, to);
    if (!to.isBefore(from)) {
      while (n > 0 && from.plusYears(n).isAfter(to)) {
        n--;
      }
      while (!from.plusYears(n + 1).isAfter(to)) {
        n++;
      }
    } else {
      while (n < 0 && from.plusYears(n).isBefore(to)) {
        n++;
      }
      while (!from.plusYears(n - 1).isBefore(to)) {
        n--;
      }
    }
    return n;
  }

  /** Monday-to-Friday days {@code d} with {@code from < d <= to}; negated when {@code to} is earlier. */
  static long businessDays(LocalDate from, LocalDate to) {
    return weekdaysUpTo(to.toEpochDay()) - weekdaysUpTo(from.toEpochDay());
  }

  /** Weekdays from a fixed Monday up to and including {@code epochDay} (negative before it). */
  private static long weekdaysUpTo(long epochDay) {
    long sinceMonday = epochDay - A_MONDAY;
    long weeks = Math.floorDiv(sinceMonday, 7);
    long dayOfWeek = Math.floorMod(sinceMonday, 7); // 0 = Monday ... 6 = Sunday
    return weeks * 5 + Math.min(dayOfWeek + 1, 5);
  }
}
