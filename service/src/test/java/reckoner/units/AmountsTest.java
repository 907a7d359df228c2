package reckoner.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.math.BigDecimal;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/** Amounts as written: each reading exact, each reading where two are possible refused. */
final class AmountsTest {
  // ---- read() --------------------------------------------------------------------------------------

  @ParameterizedTest(name = "''{0}'' is {1}, ending at {2}")
  @CsvSource(delimiter = '|', value = {
      "3.5 km|7/2|3",
      ".5 cup|1/2|2",
      "-40 F|-40|3",
      "−40 F|-40|3",
      "+2 m|2|2",
      "1e-3 m|1/1000|4",
      "2em|2|1",
      "5.|5|2",
      "3/4 in|3/4|3",
      "1 1/2 cups|3/2|5",
      "1-1/2 in|3/2|5",
      "2 300/400 in|11/4|9",
      "1,250,000 m|1250000|9",
      "1,250.5 m|2501/2|7",
      "1 250 000 m|1250000|9",
      "1 250.5 m|2501/2|7",
      "2,5 kg|5/2|3",
      "0,75 L|3/4|4",
      "5ft|5|1",
      "a mile|1|1",
      "an inch|1|2",
      "one cup|1|3",
      "twelve in|12|6",
      "half a cup|1/2|6",
      "a half cup|1/2|6",
      "a quarter of a mile|1/4|14",
      "three quarters of a cup|3/4|19",
      "one and a half cups|3/2|14",
      "2 and a quarter h|9/4|15",
      "1 h 30 min|1|1",
      "100/min|100|3"})
  void read_givesTheExactValue(String text, String value, int end) throws ToolException {
    Amounts.Amount a = Amounts.read(text, 0);
    assertEquals(Rational.parse(value), a.value());
    assertEquals(end, a.end());
  }

  @Test
  void read_withoutANumber_isNull() throws ToolException {
    assertNull(Amounts.read("km to mi", 0));
    assertNull(Amounts.read("acre", 0)); // "a" followed by a letter is no article
    assertNull(Amounts.read("- 5", 0));
  }

  @Test
  void read_aSingleCommaGroup_isRefusedWithBothReadings() {
    ToolException e = assertThrows(ToolException.class, () -> Amounts.read("1,250 m", 0));
    assertEquals(ErrorCode.SYNTAX_ERROR, e.error().code());
    assertEquals("'1,250' may be 1250 (a comma between thousands) or 1.25 (a decimal comma)", e.error().detail());
    assertEquals(List.of("1250", "1.25"), e.error().suggestions());
  }

  @ParameterizedTest(name = "''{0}''")
  @CsvSource(delimiter = '|', value = {
      "1.2.3 m|syntax_error",
      "12,34,5 m|syntax_error",
      "1,2345 m|syntax_error",
      "1/0 cup|syntax_error",
      "1/2/3 cup|syntax_error",
      "1e100000 m|limit_exceeded"})
  void read_malformedOrHuge_isRefused(String text, String code) {
    ToolException e = assertThrows(ToolException.class, () -> Amounts.read(text, 0));
    assertEquals(code, e.error().code().wireName());
  }

  // ---- canonical forms -----------------------------------------------------------------------------

  @Test
  void canonical_isTheExactDecimal_orTheFractionInLowestTerms() {
    assertEquals(new BigDecimal("0.5"), Amounts.canonical(Rational.of(1, 2)));
    assertEquals(new BigDecimal("0.0625"), Amounts.canonical(Rational.of(1, 16)));
    assertEquals(new BigDecimal("1.5"), Amounts.canonical(Rational.of(6, 4)));
    assertEquals("1/3", Amounts.canonical(Rational.of(2, 6)));
    assertEquals("-4/3", Amounts.canonical(Rational.of(-4, 3)));
    assertEquals("11.5", Amounts.text(Rational.of(23, 2)));
    assertEquals("1250000", Amounts.text(Rational.of(1250000)));
    assertEquals("0", Amounts.text(Rational.ZERO));
  }

  @Test
  void whole_readsAStructuredValue_andRefusesAnythingMore() throws ToolException {
    assertEquals(Rational.of(3, 2), Amounts.whole("1 1/2"));
    assertEquals(Rational.of(1, 3), Amounts.whole(" 1/3 "));
    assertEquals(ErrorCode.SYNTAX_ERROR, assertThrows(ToolException.class, () -> Amounts.whole("3 cups")).error().code());
    assertEquals(ErrorCode.SYNTAX_ERROR, assertThrows(ToolException.class, () -> Amounts.whole("")).error().code());
  }
}
