package reckoner.dates;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.SplittableRandom;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reckoner.call.Outcome;
import reckoner.tool.ErrorCode;
import reckoner.tool.ResultText;

/**
 * Bad input gets the contract's code, through the same path as a real call (schema, canonicalize,
 * invoke): never an answer, never internal_error (the 5xx of the HTTP layer), always a one-line error.
 */
final class DatesBadInputTest {

  static Stream<Arguments> badInputs() {
    return Stream.of(
        // impossible dates and times
        bad("{\"text\":\"weekday 2023-02-30\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"weekday\",\"date\":\"2024-13-01\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"weekday\",\"date\":\"2024-00-10\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"weekday\",\"date\":\"2024-04-31\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"weekday\",\"date\":\"2023-02-29\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"weekday\",\"date\":\"1900-02-29\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"weekday\",\"date\":\"March 1st\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"weekday\",\"date\":\"2024/03/01\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"weekday\",\"date\":\"24-03-01\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"weekday\",\"date\":\"2024-03-01T10:00\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"weekday\",\"date\":\"2021-W53-1\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"weekday\",\"date\":\"2023-366\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"days_in_month\",\"date\":\"2024-13\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"convert_zone\",\"date\":\"2024-03-10T24:00\",\"zone\":\"UTC\",\"to\":\"UTC\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"convert_zone\",\"date\":\"2024-03-10T12:60\",\"zone\":\"UTC\",\"to\":\"UTC\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"convert_zone\",\"date\":\"2016-12-31T23:59:60\",\"zone\":\"UTC\",\"to\":\"UTC\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"convert_zone\",\"date\":\"2024-03-10\",\"zone\":\"UTC\",\"to\":\"UTC\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"convert_zone\",\"date\":\"2024-03-10T12:00+19:00\",\"to\":\"UTC\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"add\",\"date\":\"2024-03-09T12:00-04:00\",\"zone\":\"America/New_York\",\"duration\":\"P1D\"}",
            ErrorCode.INVALID_DATE),
        bad("{\"op\":\"today\",\"as_of\":\"yesterday\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"today\",\"as_of\":\"2019-06-14T10:00Z[UTC]\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"from_calendar\",\"calendar\":\"hebrew\",\"date\":\"5785-02-31\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"from_calendar\",\"calendar\":\"hebrew\",\"date\":\"5785-05L-01\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"from_calendar\",\"calendar\":\"japanese\",\"date\":\"heisei 32-01-01\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"from_calendar\",\"calendar\":\"japanese\",\"date\":\"2024-01-01\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"from_calendar\",\"calendar\":\"coptic\",\"date\":\"1741-13-06\"}", ErrorCode.INVALID_DATE),
        bad("{\"op\":\"from_calendar\",\"calendar\":\"chinese\",\"date\":\"2024-02L-01\"}", ErrorCode.INVALID_DATE),
        // broken durations
        bad("{\"text\":\"2024-01-31 + P1X\"}", ErrorCode.INVALID_DURATION),
        bad("{\"op\":\"add\",\"date\":\"2024-01-01\",\"duration\":\"P\"}", ErrorCode.INVALID_DURATION),
        bad("{\"op\":\"add\",\"date\":\"2024-01-01\",\"duration\":\"PT\"}", ErrorCode.INVALID_DURATION),
        bad("{\"op\":\"add\",\"date\":\"2024-01-01\",\"duration\":\"P1.5D\"}", ErrorCode.INVALID_DURATION),
        bad("{\"op\":\"add\",\"date\":\"2024-01-01\",\"duration\":\"P-1D\"}", ErrorCode.INVALID_DURATION),
        bad("{\"op\":\"add\",\"date\":\"2024-01-01\",\"duration\":\"1 month\"}", ErrorCode.INVALID_DURATION),
        bad("{\"op\":\"add\",\"date\":\"2024-01-01\",\"duration\":\"P1DT\"}", ErrorCode.INVALID_DURATION),
        bad("{\"op\":\"add\",\"date\":\"2024-01-01\",\"duration\":\"P1M2Y\"}", ErrorCode.INVALID_DURATION),
        bad("{\"text\":\"2024-03-01 + PT36H\"}", ErrorCode.INVALID_DURATION),
        bad("{\"text\":\"3 fortnights ago\",\"as_of\":\"2024-03-01\"}", ErrorCode.INVALID_DURATION),
        bad("{\"text\":\"many days ago\",\"as_of\":\"2024-03-01\"}", ErrorCode.INVALID_DURATION),
        // unknown zones
        bad("{\"text\":\"2024-03-10T02:30 Mars/Olympus to UTC\"}", ErrorCode.UNKNOWN_ZONE),
        bad("{\"op\":\"today\",\"zone\":\"Eastern\",\"as_of\":\"2024-03-01T12:00Z\"}", ErrorCode.UNKNOWN_ZONE),
        bad("{\"op\":\"convert_zone\",\"date\":\"2024-03-10T02:30\",\"zone\":\"America/New_York\",\"to\":\"Europe/Atlantis\"}",
            ErrorCode.UNKNOWN_ZONE),
        bad("{\"op\":\"convert_zone\",\"date\":\"2024-03-10T02:30\",\"zone\":\"+25:00\",\"to\":\"UTC\"}", ErrorCode.UNKNOWN_ZONE),
        bad("{\"text\":\"today in Nowhere/Land\"}", ErrorCode.UNKNOWN_ZONE),
        // unknown calendars
        bad("{\"text\":\"2024-10-03 in klingon\"}", ErrorCode.UNKNOWN_CALENDAR),
        bad("{\"op\":\"to_calendar\",\"date\":\"2024-10-03\",\"calendar\":\"islamic\"}", ErrorCode.UNKNOWN_CALENDAR),
        bad("{\"op\":\"to_calendar\",\"date\":\"2024-10-03\",\"calendar\":\"julian\"}", ErrorCode.UNKNOWN_CALENDAR),
        bad("{\"op\":\"from_calendar\",\"date\":\"5785-01-01\",\"calendar\":\"hebrw\"}", ErrorCode.UNKNOWN_CALENDAR),
        bad("{\"text\":\"2024-10-03 in UTC\"}", ErrorCode.UNKNOWN_CALENDAR),
        // absurd years and overflowing durations
        bad("{\"text\":\"weekday 1000000-01-01\"}", ErrorCode.OUT_OF_RANGE),
        bad("{\"op\":\"weekday\",\"date\":\"-1000000-01-01\"}", ErrorCode.OUT_OF_RANGE),
        bad("{\"op\":\"leap_year\",\"date\":\"99999999999999999999\"}", ErrorCode.OUT_OF_RANGE),
        bad("{\"op\":\"add\",\"date\":\"999999-12-31\",\"duration\":\"P1D\"}", ErrorCode.OUT_OF_RANGE),
        bad("{\"op\":\"subtract\",\"date\":\"-999999-01-01\",\"duration\":\"P1D\"}", ErrorCode.OUT_OF_RANGE),
        bad("{\"op\":\"add\",\"date\":\"2024-01-01\",\"duration\":\"P9999999999999999999Y\"}", ErrorCode.OUT_OF_RANGE),
        bad("{\"op\":\"add\",\"date\":\"2024-01-01\",\"duration\":\"P999999999999999999M\"}", ErrorCode.OUT_OF_RANGE),
        bad("{\"op\":\"add\",\"date\":\"2024-01-01\",\"duration\":\"P999999999999999999W\"}", ErrorCode.OUT_OF_RANGE),
        bad("{\"op\":\"add\",\"date\":\"2024-01-01T00:00\",\"duration\":\"PT999999999999999999H\"}", ErrorCode.OUT_OF_RANGE),
        bad("{\"text\":\"999999999999999999999 days ago\",\"as_of\":\"2024-03-01\"}", ErrorCode.OUT_OF_RANGE),
        bad("{\"op\":\"to_calendar\",\"date\":\"1800-01-01\",\"calendar\":\"japanese\"}", ErrorCode.OUT_OF_RANGE),
        bad("{\"op\":\"to_calendar\",\"date\":\"2200-01-01\",\"calendar\":\"chinese\"}", ErrorCode.OUT_OF_RANGE),
        bad("{\"op\":\"to_calendar\",\"date\":\"2300-01-01\",\"calendar\":\"islamic-umalqura\"}", ErrorCode.OUT_OF_RANGE),
        bad("{\"op\":\"to_calendar\",\"date\":\"12000-01-01\",\"calendar\":\"hebrew\"}", ErrorCode.OUT_OF_RANGE),
        bad("{\"op\":\"from_calendar\",\"date\":\"1700-01-01\",\"calendar\":\"islamic-umalqura\"}", ErrorCode.OUT_OF_RANGE),
        bad("{\"op\":\"from_calendar\",\"date\":\"9999999-01-01\",\"calendar\":\"persian\"}", ErrorCode.OUT_OF_RANGE),
        bad("{\"op\":\"convert_zone\",\"date\":\"+999999-12-31T23:00\",\"zone\":\"UTC\",\"to\":\"Pacific/Kiritimati\"}",
            ErrorCode.OUT_OF_RANGE),
        bad("{\"op\":\"today\",\"as_of\":\"+999999-12-31T23:00-12:00\",\"zone\":\"Pacific/Kiritimati\"}", ErrorCode.OUT_OF_RANGE),
        // arguments a caller got wrong
        bad("{\"text\":\"what day is it\"}", ErrorCode.INVALID_ARGUMENT),
        bad("{\"text\":\"\"}", ErrorCode.INVALID_ARGUMENT),
        bad("{\"text\":\"weekday\"}", ErrorCode.INVALID_ARGUMENT),
        bad("{\"text\":\"days from 2024-01-01 until 2024-02-01\"}", ErrorCode.INVALID_ARGUMENT),
        bad("{\"op\":\"weekday\"}", ErrorCode.INVALID_ARGUMENT),
        bad("{\"op\":\"fortnight\"}", ErrorCode.INVALID_ARGUMENT),
        bad("{\"op\":\"weekday\",\"date\":\"2024-03-01\",\"to\":\"2024-03-02\"}", ErrorCode.INVALID_ARGUMENT),
        bad("{\"op\":\"weekday\",\"date\":\"2024-03-01\",\"extra\":1}", ErrorCode.INVALID_ARGUMENT),
        bad("{\"op\":\"weekday\",\"date\":5}", ErrorCode.INVALID_ARGUMENT),
        bad("{\"op\":\"weekday\",\"text\":\"weekday 2024-03-01\"}", ErrorCode.INVALID_ARGUMENT),
        bad("{\"text\":\"weekday 2024-03-01\",\"date\":\"2024-03-01\"}", ErrorCode.INVALID_ARGUMENT),
        bad("{\"text\":\"today in UTC\",\"zone\":\"UTC\",\"as_of\":\"2024-03-01\"}", ErrorCode.INVALID_ARGUMENT),
        bad("{\"op\":\"weekday\",\"date\":\"2024-03-01\",\"locale\":\"xx-YY\"}", ErrorCode.INVALID_ARGUMENT),
        bad("{\"op\":\"weekday\",\"date\":\"2024-03-01\",\"locale\":\"!!\"}", ErrorCode.INVALID_ARGUMENT),
        bad("{\"op\":\"weekday\",\"date\":\"2024-03-01\",\"style\":\"fancy\"}", ErrorCode.INVALID_ARGUMENT),
        bad("{\"op\":\"between\",\"date\":\"2024-01-01\",\"to\":\"2024-02-01\",\"unit\":\"fortnights\"}", ErrorCode.INVALID_ARGUMENT),
        bad("{\"op\":\"ago\",\"duration\":\"PT3H\",\"as_of\":\"2019-06-14\"}", ErrorCode.INVALID_ARGUMENT),
        bad("{\"op\":\"convert_zone\",\"date\":\"2024-03-10T02:30\",\"to\":\"UTC\"}", ErrorCode.INVALID_ARGUMENT),
        bad("{\"op\":\"add\",\"date\":\"2024-03-10\",\"zone\":\"UTC\",\"duration\":\"P1D\"}", ErrorCode.INVALID_ARGUMENT),
        bad("{\"op\":\"add\",\"date\":\"2024-03-09T12:00[America/New_York]\",\"zone\":\"Europe/Berlin\",\"duration\":\"P1D\"}",
            ErrorCode.INVALID_ARGUMENT));
  }

