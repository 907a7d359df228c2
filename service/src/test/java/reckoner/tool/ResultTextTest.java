package reckoner.tool;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

final class ResultTextTest {
  @Test
  void clean_controlAndLineBreaks_becomeOneSpace() {
    assertEquals("a b c d", ResultText.clean("a\nb\r\n\tc\u2028\u0000d", 200));
    assertEquals("x", ResultText.clean("  \u0085x\u001b  ", 200));
    assertTrue(ResultText.isOneLine(ResultText.clean("1\n2", 200)));
  }

  @Test
  void clean_longText_isCutAtACodePointWithAnEllipsis() {
    String s = "😀".repeat(300);
    String c = ResultText.clean(s, 200);
    assertEquals(200, c.codePointCount(0, c.length()));
    assertTrue(c.endsWith("…"));
  }

  @Test
  void errorText_isOneLine_withCodeAndSuggestions() {
    ToolError e = new ToolError(ErrorCode.UNKNOWN_UNIT, "no unit 'mtr'", java.util.List.of("m", "mi"));
    assertEquals("error: unknown_unit: no unit 'mtr' (did you mean: m, mi?)", e.text());
  }
}
