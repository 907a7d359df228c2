package reckoner.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.quicktheories.QuickTheory.qt;

import java.math.BigDecimal;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.quicktheories.core.Gen;
import org.quicktheories.impl.Constraint;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.ToolError;
import reckoner.tool.ToolException;

/**
 * The text form and the structured form of one units@2 call are the same call: equal canonical
 * arguments (so one cache entry and one ledger record) and the same answer, note or refusal.
 * Calls are generated (QuickTheories, fixed seeds) from amounts written as decimals, fractions and
 * mixed numbers, units that need a reading (cup, hp, KM, a bare F), quantities and targets in
 * parts, every phrasing of the text form, and the three systems.
 */
final class UnitsV2PropertiesTest {
  private static final UnitsToolV2 TOOL = new UnitsToolV2();
  private static final CallContext CONTEXT = new CallContext(Clock.fixed(Instant.parse("2031-05-17T09:30:00Z"),
      ZoneOffset.UTC));

  /** An amount as written in a text, and as a structured value (a number, or a string for fractions). */
  private record Amount(String text, Object value) {}

  /** A conversion: the source unit(s) as one written quantity tail, and the target. */
  private record Pair(String from, String to) {}

  private static final List<Pair> PAIRS = List.of(
      new Pair("cups", "ml"), new Pair("cup", "tbsp"), new Pair("tbsp", "tsp"), new Pair("fl oz", "mL"),
      new Pair("pints", "liters"), new Pair("quart", "cups"), new Pair("gallons", "L"), new Pair("gal", "qt"),
      new Pair("kcal", "kJ"), new Pair("Cal", "kWh"), new Pair("hp", "kW"), new Pair("kW", "hp"), new Pair("BTU", "J"),
      new Pair("BTU/h", "W"), new Pair("mpg", "L/100km"), new Pair("KM", "mi"), new Pair("Kg", "lbs"),
      new Pair("LBS", "KG"), new Pair("FT", "m"), new Pair("F", "C"), new Pair("C", "F"), new Pair("F", "K"),
      new Pair("degrees F", "°C"), new Pair("sq ft", "m2"), new Pair("sq. ft.", "m²"), new Pair("cubic meters", "cu ft"),
      new Pair("sqft", "sqm"), new Pair("km", "ft+in"), new Pair("m", "feet and inches"), new Pair("kg", "lb+oz"),
      new Pair("kg", "st+lb"), new Pair("s", "h+min+s"), new Pair("oz", "cups"), new Pair("pt", "px"),
      new Pair("kt", "km/h"), new Pair("mm", "in"), new Pair("ton", "kg"), new Pair("MM", "in"), new Pair("km", "kg"),
      new Pair("kilometrs", "mi"));

  /** Quantities in parts, with a target each. */
  private static final List<String[]> COMPOUNDS = List.of(
      new String[] {"ft", "in", "cm"}, new String[] {"lb", "oz", "kg"}, new String[] {"st", "lb", "kg"},
      new String[] {"h", "min", "s"}, new String[] {"ft", "in", "m+cm"}, new String[] {"yd", "ft", "m"},
      new String[] {"°", "′", "rad"}, new String[] {"hours and", "minutes", "seconds"});

  private static final List<String> TEMPLATES = List.of("%s to %s", "%s in %s", "%s -> %s", "%s → %s",
      "convert %s to %s", "what is %s in %s?", "%s = ? %s", "%s into %s", "%s is how many %s", "What's %s in %s");

  private static final List<String> SYSTEMS = List.of("us", "us", "imperial", "metric");

