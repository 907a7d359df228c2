package reckoner.splice;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

final class DocumentTest {
  @Test
  void parse_literalsCallsAndAnsweredCalls_keepEveryCharacter() {
    String text = "a <:arith(1+1):> b <:units@1(3 km to mi) :: 1.86411 mi:> c";
    List<Document.Part> parts = Document.parse(text, Markup.DEFAULT).parts();
    assertEquals(5, parts.size());
    assertEquals("a ", parts.get(0).raw());
    assertEquals(new CallText("arith", OptionalInt.empty(), "1+1"), parts.get(1).call().get());
    assertTrue(parts.get(1).isUnanswered());
    assertEquals(new CallText("units", OptionalInt.of(1), "3 km to mi"), parts.get(3).call().get());
    assertEquals("1.86411 mi", parts.get(3).answer().get());
    assertEquals(text, String.join("", parts.stream().map(Document.Part::raw).toList()));
  }

  @Test
  void parse_positions_countCodePoints() {
    List<Document.Part> parts = Document.parse("😀😀<:arith(1):>", Markup.DEFAULT).parts();
    assertEquals(2, parts.get(1).position());
  }

  @Test
  void parse_nestedCall_isOneMalformedPart() {
    List<Document.Part> parts = Document.parse("x <:arith(<:arith(1):>):> y", Markup.DEFAULT).parts();
    assertEquals(ErrorCode.SYNTAX_ERROR, parts.get(1).error().get().code());
    assertTrue(parts.get(1).error().get().detail().startsWith("nested call"));
  }

  @Test
  void parse_unclosedCall_keepsTheRestAsIs() {
    List<Document.Part> parts = Document.parse("x <:arith(1+", Markup.DEFAULT).parts();
    assertEquals(2, parts.size());
    assertEquals("<:arith(1+", parts.get(1).raw());
    assertTrue(parts.get(1).error().get().detail().startsWith("unclosed call"));
  }

  @Test
  void parse_customMarkup_forReservedTokens() {
    Markup m = new Markup("[CALL]", " -> ", "[/CALL]");
    List<Document.Part> parts = Document.parse("p [CALL]arith(2^10)[/CALL] q", m).parts();
    assertEquals("2^10", parts.get(1).call().get().input());
  }

  @Test
  void callText_parse_inputKeepsInnerParentheses() throws ToolException {
    assertEquals("(1+2)*(3)", CallText.parse("arith((1+2)*(3))").input());
    assertEquals("arith@2(x)", CallText.parse(" arith@2( x ) ").toString());
  }

  @Test
  void callText_parse_malformed_isSyntaxError() {
    for (String bad : new String[] {"arith", "arith(", "Arith(1)", "arith@0(1)", "arith@x(1)", "(1)", "a b(1)"}) {
      assertEquals(ErrorCode.SYNTAX_ERROR, assertThrows(ToolException.class, () -> CallText.parse(bad)).error().code(), bad);
    }
  }

  @Test
  void markup_stringsThatContainEachOther_areRefused() {
    assertThrows(IllegalArgumentException.class, () -> new Markup("<", " :: ", "<:"));
    assertThrows(IllegalArgumentException.class, () -> new Markup("<:", ":>", ":>"));
    assertThrows(IllegalArgumentException.class, () -> new Markup("<:", "   ", ":>"));
    assertThrows(IllegalArgumentException.class, () -> new Markup("", " :: ", ":>"));
  }
}
