package reckoner.dates;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static reckoner.dates.DatesCalls.say;
import static reckoner.dates.DatesCalls.text;

import com.ibm.icu.util.BasicTimeZone;
import com.ibm.icu.util.TimeZoneTransition;
import java.time.DayOfWeek;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.time.zone.ZoneOffsetTransition;
import java.time.zone.ZoneRules;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The ISO work checked against outside references, each named beside its check: ISO 8601-1:2019
 * (week dates, ordinal dates, the Gregorian calendar), weekday facts of the trade, and the IANA
 * time zone database's 2024 transitions for America/New_York and Europe/Berlin.
 */
final class IsoRulesTest {

  /* ------------------------------------------ ISO 8601-1:2019 week dates ------------------------------------------ */

  // ISO 8601-1:2019, 3.2.2 and 5.2.4: week 01 of a year is the week that contains the year's first Thursday (equivalently
  // 4 January); weeks start on Monday; days are numbered 1 (Monday) to 7 (Sunday); a week belongs to the year of its
  // Thursday. The examples below follow from those rules; 1985-04-12 = 1985-W15-5 = 1985-102 is the standard's running
  // example date (from memory of the standard's examples).
  @ParameterizedTest(name = "{0} is {1}")
  @CsvSource({
      "1985-04-12, 1985-W15-5",
      "2020-12-31, 2020-W53-4",
      "2021-01-01, 2020-W53-5",
      "2021-01-03, 2020-W53-7",
      "2021-01-04, 2021-W01-1",
      "2008-12-29, 2009-W01-1",
      "2009-12-31, 2009-W53-4",
      "2010-01-03, 2009-W53-7",
      "2005-01-02, 2004-W53-7",
      "2007-01-01, 2007-W01-1",
  })
  void isoWeek_standardExamples_matchTheWeekDateRules(String date, String weekDate) {
    assertEquals(weekDate, say("iso week " + date));
  }

  @Test
  void isoWeek_firstWeekOfEveryYear_containsTheYearsFirstThursday() {
    // ISO 8601-1:2019, 3.2.2: "the first calendar week of a year is the one that includes the first Thursday of that year".
    int checked = 0;
    for (int year = 1583; year <= 2600; year++) {
      LocalDate firstThursday = LocalDate.of(year, 1, 1);
      while (firstThursday.getDayOfWeek() != DayOfWeek.THURSDAY) {
        firstThursday = firstThursday.plusDays(1);
      }
      assertEquals(IsoText.yearText(year) + "-W01-4", say("iso week " + firstThursday), "year " + year);
      LocalDate mondayOfWeek1 = firstThursday.minusDays(3);
      assertEquals(IsoText.yearText(year) + "-W01-1", say("iso week " + mondayOfWeek1), "year " + year);
      checked++;
    }
    assertEquals(1018, checked);
  }

  @Test
  void isoWeek_longYears_are71InEvery400YearCycle() {
    // A year has 53 ISO weeks when it starts on a Thursday, or is a leap year starting on a Wednesday (consequence of
    // ISO 8601-1:2019, 3.2.2); in the Gregorian 400-year cycle that gives 71 long years (from memory, a known count).
    int longYears = 0;
    for (int year = 2000; year < 2400; year++) {
      String lastWeek = say("iso week " + year + "-12-28"); // 28 December always lies in the year's last week
      DayOfWeek jan1 = LocalDate.of(year, 1, 1).getDayOfWeek();
      boolean expectLong = jan1 == DayOfWeek.THURSDAY || (jan1 == DayOfWeek.WEDNESDAY && java.time.Year.isLeap(year));
      assertEquals(expectLong, lastWeek.contains("-W53-"), "year " + year);
      longYears += expectLong ? 1 : 0;
    }
    assertEquals(71, longYears);
  }

  @Test
  void weekDateInput_isReadBackToTheCalendarDate() {
    // ISO 8601-1:2019, 5.2.4.1 (week date, extended format) and 5.2.3 (ordinal date): the same day as 1985-04-12.
    assertEquals("Friday", text("{\"op\":\"weekday\",\"date\":\"1985-W15-5\"}"));
    assertEquals("Friday", text("{\"op\":\"weekday\",\"date\":\"1985-102\"}"));
    assertEquals("102", text("{\"op\":\"day_of_year\",\"date\":\"1985-04-12\"}"));
  }

  /* ------------------------------------------ the Gregorian calendar ------------------------------------------ */

