package reckoner.arith;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.MethodSource;
import reckoner.tool.CallContext;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolError;
import reckoner.tool.ToolException;

final class ArithToolV2Test {
  private final ArithToolV2 tool = new ArithToolV2();

  private static reckoner.tool.Arguments args(String text, Object... more) {
    Map<String, Object> args = new LinkedHashMap<>();
    args.put("text", text);
    for (int i = 0; i < more.length; i += 2) {
      args.put((String) more[i], more[i + 1]);
    }
    return reckoner.tool.Arguments.of(args);
  }

  /** The answer's text, or the error's one-line text. */
  private String eval(String text, Object... more) {
    try {
      return tool.invoke(tool.canonicalize(args(text, more)), CallContext.systemUtc()).text();
    } catch (ToolException e) {
      return e.error().text();
    }
  }

  private ToolError error(String text, Object... more) {
    try {
      String answer = tool.invoke(tool.canonicalize(args(text, more)), CallContext.systemUtc()).text();
      throw new AssertionError("expected an error for " + text + " but got " + answer);
    } catch (ToolException e) {
      return e.error();
    }
  }

  private String canonical(String text, Object... more) throws ToolException {
    return tool.canonicalize(args(text, more)).toCanonicalJson();
  }

  /* ------- the canonical form ------- */

  @Test
  void canonicalize_phraseAndExpression_giveOneCanonicalForm() throws ToolException {
    String expected = "{\"expr\":\"25 * 4\",\"pad_zeros\":false,\"places\":2,\"rounding\":\"half_even\"}";
    assertEquals(expected, canonical("What is 25 times 4?"));
    assertEquals(expected, canonical("25*4"));
    assertEquals(expected, tool.canonicalize(reckoner.tool.Arguments.of(Map.of("expr", "25 x 4", "places", 2))).toCanonicalJson());
  }

  @Test
  void canonicalize_roundingPhrase_movesIntoTheArguments() throws ToolException {
    assertEquals("{\"expr\":\"2 / 3\",\"pad_zeros\":false,\"places\":3,\"rounding\":\"half_even\"}",
        canonical("round 2/3 to 3 decimal places"));
    assertEquals("{\"digits\":3,\"expr\":\"22 / 7\",\"pad_zeros\":false,\"rounding\":\"half_even\"}",
        canonical("22/7 to 3 significant figures"));
    assertEquals("{\"expr\":\"7 / 2\",\"pad_zeros\":false,\"places\":0,\"rounding\":\"ceiling\"}", canonical("7/2 rounded up"));
    assertEquals("{\"expr\":\"3.14159\",\"pad_zeros\":false,\"places\":2,\"rounding\":\"half_even\"}", canonical("round(3.14159, 2)"));
  }

  @Test
  void canonicalize_namesWhatItMeans() throws ToolException {
    assertEquals("log10(100)", tool.canonicalize(args("log(100)")).requireString("expr"));
    assertEquals("ln(100)", tool.canonicalize(args("math.log(100)")).requireString("expr"));
    assertEquals("80 + 15%", tool.canonicalize(args("increase 80 by 15%")).requireString("expr"));
    assertEquals("floor(17 / 5)", tool.canonicalize(args("17 // 5")).requireString("expr"));
    assertEquals("(5!)!", tool.canonicalize(args("(5!)!")).requireString("expr"));
  }

  @Test
  void canonicalize_roundingPhraseAgainstAnArgument_isInvalidArgument() {
    assertEquals(ErrorCode.INVALID_ARGUMENT, error("2/3 to 3 decimal places", "places", 2).code());
    assertEquals(ErrorCode.INVALID_ARGUMENT, error("2/3 to 3 decimal places", "digits", 3).code());
    assertEquals(ErrorCode.INVALID_ARGUMENT, error("7/2 rounded up", "rounding", "floor").code());
    assertEquals("0.667", eval("2/3 to 3 decimal places", "places", 3)); // agreeing is fine
  }

  @Test
  void roundingPhraseBeyondTheLimits_isLimitExceeded() {
    // The text reads, but asks for more than the places and digits arguments allow: 422, like any
    // text that cannot be computed, not 400 (the request itself is well formed).
    assertEquals(ErrorCode.LIMIT_EXCEEDED, error("1/3 to 50 decimal places").code());
    assertEquals(ErrorCode.LIMIT_EXCEEDED, error("1/3 to 40 significant figures").code());
  }

