package reckoner.dates;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

final class IsoDurationTest {

  // ISO 8601-1:2019, 5.5.2.4 (durations PnYnMnDTnHnMnS and PnW); a whole-duration sign as in ISO 8601-2:2019.
  @ParameterizedTest(name = "{0} is {1}")
  @CsvSource({
      "P1Y2M10DT2H30M, P1Y2M10DT2H30M",
      "p1y2m10dt2h30m, P1Y2M10DT2H30M",
      "P0Y1M, P1M",
      "P2W, P2W",
      "P1Y2M3W4D, P1Y2M3W4D",
      "PT36H, PT36H",
      "PT0.5S, PT0.5S",
      "'PT1,250S', PT1.25S",
      "PT0S, P0D",
      "-P0D, P0D",
      "-P3D, -P3D",
      "+P3D, P3D",
      "P007D, P7D",
  })
  void parse_toString_isTheCanonicalSpelling(String text, String canonical) throws ToolException {
    assertEquals(canonical, IsoDuration.parse(text).toString());
  }

  @Test
  void equalDurations_fromDifferentSpellings_areEqualValues() throws ToolException {
    assertEquals(IsoDuration.parse("P1M"), IsoDuration.parse("p0y1m0d"));
    assertEquals(IsoDuration.parse("P1M").hashCode(), IsoDuration.parse("p0y1m0d").hashCode());
    assertEquals(IsoDuration.of(45, IsoDuration.TimeUnit.DAYS), IsoDuration.parse("P45D"));
    assertEquals(IsoDuration.of(-2, IsoDuration.TimeUnit.HOURS), IsoDuration.parse("-PT2H"));
  }

  @Test
  void parts_areSignedTotals() throws ToolException {
    IsoDuration d = IsoDuration.parse("-P1Y2M3W4DT5H6M7.5S");
    assertEquals(-14, d.totalMonths());
    assertEquals(-25, d.totalDays());
    assertEquals(Duration.ofHours(5).plusMinutes(6).plusSeconds(7).plusMillis(500).negated(), d.timePart());
    assertTrue(d.hasTime());
    assertFalse(IsoDuration.parse("P1D").hasTime());
    assertEquals("P1Y2M3W4DT5H6M7.5S", d.negated().toString());
  }

  @ParameterizedTest(name = "{0}")
  @CsvSource({"P", "PT", "P1DT", "1D", "P1X", "P1.5D", "PT1.5H", "P-1D", "P1M2Y", "PT1S2M", "P1D x", "P 1D"})
  void parse_malformed_isInvalidDuration(String text) {
    ToolException e = assertThrows(ToolException.class, () -> IsoDuration.parse(text));
    assertEquals(ErrorCode.INVALID_DURATION, e.error().code());
  }

  @Test
  void parse_hugeComponents_areOutOfRange() throws ToolException {
    assertEquals(ErrorCode.OUT_OF_RANGE,
        assertThrows(ToolException.class, () -> IsoDuration.parse("P1234567890123456789D")).error().code());
    IsoDuration big = IsoDuration.parse("P999999999999999999Y"); // 12 times that overflows a long
    assertEquals(ErrorCode.OUT_OF_RANGE, assertThrows(ToolException.class, big::totalMonths).error().code());
  }
}
