package reckoner.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TimeZone;
import org.junit.jupiter.api.Test;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.ToolException;

/** The tool's canonical form, defaults and answers, on plain objects. */
final class UnitsToolTest {
  private static final UnitsTool TOOL = new UnitsTool();
  private static final CallContext CONTEXT = CallContext.systemUtc();

  private static String answer(Arguments args) throws ToolException {
    return TOOL.invoke(TOOL.canonicalize(args), CONTEXT).text();
  }

  private static String text(String text) throws ToolException {
    return answer(Arguments.of("text", text));
  }

  // ---- canonicalize ----

  @Test
  void canonicalize_textAndStructured_giveEqualArguments() throws ToolException {
    Arguments fromText = TOOL.canonicalize(Arguments.of("text", "3.5  km   TO mi"));
    Arguments structured = TOOL.canonicalize(Arguments.of(Map.of("value", "3.50", "from", " km", "to", "mi ")));
    assertEquals(structured, fromText);
    assertEquals("{\"digits\":6,\"from\":\"km\",\"pad_zeros\":false,\"rounding\":\"half_even\",\"to\":\"mi\",\"value\":3.5}",
        fromText.toCanonicalJson());
  }

  @Test
  void canonicalize_placesReplacesTheDefaultDigits() throws ToolException {
    Arguments c = TOOL.canonicalize(Arguments.of(Map.of("value", 1, "from", "in", "to", "mm", "places", 2)));
    assertFalse(c.has("digits"));
    assertEquals(2, c.integer("places").get());
  }

  @Test
  void canonicalize_keepsTheExtraArgumentsOfATextCall() throws ToolException {
    Arguments c = TOOL.canonicalize(Arguments.of(Map.of("text", "1 in to mm", "digits", 3, "rounding", "up")));
    assertEquals("{\"digits\":3,\"from\":\"in\",\"pad_zeros\":false,\"rounding\":\"up\",\"to\":\"mm\",\"value\":1}",
        c.toCanonicalJson());
  }

  @Test
  void canonicalize_neverContainsText() throws ToolException {
    assertFalse(TOOL.canonicalize(Arguments.of("text", "1 m to ft")).has(Arguments.TEXT));
  }

  // ---- answers ----

  @Test
  void invoke_writesTheTargetUnitAsGiven() throws ToolException {
    assertEquals("3.28084 ft", text("1 m to ft"));
    assertEquals("3.28084 feet", text("1 m to feet"));
    assertEquals("1000000 mm²", text("1 m² to mm²"));
  }

  @Test
  void invoke_answerIsCacheable() throws ToolException {
    Answer a = TOOL.invoke(TOOL.canonicalize(Arguments.of("text", "1 m to ft")), CONTEXT);
    assertTrue(a.cacheable());
    assertTrue(a.clockReadAt().isEmpty());
  }

  @Test
  void invoke_negativeValuesAndNoNegativeZero() throws ToolException {
    assertEquals("-1.60934 km", text("-1 mi to km"));
    assertEquals("0 km", answer(Arguments.of(Map.of("value", "-0.0000001", "from", "m", "to", "km", "places", 2))));
  }

  @Test
  void invoke_exactFactorsStayExact() throws ToolException {
    assertEquals("0.45359237 kg", answer(Arguments.of(Map.of("value", 1, "from", "lb", "to", "kg", "digits", 34))));
    assertEquals("0.1 m", answer(Arguments.of(Map.of("value", "0.1", "from", "m", "to", "m", "digits", 34))));
    assertEquals("0.3333333333333333333333333333333333 ft",
        answer(Arguments.of(Map.of("value", 4, "from", "in", "to", "ft", "digits", 34))));
  }

  @Test
  void invoke_piIsExpandedOnlyAtTheEnd() throws ToolException {
    assertEquals("1 rev", text("360 ° to rev"));
    assertEquals("400 gon", text("360 deg to gon"));
    assertEquals("3.141592653589793238462643383279503 rad",
        answer(Arguments.of(Map.of("value", 180, "from", "°", "to", "rad", "digits", 34))));
  }

