package reckoner.dates;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.ibm.icu.util.Calendar;
import com.ibm.icu.util.GregorianCalendar;
import com.ibm.icu.util.TimeZone;
import com.ibm.icu.util.ULocale;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Date;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * Two independent libraries agree: the engine's date arithmetic (java.time) against ICU4J's
 * {@code GregorianCalendar} (proleptic: the Julian switch moved to the start of time; zone UTC;
 * locale root), on generated Gregorian dates and durations. Property-based, with a plain seeded
 * generator so every run checks the same cases and a failure names its seed and case; the
 * generator leans toward month ends, leap days and far years, where the rules differ most.
 */
final class LibraryAgreementTest {
  private static final long SEED = 0x5EED_2024_0301L;
  private static final int CASES = 20_000;
  private static final long MILLIS_PER_DAY = 86_400_000L;

  /* ------------------------------------------------ add ------------------------------------------------ */

  @Test
  void add_generatedDatesAndDurations_javaTimeAndIcuAgree() throws Exception {
    SplittableRandom random = new SplittableRandom(SEED);
    List<String> mismatches = new ArrayList<>();
    int checked = 0;
    for (int i = 0; i < CASES; i++) {
      LocalDate start = date(random);
      IsoDuration amount = duration(random);
      LocalDate expectedByIcu = icuPlus(start, amount);
      if (Math.abs(expectedByIcu.getYear()) > IsoText.MAX_YEAR) {
        continue; // beyond the tool's range both ways; the range check has its own tests
      }
      LocalDate byJavaTime = Moment.of(start).plus(amount).date();
      checked++;
      if (!expectedByIcu.equals(byJavaTime)) {
        mismatches.add("case " + i + ": " + start + " + " + amount + ": java.time " + byJavaTime + ", ICU " + expectedByIcu);
      }
    }
    assertAgree(mismatches, checked);
  }

  /** ICU: the whole months in one step (so a year and a month clamp once, as ISO 8601 durations do), then the days. */
  private static LocalDate icuPlus(LocalDate start, IsoDuration amount) throws Exception {
    Calendar calendar = icuAt(start);
    calendar.add(Calendar.MONTH, Math.toIntExact(amount.totalMonths()));
    calendar.add(Calendar.DATE, Math.toIntExact(amount.totalDays()));
    return icuDate(calendar);
  }

  /* ------------------------------------------------ between ------------------------------------------------ */

  @Test
  void between_generatedDatePairs_daysWeeksMonthsYearsAgree() {
    SplittableRandom random = new SplittableRandom(SEED + 1);
    List<String> mismatches = new ArrayList<>();
    for (int i = 0; i < CASES; i++) {
      LocalDate from = date(random);
      LocalDate to = near(from, random);
      long days = icuAt(to).get(Calendar.JULIAN_DAY) - icuAt(from).get(Calendar.JULIAN_DAY);
      long months = icuAt(from).fieldDifference(icuAt(to).getTime(), Calendar.MONTH);
      long years = icuAt(from).fieldDifference(icuAt(to).getTime(), Calendar.YEAR);
      String expected = days + " " + days / 7 + " " + months + " " + years;
      String actual = Spans.between(from, to, Spans.Unit.DAYS) + " " + Spans.between(from, to, Spans.Unit.WEEKS) + " "
          + Spans.between(from, to, Spans.Unit.MONTHS) + " " + Spans.between(from, to, Spans.Unit.YEARS);
      if (!expected.equals(actual)) {
        mismatches.add("case " + i + ": " + from + " to " + to + " (days weeks months years): java.time " + actual + ", ICU " + expected);
      }
    }
    assertAgree(mismatches, CASES);
  }

  @Test
  void businessDays_generatedSpans_agreeWithIcuCountingDayByDay() {
    SplittableRandom random = new SplittableRandom(SEED + 2);
    List<String> mismatches = new ArrayList<>();
    for (int i = 0; i < CASES; i++) {
      LocalDate from = date(random);
      LocalDate to = from.plusDays(random.nextInt(-45, 46));
      long expected = icuWeekdaysAfterUpTo(from, to);
      long actual = Spans.between(from, to, Spans.Unit.BUSINESS_DAYS);
      if (expected != actual) {
        mismatches.add("case " + i + ": " + from + " to " + to + ": java.time " + actual + ", ICU " + expected);
      }
    }
    assertAgree(mismatches, CASES);
  }

