package reckoner.facts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.math.BigDecimal;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** The strict one-line JSON object reader (RFC 8259). */
final class JsonLineTest {
  @Test
  void parseObject_everyValueKind_inMemberOrder() throws JsonLine.Malformed {
    Map<String, Object> o = JsonLine.parseObject(
        " {\"s\":\"a\\\"b\\\\c\\/d\\n\\u00e9\\ud83d\\ude00\",\"t\":true,\"f\":false,\"n\":null,\"x\":-1.5e3,\"a\":[1,\"b\",[]],\"o\":{}} ");
    assertEquals(List.of("s", "t", "f", "n", "x", "a", "o"), List.copyOf(o.keySet()));
    assertEquals("a\"b\\c/d\né\uD83D\uDE00", o.get("s"));
    assertEquals(Boolean.TRUE, o.get("t"));
    assertEquals(Boolean.FALSE, o.get("f"));
    assertEquals(JsonLine.NULL, o.get("n"));
    assertEquals(new BigDecimal("-1.5e3"), o.get("x"));
    assertEquals(List.of(new BigDecimal("1"), "b", List.of()), o.get("a"));
    assertEquals(Map.of(), o.get("o"));
  }

  @ParameterizedTest(name = "{0}")
  @CsvSource(delimiter = '|', value = {
      "empty line||1|expected a JSON object starting with '{' but the line ended",
      "a bare string|\"x\"|1|expected a JSON object starting with '{'",
      "single quotes|{'a':1}|2|expected a member name in double quotes",
      "a comment|{\"a\":1} // note|9|unexpected text after the object",
      "a leading zero|{\"a\":01}|7|expected ',' or '}'",
      "a bare dot|{\"a\":.5}|6|unexpected character '.'",
      "a raw tab in a string|{\"a\":\"x\ty\"}|8|raw control character U+0009 in a string (escape it)",
      "an unknown escape|{\"a\":\"\\x\"}|8|unknown escape \\x",
      "a short unicode escape|{\"a\":\"\\u12\"}|9|\\u needs four hex digits",
      "full-width digits in an escape|{\"a\":\"\\u００４１\"}|9|\\u needs four hex digits",
      "an unterminated string|{\"a\":\"x|8|unterminated string",
      "a missing colon|{\"a\" 1}|6|expected ':'",
      "a misspelt literal|{\"a\":tru}|6|unexpected character 't'",
      "a duplicate name|{\"a\":1,\"a\":2}|8|duplicate member \"a\"",
      "too deep|{\"a\":[[[[[[[[1]]]]]]]]}|13|nesting deeper than 8"})
  void parseObject_malformed_saysWhereAndWhy(String title, String line, int column, String message) {
    JsonLine.Malformed e = assertThrows(JsonLine.Malformed.class, () -> JsonLine.parseObject(line == null ? "" : line));
    assertEquals(message, e.getMessage());
    assertEquals(column, e.column());
  }
}
