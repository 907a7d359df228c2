package reckoner.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.ibm.icu.impl.units.UnitsConverter;
import com.ibm.icu.impl.units.UnitsData;
import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/**
 * A cross-check against a general-purpose reference library: ICU4J 78.1 and the CLDR unit data it
 * ships ({@code UnitsData.getSimpleUnits()}, converted with {@code UnitsConverter}). Every simple
 * unit CLDR knows is either mapped to a unit of this table, and must agree to 12 significant
 * digits, or listed below as not in the table, with the reason.
 */
final class IcuCrossCheckTest {
  private static final UnitTable TABLE = UnitTable.standard();
  private static final BigDecimal TOLERANCE = new BigDecimal("1e-12");

  /** CLDR unit, our unit, and the pair of reference units (CLDR's and ours) both are converted to. */
  private static Arguments map(String cldr, String ours, String cldrRef, String ourRef) {
    return Arguments.of(cldr, ours, cldrRef, ourRef);
  }

  static Stream<Arguments> sharedUnits() {
    return Stream.of(
        map("acre", "acre", "square-meter", "m^2"),
        map("ampere", "A", "ampere", "A"),
        map("arc-minute", "arcmin", "radian", "rad"),
        map("arc-second", "arcsec", "radian", "rad"),
        map("astronomical-unit", "au", "meter", "m"),
        map("atmosphere", "atm", "pascal", "Pa"),
        map("bar", "bar", "pascal", "Pa"),
        map("barrel", "bbl", "cubic-meter", "m^3"),
        map("bit", "bit", "bit", "bit"),
        map("british-thermal-unit", "Btu_th", "joule", "J"),
        map("british-thermal-unit-it", "Btu_IT", "joule", "J"),
        map("bushel", "bu_us", "cubic-meter", "m^3"),
        map("byte", "B", "bit", "bit"),
        map("calorie", "cal_th", "joule", "J"),
        map("calorie-it", "cal_IT", "joule", "J"),
        map("candela", "cd", "candela", "cd"),
        map("carat", "ct", "kilogram", "kg"),
        map("century", "century", "year", "yr_gregorian"),
        map("chain", "ch", "meter", "m"),
        map("coulomb", "C", "coulomb", "C"),
        map("cup", "cup_us", "cubic-meter", "m^3"),
        map("cup-imperial", "cup_imp", "cubic-meter", "m^3"),
        map("cup-metric", "cup_metric", "cubic-meter", "m^3"),
        map("day", "d", "second", "s"),
        map("decade", "decade", "year", "yr_gregorian"),
        map("degree", "°", "radian", "rad"),
        map("dram", "fldr", "cubic-meter", "m^3"),
        map("dunam", "dunam", "square-meter", "m^2"),
        map("farad", "F", "farad", "F"),
        map("fathom", "ftm", "meter", "m"),
        map("fluid-ounce", "floz_us", "cubic-meter", "m^3"),
        map("fluid-ounce-imperial", "floz_imp", "cubic-meter", "m^3"),
        map("fluid-ounce-metric", "floz_metric", "cubic-meter", "m^3"),
        map("foodcalorie", "kcal_th", "joule", "J"),
        map("foot", "ft", "meter", "m"),
        map("fortnight", "fortnight", "second", "s"),
        map("furlong", "fur", "meter", "m"),
        map("g-force", "gn", "meter-per-square-second", "m/s^2"),
        map("gallon", "gal_us", "cubic-meter", "m^3"),
        map("gallon-imperial", "gal_imp", "cubic-meter", "m^3"),
        map("grain", "gr", "kilogram", "kg"),
        map("gram", "g", "kilogram", "kg"),
        map("hectare", "ha", "square-meter", "m^2"),
        map("henry", "H", "henry", "H"),
        map("horsepower", "hp_mech", "watt", "W"),
        map("hour", "h", "second", "s"),
        map("inch", "in", "meter", "m"),
        map("jigger", "jigger", "cubic-meter", "m^3"),
        map("joule", "J", "joule", "J"),
        map("karat", "kt_purity", "part", "ratio"),
        map("katal", "kat", "katal", "kat"),
        map("kelvin", "K", "kelvin", "K"),
        map("kilogram-force", "kgf", "newton", "N"),
        map("knot", "kn", "meter-per-second", "m/s"),
        map("light-speed", "c0", "meter-per-second", "m/s"),
        map("light-year", "ly", "meter", "m"),
        map("liter", "L", "cubic-meter", "m^3"),
        map("lumen", "lm", "candela", "cd sr"),
        map("lux", "lx", "lux", "lm/m^2"),
        map("meter", "m", "meter", "m"),
        map("mile", "mi", "meter", "m"),
        map("mile-scandinavian", "mil_sv", "meter", "m"),
        map("minute", "min", "second", "s"),
        map("mole", "mol", "mole", "mol"),
        map("month", "mo_mean", "year", "yr_gregorian"),
        map("nautical-mile", "nmi", "meter", "m"),
        map("newton", "N", "newton", "N"),
        map("ohm", "Ω", "ohm", "ohm"),
        map("ounce", "oz", "kilogram", "kg"),
        map("parsec", "pc", "meter", "m"),
        map("part", "ratio", "part", "ratio"),
        map("pascal", "Pa", "pascal", "Pa"),
        map("percent", "%", "part", "ratio"),
        map("permille", "‰", "part", "ratio"),
        map("permyriad", "‱", "part", "ratio"),
        map("pint", "pt_us", "cubic-meter", "m^3"),
        map("pint-imperial", "pt_imp", "cubic-meter", "m^3"),
        map("pint-metric", "pt_metric", "cubic-meter", "m^3"),
        map("point", "pt_dtp", "meter", "m"),
        map("pound", "lb", "kilogram", "kg"),
        map("pound-force", "lbf", "newton", "N"),
        map("quart", "qt_us", "cubic-meter", "m^3"),
        map("quart-imperial", "qt_imp", "cubic-meter", "m^3"),
        map("radian", "rad", "radian", "rad"),
        map("rankine", "°R", "kelvin", "K"),
        map("revolution", "rev", "radian", "rad"),
        map("rod", "rd", "meter", "m"),
        map("second", "s", "second", "s"),
        map("siemens", "S", "siemens", "S"),
        map("slug", "slug", "kilogram", "kg"),
        map("steradian", "sr", "steradian", "sr"),
        map("stone", "st", "kilogram", "kg"),
        map("tablespoon", "tbsp_us", "cubic-meter", "m^3"),
        map("teaspoon", "tsp_us", "cubic-meter", "m^3"),
        map("tesla", "T", "tesla", "T"),
        map("therm-us", "thm_US", "joule", "J"),
        map("ton", "ton_short", "kilogram", "kg"),
        map("tonne", "t", "kilogram", "kg"),
        map("volt", "V", "volt", "V"),
        map("watt", "W", "watt", "W"),
        map("weber", "Wb", "weber", "Wb"),
        map("week", "wk", "second", "s"),
        map("yard", "yd", "meter", "m"),
        map("year", "yr_gregorian", "month", "mo_mean"));
  }

