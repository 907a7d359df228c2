package reckoner.conformance;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.http.HttpResponse;
import java.util.stream.Stream;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reckoner.spec.Json;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The contract's "Tools, version 1" section: the text forms every version 1 accepts at least, each
 * answering as its structured form does, and the result text rules. Expected values are the
 * contract's own examples, or computed by hand (the day counts: from memory of the Gregorian
 * calendar, checked with Python 3.11's datetime).
 */
final class ContractToolsIT {
  private static final JsonMapper JSON = Json.newMapper();
  private static final JarServer SERVER = JarServer.shared();

  /** tool, text form, structured form (JSON, or null), expected text. */
  static Stream<Arguments> textForms() {
    return Stream.of(
        Arguments.of("arith", "1250/4000", "{\"expr\":\"1250/4000\"}", "0.31"),
        Arguments.of("units", "3.5 km to mi", "{\"value\":3.5,\"from\":\"km\",\"to\":\"mi\"}", "2.1748 mi"),
        Arguments.of("units", "3.5 km in mi", "{\"value\":3.5,\"from\":\"km\",\"to\":\"mi\"}", "2.1748 mi"),
        Arguments.of("units", "8 L/100km to mpg", "{\"value\":8,\"from\":\"L/100km\",\"to\":\"mpg\"}", "29.4018 mpg"),
        Arguments.of("facts", "capital", "{\"key\":\"capital\"}", "Brindlecove"),
        Arguments.of("dates", "today", "{\"op\":\"today\"}", "2024-06-12"),
        Arguments.of("dates", "45 days ago", "{\"op\":\"ago\",\"duration\":\"P45D\"}", "2024-04-28"),
        Arguments.of("dates", "1 day ago", "{\"op\":\"ago\",\"duration\":\"P1D\"}", "2024-06-11"),
        Arguments.of("dates", "3 weeks ago", "{\"op\":\"ago\",\"duration\":\"P3W\"}", "2024-05-22"),
        Arguments.of("dates", "1 month ago", "{\"op\":\"ago\",\"duration\":\"P1M\"}", "2024-05-12"),
        Arguments.of("dates", "2 years ago", "{\"op\":\"ago\",\"duration\":\"P2Y\"}", "2022-06-12"),
        Arguments.of("dates", "2024-01-31 + P1M", "{\"op\":\"add\",\"date\":\"2024-01-31\",\"duration\":\"P1M\"}", "2024-02-29"),
        Arguments.of("dates", "2024-03-31 - P1M", "{\"op\":\"subtract\",\"date\":\"2024-03-31\",\"duration\":\"P1M\"}", "2024-02-29"),
        Arguments.of("dates", "2024-03-09T12:00 America/New_York + P1D",
            "{\"op\":\"add\",\"date\":\"2024-03-09T12:00\",\"zone\":\"America/New_York\",\"duration\":\"P1D\"}", null),
        Arguments.of("dates", "days from 2024-01-01 to 2024-12-25",
            "{\"op\":\"between\",\"date\":\"2024-01-01\",\"to\":\"2024-12-25\",\"unit\":\"days\"}", "359"),
        Arguments.of("dates", "weeks from 2024-01-01 to 2024-12-25",
            "{\"op\":\"between\",\"date\":\"2024-01-01\",\"to\":\"2024-12-25\",\"unit\":\"weeks\"}", "51"),
        Arguments.of("dates", "months from 2024-01-31 to 2024-12-25",
            "{\"op\":\"between\",\"date\":\"2024-01-31\",\"to\":\"2024-12-25\",\"unit\":\"months\"}", "10"),
        Arguments.of("dates", "years from 2000-02-29 to 2024-02-28",
            "{\"op\":\"between\",\"date\":\"2000-02-29\",\"to\":\"2024-02-28\",\"unit\":\"years\"}", "23"),
        Arguments.of("dates", "business days from 2024-03-01 to 2024-03-15",
            "{\"op\":\"between\",\"date\":\"2024-03-01\",\"to\":\"2024-03-15\",\"unit\":\"business_days\"}", "10"),
        Arguments.of("dates", "weekday 2024-03-01", "{\"op\":\"weekday\",\"date\":\"2024-03-01\"}", "Friday"),
        Arguments.of("dates", "iso week 2021-01-03", "{\"op\":\"iso_week\",\"date\":\"2021-01-03\"}", "2020-W53-7"),
        Arguments.of("dates", "day of year 2024-12-31", "{\"op\":\"day_of_year\",\"date\":\"2024-12-31\"}", "366"),
        Arguments.of("dates", "leap year 2100", "{\"op\":\"leap_year\",\"date\":\"2100\"}", "no"),
        Arguments.of("dates", "days in month 2024-02", "{\"op\":\"days_in_month\",\"date\":\"2024-02\"}", "29"),
        Arguments.of("dates", "quarter 2024-08-15", "{\"op\":\"quarter\",\"date\":\"2024-08-15\"}", "2024-Q3"),
        Arguments.of("dates", "2024-03-10T02:30 America/New_York to UTC",
            "{\"op\":\"convert_zone\",\"date\":\"2024-03-10T02:30\",\"zone\":\"America/New_York\",\"to\":\"UTC\"}", null),
        Arguments.of("dates", "2024-10-03 in hebrew", "{\"op\":\"to_calendar\",\"date\":\"2024-10-03\",\"calendar\":\"hebrew\"}",
            "5785-01-01"),
        Arguments.of("dates", "  WEEKDAY   2024-03-01 ", "{\"op\":\"weekday\",\"date\":\"2024-03-01\"}", "Friday"));
  }