  @ParameterizedTest(name = "{0}: {1}")
  @CsvSource({
      "1600, yes", "1700, no", "1800, no", "1900, no", "2000, yes", "2004, yes", "2023, no", "2024, yes", "2100, no",
      "2400, yes", "0, yes", "-4, yes", "-100, no",
  })
  void leapYear_gregorianRule(String year, String leap) {
    // ISO 8601-1:2019, 3.2.1 (the Gregorian calendar, with its proleptic use): a year is a leap year when divisible by 4,
    // except centuries not divisible by 400 (the rule of the 1582 reform). 1900 not, 2000 yes.
    assertEquals(leap, say("leap year " + year));
  }

  @Test
  void leapYear_97In400Years_andTheCycleIs146097Days() {
    // The Gregorian 400-year cycle: 97 leap years, 400 * 365 + 97 = 146,097 days = 20,871 weeks exactly (from memory,
    // a well-known property of the calendar; it follows from the rule above).
    int leap = 0;
    for (int year = 2000; year < 2400; year++) {
      leap += say("leap year " + year).equals("yes") ? 1 : 0;
    }
    assertEquals(97, leap);
    assertEquals("146097", say("days from 2000-01-01 to 2400-01-01"));
    assertEquals("146097", say("days from -0400-03-01 to 0000-03-01"));
    assertEquals("20871", say("weeks from 2000-01-01 to 2400-01-01"));
    assertEquals("400", say("years from 2000-01-01 to 2400-01-01"));
  }

  @Test
  void weekday_repeatsEvery146097Days() {
    for (String date : new String[] {"1970-01-01", "2024-02-29", "-0586-07-24", "1582-10-15"}) {
      assertEquals(say("weekday " + date), text("{\"op\":\"weekday\",\"date\":\""
          + LocalDate.parse(date).plusDays(146_097) + "\"}"), date);
    }
  }

  @ParameterizedTest(name = "{0} was a {1}")
  @CsvSource({
      "1970-01-01, Thursday", // the POSIX epoch (POSIX.1-2017, 4.16 "Seconds Since the Epoch"), from memory
      "2000-01-01, Saturday", // from memory
      "1900-01-01, Monday",   // from memory
      "1582-10-15, Friday",   // the first day of the Gregorian calendar (bull Inter gravissimas), from memory
      "2024-03-01, Friday",
  })
  void weekday_factsOfTheTrade(String date, String weekday) {
    assertEquals(weekday, say("weekday " + date));
  }

  @ParameterizedTest(name = "{0} has {1} days")
  @CsvSource({
      "2023-01, 31", "2023-02, 28", "2024-02, 29", "2023-03, 31", "2023-04, 30", "2023-05, 31", "2023-06, 30",
      "2023-07, 31", "2023-08, 31", "2023-09, 30", "2023-10, 31", "2023-11, 30", "2023-12, 31", "1900-02, 28",
      "2000-02, 29",
  })
  void daysInMonth_gregorianMonthLengths(String month, String days) {
    // ISO 8601-1:2019, 3.2.1: the Gregorian month lengths (28/29, 30, 31).
    assertEquals(days, say("days in month " + month));
  }

  /* ------------------------------------------ IANA tz database, 2024 ------------------------------------------ */

  // Source for the four transitions: the IANA tz database (tzdata, files northamerica and europe), from memory:
  //   Rule US 2007 max - Mar Sun>=8 2:00 1:00 D   /   Rule US 2007 max - Nov Sun>=1 2:00 0 S   (America/New_York, EST/EDT)
  //   Rule EU 1981 max - Mar lastSun 1:00u 1:00 S /   Rule EU 1996 max - Oct lastSun 1:00u 0 -  (Europe/Berlin, CET/CEST)
  // so in 2024: New York springs forward at 2024-03-10 02:00 EST (07:00 UTC) and falls back at 2024-11-03 02:00 EDT
  // (06:00 UTC); Berlin at 2024-03-31 02:00 CET (01:00 UTC) and 2024-10-27 03:00 CEST (01:00 UTC). These rules have been
  // unchanged for years, so the JDK's and ICU4J's copies of the database agree on them whatever their release.

