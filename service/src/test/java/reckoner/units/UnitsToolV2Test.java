package reckoner.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.ibm.icu.impl.units.ComplexUnitsConverter;
import com.ibm.icu.impl.units.UnitsConverter;
import com.ibm.icu.util.Measure;
import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.math.RoundingMode;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reckoner.tool.Answer;
import reckoner.tool.CallContext;
import reckoner.tool.DecimalText;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/**
 * units@2's new readings, each checked in the text form and in the structured form against an
 * outside reference named beside it: ICU4J 78.1 and its CLDR unit data ({@code UnitsConverter},
 * and {@code ComplexUnitsConverter} for targets in parts, as a general-purpose reference library),
 * or a published definition where CLDR has no such unit (NIST SP 811 Appendix B.8, the SI Brochure).
 */
final class UnitsToolV2Test {
  private static final UnitsToolV2 TOOL = new UnitsToolV2();
  private static final CallContext CONTEXT = new CallContext(Clock.fixed(Instant.parse("2031-05-17T09:30:00Z"),
      ZoneOffset.UTC));

  private static Answer call(Map<String, Object> args) throws ToolException {
    return TOOL.invoke(TOOL.canonicalize(reckoner.tool.Arguments.of(args)), CONTEXT);
  }

  private static Answer text(String text) throws ToolException {
    return call(Map.of("text", text));
  }

  private static Answer text(String text, String system) throws ToolException {
    return call(Map.of("text", text, "system", system));
  }

  private static Map<String, Object> structured(Object value, String from, String to, String system) {
    Map<String, Object> m = new LinkedHashMap<>();
    m.put("value", value);
    m.put("from", from);
    m.put("to", to);
    m.put("system", system);
    return m;
  }

  /** The reference value rounded and written as the contract says: 6 significant digits, half_even. */
  private static String expected(BigDecimal reference, String unit) {
    return DecimalText.format(reference.round(new MathContext(6, RoundingMode.HALF_EVEN)), false) + " " + unit;
  }

  private static BigDecimal icu(String from, String to, String value) {
    return new UnitsConverter(from, to).convert(new BigDecimal(value));
  }

  // ---- default readings against ICU4J / CLDR -------------------------------------------------------

  private static Arguments reading(String value, String from, String to, String system, String cldrFrom, String cldrTo,
      String note) {
    return Arguments.of(value, from, to, system, cldrFrom, cldrTo, note);
  }