  @ParameterizedTest(name = "{0}: {1}")
  @MethodSource("textForms")
  @DisplayName("Tools, version 1: each listed text form answers, as its structured form does")
  void textForm_answersAsTheStructuredForm(String tool, String text, String structured, String expected) {
    String asOf = "\"as_of\":\"2024-06-12\"";
    boolean takesAsOf = tool.equals("dates");
    String textArgs = JSON.createObjectNode().put("text", text).toString();
    if (takesAsOf) {
      textArgs = textArgs.substring(0, textArgs.length() - 1) + "," + asOf + "}";
      structured = structured.substring(0, structured.length() - 1) + "," + asOf + "}";
    }
    HttpResponse<String> a = SERVER.postJson("/v1/tools/" + tool + "/1/invoke", textArgs, "Reckoner-Run", "text-forms");
    HttpResponse<String> b = SERVER.postJson("/v1/tools/" + tool + "/1/invoke", structured, "Reckoner-Run", "text-forms");
    assertEquals(200, a.statusCode(), a.body());
    assertEquals(200, b.statusCode(), b.body());
    String textAnswer = JSON.readTree(a.body()).get("text").asString();
    assertEquals(JSON.readTree(b.body()).get("text").asString(), textAnswer);
    if (expected != null) {
      assertEquals(expected, textAnswer);
    }
  }

  @Test
  @DisplayName("Tools: the two forms of one call share one cache entry (the second form is a hit)")
  void twoForms_oneCacheEntry() {
    SERVER.postJson("/v1/tools/units/1/invoke", "{\"text\":\"17.25 furlong to km\"}");
    JsonNode structured = JSON.readTree(SERVER.postJson("/v1/tools/units/1/invoke",
        "{\"value\":17.25,\"from\":\"furlong\",\"to\":\"km\"}").body());
    assertTrue(structured.get("cached").asBoolean(), structured.toString());
  }

  /** expression, places, expected: the result text rules on numbers. */
  static Stream<Arguments> numberRules() {
    return Stream.of(
        Arguments.of("0.1+0.2", 2, "0.3"),          // trailing zeros trimmed
        Arguments.of("-0.001", 2, "0"),             // no -0
        Arguments.of("1e21", 0, "1e+21"),           // 1e21 and up: d.ddde+N
        Arguments.of("999999999999999999999", 0, "999999999999999999999"), // just under 1e21: plain
        Arguments.of("0.000001", 6, "0.000001"),    // 1e-6: still plain
        Arguments.of("0.0000001", 7, "1e-7"),       // under 1e-6: d.ddde-N
        Arguments.of("-2.5", 0, "-2"),              // '-' as minus; half_even
        Arguments.of("1234567.891", 2, "1234567.89")); // '.' as the point, no grouping
  }

  @ParameterizedTest(name = "{0} at {1} places -> {2}")
  @MethodSource("numberRules")
  @DisplayName("Result text rules: '.' point, '-' minus, no grouping, no -0, trailing zeros trimmed, plain for 1e-6 <= |x| < 1e21")
  void numbers_followTheTextRules(String expr, int places, String expected) {
    HttpResponse<String> r = SERVER.postJson("/v1/tools/arith/1/invoke",
        JSON.createObjectNode().put("expr", expr).put("places", places).toString(), "Accept", "text/plain");
    assertEquals(expected, r.body());
  }

  @Test
  @DisplayName("Result text rules: one line, no control characters, at most 200 characters")
  void answers_areOneShortLine() {
    for (String args : new String[] {"{\"expr\":\"2^3000\",\"places\":0}", "{\"expr\":\"1/3\",\"places\":40}"}) {
      String text = SERVER.postJson("/v1/tools/arith/1/invoke", args, "Accept", "text/plain").body();
      assertTrue(text.length() <= 200, text.length() + ": " + text);
      assertFalse(text.chars().anyMatch(Character::isISOControl), text);
    }
  }
}