  /** CLDR units this table does not hold as CLDR means them, and why. */
  private static final Map<String, String> NOT_IN_TABLE = new LinkedHashMap<>();

  static {
    String japanese = "a traditional Japanese unit; not in this table";
    for (String u : new String[] {"bu-jp", "cho", "cup-jp", "fun", "jo-jp", "ken", "koku", "kosaji", "osaji", "ri-jp",
        "rin", "sai", "se-jp", "shaku", "shaku-cloth", "shaku-length", "sun", "to-jp"}) {
      NOT_IN_TABLE.put(u, japanese);
    }
    String measured = "a measured constant, not an exact definition; the table holds exact definitions only";
    for (String u : new String[] {"dalton", "earth-mass", "earth-radius", "solar-luminosity", "solar-mass", "solar-radius"}) {
      NOT_IN_TABLE.put(u, measured);
    }
    String radiation = "radiation units are left out: dose quantities carry weighting factors a conversion cannot apply";
    for (String u : new String[] {"becquerel", "gray", "sievert"}) {
      NOT_IN_TABLE.put(u, radiation);
    }
    String person = "CLDR's grammatical variant of a calendar unit for ages; not a unit of its own";
    for (String u : new String[] {"day-person", "week-person", "month-person", "year-person"}) {
      NOT_IN_TABLE.put(u, person);
    }
    NOT_IN_TABLE.put("beaufort", "a wind-force scale, not a linear unit");
    NOT_IN_TABLE.put("celsius", "affine: checked at several points in celsiusAndFahrenheit_agreeWithCldr");
    NOT_IN_TABLE.put("fahrenheit", "affine: checked at several points in celsiusAndFahrenheit_agreeWithCldr");
    NOT_IN_TABLE.put("electronvolt", "CLDR rounds it to 7 digits (1.602177E-19 J); checked to those in roundedInCldr_agreesToCldrsDigits");
    NOT_IN_TABLE.put("ounce-troy", "CLDR rounds it to 7 digits (0.03110348 kg; exactly 480 grains = 0.0311034768 kg);"
        + " checked to those in roundedInCldr_agreesToCldrsDigits");
    NOT_IN_TABLE.put("hertz", "CLDR's hertz is a revolution per second; here Hz is s^-1 (SI Brochure Table 4) and angle is a dimension");
    NOT_IN_TABLE.put("dessert-spoon", "not in this table");
    NOT_IN_TABLE.put("dessert-spoon-imperial", "not in this table");
    NOT_IN_TABLE.put("drop", "not in this table");
    NOT_IN_TABLE.put("pinch", "not in this table");
    NOT_IN_TABLE.put("quarter", "not in this table");
    NOT_IN_TABLE.put("night", "a count of hotel nights, not a duration");
    NOT_IN_TABLE.put("item", "a count of entities");
    NOT_IN_TABLE.put("dot", "a device-dependent dot; CLDR gives no factor");
    NOT_IN_TABLE.put("pixel", "a device pixel; CLDR gives no factor (the table's px is the CSS pixel)");
    NOT_IN_TABLE.put("em", "a font-relative length");
    NOT_IN_TABLE.put("gasoline-energy-density", "an energy content of gasoline, not a unit");
    NOT_IN_TABLE.put("ofglucose", "a qualifier ('of glucose'), not a unit");
    NOT_IN_TABLE.put("ofhg", "a qualifier ('of mercury'); millimeter-ofhg and inch-ofhg are checked as compounds");
  }

