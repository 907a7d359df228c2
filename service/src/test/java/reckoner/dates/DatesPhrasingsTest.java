package reckoner.dates;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalInt;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import reckoner.Tools;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.tool.ToolRegistry;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.node.ObjectNode;

/**
 * The phrasing corpus ({@code phrasings/dates.jsonl}): date questions as models and people write
 * them, each with its answer from an outside reference (named on its line; computed by
 * {@code phrasings/make_dates_references.py} with Python's datetime and dateutil, or taken from a
 * published holiday calendar) or the refusal expected. Run against the newest dates version, as an
 * unpinned call gets it: every answer exact, every refusal with its code (and its readings, for an
 * ambiguous phrase), at least 95 % of all lines answered. The share version 1 answered is printed.
 */
final class DatesPhrasingsTest {
  private static final ToolCatalog CATALOG = ToolCatalog.of(ToolRegistry.of(Tools.demo()), new SpecLoader(DatesCalls.JSON));
  private static final Invoker INVOKER = new Invoker(CATALOG, DatesCalls.CLOCK);
  private static final List<JsonNode> CASES = new ArrayList<>();

  @BeforeAll
  static void readCorpus() throws Exception {
    try (InputStream in = DatesPhrasingsTest.class.getResourceAsStream("/phrasings/dates.jsonl");
        BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
      for (String line; (line = r.readLine()) != null; ) {
        if (!line.isBlank()) {
          CASES.add(DatesCalls.JSON.readTree(line));
        }
      }
    }
  }

  private static Outcome run(JsonNode c, OptionalInt version) {
    ObjectNode args = ((ObjectNode) c.get("args")).deepCopy();
    args.put("text", c.get("text").asString());
    return INVOKER.invoke(new CallRequest("dates", version, args, null, null, null));
  }

  @Test
  void corpus_holdsEnoughCases_eachWithItsReference() {
    assertTrue(CASES.size() >= 150, "the corpus holds " + CASES.size() + " cases");
    for (JsonNode c : CASES) {
      assertTrue(c.has("reference") && !c.get("reference").asString().isBlank(), () -> "no reference: " + c);
      assertTrue(c.has("expect") != c.has("refuse"), () -> "one of expect and refuse: " + c);
    }
  }

  @Test
  void structuredForm_givesTheTextFormsCanonicalArgumentsAndAnswer() {
    List<String> wrong = new ArrayList<>();
    int checked = 0;
    for (JsonNode c : CASES) {
      if (!c.has("structured")) {
        continue;
      }
      checked++;
      ObjectNode structured = ((ObjectNode) c.get("structured")).deepCopy();
      c.get("args").properties().forEach(e -> structured.set(e.getKey(), e.getValue()));
      Outcome fromText = run(c, OptionalInt.empty());
      Outcome fromArgs = INVOKER.invoke(new CallRequest("dates", OptionalInt.empty(), structured, null, null, null));
      if (!fromArgs.isOk() || !fromArgs.text().equals(c.get("expect").asString())
          || !fromArgs.canonical().equals(fromText.canonical())) {
        wrong.add(c.get("text").asString() + ": text form " + fromText.canonical().map(Object::toString).orElse("-") + " -> "
            + fromText.text() + "; structured " + fromArgs.canonical().map(Object::toString).orElse("-") + " -> " + fromArgs.text());
      }
    }
    assertTrue(checked >= 40, "structured forms checked: " + checked);
    assertEquals(List.of(), wrong);
  }

  @Test
  void everyPhrasing_getsItsExpectedAnswerOrRefusal_fromTheNewestVersion() {
    assertEquals(2, CATALOG.newest("dates").orElseThrow().tool().id().version());
    List<String> wrong = new ArrayList<>();
    int answered = 0;
    int answeredByVersion1 = 0;
    for (JsonNode c : CASES) {
      Outcome o = run(c, OptionalInt.empty());
      String text = c.get("text").asString();
      if (c.has("expect")) {
        String expect = c.get("expect").asString();
        if (!o.isOk() || !o.text().equals(expect)) {
          wrong.add(text + " -> " + o.text() + " (expected " + expect + ")");
        } else {
          answered++;
        }
        Outcome v1 = run(c, OptionalInt.of(1));
        if (v1.isOk() && v1.text().equals(expect)) {
          answeredByVersion1++;
        }
      } else {
        String code = c.get("refuse").asString();
        if (o.isOk() || !o.error().get().code().wireName().equals(code)) {
          wrong.add(text + " -> " + o.text() + " (expected the refusal " + code + ")");
        } else if (c.has("readings")) {
          List<String> readings = new ArrayList<>();
          c.get("readings").forEach(r -> readings.add(r.asString()));
          if (!readings.equals(o.error().get().suggestions())) {
            wrong.add(text + " -> readings " + o.error().get().suggestions() + " (expected " + readings + ")");
          }
        } else if (code.equals("syntax_error") && o.error().get().suggestions().isEmpty()) {
          wrong.add(text + " -> " + o.text() + " (a refusal names the nearest phrase that works)");
        }
      }
    }
    System.out.printf("dates phrasings: %d cases; version 2 answered %d (%.1f %%), version 1 answered %d (%.1f %%)%n",
        CASES.size(), answered, 100.0 * answered / CASES.size(), answeredByVersion1, 100.0 * answeredByVersion1 / CASES.size());
    assertEquals(List.of(), wrong, wrong.size() + " of " + CASES.size() + " phrasings");
    assertTrue(answered * 100 >= 95 * CASES.size(), "answered " + answered + " of " + CASES.size());
  }
}