  static Gen<Amount> amounts() {
    return in -> {
      long whole = in.next(Constraint.between(0, 5000));
      switch ((int) in.next(Constraint.between(0, 4))) {
        case 0:
          return new Amount(Long.toString(whole), BigDecimal.valueOf(whole));
        case 1: {
          BigDecimal d = BigDecimal.valueOf(whole * 1000 + in.next(Constraint.between(0, 999)), 3);
          return new Amount(d.toPlainString(), d);
        }
        case 2: {
          long den = in.next(Constraint.between(2, 16));
          long num = in.next(Constraint.between(1, den - 1));
          return new Amount(num + "/" + den, num + "/" + den);
        }
        case 3: {
          long den = in.next(Constraint.between(2, 16));
          long num = in.next(Constraint.between(1, den - 1));
          String mixed = (whole % 20 + 1) + " " + num + "/" + den;
          return new Amount(mixed, mixed);
        }
        default: {
          BigDecimal d = BigDecimal.valueOf(-whole * 10 - in.next(Constraint.between(1, 9)), 1);
          return new Amount(d.toPlainString(), d);
        }
      }
    };
  }

  @Test
  void simpleCall_textAndStructured_areOneCall() {
    Gen<Pair> pairs = in -> PAIRS.get((int) in.next(Constraint.between(0, PAIRS.size() - 1)));
    Gen<String> templates = in -> TEMPLATES.get((int) in.next(Constraint.between(0, TEMPLATES.size() - 1)));
    Gen<String> systems = in -> SYSTEMS.get((int) in.next(Constraint.between(0, SYSTEMS.size() - 1)));
    qt().withExamples(3000).withFixedSeed(20310517L).forAll(amounts(), pairs, templates, systems)
        .checkAssert((amount, pair, template, system) -> {
          String text = String.format(java.util.Locale.ROOT, template, amount.text + " " + pair.from, pair.to);
          Map<String, Object> structured = new LinkedHashMap<>();
          structured.put("value", amount.value);
          structured.put("from", pair.from);
          structured.put("to", pair.to);
          structured.put("system", system);
          assertSameCall(Map.of("text", text, "system", system), structured);
        });
  }

  @Test
  void question_textAndStructured_areOneCall() {
    Gen<Pair> pairs = in -> PAIRS.get((int) in.next(Constraint.between(0, PAIRS.size() - 1)));
    qt().withExamples(1000).withFixedSeed(5280L).forAll(amounts(), pairs).checkAssert((amount, pair) -> {
      String text = "how many " + pair.to + " are in " + amount.text + " " + pair.from + "?";
      assertSameCall(Map.of("text", text), Map.of("value", amount.value, "from", pair.from, "to", pair.to));
    });
  }

  @Test
  void quantityInParts_textAndStructured_areOneCall() {
    Gen<String[]> compounds = in -> COMPOUNDS.get((int) in.next(Constraint.between(0, COMPOUNDS.size() - 1)));
    Gen<Integer> wholes = in -> (int) in.next(Constraint.between(0, 99));
    qt().withExamples(1000).withFixedSeed(71L).forAll(compounds, wholes, amounts()).checkAssert((c, first, second) -> {
      String quantity = first + " " + c[0] + " " + (second.value instanceof BigDecimal d ? d.abs().toPlainString()
          : second.text) + " " + c[1];
      assertSameCall(Map.of("text", quantity + " to " + c[2]), Map.of("quantity", quantity, "to", c[2]));
    });
  }

  private static void assertSameCall(Map<String, Object> textArgs, Map<String, Object> structuredArgs) {
    Object text = run(textArgs);
    Object structured = run(structuredArgs);
    assertEquals(structured, text, () -> textArgs + " against " + structuredArgs);
  }

  /** The canonical arguments with the answer and its note, or the refusal's code. */
  private static Object run(Map<String, Object> args) {
    Arguments canonical;
    try {
      canonical = TOOL.canonicalize(Arguments.of(args));
    } catch (ToolException e) {
      return e.error().code();
    }
    try {
      Answer a = TOOL.invoke(canonical, CONTEXT);
      return List.of(canonical, a.text(), a.note());
    } catch (ToolException e) {
      ToolError error = e.error();
      return List.of(canonical, error.code(), Optional.empty());
    }
  }
}
