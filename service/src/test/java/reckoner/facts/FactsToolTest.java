package reckoner.facts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.TimeZone;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.ErrorCode;
import reckoner.tool.ResultText;
import reckoner.tool.ToolError;
import reckoner.tool.ToolException;

/** facts@1 on the Java level: canonical forms, lookups, time scoping at both edges, aliases and misses. */
final class FactsToolTest {
  private static final CallContext CONTEXT = new CallContext(TestFacts.CLOCK);

  @TempDir
  static Path dir;
  private static FactsTool tool;

  @BeforeAll
  static void writeFacts() {
    TestFacts.write(dir, "harbour.jsonl",
        "{\"set\":\"port\",\"key\":\"Harbour Master\",\"value\":\"Ada Brine\",\"aliases\":[\"master of the harbour\"],"
            + "\"valid_from\":\"2020-01-01\",\"valid_to\":\"2025-03-01\"}",
        "{\"set\":\"port\",\"key\":\"harbour master\",\"value\":\"Col Keel\",\"valid_from\":\"2025-03-01\"}",
        "{\"set\":\"port\",\"key\":\"pier lights\",\"value\":\"red\"}",
        "{\"set\":\"port\",\"key\":\"pier lights\",\"value\":\"green\"}",
        "{\"set\":\"port\",\"key\":\"pier lamps\",\"value\":\"white\"}",
        "{\"set\":\"port\",\"key\":\"tide gauge\",\"value\":\"old gauge\",\"valid_to\":\"2022-01-01\"}",
        "{\"set\":\"port\",\"key\":\"harbour fee\",\"value\":\"base fee\"}",
        "{\"set\":\"port\",\"key\":\"harbour fee\",\"value\":\"winter surcharge\",\"valid_from\":\"2030-10-01\",\"valid_to\":\"2031-04-01\"}",
        "{\"set\":\"port\",\"key\":\"Café Quay\",\"value\":\"north side\"}",
        "{\"set\":\"port\",\"key\":\"notice\",\"value\":\"" + "n".repeat(150) + "\",\"valid_from\":\"2030-01-01\"}",
        "{\"set\":\"port\",\"key\":\"notice\",\"value\":\"" + "m".repeat(150) + "\",\"valid_from\":\"2030-01-01\"}");
    TestFacts.write(dir, "words.jsonl",
        "{\"set\":\"words\",\"options\":{\"fold_accents\":true}}",
        "{\"set\":\"words\",\"key\":\"Café Quay\",\"value\":\"north side\"}");
    tool = new FactsTool(TestFacts.open(dir, "port"));
  }

  private static Answer ask(Map<String, ?> args) throws ToolException {
    return tool.invoke(tool.canonicalize(Arguments.of(args)), CONTEXT);
  }

  private static String text(Map<String, ?> args) throws ToolException {
    return ask(args).text();
  }

  private static ToolError error(Map<String, ?> args) {
    return assertThrows(ToolException.class, () -> ask(args)).error();
  }

  /* ---------------- canonicalize ---------------- */

  @Test
  void canonicalize_textForm_equalsKeyForm() throws ToolException {
    Arguments fromText = tool.canonicalize(Arguments.of("text", "  HARBOUR   master "));
    Arguments fromKey = tool.canonicalize(Arguments.of(Map.of("key", "harbour master", "set", "port")));
    assertEquals(fromKey, fromText);
    assertEquals("{\"key\":\"harbour master\",\"set\":\"port\"}", fromText.toCanonicalJson());
  }

  @Test
  void canonicalize_asOfDateTime_keepsItsOwnCalendarDate() throws ToolException {
    Arguments a = tool.canonicalize(Arguments.of(Map.of("key", "x", "as_of", "2031-05-17T23:30:00-05:00")));
    Arguments b = tool.canonicalize(Arguments.of(Map.of("key", "x", "as_of", "2031-05-17")));
    assertEquals(b, a);
    assertEquals(Optional.of("2031-05-17"), a.string("as_of"));
  }

  @ParameterizedTest
  @CsvSource({
      "2031-05-17T09:30Z, 2031-05-17",
      "2031-05-17T09:30:00.123+02:00, 2031-05-17",
      "2031-05-17T00:15:00+14:00[Pacific/Kiritimati], 2031-05-17",
      "2031-05-17T23:59:59, 2031-05-17",
      "2032-02-29, 2032-02-29",
      "0000-01-01, 0000-01-01",
      "+10000-01-01, +10000-01-01"})
  void parseAsOf_isoForms_giveTheWrittenDate(String asOf, String date) throws ToolException {
    assertEquals(date, FactsTool.parseAsOf(asOf).toString());
  }

