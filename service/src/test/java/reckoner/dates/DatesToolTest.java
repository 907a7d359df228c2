package reckoner.dates;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static reckoner.dates.DatesCalls.say;
import static reckoner.dates.DatesCalls.text;

import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import reckoner.call.Outcome;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/** dates@1 as a caller sees it: the reference time, canonical forms, each op's answer, and the wording. */
final class DatesToolTest {
  private final DatesTool tool = new DatesTool();

  @Test
  void id_isDatesVersion1() {
    assertEquals("dates@1", tool.id().toString());
  }

  /* ------------------------------------------------ reference time ------------------------------------------------ */

  @Test
  void today_asOf_isTheReferenceDate() {
    assertEquals("2019-06-14", text("{\"op\":\"today\",\"as_of\":\"2019-06-14\"}"));
    assertEquals("2016-02-29", text("{\"op\":\"today\",\"as_of\":\"2016-02-29T08:15:00Z\"}"));
  }

  @Test
  void today_differentAsOf_givesDifferentAnswers() {
    assertNotEquals(text("{\"text\":\"today\",\"as_of\":\"2019-06-14\"}"), text("{\"text\":\"today\",\"as_of\":\"2020-06-14\"}"));
    assertEquals("2019-05-03", text("{\"text\":\"6 weeks ago\",\"as_of\":\"2019-06-14\"}"));
    assertEquals("2020-05-03", text("{\"text\":\"6 weeks ago\",\"as_of\":\"2020-06-14\"}"));
  }

  @Test
  void today_asOfWithOffset_isTheDateAtThatOffsetUnlessAZoneIsGiven() {
    assertEquals("2019-06-14", text("{\"op\":\"today\",\"as_of\":\"2019-06-14T23:00-05:00\"}"));
    assertEquals("2019-06-15", text("{\"op\":\"today\",\"as_of\":\"2019-06-14T23:00-05:00\",\"zone\":\"UTC\"}"));
    assertEquals("2019-06-15", text("{\"text\":\"today in Asia/Tokyo\",\"as_of\":\"2019-06-14T20:00Z\"}"));
  }

  @Test
  void today_withoutAsOf_readsTheClockOnce_andIsNeverCacheable() throws ToolException {
    Instant now = Instant.parse("2024-02-29T23:30:00Z");
    int[] reads = {0};
    Clock counting = new Clock() {
      @Override public ZoneOffset getZone() {
        return ZoneOffset.UTC;
      }

      @Override public Clock withZone(java.time.ZoneId zone) {
        throw new UnsupportedOperationException();
      }

      @Override public Instant instant() {
        reads[0]++;
        return now;
      }
    };
    Answer answer = tool.invoke(tool.canonicalize(Arguments.of("text", "today")), new CallContext(counting));
    assertEquals("2024-02-29", answer.text());
    assertFalse(answer.cacheable());
    assertEquals(Optional.of(now), answer.clockReadAt());
    assertEquals(1, reads[0]);
    Answer tokyo = tool.invoke(tool.canonicalize(Arguments.of("text", "today in Asia/Tokyo")), new CallContext(counting));
    assertEquals("2024-03-01", tokyo.text());
  }

  @Test
  void ago_withoutAsOf_isNotCacheable_withAsOfItIs() {
    Outcome clock = DatesCalls.call("{\"text\":\"45 days ago\"}");
    assertEquals("2031-04-02", clock.text()); // 45 days before the test clock's 2031-05-17
    assertFalse(clock.answer().get().cacheable());
    assertEquals(Optional.of(DatesCalls.NOW), clock.answer().get().clockReadAt());
    Outcome fixed = DatesCalls.call("{\"text\":\"45 days ago\",\"as_of\":\"2019-06-14\"}");
    assertTrue(fixed.answer().get().cacheable());
    assertEquals(Optional.empty(), fixed.answer().get().clockReadAt());
  }

  @Test
  void asOfHeader_fillsTheReferenceTime_andMakesTheAnswerCacheable() {
    Outcome outcome = DatesCalls.callWithHeader("{\"text\":\"today\"}", "2019-06-14");
    assertEquals("2019-06-14", outcome.text());
    assertTrue(outcome.answer().get().cacheable());
    // an as_of in the arguments wins over the header
    assertEquals("2020-01-01", DatesCalls.callWithHeader("{\"text\":\"today\",\"as_of\":\"2020-01-01\"}", "2019-06-14").text());
  }

