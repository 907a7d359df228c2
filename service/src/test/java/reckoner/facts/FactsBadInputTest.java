package reckoner.facts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.tool.ResultText;

/**
 * Bad input through the real Invoker (schema, canonicalize, invoke) over the demo data: each gets
 * its exact code, never an internal error, and a one-line error text without splice delimiters.
 */
final class FactsBadInputTest {
  private static final Invoker INVOKER = TestFacts.invoker(TestFacts.demo());

  static Stream<Arguments> badInputs() {
    String huge = "k".repeat(257);
    return Stream.of(
        // keys
        Arguments.of("a key over 256 characters", "{\"key\":\"" + huge + "\"}", "invalid_argument"),
        Arguments.of("a text over 256 characters", "{\"text\":\"" + huge + "\"}", "invalid_argument"),
        Arguments.of("a 100 000-character key", "{\"key\":\"" + "x".repeat(100_000) + "\"}", "invalid_argument"),
        Arguments.of("an empty key", "{\"key\":\"\"}", "invalid_argument"),
        Arguments.of("a key of spaces only", "{\"key\":\"   \"}", "invalid_argument"),
        Arguments.of("a key of zero-width spaces only", "{\"key\":\"\\u200b\\u200b\"}", "invalid_argument"),
        Arguments.of("a NUL in the key", "{\"key\":\"capi\\u0000tal\"}", "invalid_argument"),
        Arguments.of("a BEL in the key", "{\"key\":\"capi\\u0007tal\"}", "invalid_argument"),
        Arguments.of("an ESC sequence in the key", "{\"key\":\"\\u001b[31mcapital\"}", "invalid_argument"),
        Arguments.of("a DEL in the key", "{\"key\":\"capital\\u007f\"}", "invalid_argument"),
        Arguments.of("a C1 control in the key", "{\"key\":\"capital\\u009b\"}", "invalid_argument"),
        Arguments.of("a control character in the text form", "{\"text\":\"capital\\u0003\"}", "invalid_argument"),
        Arguments.of("an unpaired high surrogate", "{\"key\":\"capital\\ud800\"}", "invalid_argument"),
        Arguments.of("an unpaired low surrogate", "{\"key\":\"\\udc00capital\"}", "invalid_argument"),
        Arguments.of("a key that grows past 1024 characters under NFKC",
            "{\"key\":\"" + "\\ufdfa".repeat(60) + "\"}", "invalid_argument"),
        Arguments.of("a number as key", "{\"key\":42}", "invalid_argument"),
        Arguments.of("a boolean as key", "{\"key\":true}", "invalid_argument"),
        Arguments.of("null as key", "{\"key\":null}", "invalid_argument"),
        Arguments.of("an array as key", "{\"key\":[\"capital\"]}", "invalid_argument"),
        Arguments.of("an object as key", "{\"key\":{\"name\":\"capital\"}}", "invalid_argument"),
        Arguments.of("both key and text", "{\"key\":\"capital\",\"text\":\"capital\"}", "invalid_argument"),
        Arguments.of("neither key nor text", "{\"set\":\"demo\"}", "invalid_argument"),
        Arguments.of("no arguments at all", "{}", "invalid_argument"),
        Arguments.of("an unknown argument", "{\"key\":\"capital\",\"lang\":\"en\"}", "invalid_argument"),
        Arguments.of("arguments that are not an object", "[\"capital\"]", "invalid_argument"),
        // sets
        Arguments.of("an unknown set", "{\"key\":\"capital\",\"set\":\"atlas\"}", "not_found"),
        Arguments.of("a set name with capitals", "{\"key\":\"capital\",\"set\":\"Demo\"}", "invalid_argument"),
        Arguments.of("a set name with a slash", "{\"key\":\"capital\",\"set\":\"../demo\"}", "invalid_argument"),
        Arguments.of("an empty set name", "{\"key\":\"capital\",\"set\":\"\"}", "invalid_argument"),
        Arguments.of("a set name over 64 characters", "{\"key\":\"capital\",\"set\":\"" + "s".repeat(65) + "\"}",
            "invalid_argument"),
        Arguments.of("a number as set", "{\"key\":\"capital\",\"set\":7}", "invalid_argument"),
        // as_of
        Arguments.of("as_of in words", "{\"key\":\"president\",\"as_of\":\"yesterday\"}", "invalid_argument"),
        Arguments.of("as_of on 30 February", "{\"key\":\"president\",\"as_of\":\"2031-02-30\"}", "invalid_argument"),
        Arguments.of("as_of in month 13", "{\"key\":\"president\",\"as_of\":\"2031-13-01\"}", "invalid_argument"),
        Arguments.of("as_of day first", "{\"key\":\"president\",\"as_of\":\"17-05-2031\"}", "invalid_argument"),
        Arguments.of("as_of with slashes", "{\"key\":\"president\",\"as_of\":\"2031/05/17\"}", "invalid_argument"),
        Arguments.of("as_of at hour 25", "{\"key\":\"president\",\"as_of\":\"2031-05-17T25:00Z\"}", "invalid_argument"),
        Arguments.of("as_of with offset +25:00", "{\"key\":\"president\",\"as_of\":\"2031-05-17T10:00+25:00\"}",
            "invalid_argument"),
        Arguments.of("as_of with an unknown zone", "{\"key\":\"president\",\"as_of\":\"2031-05-17T10:00Z[Mars/Olympus]\"}",
            "invalid_argument"),
        Arguments.of("as_of as a week date", "{\"key\":\"president\",\"as_of\":\"2031-W20-6\"}", "invalid_argument"),
        Arguments.of("an empty as_of", "{\"key\":\"president\",\"as_of\":\"\"}", "invalid_argument"),
        Arguments.of("an as_of over 64 characters", "{\"key\":\"president\",\"as_of\":\"2031-05-17" + " ".repeat(60) + "\"}",
            "invalid_argument"),
        Arguments.of("a number as as_of", "{\"key\":\"president\",\"as_of\":20310517}", "invalid_argument"),
        Arguments.of("as_of with a control character", "{\"key\":\"president\",\"as_of\":\"2031-05-17\\u0000\"}",
            "invalid_argument"),
        // misses
        Arguments.of("an unknown key", "{\"key\":\"national bird\"}", "not_found"),
        Arguments.of("splice markup as key", "{\"key\":\"<<facts(capital) => Brindlecove>>\"}", "not_found"),
        Arguments.of("a date before any term", "{\"key\":\"president\",\"as_of\":\"1999-01-01\"}", "not_found"),
        Arguments.of("an accented spelling in a set that keeps accents", "{\"key\":\"island of Sainte-Aurelie\"}",
            "not_found"));
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("badInputs")
  void badInput_isRefusedWithItsCode(String title, String args, String code) {
    Outcome outcome = INVOKER.invoke(CallRequest.of("facts", 1, TestFacts.JSON.readTree(args)));
    assertTrue(outcome.error().isPresent(), () -> title + ": expected " + code + " but answered " + outcome.text());
    assertEquals(code, outcome.error().get().code().wireName(), outcome::text);
    String text = outcome.text();
    assertTrue(ResultText.isOneLine(text) && text.length() <= ResultText.DEFAULT_MAX_LENGTH, text);
    assertFalse(text.contains("<<") || text.contains(">>") || text.contains("=>"), text);
  }

  @Test
  void badInputs_areAtLeastThirty() {
    assertTrue(badInputs().count() >= 30);
  }

  @Test
  void badInput_doesNotHarmTheNextCall() {
    INVOKER.invoke(CallRequest.of("facts", 1, TestFacts.JSON.readTree("{\"key\":\"capi\\u0000tal\"}")));
    assertEquals("Brindlecove", TestFacts.call(INVOKER, "{\"key\":\"capital\"}").text());
  }

  @Test
  void controlCharacter_detailSaysWhichAndWhere() {
    Outcome o = TestFacts.call(INVOKER, "{\"key\":\"capi\\u0007tal\"}");
    assertEquals("key contains the control character U+0007 at position 5", o.error().get().detail());
  }

  @Test
  void malformedAsOf_detailShowsTheExpectedForm() {
    Outcome o = TestFacts.call(INVOKER, "{\"key\":\"president\",\"as_of\":\"2031/05/17\"}");
    assertEquals("as_of must be an ISO 8601 date such as 2031-05-17 or a date-time such as 2031-05-17T09:30:00Z"
        + " but was '2031/05/17'", o.error().get().detail());
  }

  @Test
  void unknownSet_listsTheServedSets() {
    Outcome o = TestFacts.call(INVOKER, "{\"key\":\"capital\",\"set\":\"demo-word\"}");
    assertEquals("error: not_found: no fact set 'demo-word'; served sets: demo, demo-words (did you mean: demo-words?)",
        o.text());
  }
}
