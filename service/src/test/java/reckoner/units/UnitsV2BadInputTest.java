package reckoner.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.spec.Json;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolRegistry;
import tools.jackson.databind.json.JsonMapper;

/**
 * units@2's refusals through the real call path (schema, canonicalize, invoke): a request that
 * cannot be read is {@code invalid_argument} (400); a text or value that cannot be read or
 * computed has a 422 code, never {@code invalid_argument}; an invisible character is named by its
 * code point; and a refusal names the nearest phrase that is answered.
 */
final class UnitsV2BadInputTest {
  private static final JsonMapper JSON = Json.newMapper();
  private static final Invoker INVOKER = new Invoker(ToolCatalog.of(ToolRegistry.of(List.of(new UnitsToolV2())),
      new SpecLoader(JSON)), Clock.fixed(Instant.parse("2031-05-17T09:30:00Z"), ZoneOffset.UTC));
  /** The request-level codes; every other refusal of units@2 is a 422. */
  private static final Set<ErrorCode> MALFORMED_REQUEST = Set.of(ErrorCode.INVALID_ARGUMENT);

  private static Outcome call(Map<String, ?> args) {
    return INVOKER.invoke(CallRequest.of("units", 2, JSON.valueToTree(args)));
  }

  private static Arguments text(String text, ErrorCode code) {
    return Arguments.of(Map.of("text", text), code);
  }

  private static Arguments args(Map<String, Object> args, ErrorCode code) {
    return Arguments.of(args, code);
  }

