package reckoner.arith;

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
import java.util.Locale;
import java.util.OptionalInt;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
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
 * The phrasing corpus ({@code phrasings/arith.jsonl}): arithmetic requests as models and people
 * write them, each answer computed outside Reckoner by {@code make_arith_references.py} (Python
 * 3.11 fractions, decimal and math; the reference is named on every line). Every case runs against
 * the newest arith version, unpinned as a caller would send it, in the text form and in the
 * structured form ({@code expr}); both must give the expected answer or refusal, and the same
 * canonical arguments. Version 1 answers the same texts for comparison.
 */
final class ArithPhrasingsTest {
  private static final JsonMapper JSON = Json.newMapper();
  private static final Clock CLOCK = Clock.fixed(Instant.parse("2031-05-17T09:30:00Z"), ZoneOffset.UTC);
  private static final Invoker INVOKER = new Invoker(ToolCatalog.of(ToolRegistry.of(Tools.demo()), new SpecLoader(JSON)), CLOCK);
  private static List<JsonNode> cases;

  @BeforeAll
  static void load() throws IOException {
    cases = new ArrayList<>();
    try (InputStream in = ArithPhrasingsTest.class.getResourceAsStream("/phrasings/arith.jsonl");
        BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
      for (String line; (line = r.readLine()) != null; ) {
        if (!line.isBlank()) {
          cases.add(JSON.readTree(line));
        }
      }
    }
  }

  private static Outcome call(JsonNode c, String form, OptionalInt version) {
    ObjectNode args = c.has("args") ? (ObjectNode) c.get("args").deepCopy() : JSON.createObjectNode();
    args.put(form, c.get("text").asString());
    return INVOKER.invoke(new CallRequest("arith", version, args, null, null, null));
  }

  @Test
  void everyCase_hasAReferenceAndAnExpectation() {
    assertTrue(cases.size() >= 120, "the corpus holds " + cases.size() + " cases");
    for (JsonNode c : cases) {
      assertTrue(c.has("reference") && !c.get("reference").asString().isBlank(), c::toString);
      assertTrue(c.has("expect") ^ c.has("refuse"), c::toString);
    }
  }

  @Test
  void newestVersion_answersEveryCaseAsItsReference_inTextAndStructuredForm() {
    List<String> wrong = new ArrayList<>();
    int answered = 0;
    for (JsonNode c : cases) {
      Outcome text = call(c, "text", OptionalInt.empty());
      Outcome expr = call(c, "expr", OptionalInt.empty());
      String problem = check(c, text);
      if (problem == null) {
        problem = check(c, expr);
      }
      if (problem == null && !text.canonical().equals(expr.canonical())) {
        problem = "the text and expr forms canonicalise differently: " + text.canonical() + " vs " + expr.canonical();
      }
      if (problem != null) {
        wrong.add(c.get("text").asString() + ": " + problem);
      }
      if (text.error().isEmpty()) {
        answered++;
      }
    }
    assertEquals(List.of(), wrong);
    double share = 100.0 * answered / cases.size();
    System.out.printf(Locale.ROOT, "arith phrasings: the newest version answers %d of %d (%.1f %%)%n", answered, cases.size(), share);
    assertTrue(share >= 95.0, "answered " + answered + " of " + cases.size());
  }

  /** Null when the outcome is what the case expects, else what differs. */
  private static String check(JsonNode c, Outcome o) {
    if (c.has("expect")) {
      String expected = c.get("expect").asString();
      return o.error().isEmpty() && o.text().equals(expected) ? null : "expected " + expected + " but got " + o.text();
    }
    String code = c.get("refuse").asString();
    if (o.error().isEmpty() || !o.error().get().code().wireName().equals(code)) {
      return "expected a refusal " + code + " but got " + o.text();
    }
    List<String> suggestions = new ArrayList<>();
    JsonNode listed = c.has("readings") ? c.get("readings") : c.get("suggests");
    if (listed != null) {
      listed.forEach(n -> suggestions.add(n.asString()));
    }
    return o.error().get().suggestions().equals(suggestions) ? null
        : "expected the suggestions " + suggestions + " but got " + o.error().get().suggestions() + " in " + o.text();
  }

  @Test
  void textAndStructuredForms_shareOneCacheEntry() {
    Invoker cached = new Invoker(ToolCatalog.of(ToolRegistry.of(Tools.demo()), new SpecLoader(JSON)), CLOCK,
        reckoner.call.AnswerCache.ofMaximumSize(10_000));
    int hits = 0;
    for (JsonNode c : cases) {
      ObjectNode text = c.has("args") ? (ObjectNode) c.get("args").deepCopy() : JSON.createObjectNode();
      ObjectNode expr = text.deepCopy();
      text.put("text", c.get("text").asString());
      expr.put("expr", c.get("text").asString());
      Outcome first = cached.invoke(new CallRequest("arith", OptionalInt.empty(), text, null, null, null));
      Outcome second = cached.invoke(new CallRequest("arith", OptionalInt.empty(), expr, null, null, null));
      if (first.canonical().isPresent()) {
        assertTrue(second.cached(), () -> c.get("text").asString() + " in the expr form missed the text form's cache entry");
        assertEquals(first.text(), second.text());
        hits++;
      }
    }
    assertTrue(hits >= cases.size() * 9 / 10, "cache hits: " + hits);
  }

  @Test
  void versionOne_answersFewerOfTheSameTexts() {
    int answered = 0;
    int right = 0;
    int newest = 0;
    for (JsonNode c : cases) {
      Outcome v1 = call(c, "text", OptionalInt.of(1));
      if (v1.error().isEmpty()) {
        answered++;
        if (c.has("expect") && v1.text().equals(c.get("expect").asString())) {
          right++;
        }
      }
      if (call(c, "text", OptionalInt.empty()).error().isEmpty()) {
        newest++;
      }
    }
    System.out.printf(Locale.ROOT, "arith phrasings: version 1 answers %d of %d, %d of them as the reference%n",
        answered, cases.size(), right);
    assertTrue(answered < newest, "version 1 answered " + answered + ", the newest " + newest);
  }
}