  @Test
  void everyCldrSimpleUnit_isMappedOrExplained() {
    Set<String> cldr = new TreeSet<>(Arrays.asList(UnitsData.getSimpleUnits()));
    Set<String> covered = new TreeSet<>(NOT_IN_TABLE.keySet());
    sharedUnits().forEach(a -> covered.add((String) a.get()[0]));
    assertEquals(cldr, covered);
  }

  @ParameterizedTest(name = "CLDR {0} = our {1}")
  @MethodSource("sharedUnits")
  void sharedUnit_agreesToTwelveDigits(String cldr, String ours, String cldrRef, String ourRef) throws ToolException {
    BigDecimal icu = new UnitsConverter(cldr, cldrRef).convert(BigDecimal.ONE);
    assertAgree(icu, ours(BigDecimal.ONE, ours, ourRef), cldr + " -> " + cldrRef);
  }

  static Stream<Arguments> compounds() {
    return Stream.of(
        map("kilometer-per-hour", "km/h", "meter-per-second", "m/s"),
        map("mile-per-hour", "mph", "meter-per-second", "m/s"),
        map("mile-per-hour", "mi/h", "knot", "kn"),
        map("liter-per-100-kilometer", "L/100km", "mile-per-gallon", "mpg"),
        map("liter-per-100-kilometer", "L/100 km", "mile-per-gallon-imperial", "mpg_imp"),
        map("mile-per-gallon", "mpg", "liter-per-kilometer", "L/km"),
        map("pound-force-per-square-inch", "psi", "pascal", "Pa"),
        map("kilowatt-hour", "kWh", "joule", "J"),
        map("revolution-per-minute", "rpm", "radian-per-second", "rad/s"),
        map("degree-per-second", "°/s", "revolution-per-minute", "rpm"),
        map("foot-pound-force", "ft lbf", "joule", "J"),
        map("millimeter-ofhg", "mmHg", "pascal", "Pa"),
        map("inch-ofhg", "inHg", "pascal", "Pa"),
        map("kibibyte", "KiB", "byte", "B"),
        map("megabyte", "MB", "byte", "B"),
        map("square-mile", "mi^2", "square-meter", "m^2"),
        map("cubic-foot", "ft^3", "liter", "L"),
        map("cubic-foot-per-minute", "cfm", "liter-per-second", "L/s"),
        map("gigawatt-hour", "GWh", "joule", "J"),
        map("kilogram-per-cubic-meter", "kg/m^3", "gram-per-cubic-centimeter", "g/cm^3"),
        map("pound-per-cubic-foot", "lb/ft^3", "kilogram-per-cubic-meter", "kg/m^3"),
        map("newton-meter", "N·m", "pound-force-foot", "lbf·ft"),
        map("microgram", "µg", "grain", "gr"),
        map("nanometer", "nm", "picometer", "pm"));
  }

