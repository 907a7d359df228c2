package reckoner.dates;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.LinkedHashMap;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/** The text grammar maps onto structured arguments; values are checked later, by the canonical form. */
final class TextFormTest {

  @ParameterizedTest(name = "{0}")
  @CsvSource(delimiter = '|', value = {
      "today | op=today",
      "Today in Asia/Tokyo | op=today zone=Asia/Tokyo",
      "45 days ago | op=ago duration=P45D",
      "a week ago | op=ago duration=P1W",
      "1 year ago in Europe/Berlin | op=ago duration=P1Y zone=Europe/Berlin",
      "P1Y2M ago | op=ago duration=P1Y2M",
      "2024-01-31 + P1M | op=add date=2024-01-31 duration=P1M",
      "2024-01-31   +   P1M | op=add date=2024-01-31 duration=P1M",
      "2024-01-31 - 3 days | op=subtract date=2024-01-31 duration=P3D",
      "2024-01-31 minus 2 hours | op=subtract date=2024-01-31 duration=PT2H",
      "2024-03-09T12:00 America/New_York + P1D | op=add date=2024-03-09T12:00 duration=P1D zone=America/New_York",
      "10 days before 2024-03-09T12:00 UTC | op=subtract date=2024-03-09T12:00 duration=P10D zone=UTC",
      "days from 2024-01-01 to 2024-12-25 | op=between date=2024-01-01 to=2024-12-25 unit=days",
      "Business Days between 2024-01-01 and 2024-01-31 | op=between date=2024-01-01 to=2024-01-31 unit=business_days",
      "month from 2024-01-01 to 2024-12-25 | op=between date=2024-01-01 to=2024-12-25 unit=months",
      "weekday 2024-03-01 | op=weekday date=2024-03-01",
      "day of week 2024-03-01 | op=weekday date=2024-03-01",
      "iso week 2024-03-01 | op=iso_week date=2024-03-01",
      "day of year 2024-03-01 | op=day_of_year date=2024-03-01",
      "leap year 2024 | op=leap_year date=2024",
      "days in month 2024-02 | op=days_in_month date=2024-02",
      "quarter 2024-03-01 | op=quarter date=2024-03-01",
      "2024-03-10T02:30 America/New_York to UTC | op=convert_zone date=2024-03-10T02:30 zone=America/New_York to=UTC",
      "2024-03-10T02:30 America/New_York in UTC | op=convert_zone date=2024-03-10T02:30 zone=America/New_York to=UTC",
      "2024-03-10T12:00Z in Asia/Tokyo | op=convert_zone date=2024-03-10T12:00Z to=Asia/Tokyo",
      "2024-10-03 in hebrew | op=to_calendar date=2024-10-03 calendar=hebrew",
      "2024-10-03 to persian | op=to_calendar date=2024-10-03 calendar=persian",
      "hebrew 5785-01-01 to iso | op=from_calendar calendar=hebrew date=5785-01-01",
      "japanese reiwa 6-10-03 in gregorian | op=from_calendar calendar=japanese date=reiwa 6-10-03",
  })
  void parse_eachPhrasing_givesItsArguments(String text, String expected) throws ToolException {
    Map<String, String> args = new LinkedHashMap<>();
    for (String pair : expected.split(" (?=[a-z_]+=)")) {
      args.put(pair.substring(0, pair.indexOf('=')), pair.substring(pair.indexOf('=') + 1));
    }
    assertEquals(args, TextForm.parse(text));
  }

  @ParameterizedTest(name = "{0}")
  @CsvSource(delimiter = '|', value = {
      "what day is it | cannot read 'what day is it' as a date question;",
      "today please | write today [in ZONE]",
      "45 days ago somewhere | write N UNIT ago [in ZONE]",
      "weekday | write weekday DATE",
      "weekday 2024-03-01 2024-03-02 | write weekday DATE",
      "days from 2024-01-01 until 2024-02-01 | write days from DATE to DATE",
      "2024-01-31 + 1 2 3 | write DATE + DURATION",
  })
  void parse_unreadable_isInvalidArgument_namingTheForm(String text, String detailStart) {
    ToolException e = assertThrows(ToolException.class, () -> TextForm.parse(text));
    assertEquals(ErrorCode.INVALID_ARGUMENT, e.error().code());
    assertEquals(detailStart, e.error().detail().substring(0, detailStart.length()), e.error().detail());
  }

  @Test
  void parse_unknownUnit_isInvalidDuration() {
    assertEquals(ErrorCode.INVALID_DURATION,
        assertThrows(ToolException.class, () -> TextForm.parse("3 fortnights ago")).error().code());
  }
}