  static Stream<Arguments> badInputs() {
    return Stream.of(
        // invisible characters
        text("5 km\u202e to mi", ErrorCode.SYNTAX_ERROR),
        text("5\u200bkm to mi", ErrorCode.SYNTAX_ERROR),
        text("5 k\u00adm to mi", ErrorCode.SYNTAX_ERROR),
        text("5 km to mi\u0000", ErrorCode.SYNTAX_ERROR),
        args(Map.of("value", 5, "from", "k\u2066m", "to", "mi"), ErrorCode.SYNTAX_ERROR),
        args(Map.of("value", "\ufeff5", "from", "km", "to", "mi"), ErrorCode.SYNTAX_ERROR),
        // numbers
        text("1,250 m to km", ErrorCode.SYNTAX_ERROR),
        text("1,000 m to km", ErrorCode.SYNTAX_ERROR),
        text("12,34,5 m to km", ErrorCode.SYNTAX_ERROR),
        text("1.2.3 m to km", ErrorCode.SYNTAX_ERROR),
        text("1/0 cup to ml", ErrorCode.SYNTAX_ERROR),
        text("1 1/2/3 cups to ml", ErrorCode.SYNTAX_ERROR),
        args(Map.of("value", "lots", "from", "km", "to", "mi"), ErrorCode.SYNTAX_ERROR),
        args(Map.of("value", "", "from", "km", "to", "mi"), ErrorCode.SYNTAX_ERROR),
        args(Map.of("value", "1e100000", "from", "m", "to", "km"), ErrorCode.LIMIT_EXCEEDED),
        text("1e100000 m to km", ErrorCode.LIMIT_EXCEEDED),
        // the shape of the text
        text("km to mi", ErrorCode.SYNTAX_ERROR),
        text("3 km mi", ErrorCode.SYNTAX_ERROR),
        text("5 ft 11 to cm", ErrorCode.SYNTAX_ERROR),
        text("how many in", ErrorCode.SYNTAX_ERROR),
        args(Map.of("quantity", "ft 11 in", "to", "cm"), ErrorCode.SYNTAX_ERROR),
        args(Map.of("value", 1, "from", "   ", "to", "m"), ErrorCode.SYNTAX_ERROR),
        text("1 (°C) to K", ErrorCode.SYNTAX_ERROR),
        text("1 m to ft+cm", ErrorCode.SYNTAX_ERROR),
        text("20 °C to °C+°F", ErrorCode.SYNTAX_ERROR),
        text("20 °C 5 °F to K", ErrorCode.SYNTAX_ERROR),
        text("1 J/kg·K to J/kg", ErrorCode.SYNTAX_ERROR),
        // units
        text("5 kilometrs to mi", ErrorCode.UNKNOWN_UNIT),
        text("1 smoot to m", ErrorCode.UNKNOWN_UNIT),
        text("1 ton to kg", ErrorCode.AMBIGUOUS_UNIT),
        text("2000 calories to kJ", ErrorCode.AMBIGUOUS_UNIT),
        text("1 MM to in", ErrorCode.AMBIGUOUS_UNIT),
        text("10 MG to g", ErrorCode.AMBIGUOUS_UNIT),
        text("1 year to days", ErrorCode.AMBIGUOUS_UNIT),
        args(Map.of("text", "1 gallon to L", "system", "metric"), ErrorCode.AMBIGUOUS_UNIT),
        text("1 km to kg", ErrorCode.DIMENSION_MISMATCH),
        text("5 ft 3 lb to kg", ErrorCode.DIMENSION_MISMATCH),
        text("10 °C to Δ°F", ErrorCode.DIMENSION_MISMATCH),
        text("1 cup of flour to grams", ErrorCode.DIMENSION_MISMATCH),
        text("100 mpg to ft+in", ErrorCode.DIMENSION_MISMATCH),
        text("0 mpg to L/100km", ErrorCode.DOMAIN_ERROR),
        text("1 m^99 to m", ErrorCode.LIMIT_EXCEEDED),
        text("1 " + "m".repeat(100_000) + " to m", ErrorCode.LIMIT_EXCEEDED),
        args(Map.of("value", 1, "from", "m ".repeat(150), "to", "m"), ErrorCode.LIMIT_EXCEEDED),
        text("1 ft 1 in 1 ft 1 in 1 ft 1 in 1 ft to m", ErrorCode.LIMIT_EXCEEDED),
        text("1 m" + " in m".repeat(40) + " to m", ErrorCode.LIMIT_EXCEEDED),
        // malformed requests: 400
        args(Map.of("text", "3 cups to ml", "value", 3), ErrorCode.INVALID_ARGUMENT),
        args(Map.of("quantity", "5 ft 11 in", "value", 3, "from", "ft", "to", "cm"), ErrorCode.INVALID_ARGUMENT),
        args(Map.of("value", 1, "from", "in", "to", "mm", "places", 2, "digits", 3), ErrorCode.INVALID_ARGUMENT),
        args(Map.of("text", "3 cups to ml", "system", "japanese"), ErrorCode.INVALID_ARGUMENT),
        args(Map.of("value", 1, "from", "in"), ErrorCode.INVALID_ARGUMENT));
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("badInputs")
  void badInput_getsItsCode_andTheNextCallAnswers(Map<String, Object> args, ErrorCode code) {
    Outcome o = call(args);
    assertTrue(o.error().isPresent(), () -> "answered: " + o.text());
    assertEquals(code, o.error().get().code(), o::text);
    if (!MALFORMED_REQUEST.contains(code)) {
      assertNotEquals(ErrorCode.INVALID_ARGUMENT, o.error().get().code());
    }
    assertEquals("3.10686 mi", call(Map.of("text", "5 km to mi")).text());
  }

  // ---- what the refusals say -----------------------------------------------------------------------

  private static String refusal(Map<String, ?> args) {
    return call(args).error().orElseThrow().text();
  }

  @Test
  void invisibleCharacter_isNamedByItsCodePoint_neverShownAsASpace() {
    assertEquals("error: syntax_error: the text holds the invisible character U+202E (RIGHT-TO-LEFT OVERRIDE) at"
        + " character 5; remove it; try '5 km to mi'", refusal(Map.of("text", "5 km\u202e to mi")));
    assertEquals("error: syntax_error: 'from' holds the invisible character U+2066 (LEFT-TO-RIGHT ISOLATE) at character"
        + " 2; remove it; try '5 km to mi'", refusal(Map.of("value", 5, "from", "k\u2066m", "to", "mi")));
  }

  @Test
  void everyRefusal_namesTheNearestPhraseThatWorks() {
    assertEquals("error: ambiguous_unit: 'ton' is ambiguous: ton_short (short ton), ton_long (long ton) or t (tonne);"
        + " try '1 ton_short to kg' (did you mean: ton_short, ton_long, t?)", refusal(Map.of("text", "1 ton to kg")));
    assertEquals("error: ambiguous_unit: 'ton' is ambiguous: ton_short (short ton), ton_long (long ton) or t (tonne);"
        + " try '1 ton_short to kg' (did you mean: ton_short, ton_long, t?)",
        refusal(Map.of("value", 1, "from", "ton", "to", "kg")));
    assertEquals("error: ambiguous_unit: 'calories' is ambiguous: kcal_th, cal_th or cal_IT; try '2000 kcal_th to kJ'"
        + " (did you mean: kcal_th, cal_th, cal_IT?)", refusal(Map.of("text", "2000 calories to kJ")));
    assertEquals("error: syntax_error: '1,250' may be 1250 (a comma between thousands) or 1.25 (a decimal comma);"
        + " try '1250 m to km' (did you mean: 1250, 1.25?)", refusal(Map.of("text", "1,250 m to km")));
    assertEquals("error: unknown_unit: unknown unit 'kilometrs'; try '5 kilometers to mi' (did you mean: kilometers,"
        + " kilomoles, kilohertz?)", refusal(Map.of("text", "5 kilometrs to mi")));
    assertEquals("error: syntax_error: expected 'to' between the quantity and the unit to convert to, as in"
        + " '3.5 km to mi'; try '3 km to mi'", refusal(Map.of("text", "3 km mi")));
    assertEquals("error: syntax_error: the amount 11 has no unit after 'ft'; give each part its unit, as in"
        + " '5 ft 11 in'; try '5 ft 11 in to cm'", refusal(Map.of("text", "5 ft 11 to cm")));
    assertEquals("error: dimension_mismatch: cannot convert volume to mass ('cup' to 'grams'); volume and mass convert"
        + " only through a density, which depends on the substance; try '1 cup to mL'",
        refusal(Map.of("text", "1 cup to grams")));
    assertEquals("error: ambiguous_unit: 'MM' is ambiguous: mm (millimetre) or Mm (megametre), as megamolar (MM) does"
        + " not fit; symbols are case-sensitive; try '1 mm to in' (did you mean: mm, Mm?)",
        refusal(Map.of("text", "1 MM to in")));
  }

  @Test
  void version1_keepsItsOwnCodes() {
    // units@1 is unchanged: the same texts keep their version 1 outcomes (GoldenV1Test holds them all)
    Invoker v1 = new Invoker(ToolCatalog.of(ToolRegistry.of(List.of(new UnitsTool())), new SpecLoader(JSON)),
        Clock.fixed(Instant.parse("2031-05-17T09:30:00Z"), ZoneOffset.UTC));
    assertEquals(ErrorCode.INVALID_ARGUMENT, v1.invoke(CallRequest.of("units", 1,
        JSON.valueToTree(Map.of("text", "1,250 m to km")))).error().get().code());
    assertEquals(ErrorCode.INVALID_ARGUMENT, v1.invoke(CallRequest.of("units", 1,
        JSON.valueToTree(Map.of("text", "25 °C/min to K/s")))).error().get().code());
    assertEquals("0.416667 K/s", call(Map.of("text", "25 °C/min to K/s")).text());
  }
}