  @ParameterizedTest(name = "{0}: {1} -> {2} at {3}")
  @CsvSource({
      "America/New_York, -05:00, -04:00, 2024-03-10T07:00:00Z",
      "America/New_York, -04:00, -05:00, 2024-11-03T06:00:00Z",
      "Europe/Berlin, +01:00, +02:00, 2024-03-31T01:00:00Z",
      "Europe/Berlin, +02:00, +01:00, 2024-10-27T01:00:00Z",
  })
  void tzTransitions2024_jdkAndIcuDatabasesAgreeWithIana(String zone, String before, String after, String at) {
    Instant instant = Instant.parse(at);
    ZoneRules rules = ZoneId.of(zone).getRules();
    ZoneOffsetTransition jdk = rules.nextTransition(instant.minusSeconds(1));
    assertEquals(instant, jdk.getInstant());
    assertEquals(ZoneOffset.of(before), jdk.getOffsetBefore());
    assertEquals(ZoneOffset.of(after), jdk.getOffsetAfter());
    BasicTimeZone icu = (BasicTimeZone) com.ibm.icu.util.TimeZone.getTimeZone(zone, com.ibm.icu.util.TimeZone.TIMEZONE_ICU);
    TimeZoneTransition icuNext = icu.getNextTransition(instant.toEpochMilli() - 1000, false);
    assertEquals(instant.toEpochMilli(), icuNext.getTime());
    assertEquals(ZoneOffset.of(after).getTotalSeconds() * 1000,
        icuNext.getTo().getRawOffset() + icuNext.getTo().getDSTSavings());
  }

  @ParameterizedTest(name = "{0} {1} is {2}")
  @CsvSource({
      // spring forward: 02:00-02:59 do not exist and move forward by the gap (one hour)
      "America/New_York, 2024-03-10T01:59, 2024-03-10T06:59Z[UTC]",
      "America/New_York, 2024-03-10T02:00, 2024-03-10T07:00Z[UTC]",
      "America/New_York, 2024-03-10T02:30, 2024-03-10T07:30Z[UTC]",
      "America/New_York, 2024-03-10T03:00, 2024-03-10T07:00Z[UTC]",
      // fall back: 01:00-01:59 happen twice and take the earlier offset (EDT)
      "America/New_York, 2024-11-03T00:59, 2024-11-03T04:59Z[UTC]",
      "America/New_York, 2024-11-03T01:00, 2024-11-03T05:00Z[UTC]",
      "America/New_York, 2024-11-03T01:59, 2024-11-03T05:59Z[UTC]",
      "America/New_York, 2024-11-03T02:00, 2024-11-03T07:00Z[UTC]",
      "Europe/Berlin, 2024-03-31T01:59, 2024-03-31T00:59Z[UTC]",
      "Europe/Berlin, 2024-03-31T02:30, 2024-03-31T01:30Z[UTC]",
      "Europe/Berlin, 2024-03-31T03:00, 2024-03-31T01:00Z[UTC]",
      "Europe/Berlin, 2024-10-27T01:59, 2024-10-26T23:59Z[UTC]",
      "Europe/Berlin, 2024-10-27T02:30, 2024-10-27T00:30Z[UTC]",
      "Europe/Berlin, 2024-10-27T03:00, 2024-10-27T02:00Z[UTC]",
  })
  void convertZone_aroundThe2024Transitions_gapsMoveForwardAndOverlapsTakeTheEarlierOffset(
      String zone, String local, String utc) {
    assertEquals(utc, say(local + " " + zone + " to UTC"));
  }

  @Test
  void convertZone_gapTimeInItsOwnZone_showsTheMovedClockTime() {
    assertEquals("2024-03-10T03:30-04:00[America/New_York]", say("2024-03-10T02:30 America/New_York to America/New_York"));
    assertEquals("2024-10-27T02:30+02:00[Europe/Berlin]", say("2024-10-27T02:30 Europe/Berlin to Europe/Berlin"));
  }

  @Test
  void add_acrossTheGap_nominalDayKeepsClockTimeElapsedHoursDoNot() {
    // RFC 5545, 3.3.6 makes the same distinction: nominal days versus exact hours across a DST change.
    assertEquals("2024-03-10T12:00-04:00[America/New_York]", say("2024-03-09T12:00 America/New_York + P1D"));
    assertEquals("2024-03-10T13:00-04:00[America/New_York]", say("2024-03-09T12:00 America/New_York + PT24H"));
    assertEquals("2024-10-28T02:30+01:00[Europe/Berlin]", say("2024-10-27T02:30 Europe/Berlin + P1D"));
    // a day landing in the overlap takes the earlier offset too, even from the later one
    assertEquals("2024-11-03T01:30-04:00[America/New_York]", say("2024-11-04T01:30 America/New_York - P1D"));
    assertTrue(say("2024-03-09T02:30 America/New_York + P1D").startsWith("2024-03-10T03:30-04:00"));
  }
}
