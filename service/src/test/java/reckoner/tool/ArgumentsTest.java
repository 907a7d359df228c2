package reckoner.tool;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.math.BigDecimal;
import java.util.Map;
import org.junit.jupiter.api.Test;

final class ArgumentsTest {
  @Test
  void numbers_twoSpellingsOfOneValue_areEqual() {
    Arguments a = Arguments.of(Map.of("places", new BigDecimal("2.0")));
    Arguments b = Arguments.of(Map.of("places", 2));
    Arguments c = Arguments.of(Map.of("places", new BigDecimal("2e0")));
    assertEquals(a, b);
    assertEquals(b, c);
    assertEquals(a.hashCode(), c.hashCode());
    assertEquals("{\"places\":2}", a.toCanonicalJson());
  }

  @Test
  void canonicalJson_sortsKeys_andEscapesStrings() {
    Arguments a = Arguments.of(Map.of("z", "a\"b\\c\n", "a", true, "m", new BigDecimal("-0.50")));
    assertEquals("{\"a\":true,\"m\":-0.5,\"z\":\"a\\\"b\\\\c\\n\"}", a.toCanonicalJson());
    assertEquals(a.toCanonicalJson(), a.toString());
  }

  @Test
  void canonicalJson_hugeMagnitudes_stayShort() {
    assertEquals("{\"v\":1E+999999999}", Arguments.of("v", new BigDecimal("1e999999999")).toCanonicalJson());
    assertEquals("{\"v\":0}", Arguments.of("v", new BigDecimal("-0.000")).toCanonicalJson());
  }

  @Test
  void with_returnsACopy_andLeavesTheOriginal() {
    Arguments a = Arguments.of("x", "1");
    Arguments b = a.with("y", "2");
    assertEquals("{\"x\":\"1\"}", a.toCanonicalJson());
    assertEquals("{\"x\":\"1\",\"y\":\"2\"}", b.toCanonicalJson());
    assertEquals(a, b.without("y"));
    assertNotEquals(a, b);
  }

  @Test
  void typedGetters_wrongType_isInvalidArgument() {
    Arguments a = Arguments.of(Map.of("n", 1.5, "s", "x"));
    ToolException e = assertThrows(ToolException.class, () -> a.string("n"));
    assertEquals(ErrorCode.INVALID_ARGUMENT, e.error().code());
    assertEquals("argument 'n' must be a string but was a number", e.error().detail());
    assertEquals("argument 'n' must be a whole number within ±2147483647 but was 1.5",
        assertThrows(ToolException.class, () -> a.integer("n")).error().detail());
    assertEquals("argument 'q' is required", assertThrows(ToolException.class, () -> a.requireString("q")).error().detail());
  }

  @Test
  void of_nonScalarValue_isAProgrammerError() {
    assertThrows(IllegalArgumentException.class, () -> Arguments.of("x", new Object()));
    assertThrows(IllegalArgumentException.class, () -> Arguments.of("x", Double.NaN));
  }
}
