package reckoner.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/** The unit grammar: spellings that must mean the same unit, precedence, limits. */
final class UnitParserTest {
  private static final UnitTable TABLE = UnitTable.standard();

  private static Unit parse(String s) throws ToolException {
    return UnitParser.parse(s, TABLE);
  }

  private static ErrorCode codeOf(String s) {
    return assertThrows(ToolException.class, () -> parse(s)).error().code();
  }

  static Stream<Arguments> sameUnit() {
    return Stream.of(
        Arguments.of("kg*m^2/s^2", "J"),
        Arguments.of("kg·m²/s²", "J"),
        Arguments.of("kg m2 s-2", "J"),
        Arguments.of("kg × m**2 / s**2", "J"),
        Arguments.of("kg⋅m^(2)⋅s^(-2)", "J"),
        Arguments.of("N-m", "J"),
        Arguments.of("N m", "Nm"),
        Arguments.of("kilowatt hours", "kWh"),
        Arguments.of("kilowatt-hour", "kWh"),
        Arguments.of("km/h", "kilometres per hour"),
        Arguments.of("km/h", "Kilometers Per Hour"),
        Arguments.of("m/s^2", "metres per second squared"),
        Arguments.of("m/s/s", "m/s^2"),
        Arguments.of("J/kg K", "J/(kg·K)"),
        Arguments.of("W/m² K", "W/(m^2*K)"),
        Arguments.of("L/100km", "L/(100 km)"),
        Arguments.of("L/100 km", "10 mL/km"),
        Arguments.of("ft²", "square feet"),
        Arguments.of("sq ft", "ft^2"),
        Arguments.of("cubic inches", "in^3"),
        Arguments.of("cu in", "in3"),
        Arguments.of("µm", "um"),
        Arguments.of("μm", "micrometre"),
        Arguments.of("℃", "°C"),
        Arguments.of("Ω", "ohm"),
        Arguments.of("kΩ", "kohm"),
        Arguments.of("Å", "angstrom"),
        Arguments.of("pound-force", "lbf"),
        Arguments.of("pounds per square inch", "psi"),
        Arguments.of("fluid ounce (US)", "floz_us"),
        Arguments.of("US gallons", "gal_us"),
        Arguments.of("imperial gallon", "gal_imp"),
        Arguments.of("kibibytes", "KiB"),
        Arguments.of("megabytes", "MB"),
        Arguments.of("kilograms", "kg"),
        Arguments.of("kilos", "kg"),
        Arguments.of("KILOGRAMS", "kg"),
        Arguments.of("millilitres", "mL"),
        Arguments.of("ml", "mL"),
        Arguments.of("cc", "cm^3"),
        Arguments.of("per cent", "%"),
        Arguments.of("1/s", "Hz"),
        Arguments.of("s^-1", "Hz"),
        Arguments.of("(m/s)^2", "m^2/s^2"),
        Arguments.of("((m))", "m"),
        Arguments.of("mi/gal_us", "mpg"),
        Arguments.of("miles per gallon", "mpg"),
        Arguments.of("inH2O", "in_H2O"),
        Arguments.of("lb-ft", "lbf ft"),
        Arguments.of("degrees", "°"),
        Arguments.of("m^0", "ratio"));
  }

  @ParameterizedTest(name = "{0} = {1}")
  @MethodSource("sameUnit")
  void spellings_giveTheSameUnit(String a, String b) throws ToolException {
    Unit x = parse(a);
    Unit y = parse(b);
    assertEquals(y.dimension(), x.dimension(), a + " vs " + b);
    assertEquals(y.factor(), x.factor(), a + " vs " + b);
  }

  // ---- precedence ----

  @Test
  void explicitProducts_beforeTheSlash_formTheNumerator() throws ToolException {
    assertEquals(parse("N").dimension(), parse("kg*m/s^2").dimension());
    assertEquals(parse("m/s^2").factor(), parse("m/s/s").factor()); // a second slash divides again
  }

  @Test
  void productAfterSlash_isRefusedAsAmbiguous() {
    assertEquals(ErrorCode.SYNTAX_ERROR, codeOf("J/kg·K"));
    assertEquals(ErrorCode.SYNTAX_ERROR, codeOf("J/kg*K"));
  }

  @Test
  void symbols_areCaseSensitive() throws ToolException {
    assertEquals(Factor.of(Rational.parse("0.001")), parse("mm").factor());
    assertEquals(Factor.of(Rational.parse("1e6")), parse("Mm").factor());
    assertEquals(DimensionNames.forName("amount concentration").get(), parse("mM").dimension());
  }

  @Test
  void exactSymbol_winsOverAPrefixReading() throws ToolException {
    assertEquals(Factor.of(Rational.parse("0.3048")), parse("ft").factor()); // not femto-tonne
    assertEquals(Factor.of(Rational.parse("98066.5")), parse("at").factor()); // not atto-tonne
  }

  @Test
  void bareTemperatureScale_keepsItsOffset() throws ToolException {
    Unit c = parse("°C");
    assertTrue(c.simple());
    assertEquals(Rational.parse("273.15"), c.offset());
    assertFalse(parse("K").hasOffset());
  }

  // ---- limits and errors ----

  @Test
  void twoHundredCharacters_isTheLimit() throws ToolException {
    String groups = String.join("*", java.util.Collections.nCopies(33, "(m/m)")) + "*m"; // 199 characters
    assertEquals(199, groups.length());
    assertEquals(parse("m").dimension(), parse(groups + " ").dimension());
    assertEquals(ErrorCode.LIMIT_EXCEEDED, codeOf(groups + "  "));
  }

  @Test
  void exponents_areBoundedByTwelve() throws ToolException {
    assertEquals(12, parse("m^12").dimension().exponent(Dimension.Base.LENGTH));
    assertEquals(ErrorCode.LIMIT_EXCEEDED, codeOf("m^13"));
    assertEquals(ErrorCode.LIMIT_EXCEEDED, codeOf("(m^12)^3"));
  }

  @Test
  void prefixes_onlyWhereTheTableAllows() {
    assertEquals(ErrorCode.UNKNOWN_UNIT, codeOf("kin")); // no kilo-inch
    assertEquals(ErrorCode.UNKNOWN_UNIT, codeOf("mt"));  // tonne takes multiples only: not a milli-tonne
    assertEquals(ErrorCode.UNKNOWN_UNIT, codeOf("Kim")); // binary prefixes are for bits and bytes
  }

  @Test
  void unknownWord_isNamedWithSuggestions() {
    ToolException e = assertThrows(ToolException.class, () -> parse("kilometrs/h"));
    assertEquals("unknown unit 'kilometrs' in 'kilometrs/h'", e.error().detail());
    assertEquals("kilometers", e.error().suggestions().get(0));
  }

  @Test
  void ambiguousPrefixedName_listsPrefixedReadings() {
    ToolException e = assertThrows(ToolException.class, () -> parse("kcal"));
    assertEquals(ErrorCode.AMBIGUOUS_UNIT, e.error().code());
    assertEquals(java.util.List.of("kcal_th", "kcal_IT"), e.error().suggestions());
  }
}
