package reckoner.tool;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.math.BigDecimal;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** The contract's number rules ("Result text rules"), one row per rule and boundary. */
final class DecimalTextTest {
  @ParameterizedTest(name = "{0} -> {1}")
  @CsvSource({
      "0, 0", "-0, 0", "0.000, 0", "-0.000, 0", "1.2300, 1.23", "100, 100", "1E+2, 100", "-1.5, -1.5",
      "0.000001, 0.000001", "0.00000099, 9.9e-7", "999999999999999999999.9, 999999999999999999999.9",
      "1E+21, 1e+21", "1.5E+21, 1.5e+21", "-2.50E-8, -2.5e-8", "12345678901234567890123, 1.2345678901234567890123e+22"})
  void format_unpadded(String value, String expected) {
    assertEquals(expected, DecimalText.format(new BigDecimal(value), false));
  }

  @ParameterizedTest(name = "{0} padded -> {1}")
  @CsvSource({"1.2300, 1.2300", "0.00, 0.00", "-0.00, 0.00", "1.500E+21, 1.500e+21", "12E+1, 120"})
  void format_padded(String value, String expected) {
    assertEquals(expected, DecimalText.format(new BigDecimal(value), true));
  }

  @ParameterizedTest(name = "{0} at {1} digits -> {2}")
  @CsvSource({"1.5, 3, 1.50", "123456, 2, 1.2E+5", "0.0012345, 3, 0.00123", "0, 3, 0.00"})
  void roundToDigits_padsShortValues(String value, int digits, String expected) {
    assertEquals(new BigDecimal(expected), DecimalText.roundToDigits(new BigDecimal(value), digits, Rounding.HALF_EVEN));
  }
}