  @Test
  void deepPhrases_haveCanonicalFormsThatReadBack() {
    // Words and prefix operators nest without parentheses; the canonical form spells them out.
    assertEquals("1", eval("sqrt ".repeat(190) + "4"));
    assertEquals("-1", eval("-".repeat(199) + "1"));
    assertEquals(ErrorCode.LIMIT_EXCEEDED, error("-".repeat(201) + "1").code());
  }

  /* ------- what version 1 answered differently (arith@1 answers are frozen in golden/v1.jsonl) ------- */

  @Test
  void exactRationals_roundOnceAtTheEnd() {
    // arith@1 rounds 1 + (-1e-383) to 34 digits first, giving 1 (the example).
    assertEquals("0.9999999999999999", eval("1 + (-1e-383)", "digits", 16, "rounding", "down"));
    assertEquals("1", eval("1/3 + 1/3 + 1/3", "digits", 34));
    assertEquals("2.333333333333333333333333333333333", eval("7/3", "digits", 34, "rounding", "floor")); // Python decimal, prec 34, ROUND_FLOOR
  }

  @Test
  void log_isBaseTen_lnIsNatural() {
    assertEquals("2", eval("log(100)"));
    assertEquals("4.61", eval("ln(100)")); // ln 100 = 4.60517... (Python math.log)
    assertEquals("-5", eval("log10(0.00001)", "digits", 34));
    assertEquals("-3", eval("log2(1/8)", "digits", 34));
    assertEquals("4", eval("log_3(81)", "digits", 34));
  }

  @Test
  void percentSign_isAPercentage_andModIsSpelledMod() {
    assertEquals("5", eval("200*2.5%"));
    assertEquals("92", eval("80 + 15%"));
    assertEquals("80.15", eval("80 + 0.15"));
    assertEquals("2", eval("-7 mod 3")); // Python: -7 % 3 == 2
    assertEquals("-1", eval("rem(-7, 3)")); // C fmod(-7, 3) == -1
  }

  /* ------- exact functions ------- */

  @ParameterizedTest(name = "{0} -> {1}")
  @CsvSource(delimiter = '|', value = {
      "sqrt(9/4)|1.5", "sqrt(1/9) * 3|1", "cbrt(-27)|-3", "root(16, 4)|2", "8^(1/3)|2", "4^0.5|2",
      "sqrt(2)|1.414213562373095048801688724209698", // Python decimal sqrt at 34 digits
      "cos(90°)|0", "sin(30°)|0.5", "tan(135 degrees)|-1", "sin(-210°)|0.5", "sin(45° + 45°)|1",
      "pi|3.141592653589793238462643383279503", "10 choose 3|120", "0!|1", "gcd(0, 5)|5"})
  void exactValues_atThirtyFourDigits(String expr, String expected) {
    assertEquals(expected, eval(expr, "digits", 34));
  }

  @Test
  void pi_carriesSixtyDigits() {
    // pi to 40 places: 3.14159 26535 89793 23846 26433 83279 50288 41971 69399... (from memory; Python Machin formula agrees)
    assertEquals("3.1415926535897932384626433832795028841972", eval("pi", "places", 40));
  }

  /* ------- values too large to keep exact: bounded evaluation ------- */

  @Test
  void boundedEvaluation_givesTheCorrectlyRoundedValue() {
    // References: Python 3.11 fractions raised exactly, then decimal division at the precision.
    assertEquals("4.481228688524515247752280085827483", eval("(1 + 0.05/365)^(365*30)", "digits", 34));
    assertEquals("1.0100500655741364504", eval("1.0000001^99999", "digits", 20));
    assertEquals("1.010050066584176416", eval("0.9999999^-99999", "digits", 20));
  }

  @Test
  void boundedEvaluation_nearABoundaryItCannotDecide_isLimitExceeded() {
    // (8/7)^20000 (about 1e1160, 60,000 bits exactly) minus itself is exactly 0, so the sum is
    // exactly 0.005: a tie at two places that bounds around 1e1160 never settle. 0.004 is no tie,
    // and bounds at about 1,200 digits decide it.
    assertEquals(ErrorCode.LIMIT_EXCEEDED, error("(8/7)^20000 - (8/7)^20000 + 0.005").code());
    assertEquals("0", eval("(8/7)^20000 - (8/7)^20000 + 0.004"));
    assertEquals(ErrorCode.LIMIT_EXCEEDED, error("(4/3)^30000 - (4/3)^30000 + 0.004").code()); // 1e3748: beyond 2,000 digits
  }