  @Test
  void asOf_isDroppedByOpsThatDoNotReadIt_soTheHeaderDoesNotSplitTheCache() throws ToolException {
    Arguments plain = tool.canonicalize(Arguments.of(Map.of("op", "weekday", "date", "2024-03-01")));
    Arguments withHeader = tool.canonicalize(Arguments.of(Map.of("op", "weekday", "date", "2024-03-01", "as_of", "2019-06-14")));
    assertEquals(plain, withHeader);
    assertEquals("Friday", DatesCalls.callWithHeader("{\"text\":\"weekday 2024-03-01\"}", "not even a date").text());
  }

  @Test
  void ago_timeUnits_giveADateTime_dateUnitsADate() {
    assertEquals("2019-06-13T22:00Z", text("{\"text\":\"3 hours ago\",\"as_of\":\"2019-06-14T01:00Z\"}"));
    assertEquals("2019-06-13T21:00-04:00[America/New_York]",
        text("{\"text\":\"3 hours ago in America/New_York\",\"as_of\":\"2019-06-14T04:00Z\"}"));
    assertEquals("2019-06-13T07:30", text("{\"op\":\"ago\",\"duration\":\"PT90M\",\"as_of\":\"2019-06-13T09:00\"}"));
    assertEquals("2019-06-13", text("{\"text\":\"1 day ago\",\"as_of\":\"2019-06-14T01:00Z\"}"));
  }

  /* ------------------------------------------------ canonical form ------------------------------------------------ */

  @ParameterizedTest(name = "{0}")
  @CsvSource(delimiter = '|', value = {
      "weekday 2024-03-01 | {\"op\":\"weekday\",\"date\":\"2024-03-01\"}",
      "WEEKDAY   2024-03-01 | {\"op\":\"weekday\",\"date\":\"2024-03-01\",\"style\":\"iso\"}",
      "day of week 2024-03-01 | {\"op\":\"weekday\",\"date\":\"2024-03-01\"}",
      "2024-01-31 + P1M | {\"op\":\"add\",\"date\":\"2024-01-31\",\"duration\":\"P1M\"}",
      "2024-01-31 plus 1 month | {\"op\":\"add\",\"date\":\"2024-01-31\",\"duration\":\"p0y1m\"}",
      "1 month after 2024-01-31 | {\"op\":\"add\",\"date\":\"2024-01-31\",\"duration\":\"P1M\"}",
      "2024-03-31 - P1M | {\"op\":\"subtract\",\"date\":\"2024-03-31\",\"duration\":\"P1M\"}",
      "6 weeks before 2024-03-31 | {\"op\":\"subtract\",\"date\":\"2024-03-31\",\"duration\":\"P6W\"}",
      "2024-03-09T12:00 america/new_york + P1D | {\"op\":\"add\",\"date\":\"2024-03-09T12:00:00\",\"zone\":\"America/New_York\",\"duration\":\"P1D\"}",
      "2024-03-09T12:00-05:00[America/New_York] + P1D | {\"op\":\"add\",\"date\":\"2024-03-09T12:00-05:00\",\"zone\":\"America/New_York\",\"duration\":\"P1D\"}",
      "days from 2024-01-01 to 2024-12-25 | {\"op\":\"between\",\"date\":\"2024-01-01\",\"to\":\"2024-12-25\"}",
      "days between 2024-01-01 and 2024-12-25 | {\"op\":\"between\",\"date\":\"2024-01-01\",\"to\":\"2024-12-25\",\"unit\":\"days\"}",
      "business days from 2024-03-01 to 2024-03-11 | {\"op\":\"between\",\"date\":\"2024-03-01\",\"to\":\"2024-03-11\",\"unit\":\"business_days\"}",
      "iso week 2020-12-31 | {\"op\":\"iso_week\",\"date\":\"2020-12-31\",\"style\":\"long\"}",
      "day of year 2024-03-01 | {\"op\":\"day_of_year\",\"date\":\"2024-061\"}",
      "leap year 2024 | {\"op\":\"leap_year\",\"date\":\"2024-07-04\"}",
      "days in month 2024-02 | {\"op\":\"days_in_month\",\"date\":\"2024-02-10\"}",
      "quarter 2024-03-01 | {\"op\":\"quarter\",\"date\":\"2024-W09-5\"}",
      "2024-03-10T02:30 America/New_York to UTC | {\"op\":\"convert_zone\",\"date\":\"2024-03-10T02:30\",\"zone\":\"America/New_York\",\"to\":\"utc\"}",
      "2024-03-10T02:30 America/New_York in UTC | {\"op\":\"convert_zone\",\"date\":\"2024-03-10T02:30:00.000\",\"zone\":\"America/New_York\",\"to\":\"UTC\"}",
      "2024-10-03 in hebrew | {\"op\":\"to_calendar\",\"date\":\"2024-10-03\",\"calendar\":\"Hebrew\"}",
      "2024-10-03 to jewish | {\"op\":\"to_calendar\",\"date\":\"2024-10-03\",\"calendar\":\"hebrew\"}",
      "hebrew 5785-M01-01 to iso | {\"op\":\"from_calendar\",\"date\":\"5785-1-1\",\"calendar\":\"hebrew\"}",
      "japanese Reiwa 6-10-03 to gregorian | {\"op\":\"from_calendar\",\"date\":\"reiwa 6-10-3\",\"calendar\":\"japanese\"}",
  })
  void textAndStructured_spellingsOfOneCall_canonicalizeEqually(String text, String structured) throws ToolException {
    Arguments fromText = tool.canonicalize(Arguments.of("text", text));
    Arguments fromStructured = tool.canonicalize(DatesCallsArguments.of(structured));
    assertEquals(fromStructured, fromText);
    assertEquals(fromStructured.toCanonicalJson(), fromText.toCanonicalJson());
    assertFalse(fromText.has(Arguments.TEXT));
  }