  static Stream<Arguments> defaultReadings() {
    return Stream.of(
        // CLDR cup, tablespoon, teaspoon, fluid-ounce, pint, quart, gallon: the US customary measures (HB 44 App. C)
        reading("3", "cups", "ml", "us", "cup", "milliliter", "'cups' read as US cup (cup_us), the default for system us"),
        reading("2", "tbsp", "ml", "us", "tablespoon", "milliliter",
            "'tbsp' read as US tablespoon (tbsp_us), the default for system us"),
        reading("1", "tsp", "mL", "us", "teaspoon", "milliliter",
            "'tsp' read as US teaspoon (tsp_us), the default for system us"),
        reading("8", "fl oz", "mL", "us", "fluid-ounce", "milliliter",
            "'fl oz' read as US fluid ounce (floz_us), the default for system us"),
        reading("1", "pint", "mL", "us", "pint", "milliliter", "'pint' read as US pint (pt_us), the default for system us"),
        reading("1", "quart", "L", "us", "quart", "liter", "'quart' read as US quart (qt_us), the default for system us"),
        reading("1", "gallon", "liters", "us", "gallon", "liter",
            "'gallon' read as US gallon (gal_us), the default for system us"),
        reading("30", "mpg", "L/100km", "us", "mile-per-gallon", "liter-per-100-kilometer",
            "'mpg' read as mile per US gallon (mpg_us), the default for system us"),
        // CLDR's imperial measures (UK Weights and Measures Act 1985)
        reading("1", "cup", "ml", "imperial", "cup-imperial", "milliliter",
            "'cup' read as imperial cup (cup_imp), the default for system imperial"),
        reading("1", "pint", "ml", "imperial", "pint-imperial", "milliliter",
            "'pint' read as imperial pint (pt_imp), the default for system imperial"),
        reading("2", "quarts", "L", "imperial", "quart-imperial", "liter",
            "'quarts' read as imperial quart (qt_imp), the default for system imperial"),
        reading("1", "gallon", "L", "imperial", "gallon-imperial", "liter",
            "'gallon' read as imperial gallon (gal_imp), the default for system imperial"),
        reading("1", "fl oz", "ml", "imperial", "fluid-ounce-imperial", "milliliter",
            "'fl oz' read as imperial fluid ounce (floz_imp), the default for system imperial"),
        reading("30", "mpg", "L/100km", "imperial", "mile-per-gallon-imperial", "liter-per-100-kilometer",
            "'mpg' read as mile per imperial gallon (mpg_imp), the default for system imperial"),
        // CLDR's metric cup, pint and fluid ounce
        reading("1", "cup", "ml", "metric", "cup-metric", "milliliter",
            "'cup' read as metric cup (cup_metric), the default for system metric"),
        reading("1", "pint", "ml", "metric", "pint-metric", "milliliter",
            "'pint' read as metric pint (pt_metric), the default for system metric"),
        reading("1", "fl oz", "ml", "metric", "fluid-ounce-metric", "milliliter",
            "'fl oz' read as metric fluid ounce (floz_metric), the default for system metric"),
        // CLDR kilocalorie (4184 J), horsepower (550 ft lbf/s), british-thermal-unit-it
        reading("2000", "kcal", "kJ", "us", "kilocalorie", "kilojoule",
            "'kcal' read as kilocalorie (thermochemical) (kcal_th), the default"),
        reading("500", "Cal", "kJ", "metric", "foodcalorie", "kilojoule",
            "'Cal' read as kilocalorie (thermochemical) (kcal_th), the default"),
        reading("1", "hp", "watts", "us", "horsepower", "watt",
            "'hp' read as mechanical horsepower (hp_mech), the default for system us"),
        reading("150", "hp", "kW", "imperial", "horsepower", "kilowatt",
            "'hp' read as mechanical horsepower (hp_mech), the default for system imperial"),
        reading("1", "BTU", "J", "us", "british-thermal-unit-it", "joule",
            "'BTU' read as British thermal unit (international table) (Btu_IT), the default"),
        reading("1", "Btu", "kWh", "metric", "british-thermal-unit-it", "kilowatt-hour",
            "'Btu' read as British thermal unit (international table) (Btu_IT), the default"));
  }

  @ParameterizedTest(name = "{0} {1} to {2} ({3}) = CLDR {4}")
  @MethodSource("defaultReadings")
  void defaultReading_agreesWithCldr_inTextAndStructuredForm(String value, String from, String to, String system,
      String cldrFrom, String cldrTo, String note) throws ToolException {
    String want = expected(icu(cldrFrom, cldrTo, value), to);
    Answer byText = text(value + " " + from + " to " + to, system);
    Answer byArgs = call(structured(new BigDecimal(value), from, to, system));
    assertEquals(want, byText.text());
    assertEquals(want, byArgs.text());
    assertEquals(Optional.of(note), byText.note());
    assertEquals(Optional.of(note), byArgs.note());
  }

  @Test
  void metricSpoonsAndHorsepower_followTheirDefinitions() throws ToolException {
    // No CLDR unit: metric tablespoon 15 mL and teaspoon 5 mL (from memory); metric horsepower
    // 75 kgf m/s = 735.49875 W (NIST SP 811 B.8: horsepower, metric = 7.354 988 E+02 W).
    assertEquals("30 ml", text("2 tbsp to ml", "metric").text());
    assertEquals("30 ml", call(structured(2, "tbsp", "ml", "metric")).text());
    assertEquals("15 ml", text("3 tsp to ml", "imperial").text());
    assertEquals("735.499 W", text("1 hp to W", "metric").text());
    assertEquals("735.499 W", call(structured(1, "hp", "W", "metric")).text());
  }

  @Test
  void aSystemWithoutAReading_refusesTheName_listingItsReadings() {
    ToolException e = assertThrows(ToolException.class, () -> text("1 gallon to L", "metric"));
    assertEquals(ErrorCode.AMBIGUOUS_UNIT, e.error().code());
    assertEquals(List.of("gal_us", "gal_imp"), e.error().suggestions());
    assertEquals("'gallon' is ambiguous: gal_us (US gallon) or gal_imp (imperial gallon); system metric gives it no"
        + " default; try '1 gal_us to L'", e.error().detail());
  }

