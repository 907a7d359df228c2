package reckoner.tool;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

final class ToolIdTest {
  @Test
  void parse_nameAtVersion_roundTripsThroughToString() {
    ToolId id = ToolId.parse("arith@1");
    assertEquals(ToolId.of("arith", 1), id);
    assertEquals("arith@1", id.toString());
    assertEquals(id.hashCode(), ToolId.of("arith", 1).hashCode());
    assertNotEquals(ToolId.of("arith", 2), id);
  }

  @ParameterizedTest
  @ValueSource(strings = {"arith", "arith@", "arith@0", "arith@-1", "arith@01", "Arith@1", "@1", "a b@1", "arith@1.0", "xxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxx@1"})
  void parse_malformed_throwsIllegalArgument(String text) {
    assertThrows(IllegalArgumentException.class, () -> ToolId.parse(text));
  }

  @Test
  void compareTo_ordersByNameThenVersion() {
    assertEquals(-1, Integer.signum(ToolId.of("arith", 2).compareTo(ToolId.of("dates", 1))));
    assertEquals(-1, Integer.signum(ToolId.of("arith", 1).compareTo(ToolId.of("arith", 2))));
  }
}