  @ParameterizedTest
  @CsvSource({"2031-02-29", "2031-00-10", "2031-04-31", "2031-4-01", "2031-04-1", "２０３１-04-01", "+2031-04-01"})
  void parseAsOf_notAnIsoCalendarDate_isInvalid(String asOf) {
    assertEquals(ErrorCode.INVALID_ARGUMENT, assertThrows(ToolException.class, () -> FactsTool.parseAsOf(asOf)).error().code());
  }

  @Test
  void canonicalize_unknownArgument_isInvalid() {
    ToolError e = assertThrows(ToolException.class, () -> tool.canonicalize(Arguments.of(Map.of("key", "x", "lang", "en"))))
        .error();
    assertEquals(ErrorCode.INVALID_ARGUMENT, e.code());
    assertEquals("unknown argument 'lang'; facts@1 takes key (or text), set and as_of", e.detail());
  }

  /* ---------------- plain lookups, aliases, several values ---------------- */

  @Test
  void invoke_plainKey_answersValueWithDataVersion() throws ToolException {
    Answer a = ask(Map.of("key", "pier lamps"));
    assertEquals("white", a.text());
    assertTrue(a.cacheable());
    assertTrue(a.dataVersion().orElseThrow().matches("sha256:[0-9a-f]{16}"), a.dataVersion().toString());
  }

  @Test
  void invoke_severalValues_joinInFileOrder() throws ToolException {
    assertEquals("red; green", text(Map.of("key", "Pier  Lights")));
  }

  @Test
  void invoke_alias_answersItsKey() throws ToolException {
    assertEquals("Ada Brine", text(Map.of("key", "MASTER OF THE HARBOUR", "as_of", "2024-12-31")));
  }

  @Test
  void invoke_untimedValueAndTimedValue_bothAnswerInsideTheInterval() throws ToolException {
    assertEquals("base fee; winter surcharge", text(Map.of("key", "harbour fee", "as_of", "2030-10-01")));
    assertEquals("base fee", text(Map.of("key", "harbour fee", "as_of", "2031-04-01")));
  }

  /* ---------------- time scoping at both edges ---------------- */

  @ParameterizedTest
  @CsvSource({
      "2020-01-01, Ada Brine",   // first day of the first term: valid_from is inclusive
      "2025-02-28, Ada Brine",   // last day of the first term
      "2025-03-01, Col Keel",    // valid_to is exclusive: the successor's first day
      "2099-12-31, Col Keel"})   // an open end
  void invoke_termEdges_halfOpenIntervals(String asOf, String expected) throws ToolException {
    assertEquals(expected, text(Map.of("key", "harbour master", "as_of", asOf)));
  }

  @Test
  void invoke_beforeTheFirstTerm_isNotFoundWithCoverage() {
    ToolError e = error(Map.of("key", "harbour master", "as_of", "2019-12-31"));
    assertEquals(ErrorCode.NOT_FOUND, e.code());
    assertEquals("'Harbour Master' has no value on 2019-12-31 in set 'port'; its values start on 2020-01-01", e.detail());
  }

  @Test
  void invoke_afterAClosedEnd_isNotFoundWithCoverage() {
    ToolError e = error(Map.of("key", "tide gauge", "as_of", "2022-01-01"));
    assertEquals("'tide gauge' has no value on 2022-01-01 in set 'port'; its values end before 2022-01-01", e.detail());
    assertEquals("old gauge", assertDoesNotThrow(Map.of("key", "tide gauge", "as_of", "2021-12-31")));
  }

  private static String assertDoesNotThrow(Map<String, ?> args) {
    try {
      return text(args);
    } catch (ToolException e) {
      throw new AssertionError(e.error().text(), e);
    }
  }

  /* ---------------- the server clock ---------------- */

  @Test
  void invoke_timeScopedKeyWithoutAsOf_answersOnTheClockAndSaysSo() throws ToolException {
    Answer a = ask(Map.of("key", "harbour master"));
    assertEquals("Col Keel (as of 2031-05-17, server clock)", a.text());
    assertFalse(a.cacheable());
    assertEquals(Optional.of(Instant.parse("2031-05-17T09:30:00Z")), a.clockReadAt());
    assertTrue(a.dataVersion().isPresent());
  }

  @Test
  void invoke_longValuesOnTheClock_keepTheServerClockNoteWithinTheBound() throws ToolException {
    String text = ask(Map.of("key", "notice")).text();
    assertEquals(ResultText.DEFAULT_MAX_LENGTH, text.codePointCount(0, text.length()));
    assertTrue(text.endsWith("m… (as of 2031-05-17, server clock)"), text);
    assertTrue(text.startsWith("n".repeat(150) + "; m"), text);
  }