  @Test
  void unknownSystem_isAMalformedRequest() {
    ToolException e = assertThrows(ToolException.class, () -> text("3 cups to ml", "japanese"));
    assertEquals(ErrorCode.INVALID_ARGUMENT, e.error().code());
  }

  // ---- bare F and C, offset scales in compounds ----------------------------------------------------

  @ParameterizedTest(name = "{0} {1} to {2}")
  @MethodSource("temperatures")
  void bareTemperatureLetters_areScalesBesideATemperature(String value, String from, String to, String cldrFrom,
      String cldrTo) throws ToolException {
    String want = expected(icu(cldrFrom, cldrTo, value), to); // ICU4J CLDR fahrenheit, celsius, kelvin
    assertEquals(want, text(value + " " + from + " to " + to).text());
    assertEquals(want, call(structured(new BigDecimal(value), from, to, "us")).text());
  }

  static Stream<Arguments> temperatures() {
    return Stream.of(
        Arguments.of("98.6", "F", "C", "fahrenheit", "celsius"),
        Arguments.of("100", "C", "F", "celsius", "fahrenheit"),
        Arguments.of("-40", "F", "C", "fahrenheit", "celsius"),
        Arguments.of("350", "F", "°C", "fahrenheit", "celsius"),
        Arguments.of("300", "K", "F", "kelvin", "fahrenheit"),
        Arguments.of("20", "C", "K", "celsius", "kelvin"),
        Arguments.of("72", "degrees F", "Celsius", "fahrenheit", "celsius"));
  }

  @Test
  void bareLetters_besideOtherKinds_stayFaradAndCoulomb() throws ToolException {
    assertEquals("1000000 µF", text("1 F to µF").text()); // SI Brochure Table 7: µ = 10^-6
    assertEquals(Optional.empty(), text("1 F to µF").note());
    assertEquals("0.277778 mAh", text("1 C to mAh").text()); // 1 C = 1 A s = 1/3.6 mAh (SI Brochure Table 4)
  }

  @Test
  void offsetScaleInACompound_isADifference() throws ToolException {
    // SP 811 B.9: an interval of 1 °C is 1 K, of 1 °F is 5/9 K
    Answer a = text("25 °C/min to K/s");
    assertEquals("0.416667 K/s", a.text());
    assertEquals(Optional.of("°C in a compound read as a temperature difference (1 °C = 1 K)"), a.note());
    assertEquals("4184 J/(kg·K)", text("4184 J/(kg·°C) to J/(kg·K)").text());
    assertEquals("5 K/h", call(structured(9, "°F/h", "K/h", "us")).text());
  }

  // ---- quantities in parts -------------------------------------------------------------------------

  static Stream<Arguments> quantitiesInParts() {
    // each part converted by ICU4J's UnitsConverter and summed
    return Stream.of(
        Arguments.of("5 ft 11 in", "cm", List.of("5 foot", "11 inch"), "centimeter"),
        Arguments.of("5'11\"", "cm", List.of("5 foot", "11 inch"), "centimeter"),
        Arguments.of("5ft11in", "m", List.of("5 foot", "11 inch"), "meter"),
        Arguments.of("5 ft 11 1/2 in", "cm", List.of("5 foot", "11.5 inch"), "centimeter"),
        Arguments.of("2 lb 3 oz", "kg", List.of("2 pound", "3 ounce"), "kilogram"),
        Arguments.of("11 st 6 lb", "kg", List.of("11 stone", "6 pound"), "kilogram"),
        Arguments.of("1 hour and 30 minutes", "seconds", List.of("1 hour", "30 minute"), "second"),
        Arguments.of("30° 15′ 10″", "°", List.of("30 degree", "15 arc-minute", "10 arc-second"), "degree"),
        Arguments.of("-1 yd 2 ft", "m", List.of("-1 yard", "-2 foot"), "meter"));
  }

