package reckoner.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.OptionalInt;
import java.util.stream.Stream;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestFactory;
import reckoner.Tools;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.spec.Json;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.tool.ToolRegistry;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;

/**
 * The phrasing corpus ({@code phrasings/units.jsonl}): units as models and people write them,
 * each with its expected answer computed from the published definition its {@code reference}
 * names ({@code phrasings/units_references.py} wrote the file), or with the refusal a truly
 * ambiguous phrase must get and the readings it must list. Run unpinned, so against the newest
 * units version; at least 95 % must be answered, every answer exactly as expected. The structured
 * form of each answered phrase (its canonical arguments, sent as JSON) must give the same
 * canonical arguments and the same answer. The share units@1 answered is printed for comparison.
 */
final class UnitsPhrasingsTest {
  private static final JsonMapper JSON = Json.newMapper();
  private static final Invoker INVOKER = new Invoker(ToolCatalog.of(ToolRegistry.of(Tools.demo()),
      new SpecLoader(JSON)), Clock.fixed(Instant.parse("2031-05-17T09:30:00Z"), ZoneOffset.UTC));
  private static final List<JsonNode> CASES = load();

  private static List<JsonNode> load() {
    List<JsonNode> out = new ArrayList<>();
    try (InputStream in = UnitsPhrasingsTest.class.getResourceAsStream("/phrasings/units.jsonl");
        BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
      for (String line; (line = r.readLine()) != null; ) {
        if (!line.isBlank()) {
          out.add(JSON.readTree(line));
        }
      }
    } catch (IOException e) {
      throw new java.io.UncheckedIOException(e);
    }
    return out;
  }

  private static ObjectNode args(JsonNode c) {
    ObjectNode args = JSON.createObjectNode();
    args.put("text", c.get("text").asString());
    if (c.has("args")) {
      c.get("args").properties().forEach(e -> args.set(e.getKey(), e.getValue()));
    }
    return args;
  }

  private static Outcome newest(JsonNode args) {
    return INVOKER.invoke(new CallRequest("units", OptionalInt.empty(), args, null, null, null));
  }

  @TestFactory
  Stream<DynamicTest> everyPhrase_isAnsweredOrRefusedAsItsReferenceSays() {
    return CASES.stream().map(c -> DynamicTest.dynamicTest(c.get("text").asString()
        + (c.has("args") ? " " + c.get("args") : ""), () -> {
          Outcome o = newest(args(c));
          assertEquals(UnitsToolV2.ID, o.tool().orElseThrow(), "an unpinned call gets units@2");
          if (c.has("expect")) {
            assertEquals(c.get("expect").asString(), o.text(), () -> "reference: " + c.get("reference").asString());
          } else {
            assertTrue(o.error().isPresent(), () -> "expected a refusal but got " + o.text());
            assertEquals(c.get("refuse").asString(), o.error().get().code().wireName(), o::text);
            if (c.has("readings")) {
              List<String> readings = new ArrayList<>();
              c.get("readings").forEach(n -> readings.add(n.asString()));
              assertEquals(readings, o.error().get().suggestions(), o::text);
            }
            assertTrue(o.error().get().detail().contains("try '"), () -> "names no nearest phrase: " + o.text());
          }
        }));
  }

  @TestFactory
  Stream<DynamicTest> everyAnsweredPhrase_givesTheSameAnswerInItsStructuredForm() {
    return CASES.stream().filter(c -> c.has("expect")).map(c -> DynamicTest.dynamicTest(c.get("text").asString(), () -> {
      Outcome text = newest(args(c));
      ObjectNode structured = JSON.createObjectNode();
      for (Map.Entry<String, Object> e : text.canonical().orElseThrow().asMap().entrySet()) {
        Object v = e.getValue();
        if (v instanceof String s) {
          structured.put(e.getKey(), s);
        } else if (v instanceof Boolean b) {
          structured.put(e.getKey(), b);
        } else {
          structured.put(e.getKey(), (java.math.BigDecimal) v);
        }
      }
      Outcome o = newest(structured);
      assertEquals(text.canonical(), o.canonical(), "the same canonical arguments, so the same cache entry");
      assertEquals(text.text(), o.text());
      assertEquals(text.answer().get().note(), o.answer().get().note(), "the same reading");
    }));
  }

  @Test
  void corpus_isLarge_andAtLeast95PercentAnswered() {
    int answered = 0;
    int byVersion1 = 0;
    int sameAsVersion1 = 0;
    for (JsonNode c : CASES) {
      Outcome o = newest(args(c));
      if (o.isOk()) {
        answered++;
      }
      if (!c.has("args")) {
        Outcome v1 = INVOKER.invoke(CallRequest.of("units", 1, args(c)));
        if (v1.isOk()) {
          byVersion1++;
          if (c.has("expect") && v1.text().equals(c.get("expect").asString())) {
            sameAsVersion1++;
          }
        }
      }
    }
    int total = CASES.size();
    System.out.printf(java.util.Locale.ROOT, "units phrasings: %d cases; units@2 answers %d (%.1f %%); units@1 answered"
        + " %d (%.1f %%), %d of them with the same text%n", total, answered, 100.0 * answered / total, byVersion1,
        100.0 * byVersion1 / total, sameAsVersion1);
    assertTrue(total >= 150, "the corpus holds " + total + " phrasings");
    assertTrue(answered * 100 >= total * 95, answered + " of " + total + " answered");
  }
}