  /* ------- ambiguity: refused with both readings ------- */

  static Stream<Arguments> ambiguous() {
    return Stream.of(
        Arguments.of("6/2(1+2)", List.of("6 / 2 * (1 + 2)", "6 / (2 * (1 + 2))")),
        Arguments.of("1/2pi", List.of("1 / 2 * pi", "1 / (2 * pi)")),
        Arguments.of("17 % 5", List.of("17 mod 5", "17% * 5")),
        Arguments.of("square root of 16 plus 9", List.of("sqrt(16) + 9", "sqrt(16 + 9)")),
        Arguments.of("twice 3 plus 4", List.of("2 * 3 + 4", "2 * (3 + 4)")),
        Arguments.of("sum of 3 and 4 times 2", List.of("(3 + 4) * 2", "3 + 4 * 2")),
        Arguments.of("log(8, 2)", List.of("log_2(8)", "log_8(2)")),
        Arguments.of("difference between 3 and 10", List.of("3 - 10", "10 - 3")));
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("ambiguous")
  void ambiguousPhrase_isRefusedWithBothReadings(String text, List<String> readings) {
    ToolError e = error(text);
    assertEquals(ErrorCode.SYNTAX_ERROR, e.code());
    assertTrue(e.detail().startsWith("ambiguous: "), e.detail());
    assertEquals(readings, e.suggestions());
  }

  @Test
  void unambiguousNeighbours_areAnswered() {
    assertEquals("9", eval("(6/2)(1+2)"));
    assertEquals("13", eval("sqrt(16) + 9"));
    assertEquals("13", eval("sqrt 16 + 9")); // formula style binds like unary minus
    assertEquals("5", eval("square root of (16 + 9)"));
    assertEquals("7", eval("difference between 10 and 3"));
  }

  /* ------- refusals name what works ------- */

  @Test
  void invisibleCharacters_areNamedByCodePoint_neverShown() {
    for (String[] c : new String[][] {{"2\u202e+2", "U+202E"}, {"2\u200b+2", "U+200B"}, {"\ufeff2+2", "U+FEFF"},
        {"2\u0007+2", "U+0007"}, {"2\u2066+2", "U+2066"}, {"2\u00ad+2", "U+00AD"}}) {
      ToolError e = error(c[0]);
      assertEquals(ErrorCode.SYNTAX_ERROR, e.code());
      assertTrue(e.text().contains(c[1]), e.text());
      assertFalse(e.text().contains(c[0].replaceAll("[0-9+]", "")), e.text());
    }
    assertEquals("error: syntax_error: the text holds a bidirectional control character U+202E at position 2; remove it"
        + " and send the expression as plain text", error("2\u202e+2").text());
  }

  @Test
  void unknownWords_suggestThePhraseWithoutThem() {
    assertEquals(List.of("5 + 3"), error("what is 5 apples plus 3 oranges").suggestions());
    assertEquals(List.of("15% * 60"), error("what is a 15% tip on $60").suggestions());
    assertEquals(List.of("3.5"), error("3,5 + 1").suggestions());
    assertEquals(List.of("31"), error("0x1F").suggestions());
    assertEquals(List.of("1000"), error("1 000").suggestions());
  }

  static Stream<Arguments> failures() {
    return Stream.of(
        Arguments.of("1/0", ErrorCode.DOMAIN_ERROR), Arguments.of("5 mod 0", ErrorCode.DOMAIN_ERROR),
        Arguments.of("sqrt(-1)", ErrorCode.DOMAIN_ERROR), Arguments.of("root(-16, 4)", ErrorCode.DOMAIN_ERROR),
        Arguments.of("ln(0)", ErrorCode.DOMAIN_ERROR), Arguments.of("log(-1)", ErrorCode.DOMAIN_ERROR),
        Arguments.of("log_1(5)", ErrorCode.DOMAIN_ERROR), Arguments.of("asin(2)", ErrorCode.DOMAIN_ERROR),
        Arguments.of("tan(90°)", ErrorCode.DOMAIN_ERROR), Arguments.of("0^-1", ErrorCode.DOMAIN_ERROR),
        Arguments.of("(-8)^(1/3)", ErrorCode.DOMAIN_ERROR), Arguments.of("2.5!", ErrorCode.DOMAIN_ERROR),
        Arguments.of("(-1)!", ErrorCode.DOMAIN_ERROR), Arguments.of("gcd(1.5, 3)", ErrorCode.DOMAIN_ERROR),
        Arguments.of("root(8, 0)", ErrorCode.DOMAIN_ERROR), Arguments.of("root(8, 101)", ErrorCode.DOMAIN_ERROR),
        Arguments.of("9^9^9^9", ErrorCode.LIMIT_EXCEEDED), Arguments.of("2^100001", ErrorCode.LIMIT_EXCEEDED),
        Arguments.of("3001!", ErrorCode.LIMIT_EXCEEDED), Arguments.of("10001 choose 2", ErrorCode.LIMIT_EXCEEDED),
        Arguments.of("(".repeat(51) + "1" + ")".repeat(51), ErrorCode.LIMIT_EXCEEDED),
        Arguments.of("-".repeat(300) + "1", ErrorCode.LIMIT_EXCEEDED),
        Arguments.of("1+".repeat(500) + "1", ErrorCode.LIMIT_EXCEEDED),
        Arguments.of("10^10000", ErrorCode.OVERFLOW), Arguments.of("1e10000", ErrorCode.OVERFLOW),
        Arguments.of("0.1^10000", ErrorCode.OVERFLOW), Arguments.of("exp(1000000)", ErrorCode.OVERFLOW),
        Arguments.of("(1e5000)^3", ErrorCode.OVERFLOW),
        Arguments.of("(1", ErrorCode.SYNTAX_ERROR), Arguments.of("1)", ErrorCode.SYNTAX_ERROR),
        Arguments.of("1+", ErrorCode.SYNTAX_ERROR), Arguments.of("*1", ErrorCode.SYNTAX_ERROR),
        Arguments.of("2 3", ErrorCode.SYNTAX_ERROR), Arguments.of("x + 1", ErrorCode.SYNTAX_ERROR),
        Arguments.of("5!!", ErrorCode.SYNTAX_ERROR), Arguments.of("sinh(1)", ErrorCode.SYNTAX_ERROR),
        Arguments.of("   ", ErrorCode.SYNTAX_ERROR), Arguments.of("what is", ErrorCode.SYNTAX_ERROR),
        Arguments.of("1..2", ErrorCode.SYNTAX_ERROR), Arguments.of("1;2", ErrorCode.SYNTAX_ERROR),
        Arguments.of("()", ErrorCode.SYNTAX_ERROR), Arguments.of("2 = 2", ErrorCode.SYNTAX_ERROR),
        Arguments.of("$5 + €3", ErrorCode.SYNTAX_ERROR), Arguments.of("max 3, 4", ErrorCode.SYNTAX_ERROR),
        Arguments.of("the sum of 5", ErrorCode.SYNTAX_ERROR), Arguments.of("add 3", ErrorCode.SYNTAX_ERROR),
        Arguments.of("2 ‰", ErrorCode.SYNTAX_ERROR), Arguments.of("\ud83d\ude00 + 1", ErrorCode.SYNTAX_ERROR));
  }

  @ParameterizedTest(name = "{0} -> {1}")
  @MethodSource("failures")
  void badPhrases_failWithTheirCode(String text, ErrorCode expected) {
    assertEquals(expected, error(text).code(), () -> error(text).text());
  }

  @Test
  void everyHostilePhrase_finishes() {
    // A behavioural bound, not a benchmark: hostile phrases in a row must all finish with an
    // answer or an error (no hang, no runaway allocation). Timing is measured in load-tests/.
    String[] hostile = {"9^9^9^9", "1.0000001^99999", "0.9999999^-99999", "(10^9999) mod (1e-9999)",
        "sqrt(" + "9".repeat(990) + ")", "3000!", "10000 choose 5000", "(4/3)^30000 - (4/3)^30000 + 0.005",
        "root(" + "7".repeat(900) + ", 99)", "(1e9999)^(1/3)"};
    for (int i = 0; i < 3; i++) {
      for (String h : hostile) {
        String out = eval(h);
        assertFalse(out.isEmpty(), h);
      }
    }
    assertEquals("error: limit_exceeded: the exponent 387420489 exceeds the limit of ±100000", eval("9^9^9^9"));
  }
}