  @ParameterizedTest(name = "{0} to {1}")
  @MethodSource("quantitiesInParts")
  void quantityInParts_isTheSumOfItsParts(String quantity, String to, List<String> cldrParts, String cldrTo)
      throws ToolException {
    BigDecimal sum = BigDecimal.ZERO;
    for (String part : cldrParts) {
      String[] p = part.split(" ");
      sum = sum.add(icu(p[1], cldrTo, p[0]));
    }
    String want = expected(sum, to);
    assertEquals(want, text(quantity + " to " + to).text());
    assertEquals(want, call(Map.of("quantity", quantity, "to", to)).text());
  }

  @Test
  void quantityInParts_hasOneCanonicalForm() throws ToolException {
    reckoner.tool.Arguments a = TOOL.canonicalize(reckoner.tool.Arguments.of("text", "5ft, 11in to cm"));
    reckoner.tool.Arguments b = TOOL.canonicalize(reckoner.tool.Arguments.of(Map.of("quantity", "5 ft 11 in", "to", "cm")));
    assertEquals(a, b);
    assertEquals("{\"digits\":6,\"pad_zeros\":false,\"quantity\":\"5 ft 11 in\",\"rounding\":\"half_even\","
        + "\"system\":\"us\",\"to\":\"cm\"}", a.toCanonicalJson());
  }

  @Test
  void quantityInParts_ofDifferentKinds_isRefused() {
    ToolException e = assertThrows(ToolException.class, () -> text("5 ft 3 lb to kg"));
    assertEquals(ErrorCode.DIMENSION_MISMATCH, e.error().code());
    assertEquals("the parts of a quantity must measure one kind: 'ft' is length but 'lb' is mass", e.error().detail());
  }

  // ---- targets in parts ----------------------------------------------------------------------------

  static Stream<Arguments> targetsInParts() {
    // ICU4J ComplexUnitsConverter over CLDR mixed units; its last part rounded to 6 significant digits here
    return Stream.of(
        Arguments.of("180", "cm", "ft+in", "centimeter", "foot-and-inch"),
        Arguments.of("180", "cm", "feet and inches", "centimeter", "foot-and-inch"),
        Arguments.of("1.75", "m", "ft+in", "meter", "foot-and-inch"),
        Arguments.of("100", "kg", "st+lb", "kilogram", "stone-and-pound"),
        Arguments.of("3.5", "kg", "lb and oz", "kilogram", "pound-and-ounce"),
        Arguments.of("10000", "s", "h+min+s", "second", "hour-and-minute-and-second"),
        Arguments.of("7.25", "h", "h+min", "hour", "hour-and-minute"),
        Arguments.of("100", "km", "mi+ft", "kilometer", "mile-and-foot"),
        Arguments.of("2.5", "rad", "°+′+″", "radian", "degree-and-arc-minute-and-arc-second"),
        Arguments.of("-90", "in", "ft+in", "inch", "foot-and-inch"),
        Arguments.of("-10.5", "in", "ft+in", "inch", "foot-and-inch"));
  }

  @ParameterizedTest(name = "{0} {1} to {2}")
  @MethodSource("targetsInParts")
  void targetInParts_agreesWithCldrMixedUnits(String value, String from, String to, String cldrFrom, String cldrTo)
      throws ToolException {
    List<Measure> parts = new ComplexUnitsConverter(cldrFrom, cldrTo).convert(new BigDecimal(value), null).measures;
    List<String> written = List.of(to.split("\\+| and "));
    StringBuilder want = new StringBuilder();
    for (int i = 0; i < parts.size(); i++) {
      Number n = parts.get(i).getNumber();
      String shown = i < parts.size() - 1 ? ((BigInteger) n).toString()
          : DecimalText.format(((BigDecimal) n).round(new MathContext(6, RoundingMode.HALF_EVEN)), false);
      want.append(i == 0 ? "" : " ").append(shown).append(' ').append(written.get(i).trim());
    }
    assertEquals(want.toString(), text(value + " " + from + " to " + to).text());
    assertEquals(want.toString(), call(structured(new BigDecimal(value), from, to, "us")).text());
  }