  @Test
  void canonicalize_fillsDefaults_andNormalisesValues() throws ToolException {
    assertEquals("{\"date\":\"2024-01-01\",\"op\":\"between\",\"to\":\"2024-12-25\",\"unit\":\"days\"}",
        tool.canonicalize(Arguments.of("text", "days from 2024-01-01 to 2024-12-25")).toCanonicalJson());
    assertEquals("{\"as_of\":\"2019-06-14T10:00Z\",\"duration\":\"P45D\",\"op\":\"ago\",\"style\":\"iso\"}",
        tool.canonicalize(Arguments.of(Map.of("text", "45 days ago", "as_of", "2019-06-14T10:00:00.000Z"))).toCanonicalJson());
    assertEquals("{\"date\":\"2024-03-01\",\"locale\":\"fr-FR\",\"op\":\"weekday\",\"style\":\"long\"}",
        tool.canonicalize(Arguments.of(Map.of("text", "weekday 2024-03-01", "locale", "fr_fr"))).toCanonicalJson());
    assertEquals("{\"date\":\"2024-03-01\",\"locale\":\"en-US\",\"op\":\"weekday\",\"style\":\"long\"}",
        tool.canonicalize(Arguments.of(Map.of("op", "weekday", "date", "2024-03-01", "style", "long"))).toCanonicalJson());
    assertEquals("{\"date\":\"2024-03-01\",\"locale\":\"th-TH\",\"op\":\"weekday\",\"style\":\"long\"}",
        tool.canonicalize(Arguments.of(Map.of("op", "weekday", "date", "2024-03-01", "locale", "th-TH-u-ca-buddhist")))
            .toCanonicalJson()); // the calendar comes from the calendar argument, never from the locale
    assertEquals("{\"date\":\"2020-12-31\",\"op\":\"iso_week\"}", // nothing to word: style and locale are dropped
        tool.canonicalize(Arguments.of(Map.of("op", "iso_week", "date", "2020-12-31", "locale", "de-DE"))).toCanonicalJson());
  }

