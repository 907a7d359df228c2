package reckoner.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.List;
import java.util.Map;
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
 * Bad input through the real call path (schema validation, canonicalize, invoke): each gets its
 * exact caller-error code, never {@code internal_error} or {@code unavailable}, and the next call
 * still answers.
 */
final class UnitsBadInputTest {
  private static final JsonMapper JSON = Json.newMapper();
  private static final ToolCatalog CATALOG = ToolCatalog.of(ToolRegistry.of(List.of(new UnitsTool())), new SpecLoader(JSON));
  private static final Invoker INVOKER = new Invoker(CATALOG,
      Clock.fixed(Instant.parse("2031-05-17T09:30:00Z"), ZoneOffset.UTC));
  private static final String HUGE = "m".repeat(100_000);

  private static Arguments text(String text, ErrorCode code) {
    return Arguments.of(Map.of("text", text), code);
  }

  private static Arguments args(Map<String, Object> args, ErrorCode code) {
    return Arguments.of(args, code);
  }

  private static Map<String, Object> call(Object value, String from, String to) {
    return Map.of("value", value, "from", from, "to", to);
  }

  static Stream<Arguments> badInputs() {
    return Stream.of(
        // unknown units
        text("5 kilometrs to mi", ErrorCode.UNKNOWN_UNIT),
        text("5 furlongz to m", ErrorCode.UNKNOWN_UNIT),
        text("1 KM to mi", ErrorCode.UNKNOWN_UNIT),
        text("1 smoot to m", ErrorCode.UNKNOWN_UNIT),
        args(call(1, "m", "parsecs per fortnite"), ErrorCode.UNKNOWN_UNIT),
        args(call(1, "kg/blorp", "kg/m"), ErrorCode.UNKNOWN_UNIT),
        args(call(1, "Mkg", "kg"), ErrorCode.UNKNOWN_UNIT),
        args(call(1, "kin", "m"), ErrorCode.UNKNOWN_UNIT),
        args(call(1, "mb", "bit"), ErrorCode.UNKNOWN_UNIT),
        // ambiguous names
        text("1 gal to L", ErrorCode.AMBIGUOUS_UNIT),
        text("1 ton to kg", ErrorCode.AMBIGUOUS_UNIT),
        text("1 kcal to kJ", ErrorCode.AMBIGUOUS_UNIT),
        text("2 cups to mL", ErrorCode.AMBIGUOUS_UNIT),
        text("1 tsp to mL", ErrorCode.AMBIGUOUS_UNIT),
        text("200 hp to kW", ErrorCode.AMBIGUOUS_UNIT),
        text("1 KB to B", ErrorCode.AMBIGUOUS_UNIT),
        args(call(1, "pt", "mL"), ErrorCode.AMBIGUOUS_UNIT),
        args(call(3, "yr", "d"), ErrorCode.AMBIGUOUS_UNIT),
        // mixed dimensions
        text("100 km to kg", ErrorCode.DIMENSION_MISMATCH),
        text("100 C to F", ErrorCode.DIMENSION_MISMATCH),
        text("1 Hz to rpm", ErrorCode.DIMENSION_MISMATCH),
        text("1 J to W", ErrorCode.DIMENSION_MISMATCH),
        text("1 B to 1", ErrorCode.DIMENSION_MISMATCH),
        args(call(1, "m/s", "m/s^2"), ErrorCode.DIMENSION_MISMATCH),
        args(call(1, "mpg", "km/h"), ErrorCode.DIMENSION_MISMATCH),
        // offset temperatures in compounds, or against differences
        text("1 °C/s to K/s", ErrorCode.INVALID_ARGUMENT),
        text("1 J/(kg·°C) to J/(kg·K)", ErrorCode.INVALID_ARGUMENT),
        text("1 °F^2 to K^2", ErrorCode.INVALID_ARGUMENT),
        text("3 m°C to K", ErrorCode.UNKNOWN_UNIT),
        text("10 °C to Δ°F", ErrorCode.INVALID_ARGUMENT),
        args(call(1, "2 °C", "K"), ErrorCode.INVALID_ARGUMENT),
        // absurd exponents and sizes
        text("1 m^99 to m", ErrorCode.LIMIT_EXCEEDED),
        text("1 m^-13 to m", ErrorCode.LIMIT_EXCEEDED),
        text("1 ((((((((((((m)))))))))))) to m", ErrorCode.LIMIT_EXCEEDED),
        text("1 (m^12)^12 to m", ErrorCode.LIMIT_EXCEEDED),
        text("1 ((%^12)^12)^12 to 1", ErrorCode.LIMIT_EXCEEDED),
        text("1 m^1000000000000 to m", ErrorCode.LIMIT_EXCEEDED),
        args(call(1, HUGE, "m"), ErrorCode.LIMIT_EXCEEDED),
        args(call(1, "m", HUGE), ErrorCode.LIMIT_EXCEEDED),
        args(Map.of("text", "1 " + HUGE + " to m"), ErrorCode.LIMIT_EXCEEDED),
        args(call(1, "m ".repeat(150), "m"), ErrorCode.LIMIT_EXCEEDED),
        args(call("1e100000", "m", "km"), ErrorCode.LIMIT_EXCEEDED),
        args(call(1, "1e99999 m", "m"), ErrorCode.LIMIT_EXCEEDED),
        // malformed expressions and text
        text("1 J/kg·K to J/kg", ErrorCode.SYNTAX_ERROR),
        text("1 m^0.5 to m", ErrorCode.SYNTAX_ERROR),
        text("1 m^(1/2) to m", ErrorCode.SYNTAX_ERROR),
        text("1 (m to m", ErrorCode.SYNTAX_ERROR),
        text("1 m) to m", ErrorCode.SYNTAX_ERROR),
        text("1 m// s to m/s", ErrorCode.SYNTAX_ERROR),
        text("1 m/ to m", ErrorCode.SYNTAX_ERROR),
        text("1 m^ to m", ErrorCode.SYNTAX_ERROR),
        text("3 km mi", ErrorCode.SYNTAX_ERROR),
        text("km to mi", ErrorCode.SYNTAX_ERROR),
        text("1 to m", ErrorCode.SYNTAX_ERROR),
        text("1 m to", ErrorCode.SYNTAX_ERROR),
        text("1 m to m to m", ErrorCode.SYNTAX_ERROR),
        text("1 m @ to m", ErrorCode.SYNTAX_ERROR),
        // values and arguments
        text("1,000 m to km", ErrorCode.INVALID_ARGUMENT),
        args(call("three", "km", "mi"), ErrorCode.INVALID_ARGUMENT),
        args(call("", "km", "mi"), ErrorCode.INVALID_ARGUMENT),
        args(call("1e", "km", "mi"), ErrorCode.INVALID_ARGUMENT),
        args(call(1, "   ", "mi"), ErrorCode.INVALID_ARGUMENT),
        args(call(1, "0 m", "m"), ErrorCode.INVALID_ARGUMENT),
        args(Map.of("value", 1, "from", "km"), ErrorCode.INVALID_ARGUMENT),
        args(Map.of("value", 1, "from", "km", "to", "mi", "places", 2, "digits", 3), ErrorCode.INVALID_ARGUMENT),
        args(Map.of("value", 1, "from", "km", "to", "mi", "digits", 0), ErrorCode.INVALID_ARGUMENT),
        args(Map.of("value", 1, "from", "km", "to", "mi", "digits", 35), ErrorCode.INVALID_ARGUMENT),
        args(Map.of("value", 1, "from", "km", "to", "mi", "rounding", "bankers"), ErrorCode.INVALID_ARGUMENT),
        args(Map.of("value", 1, "from", "km", "to", "mi", "text", "1 km to mi"), ErrorCode.INVALID_ARGUMENT),
        args(Map.of("value", 1, "from", "km", "to", "mi", "precision", 3), ErrorCode.INVALID_ARGUMENT),
        args(Map.of("value", true, "from", "km", "to", "mi"), ErrorCode.INVALID_ARGUMENT),
        args(Map.of("value", 1, "from", 5, "to", "mi"), ErrorCode.INVALID_ARGUMENT),
        // reciprocal of zero
        text("0 mpg to L/100km", ErrorCode.DOMAIN_ERROR),
        text("0 km/h to min/km", ErrorCode.DOMAIN_ERROR),
        // an answer too long to be one line
        args(Map.of("value", "1e900", "from", "m", "to", "m", "places", 40, "pad_zeros", true), ErrorCode.LIMIT_EXCEEDED));
  }

