package reckoner.http;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.NullSource;
import org.junit.jupiter.params.provider.ValueSource;

/** Accept headers read by weight and specificity, as RFC 9110 section 12.5.1 describes. */
final class AcceptHeaderTest {
  @ParameterizedTest(name = "[{0}] -> text {1}")
  @CsvSource(delimiter = '|', value = {
      "text/plain|true",
      "text/plain; charset=utf-8|true",
      "TEXT/PLAIN|true",
      "text/*|true",
      "application/json|false",
      "application/problem+json|false",
      "*/*|false",
      "text/plain, application/json|false",          // a tie goes to JSON, the default form
      "text/plain, application/json;q=0.5|true",     // the case the weights decide
      "application/json;q=0.9, text/plain|true",
      "text/plain;q=0.1, */*|false",
      "text/plain;q=0.1, application/*;q=0.05|true",
      "*/*;q=0.8, text/plain|true",
      "text/*;q=0.2, text/plain;q=0.9, application/json;q=0.5|true",
      "text/plain;q=0, */*|false",                   // q=0: not acceptable
      "text/plain;q=abc, application/json;q=0.1|false", // a malformed element is ignored
      "text/html|false"})
  void prefersText_byWeightAndSpecificity(String header, boolean text) {
    assertEquals(text, AcceptHeader.parse(header).prefersText());
  }

  @ParameterizedTest
  @NullSource
  @ValueSource(strings = {"", "   "})
  void absent_acceptsBothAndPrefersJson(String header) {
    AcceptHeader a = AcceptHeader.parse(header);
    assertFalse(a.prefersText());
    assertFalse(a.acceptsNeither());
  }

  @ParameterizedTest
  @ValueSource(strings = {"text/html", "image/png, application/xml", "text/plain;q=0, application/json;q=0", "*/*;q=0"})
  void noServedForm_acceptsNeither(String header) {
    assertTrue(AcceptHeader.parse(header).acceptsNeither());
  }

  @ParameterizedTest
  @ValueSource(strings = {"text/plain;q=1.5", "text/plain;q=-1", "text/plain;q=0.12345", "text/plain;q="})
  void malformedWeight_elementIgnored(String header) {
    assertTrue(AcceptHeader.parse(header).acceptsNeither());
  }
}
