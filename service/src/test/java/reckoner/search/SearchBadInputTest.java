package reckoner.search;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Clock;
import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.MethodSource;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.spec.Json;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.tool.ToolRegistry;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;

/** Hostile and malformed queries get a stable 4xx code or not_found, never internal_error. */
final class SearchBadInputTest {
  private static final JsonMapper JSON = Json.newMapper();
  private static final Invoker INVOKER = new Invoker(
      ToolCatalog.of(ToolRegistry.of(List.of(new SearchTool(SearchStore.openDemo()))), new SpecLoader(JSON)), Clock.systemUTC());

  private static Outcome call(String query) {
    ObjectNode args = JSON.createObjectNode().put("query", query);
    return INVOKER.invoke(CallRequest.of("search", 1, args));
  }

  @ParameterizedTest(name = "{0}")
  @CsvSource(delimiter = '|', value = {
      "field syntax|title:bridge AND text:harbour",
      "boolean operators|bridge AND NOT harbour OR (gannet && seal) || !tide",
      "wildcards|brid* ?ridge *",
      "regular expression|/br[iu]dge.*/",
      "fuzzy and boost|bridge~2 harbour^10",
      "ranges|[a TO z] {1 TO 9}",
      "phrase and proximity|\"harbour bridge\"~5",
      "escapes|\\\\bridge\\\\:harbour\\\\*",
      "a query parser's nightmare|((((((((((bridge))))))))))"})
  void luceneSyntax_isReadAsPlainWords(String title, String query) {
    Outcome o = call(query);
    assertTrue(o.error().isEmpty() || o.error().get().code().wireName().equals("not_found"), o.text());
  }

  @ParameterizedTest(name = "{0}")
  @CsvSource(delimiter = '|', value = {
      "only stop words|the of and a an|not_found",
      "only punctuation|?!.,;:-()[]{}|not_found",
      "only symbols|★ ☂ ♞|not_found",
      "nothing matches|xylophone zeppelin quasar|not_found",
      "white space only|'   '|invalid_argument"})
  void queriesWithoutAnAnswer_areNotFoundOrInvalid(String title, String query, String code) {
    assertEquals(code, call(query).error().orElseThrow().code().wireName());
  }

  static List<Object[]> hostile() {
    return List.of(
        new Object[] {"a bell character", "bri\u0007dge", "invalid_argument"},
        new Object[] {"a NUL", "bridge\u0000", "invalid_argument"},
        new Object[] {"an escape sequence", "\u001b[31mbridge", "invalid_argument"},
        new Object[] {"a C1 control", "bridge\u0090", "invalid_argument"},
        new Object[] {"an unpaired surrogate", "bridge\ud800", "invalid_argument"},
        new Object[] {"501 characters", "t".repeat(501), "limit_exceeded"},
        new Object[] {"600 characters of words", "tide ".repeat(120), "limit_exceeded"},
        new Object[] {"33 distinct words", String.join(" ", words(33)), "limit_exceeded"},
        new Object[] {"beyond the schema's length", "tide ".repeat(1000), "invalid_argument"},
        new Object[] {"a huge token", "x".repeat(499), "not_found"});
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("hostile")
  void hostileQueries_getStableCodes(String title, String query, String code) {
    Outcome o = call(query);
    assertEquals(code, o.error().orElseThrow().code().wireName(), o.text());
    assertTrue(o.text().length() <= 400 && !o.text().contains("\n"), o.text());
  }

  @ParameterizedTest(name = "{0}")
  @CsvSource(delimiter = '|', value = {
      "both forms|{\"query\":\"bridge\",\"text\":\"bridge\"}|invalid_argument",
      "neither form|{\"collection\":\"demo\"}|invalid_argument",
      "an unknown argument|{\"query\":\"bridge\",\"limit\":5}|invalid_argument",
      "a number query|{\"query\":5}|invalid_argument",
      "a bad collection name|{\"query\":\"bridge\",\"collection\":\"Demo!\"}|invalid_argument",
      "an unknown collection|{\"query\":\"bridge\",\"collection\":\"dmeo\"}|not_found",
      "an impossible date|{\"query\":\"bridge\",\"as_of\":\"2030-02-30\"}|invalid_argument",
      "a week date|{\"query\":\"bridge\",\"as_of\":\"2030-W11-4\"}|invalid_argument",
      "the last date java.time knows|{\"query\":\"bridge\",\"as_of\":\"+999999999-12-31\"}|ok",
      "the first date java.time knows|{\"query\":\"bridge\",\"as_of\":\"-999999999-01-01\"}|ok"})
  void malformedCalls_getStableCodes(String title, String args, String code) {
    Outcome o = INVOKER.invoke(CallRequest.of("search", 1, JSON.readTree(args)));
    assertEquals(code, o.error().map(e -> e.code().wireName()).orElse("ok"), o.text());
  }

  private static List<String> words(int n) {
    List<String> words = new java.util.ArrayList<>();
    for (int i = 0; i < n; i++) {
      words.add("word" + (char) ('a' + i % 26) + (char) ('a' + i / 26));
    }
    return words;
  }
}