  private static Arguments bad(String args, ErrorCode code) {
    return Arguments.of(args, code);
  }

  @ParameterizedTest(name = "{1}: {0}")
  @MethodSource("badInputs")
  void badInput_getsItsCode_asOneLineError(String args, ErrorCode code) {
    Outcome outcome = DatesCalls.call(args);
    assertTrue(outcome.error().isPresent(), () -> "expected " + code + " but got the answer " + outcome.text());
    assertEquals(code, outcome.error().get().code(), outcome::text);
    assertTrue(outcome.text().startsWith("error: " + code.wireName() + ": "), outcome::text);
    assertTrue(ResultText.isOneLine(outcome.text()), outcome::text);
  }

  @Test
  void badInputs_areAtLeastForty_andCoverEveryDatesCode() {
    List<ErrorCode> codes = badInputs().map(a -> (ErrorCode) a.get()[1]).toList();
    assertTrue(codes.size() >= 40, "only " + codes.size());
    for (ErrorCode code : List.of(ErrorCode.INVALID_DATE, ErrorCode.INVALID_DURATION, ErrorCode.UNKNOWN_ZONE,
        ErrorCode.UNKNOWN_CALENDAR, ErrorCode.OUT_OF_RANGE, ErrorCode.INVALID_ARGUMENT)) {
      assertTrue(codes.contains(code), code.wireName());
    }
  }