  @ParameterizedTest(name = "{0} -> {1}")
  @MethodSource("badInputs")
  void badInput_getsItsCallerErrorCode(Map<String, Object> args, ErrorCode code) {
    Outcome outcome = INVOKER.invoke(CallRequest.of("units", 1, JSON.valueToTree(args)));
    assertTrue(outcome.error().isPresent(), () -> "expected " + code + " but got " + outcome.text());
    ErrorCode actual = outcome.error().get().code();
    assertNotEquals(ErrorCode.INTERNAL_ERROR, actual, outcome::text);
    assertNotEquals(ErrorCode.UNAVAILABLE, actual, outcome::text);
    assertEquals(code, actual, outcome::text);
    assertTrue(outcome.text().length() <= 200 && !outcome.text().contains("\n"), outcome::text);
    // The next call is unharmed.
    assertEquals("2.1748 mi", INVOKER.invoke(CallRequest.of("units", 1, JSON.valueToTree(Map.of("text", "3.5 km to mi")))).text());
  }

  @Test
  void atLeastFortyBadInputs_areChecked() {
    assertTrue(badInputs().count() >= 40);
  }

  @Test
  void unknownUnit_suggestsUpToThreeNearest() {
    Outcome o = INVOKER.invoke(CallRequest.of("units", 1, JSON.valueToTree(Map.of("text", "1 KM to mi"))));
    assertEquals(List.of("km"), o.error().get().suggestions().subList(0, 1));
    assertTrue(o.error().get().suggestions().size() <= 3);
  }

  @Test
  void ambiguousUnit_listsItsReadings() {
    Outcome o = INVOKER.invoke(CallRequest.of("units", 1, JSON.valueToTree(Map.of("text", "1 ton to kg"))));
    assertEquals(List.of("ton_short", "ton_long", "t"), o.error().get().suggestions());
    assertEquals("error: ambiguous_unit: 'ton' is ambiguous: short ton (ton_short), long ton (ton_long) or tonne (t)"
        + " (did you mean: ton_short, ton_long, t?)", o.text());
  }

  @Test
  void dimensionMismatch_namesBothDimensionsInWords() {
    Outcome o = INVOKER.invoke(CallRequest.of("units", 1, JSON.valueToTree(Map.of("text", "100 km to kg"))));
    assertEquals("error: dimension_mismatch: cannot convert length to mass ('km' to 'kg')", o.text());
  }
}