  @Test
  void targetInParts_carriesARoundingIntoTheLargerUnit() throws ToolException {
    // 71.99999 in is 5 ft 11.99999 in; at 4 significant digits 11.99999 is 12.00, a whole foot (arithmetic)
    assertEquals("6 ft 0 in", call(Map.of("text", "71.99999 in to ft+in", "digits", 4)).text());
    assertEquals("6 ft 0.0 in", call(Map.of("text", "71.99999 in to ft+in", "places", 1, "pad_zeros", true)).text());
    // 3599.9999 s: 59 min 59.9999 s, at 2 places 60.00 s carries into a minute and that into an hour
    assertEquals("1 h 0 min 0 s", call(Map.of("text", "3599.9999 s to h+min+s", "places", 2)).text());
  }

  @Test
  void targetInParts_ofANegativeValue_hasNegativeParts() throws ToolException {
    assertEquals("-1 h -30 min", text("-1.5 h to h+min").text());
    // floor rounds toward minus infinity: -10.5 in is -11 in; ceiling toward plus infinity: -10 in
    assertEquals("0 ft -11 in", call(Map.of("text", "-10.5 in to ft+in", "places", 0, "rounding", "floor")).text());
    assertEquals("0 ft -10 in", call(Map.of("text", "-10.5 in to ft+in", "places", 0, "rounding", "ceiling")).text());
    assertEquals("0 ft 0 in", call(Map.of("text", "-0.2 in to ft+in", "places", 0)).text()); // no -0
  }

  @Test
  void targetInParts_whoseUnitsAreNotWholeMultiples_isRefused() {
    ToolException e = assertThrows(ToolException.class, () -> text("1 m to ft+cm"));
    assertEquals(ErrorCode.SYNTAX_ERROR, e.error().code());
    ToolException f = assertThrows(ToolException.class, () -> text("100 in to in+ft"));
    assertEquals(ErrorCode.SYNTAX_ERROR, f.error().code());
  }

  // ---- amounts -------------------------------------------------------------------------------------

  @Test
  void fractionWithoutAnExactDecimal_staysExact() throws ToolException {
    reckoner.tool.Arguments a = TOOL.canonicalize(reckoner.tool.Arguments.of("text", "1/3 cup to ml"));
    assertEquals("1/3", a.asMap().get("value"));
    // 1/3 of 236.5882365 mL (HB 44) = 78.8627455 mL: one rounding of the exact value, not of 0.333333
    assertEquals("78.86274550 ml", call(Map.of("text", "1/3 cup to ml", "digits", 10, "pad_zeros", true)).text());
    assertEquals(a, TOOL.canonicalize(reckoner.tool.Arguments.of(Map.of("value", "1/3", "from", "cup", "to", "ml"))));
    assertEquals(a, TOOL.canonicalize(reckoner.tool.Arguments.of(Map.of("value", "⅓", "from", "cup", "to", "ml"))));
  }

  @Test
  void equalAmounts_writtenDifferently_areOneCall() throws ToolException {
    List<reckoner.tool.Arguments> forms = new ArrayList<>();
    for (String t : List.of("1 1/2 cups to ml", "1½ cups to ml", "1-1/2 cups to ml", "one and a half cups to ml",
        "3/2 cups to ml", "1.5 cups to ml", "1,5 cups to ml")) {
      forms.add(TOOL.canonicalize(reckoner.tool.Arguments.of("text", t)));
    }
    forms.forEach(f -> assertEquals(forms.get(0), f));
  }

  // ---- case -----------------------------------------------------------------------------------------

  @Test
  void exactSpellings_areReadAsWritten_andCaseSlipsOnlyWhereOneUnitFits() throws ToolException {
    assertEquals("1000 km", text("1 Mm to km").text()); // megametre, SI Brochure Table 7
    assertEquals("0.001 m", text("1 mm to m").text());
    Answer km = text("10 KM to miles");
    assertEquals("6.21371 miles", km.text()); // 10 km / 1609.344 m (1959 agreement)
    assertEquals(Optional.of("'KM' read as km (kilometre)"), km.note());
    ToolException mm = assertThrows(ToolException.class, () -> text("1 MM to in"));
    assertEquals(ErrorCode.AMBIGUOUS_UNIT, mm.error().code());
    assertEquals(List.of("mm", "Mm"), mm.error().suggestions());
    ToolException mb = assertThrows(ToolException.class, () -> text("1 mb to kB"));
    assertEquals(List.of("Mb", "MB"), mb.error().suggestions());
  }
}