  @Test
  void invoke_piResultsRoundCorrectlyInEveryMode() throws ToolException {
    // pi = 3.14159 26535 89793...; to 5 digits: 3.1416 (half modes, up, ceiling), 3.1415 (down, floor)
    for (String mode : List.of("half_even", "half_up", "half_down", "up", "ceiling")) {
      assertEquals("3.1416 rad", answer(Arguments.of(Map.of("value", 180, "from", "deg", "to", "rad", "digits", 5,
          "rounding", mode))), mode);
    }
    for (String mode : List.of("down", "floor")) {
      assertEquals("3.1415 rad", answer(Arguments.of(Map.of("value", 180, "from", "deg", "to", "rad", "digits", 5,
          "rounding", mode))), mode);
    }
  }

  @Test
  void invoke_reciprocalConversions() throws ToolException {
    assertEquals("23.5215 mpg", text("10 L/100km to mpg"));
    assertEquals("4.25144 km/L", text("10 mpg to km/L"));
    assertEquals("5 min/km", text("12 km/h to min/km"));
    assertEquals("8.04672 min/mi", text("12 km/h to min/mi"));
  }

  @Test
  void invoke_temperatures() throws ToolException {
    assertEquals("98.6 °F", text("37 °C to °F"));
    assertEquals("491.67 °R", text("0 °C to °R"));
    assertEquals("-459.67 degF", text("0 K to degF"));
    assertEquals("1.8 Δ°F", text("1 K to Δ°F"));
  }

  @Test
  void invoke_textKeywordsInAnyCase() throws ToolException {
    assertEquals("2.1748 mi", text("3.5 km TO mi"));
    assertEquals("2.1748 mi", text("Convert 3.5 km In mi"));
    assertEquals("2.1748 mi", text("3.5km to mi"));
  }

  @Test
  void invoke_sameBytesUnderAnyDefaultLocaleAndZone() throws ToolException {
    Locale locale = Locale.getDefault();
    TimeZone zone = TimeZone.getDefault();
    List<String> calls = List.of("1234.5678 km to MILES", "1 INCH to mm", "3.5 KILOMETRES to mi", "1e-9 s to ns",
        "100 °F to °C", "1 ly to nm");
    try {
      List<String> expected = null;
      for (Locale l : List.of(Locale.ROOT, Locale.forLanguageTag("tr-TR"), Locale.forLanguageTag("de-DE"),
          Locale.forLanguageTag("ar-EG"), Locale.forLanguageTag("hi-IN-u-nu-deva"))) {
        Locale.setDefault(l);
        TimeZone.setDefault(TimeZone.getTimeZone("Asia/Kathmandu"));
        UnitsTool fresh = new UnitsTool();
        List<String> got = new java.util.ArrayList<>();
        for (String c : calls) {
          got.add(fresh.invoke(fresh.canonicalize(Arguments.of("text", c)), CONTEXT).text());
        }
        if (expected == null) {
          expected = got;
        }
        assertEquals(expected, got, l.toLanguageTag());
      }
      assertEquals("767.125 MILES", expected.get(0)); // 1234.5678 / 1.609344
    } finally {
      Locale.setDefault(locale);
      TimeZone.setDefault(zone);
    }
  }

  @Test
  void invoke_isFastOnceWarm() throws ToolException {
    // Measured, not asserted: a timing assertion would be flaky on a shared machine.
    Arguments c = TOOL.canonicalize(Arguments.of("text", "3.5 kg·m²/s² to kWh"));
    assertEquals("9.72222e-7 kWh", TOOL.invoke(c, CONTEXT).text()); // 3.5 J / 3.6e6 J
    int n = 20_000;
    for (int i = 0; i < n; i++) { // warm-up for the JIT
      TOOL.invoke(TOOL.canonicalize(Arguments.of("text", (i % 100) + " km/h to mph")), CONTEXT);
    }
    long start = System.nanoTime();
    for (int i = 0; i < n; i++) {
      TOOL.invoke(TOOL.canonicalize(Arguments.of("text", (i % 100) + " km/h to mph")), CONTEXT);
    }
    long perCall = (System.nanoTime() - start) / n;
    System.out.println("units@1: canonicalize + invoke, text form, warm: " + perCall + " ns per call");
    assertEquals("62.1371 mph", TOOL.invoke(TOOL.canonicalize(Arguments.of("text", "100 km/h to mph")), CONTEXT).text());
  }
}