  @Test
  void unknownZone_suggestsTheNearestIds() {
    Outcome outcome = DatesCalls.call("{\"text\":\"2024-03-10T02:30 America/New_Yrok to UTC\"}");
    assertEquals(List.of("America/New_York"), outcome.error().get().suggestions());
    assertEquals(List.of("America/New_York"),
        DatesCalls.call("{\"text\":\"2024-03-10T02:30 New_York to UTC\"}").error().get().suggestions());
  }

  @Test
  void unknownCalendar_suggestsTheNearestKeys() {
    assertEquals(List.of("hebrew"), DatesCalls.call("{\"text\":\"2024-10-03 in hebrw\"}").error().get().suggestions());
    assertEquals(List.of("islamic-umalqura", "islamic-civil"),
        DatesCalls.call("{\"text\":\"2024-10-03 in islamic\"}").error().get().suggestions());
  }

  @Test
  void badInput_detail_saysWhatWasExpectedAndFound() {
    assertEquals("error: invalid_date: '2023-02-30' is not a date: February 2023 has 28 days",
        DatesCalls.call("{\"text\":\"weekday 2023-02-30\"}").text());
    assertEquals("error: invalid_duration: 'P1.5D': only the seconds may have a fraction; write P1DT12H instead of P1.5D",
        DatesCalls.call("{\"op\":\"add\",\"date\":\"2024-01-01\",\"duration\":\"P1.5D\"}").text());
    assertEquals("error: out_of_range: the year in '1000000-01-01' is outside the supported range -999999 to 999999",
        DatesCalls.call("{\"text\":\"weekday 1000000-01-01\"}").text());
  }

