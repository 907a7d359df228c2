package reckoner.dates;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.Optional;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

final class IsoTextTest {

  @ParameterizedTest(name = "{0} is {1}")
  @CsvSource({
      "2024-03-01, 2024-03-01",
      "-0044-03-15, -0044-03-15",
      "+10000-01-01, +10000-01-01",
      "10000-01-01, +10000-01-01",
      "+002024-03-01, 2024-03-01",
      "0000-01-01, 0000-01-01",
      "2024-061, 2024-03-01",
      "2020-W53-4, 2020-12-31",
      "2020-w53-4, 2020-12-31",
      "2024-03-10T02:30, 2024-03-10T02:30",
      "2024-03-10t02:30:00, 2024-03-10T02:30",
      "'2024-03-10T02:30:00,5', 2024-03-10T02:30:00.500",
      "2024-03-10T02:30z, 2024-03-10T02:30Z",
      "2024-03-10T02:30+05:30, 2024-03-10T02:30+05:30",
      "2024-03-10T02:30-00:00, 2024-03-10T02:30Z",
  })
  void stamp_readsIso8601Extended_writesJavaTimeForm(String text, String canonical) throws ToolException {
    assertEquals(canonical, IsoText.stamp(text).withoutZone());
  }

  @Test
  void stamp_bracketedZone_isKeptApart() throws ToolException {
    IsoStamp stamp = IsoText.stamp("2024-03-09T12:00-05:00[America/New_York]");
    assertEquals(Optional.of("America/New_York"), stamp.zone());
    assertEquals(Optional.of(ZoneOffset.ofHours(-5)), stamp.offset());
    assertEquals(LocalDate.of(2024, 3, 9), stamp.date());
  }

  @ParameterizedTest(name = "{0}: {1}")
  @CsvSource(delimiter = '|', value = {
      "2023-02-29 | '2023-02-29' is not a date: February 2023 has 28 days",
      "2024-13-01 | '2024-13-01' is not a date: month 13 does not exist (months run 01 to 12)",
      "2024-03-10T24:00 | '2024-03-10T24:00': hour 24 is not accepted; write 00:00 of the next day",
      "2024-03-10T23:59:60 | '2024-03-10T23:59:60': leap seconds (second 60) are not supported",
      "2024-367 | '2024-367' is not a date: year 2024 has days 001 to 366",
      "2023-366 | '2023-366' is not a date: year 2023 has days 001 to 365",
      "1 March 2024 | expected an ISO 8601 date YYYY-MM-DD or date-time YYYY-MM-DDThh:mm[:ss] but found '1 March 2024'",
  })
  void stamp_impossible_isInvalidDate_sayingWhy(String text, String detail) {
    ToolException e = assertThrows(ToolException.class, () -> IsoText.stamp(text));
    assertEquals(ErrorCode.INVALID_DATE, e.error().code());
    assertEquals(detail, e.error().detail());
  }

  @ParameterizedTest(name = "{0}")
  @CsvSource({"1000000-01-01", "-1000000-12-31", "123456789012345678901234-01-01"})
  void stamp_yearsBeyondSixDigits_areOutOfRange(String text) {
    assertEquals(ErrorCode.OUT_OF_RANGE, assertThrows(ToolException.class, () -> IsoText.stamp(text)).error().code());
  }

  @ParameterizedTest(name = "{0} -> {1}")
  @CsvSource({"2024, 2024", "24, 24", "-44, -44", "2024-07-04, 2024", "+999999, 999999"})
  void yearOf_yearOrDate(String text, int year) throws ToolException {
    assertEquals(year, IsoText.yearOf(text));
  }

  @ParameterizedTest(name = "{0} -> {1}")
  @CsvSource({"5, 0005", "2024, 2024", "-1, -0001", "-44, -0044", "10000, +10000", "-10000, -10000"})
  void yearText_writesAsJavaTimeDoesInADate(long year, String text) {
    assertEquals(text, IsoText.yearText(year));
    if (Math.abs(year) < 1_000_000) {
      assertEquals(LocalDate.of((int) year, 1, 1).toString().replaceFirst("-01-01$", ""), text);
    }
  }
}