  @Test
  void invoke_clockDate_isTheUtcDate() throws ToolException {
    Clock lateEvening = Clock.fixed(Instant.parse("2025-02-28T23:59:59Z"), ZoneOffset.ofHours(10));
    Answer a = tool.invoke(tool.canonicalize(Arguments.of("key", "harbour master")), new CallContext(lateEvening));
    assertEquals("Ada Brine (as of 2025-02-28, server clock)", a.text());
  }

  @Test
  void invoke_untimedKeyWithoutAsOf_readsNoClock() throws ToolException {
    Answer a = ask(Map.of("key", "pier lamps"));
    assertTrue(a.cacheable());
    assertEquals(Optional.empty(), a.clockReadAt());
  }

  @Test
  void invoke_timeScopedKeyWithoutValueToday_saysHowToFixIt() {
    ToolError e = error(Map.of("key", "tide gauge"));
    assertEquals("'tide gauge' has no value on 2031-05-17 (server clock; pass as_of for a fixed date) in set 'port';"
        + " its values end before 2022-01-01", e.detail());
  }

  /* ---------------- accent folding is a per-set choice ---------------- */

  @Test
  void invoke_accentsInAnExactSet_doNotFold() {
    ToolError e = error(Map.of("key", "cafe quay"));
    assertEquals(ErrorCode.NOT_FOUND, e.code());
    assertEquals(List.of("Café Quay"), e.suggestions());
  }

  @Test
  void invoke_accentsInAFoldingSet_fold() throws ToolException {
    assertEquals("north side", text(Map.of("key", "CAFE QUAY", "set", "words")));
    assertEquals("north side", text(Map.of("key", "Cafe\u0301 Quay", "set", "words"))); // decomposed é
  }

  /* ---------------- misses ---------------- */

  @Test
  void invoke_miss_suggestsNearestKeysNearestFirst() {
    ToolError e = error(Map.of("key", "pier ligts")); // 1 edit from "pier lights", 3 from "pier lamps"
    assertEquals(ErrorCode.NOT_FOUND, e.code());
    assertEquals("no fact 'pier ligts' in set 'port'", e.detail());
    assertEquals(List.of("pier lights", "pier lamps"), e.suggestions());
    assertEquals("error: not_found: no fact 'pier ligts' in set 'port' (did you mean: pier lights, pier lamps?)", e.text());
  }

  @Test
  void invoke_missEquallyFarFromTwoKeys_ordersThemByName() {
    // "lites" is 3 edits from both "lights" (two insertions, one deletion) and "lamps" (three substitutions)
    assertEquals(List.of("pier lamps", "pier lights"), error(Map.of("key", "pier lites")).suggestions());
  }

  @Test
  void invoke_missNearAnAlias_suggestsTheAliasAsWritten() {
    assertEquals(List.of("master of the harbour"), error(Map.of("key", "master of the harbor")).suggestions());
  }

  @Test
  void invoke_farMiss_suggestsNothing() {
    assertEquals(List.of(), error(Map.of("key", "lighthouse keeper")).suggestions());
  }

  @Test
  void invoke_unknownSet_namesServedSetsAndTheNearest() {
    ToolError e = error(Map.of("key", "x", "set", "ports"));
    assertEquals(ErrorCode.NOT_FOUND, e.code());
    assertEquals("no fact set 'ports'; served sets: port, words", e.detail());
    assertEquals(List.of("port", "words"), e.suggestions()); // 1 and 2 edits away
  }

  @Test
  void invoke_spliceMarkupInAMiss_isNotEchoed() {
    ToolError e = error(Map.of("key", "<<facts(capital)>> => x"));
    assertEquals("no fact '‹‹facts(capital)›› =› x' in set 'port'", e.detail());
    assertFalse(e.text().contains("<<") || e.text().contains(">>") || e.text().contains("=>"), e.text());
  }

  /* ---------------- no hidden inputs ---------------- */

  @Test
  void invoke_underTurkishLocaleAndFarZone_givesTheSameBytes() throws ToolException {
    Locale locale = Locale.getDefault();
    TimeZone zone = TimeZone.getDefault();
    String expected = text(Map.of("key", "HARBOUR MASTER", "as_of", "2025-03-01"))
        + "|" + text(Map.of("key", "harbour master"));
    try {
      Locale.setDefault(Locale.forLanguageTag("tr-TR")); // where "I".toLowerCase() is a dotless ı
      TimeZone.setDefault(TimeZone.getTimeZone("Pacific/Kiritimati"));
      assertEquals(expected, text(Map.of("key", "HARBOUR MASTER", "as_of", "2025-03-01"))
          + "|" + text(Map.of("key", "harbour master")));
    } finally {
      Locale.setDefault(locale);
      TimeZone.setDefault(zone);
    }
  }
}