  /* ------------------------------------------------ generated garbage ------------------------------------------------ */

  private static final String[] PIECES = {
      "today", "ago", "in", "to", "from", "between", "and", "+", "-", "plus", "weekday", "iso", "week", "day", "of", "year",
      "leap", "days", "in", "month", "quarter", "business", "3", "0", "-1", "999999999999999999999", "a", "P1M", "PT2H",
      "P", "-P1D", "P1.5D", "2024-02-29", "2023-02-29", "2024-03-10T02:30", "2024-03-10T02:30Z", "+999999-12-31",
      "-999999-01-01", "2020-W53-4", "2024-366", "2024-02", "24", "America/New_York", "UTC", "+05:30", "Mars/Base",
      "hebrew", "japanese", "reiwa", "6-10-03", "chinese", "2023-02L-15", "5784-05L-21", "islamic-umalqura", "x", "Ω",
      "\u0000", "[UTC]", "2024-03-10T02:30[Europe/Berlin]", "T", "Z", "",
  };
  private static final String[] KEYS = {"op", "date", "to", "duration", "unit", "zone", "calendar", "as_of", "locale", "style"};
  private static final String[] OPS = {"today", "ago", "add", "subtract", "between", "weekday", "iso_week", "day_of_year",
      "leap_year", "days_in_month", "quarter", "convert_zone", "to_calendar", "from_calendar"};

  @Test
  void generatedGarbage_neverFailsInternally() {
    SplittableRandom random = new SplittableRandom(42);
    int calls = 0;
    for (int i = 0; i < 4000; i++) {
      String args = i % 2 == 0 ? randomText(random) : randomStructured(random);
      Outcome outcome = DatesCalls.call(args);
      assertTrue(ResultText.isOneLine(outcome.text()), args);
      if (outcome.error().isPresent()) {
        assertNotEquals(ErrorCode.INTERNAL_ERROR, outcome.error().get().code(), () -> args + " -> " + outcome.text());
      }
      calls++;
    }
    assertEquals(4000, calls);
  }

  private static String randomText(SplittableRandom random) {
    StringBuilder sb = new StringBuilder();
    for (int n = random.nextInt(1, 7); n > 0; n--) {
      sb.append(PIECES[random.nextInt(PIECES.length)]).append(random.nextInt(5) == 0 ? "  " : " ");
    }
    return "{\"text\":" + DatesCalls.JSON.writeValueAsString(sb.toString()) + (random.nextBoolean() ? ",\"as_of\":\"2024-03-01T12:00Z\"" : "")
        + "}";
  }

  private static String randomStructured(SplittableRandom random) {
    StringBuilder sb = new StringBuilder("{\"op\":\"").append(OPS[random.nextInt(OPS.length)]).append('"');
    for (int n = random.nextInt(0, 5); n > 0; n--) {
      String key = KEYS[1 + random.nextInt(KEYS.length - 1)];
      if (sb.indexOf("\"" + key + "\"") < 0) {
        sb.append(",\"").append(key).append("\":").append(DatesCalls.JSON.writeValueAsString(PIECES[random.nextInt(PIECES.length)]));
      }
    }
    return sb.append('}').toString();
  }
}