  @Test
  void canonicalize_isIdempotent() throws ToolException {
    for (String text : new String[] {"today in Asia/Tokyo", "2024-03-09T12:00 America/New_York + P1DT2H", "hebrew 5784-05L-21 to iso",
        "business days between 2024-03-01 and 2024-03-11", "leap year -44"}) {
      Arguments once = tool.canonicalize(Arguments.of(Map.of("text", text, "as_of", "2024-03-01", "locale", "de")));
      assertEquals(once, tool.canonicalize(once), text);
    }
  }

  /* ------------------------------------------------ add, subtract ------------------------------------------------ */

  @ParameterizedTest(name = "{0}")
  @CsvSource(delimiter = '|', value = {
      "2024-01-31 + P1M | 2024-02-29",
      "2023-01-31 + P1M | 2023-02-28",
      "2024-01-31 + P1M1D | 2024-03-01",
      "2024-02-29 + P1Y | 2025-02-28",
      "2024-02-29 + P4Y | 2028-02-29",
      "2024-02-29 + P1Y1M | 2025-03-29",
      "2024-03-31 - P1M | 2024-02-29",
      "2024-01-01 + P2W | 2024-01-15",
      "2024-01-01 + -P1D | 2023-12-31",
      "2024-01-01 - -P1D | 2024-01-02",
      "2024-01-01 + P0D | 2024-01-01",
      "-0001-12-31 + P1D | 0000-01-01",
      "9999-12-31 + P1D | +10000-01-01",
      "2024-03-01T00:00 + PT36H | 2024-03-02T12:00",
      "2024-03-01T23:59:59.5 + PT0.5S | 2024-03-02T00:00",
      "2024-03-09T12:00-05:00 + P1D | 2024-03-10T12:00-05:00",
  })
  void add_monthArithmeticClampsToTheLastDay_andDateTimesKeepTheirForm(String text, String answer) {
    assertEquals(answer, say(text));
  }

  /* ------------------------------------------------ between ------------------------------------------------ */

  @ParameterizedTest(name = "{0}")
  @CsvSource(delimiter = '|', value = {
      "days from 2024-01-01 to 2024-12-25 | 359",
      "days from 2024-12-25 to 2024-01-01 | -359",
      "days from 2024-03-01 to 2024-03-01 | 0",
      "weeks from 2024-01-01 to 2024-01-20 | 2",
      "weeks from 2024-01-20 to 2024-01-01 | -2",
      "months from 2024-01-31 to 2024-02-29 | 1",
      "months from 2024-01-31 to 2024-02-28 | 0",
      "months from 2024-02-29 to 2024-01-31 | 0",
      "months from 2024-03-31 to 2024-02-29 | -1",
      "years from 2000-02-29 to 2001-02-28 | 1",
      "years from 2000-02-29 to 2004-02-28 | 3",
      "years from 1990-06-15 to 2024-06-14 | 33",
      "business days from 2024-03-01 to 2024-03-04 | 1",
      "business days from 2024-03-02 to 2024-03-04 | 1",
      "business days from 2024-03-01 to 2024-03-02 | 0",
      "business days from 2024-03-01 to 2024-03-11 | 6",
      "business days from 2024-03-11 to 2024-03-01 | -6",
      "business days from 2024-01-01 to 2024-12-31 | 261",
  })
  void between_countsSignedWholeUnits(String text, String answer) {
    assertEquals(answer, say(text));
  }

  /* ------------------------------------------------ the other ops ------------------------------------------------ */

  @ParameterizedTest(name = "{0}")
  @CsvSource(delimiter = '|', value = {
      "weekday 2024-03-01 | Friday",
      "weekday -0586-07-24 | Sunday", // Reingold and Dershowitz, Calendrical Calculations, sample dates (from memory)
      "iso week +10000-01-01 | 9999-W52-6", // a Saturday in the last week of week-year 9999
      "iso week +10000-01-03 | +10000-W01-1",
      "day of year 2024-12-31 | 366",
      "day of year 2023-12-31 | 365",
      "leap year 2024 | yes",
      "leap year -4 | yes",
      "days in month 1900-02 | 28",
      "quarter 2024-12-31 | 2024-Q4",
      "quarter -0044-03-15 | -0044-Q1",
      "2024-03-10T12:00Z in Asia/Tokyo | 2024-03-10T21:00+09:00[Asia/Tokyo]",
      "2024-03-10T12:00 UTC to +05:30 | 2024-03-10T17:30+05:30",
      "2024-03-10T12:00:15.250 Europe/Berlin to America/Sao_Paulo | 2024-03-10T08:00:15.250-03:00[America/Sao_Paulo]",
  })
  void ops_giveTheirIsoAnswers(String text, String answer) {
    assertEquals(answer, say(text));
  }