  @ParameterizedTest(name = "CLDR {0} -> {2} = our {1} -> {3}")
  @MethodSource("compounds")
  void compoundUnit_agreesToTwelveDigits(String cldr, String ours, String cldrRef, String ourRef) throws ToolException {
    for (String v : new String[] {"1", "7.5", "250"}) {
      BigDecimal icu = new UnitsConverter(cldr, cldrRef).convert(new BigDecimal(v));
      assertAgree(icu, ours(new BigDecimal(v), ours, ourRef), v + " " + cldr + " -> " + cldrRef);
    }
  }

  @Test
  void celsiusAndFahrenheit_agreeWithCldr() throws ToolException {
    for (String v : new String[] {"-273.15", "-40", "0", "36.6", "100", "1000"}) {
      BigDecimal value = new BigDecimal(v);
      assertAgree(new UnitsConverter("celsius", "fahrenheit").convert(value), ours(value, "°C", "°F"), v + " °C");
      assertAgree(new UnitsConverter("fahrenheit", "kelvin").convert(value), ours(value, "°F", "K"), v + " °F");
      assertAgree(new UnitsConverter("celsius", "rankine").convert(value), ours(value, "°C", "°R"), v + " °C to °R");
    }
  }

  @ParameterizedTest(name = "CLDR {0} rounded")
  @MethodSource("roundedInCldr")
  void roundedInCldr_agreesToCldrsDigits(String cldr, String ours, String cldrRef, String ourRef) throws ToolException {
    BigDecimal icu = new UnitsConverter(cldr, cldrRef).convert(BigDecimal.ONE);
    BigDecimal exact = ours(BigDecimal.ONE, ours, ourRef);
    assertEquals(0, icu.compareTo(exact.round(new MathContext(icu.precision(), RoundingMode.HALF_EVEN))),
        "CLDR " + icu + ", ours " + exact);
  }

  static Stream<Arguments> roundedInCldr() {
    return Stream.of(
        map("electronvolt", "eV", "joule", "J"),
        map("ounce-troy", "ozt", "kilogram", "kg"));
  }

  @Test
  void hertz_isNotAnAngleRateHere() {
    // CLDR converts hertz to revolution-per-second; here that is a dimension mismatch by design.
    ToolException e = assertThrows(ToolException.class, () -> ours(BigDecimal.ONE, "Hz", "rev/s"));
    assertEquals(ErrorCode.DIMENSION_MISMATCH, e.error().code());
  }

  private static BigDecimal ours(BigDecimal value, String from, String to) throws ToolException {
    Factor exact = Converter.convert(Rational.of(value), UnitParser.parse(from, TABLE), from,
        UnitParser.parse(to, TABLE), to);
    return Rounder.toDigits(exact, 30, RoundingMode.HALF_EVEN);
  }

  private static void assertAgree(BigDecimal icu, BigDecimal ours, String what) {
    if (icu.signum() == 0 && ours.signum() == 0) {
      return;
    }
    BigDecimal relative = icu.subtract(ours).abs().divide(ours.abs().max(icu.abs()), MathContext.DECIMAL64);
    assertTrue(relative.compareTo(TOLERANCE) < 0, () -> what + ": CLDR " + icu + ", ours " + ours);
  }
}