  /** Monday-to-Friday days after {@code from} up to and including {@code to}, negated backwards, by ICU's weekday. */
  private static long icuWeekdaysAfterUpTo(LocalDate from, LocalDate to) {
    boolean forward = !to.isBefore(from);
    Calendar day = icuAt(forward ? from : to);
    Date end = icuAt(forward ? to : from).getTime();
    long count = 0;
    while (day.getTime().before(end)) {
      day.add(Calendar.DATE, 1);
      int weekday = day.get(Calendar.DAY_OF_WEEK);
      if (weekday != Calendar.SATURDAY && weekday != Calendar.SUNDAY) {
        count++;
      }
    }
    return forward ? count : -count;
  }

  /* ------------------------------------------------ weekday ------------------------------------------------ */

  @Test
  void weekday_generatedDates_agree() {
    SplittableRandom random = new SplittableRandom(SEED + 3);
    List<String> mismatches = new ArrayList<>();
    for (int i = 0; i < CASES; i++) {
      LocalDate date = date(random);
      int icu = icuAt(date).get(Calendar.DAY_OF_WEEK); // 1 = Sunday ... 7 = Saturday
      int iso = date.getDayOfWeek().getValue(); // 1 = Monday ... 7 = Sunday
      if (icu != iso % 7 + 1) {
        mismatches.add("case " + i + ": " + date + ": java.time " + date.getDayOfWeek() + ", ICU day " + icu);
      }
    }
    assertAgree(mismatches, CASES);
  }

  /* ------------------------------------------------ generators ------------------------------------------------ */

  /** Dates across the range, most in recent centuries, many at month ends and on 29 February. */
  static LocalDate date(SplittableRandom random) {
    int kind = random.nextInt(10);
    int year = kind < 5 ? random.nextInt(1800, 2201)
        : kind < 9 ? random.nextInt(-9999, 10_000)
        : random.nextInt(IsoText.MIN_YEAR + 1000, IsoText.MAX_YEAR - 999);
    int month = random.nextInt(1, 13);
    int length = LocalDate.of(year, month, 1).lengthOfMonth();
    int day = switch (random.nextInt(4)) {
      case 0 -> length;                      // month end: where clamping shows
      case 1 -> Math.max(1, length - random.nextInt(3));
      default -> random.nextInt(1, length + 1);
    };
    if (random.nextInt(20) == 0) {
      int leapYear = 2000 + 4 * random.nextInt(-400, 400);
      return LocalDate.of(leapYear % 100 == 0 && leapYear % 400 != 0 ? leapYear + 4 : leapYear, 2, 29);
    }
    return LocalDate.of(year, month, day);
  }

  /** Durations of years, months, weeks and days, often with only one or two parts, of either sign. */
  static IsoDuration duration(SplittableRandom random) {
    long years = random.nextInt(3) == 0 ? random.nextInt(0, 120) : 0;
    long months = random.nextInt(2) == 0 ? random.nextInt(0, 40) : 0;
    long weeks = random.nextInt(4) == 0 ? random.nextInt(0, 60) : 0;
    long days = random.nextInt(2) == 0 ? random.nextInt(0, 800) : 0;
    return new IsoDuration(random.nextBoolean(), years, months, weeks, days, 0, 0, 0, 0);
  }

  /** A second date: mostly within a few years of the first, sometimes centuries away, either side. */
  private static LocalDate near(LocalDate from, SplittableRandom random) {
    long span = random.nextInt(4) == 0 ? 200_000 : random.nextInt(2) == 0 ? 2_000 : 70;
    LocalDate to = from.plusDays(random.nextLong(-span, span + 1));
    return Math.abs(to.getYear()) > IsoText.MAX_YEAR ? from : to;
  }

  /* ------------------------------------------------ ICU side ------------------------------------------------ */

  private static Calendar icuAt(LocalDate date) {
    GregorianCalendar calendar = new GregorianCalendar(TimeZone.GMT_ZONE, ULocale.ROOT);
    calendar.setGregorianChange(new Date(Long.MIN_VALUE)); // proleptic Gregorian, like ISO 8601 and java.time
    calendar.clear();
    calendar.set(Calendar.EXTENDED_YEAR, date.getYear());
    calendar.set(Calendar.MONTH, date.getMonthValue() - 1);
    calendar.set(Calendar.DAY_OF_MONTH, date.getDayOfMonth());
    return calendar;
  }

  private static LocalDate icuDate(Calendar calendar) {
    return LocalDate.of(calendar.get(Calendar.EXTENDED_YEAR), calendar.get(Calendar.MONTH) + 1,
        calendar.get(Calendar.DAY_OF_MONTH));
  }

  private static void assertAgree(List<String> mismatches, int checked) {
    assertTrue(checked >= CASES * 99 / 100, "too few cases checked: " + checked);
    assertEquals(List.of(), mismatches.subList(0, Math.min(5, mismatches.size())),
        () -> mismatches.size() + " of " + checked + " cases disagree (seed " + SEED + ")");
  }
}