  /* ------------------------------------------------ wording ------------------------------------------------ */

  @ParameterizedTest(name = "{0} in {1}")
  @CsvSource(delimiter = '|', value = {
      // ICU4J 78.1 with its CLDR data; the en-US and fr-FR forms are the ones the issue names
      "today | en-US | Friday, March 1, 2024",
      "today | fr-FR | vendredi 1 mars 2024",
      "today | de-DE | Freitag, 1. März 2024",
      "today | en-GB | Friday, 1 March 2024",
      "today | ja-JP | 2024年3月1日金曜日",
      "today | ar-EG | الجمعة، ١ مارس ٢٠٢٤",
      "today | hi-IN | शुक्रवार, 1 मार्च 2024",
      "today | tr-TR | 1 Mart 2024 Cuma",
      "weekday 2024-03-01 | fr-FR | vendredi",
      "weekday 2024-03-01 | tr-TR | Cuma",
      "quarter 2024-03-01 | en-US | 1st quarter 2024",
      "quarter 2024-03-01 | fr-FR | 1er trimestre 2024",
      "2024-10-03 in hebrew | en-US | Thursday, 1 Tishri 5785",
      "2024-10-03 in japanese | ja-JP | 令和6年10月3日木曜日",
      "2024-10-03 in buddhist | th-TH | วันพฤหัสบดีที่ 3 ตุลาคม พ.ศ. 2567",
      "hebrew 5785-01-01 to iso | de-DE | Donnerstag, 3. Oktober 2024",
  })
  void styleLong_wordsTheAnswerInTheLocale(String text, String locale, String answer) {
    assertEquals(answer, text("{\"text\":\"" + text + "\",\"as_of\":\"2024-03-01\",\"locale\":\"" + locale + "\"}"));
  }

  @Test
  void styleLong_dateTimes_andYearsBeforeOne() {
    // CLDR puts a narrow no-break space (U+202F) before AM; the offset is ICU's localized GMT format
    assertEquals("Sunday, March 10, 2024 at 7:30\u202fAM GMT+0",
        text("{\"text\":\"2024-03-10T02:30 America/New_York to UTC\",\"style\":\"long\"}"));
    assertEquals("Sunday, 10 March 2024 at 13:00:15 GMT+5:30",
        text("{\"text\":\"2024-03-10T02:30:15 America/New_York to Asia/Kolkata\",\"locale\":\"en-GB\"}"));
    assertEquals("Monday, July 25, 587 BC", text("{\"text\":\"-0586-07-24 + P1D\",\"style\":\"long\"}"));
  }

  @Test
  void styleLong_neverCarriesBidirectionalMarks() {
    String hebrew = text("{\"text\":\"2024-03-10T02:30 America/New_York to UTC\",\"locale\":\"he-IL\"}");
    assertTrue(hebrew.codePoints().noneMatch(cp -> cp == 0x200E || cp == 0x200F || cp == 0x061C), hebrew);
  }

  @Test
  void styleIso_isTheDefault_evenWithAStyleFreeOp() {
    assertEquals("Friday", say("weekday 2024-03-01"));
    assertEquals("2020-W53-4", text("{\"text\":\"iso week 2020-12-31\",\"locale\":\"fr-FR\"}"));
  }

  /* ------------------------------------------------ direct use ------------------------------------------------ */

  @Test
  void invoke_badCanonicalValue_isAToolErrorNotACrash() {
    ToolException e = assertThrows(ToolException.class,
        () -> tool.invoke(Arguments.of(Map.of("op", "weekday", "date", "2024-02-30")), new CallContext(DatesCalls.CLOCK)));
    assertEquals(ErrorCode.INVALID_DATE, e.error().code());
  }
}
