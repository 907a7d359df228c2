package reckoner.dates;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.TimeZone;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.tool.ResultText;
import reckoner.tool.ToolRegistry;
import tools.jackson.databind.JsonNode;

/**
 * The same arguments give the same bytes whatever the JVM's default locale and time zone: the
 * corpus {@code corpus/dates.jsonl} (every op of dates@1 and dates@2, text and structured, several wording locales) runs
 * under the defaults of this JVM and again under tr-TR (whose dotless i breaks careless
 * lower-casing), ar-EG, de-DE and hi-IN with the zone Pacific/Kiritimati (UTC+14).
 */
final class DatesDeterminismTest {
  private static final String CORPUS = "corpus/dates.jsonl";
  private static final List<Locale> LOCALES = List.of(
      new Locale("tr", "TR"), new Locale("ar", "EG"), new Locale("de", "DE"), new Locale("hi", "IN"));

  @Test
  void corpus_underOtherDefaultLocalesAndZone_givesTheSameBytes() throws IOException {
    List<JsonNode> calls = corpus();
    List<String> expected = run(calls);
    Locale locale = Locale.getDefault();
    TimeZone zone = TimeZone.getDefault();
    try {
      TimeZone.setDefault(TimeZone.getTimeZone("Pacific/Kiritimati"));
      for (Locale other : LOCALES) {
        Locale.setDefault(other);
        List<String> actual = run(calls);
        for (int i = 0; i < calls.size(); i++) {
          assertEquals(expected.get(i), actual.get(i), "under " + other.toLanguageTag() + " and Pacific/Kiritimati: " + calls.get(i));
        }
      }
    } finally {
      Locale.setDefault(locale);
      TimeZone.setDefault(zone);
    }
  }

  @Test
  void corpus_hasFortyCallsOrMore_coveringEveryOp_allAnsweredOnOneLine() throws IOException {
    List<JsonNode> calls = corpus().stream().filter(c -> c.get("version").asInt() == 1).collect(Collectors.toList());
    assertTrue(calls.size() >= 40, "only " + calls.size());
    Set<String> ops = calls.stream().map(this::op).collect(Collectors.toSet());
    for (Op op : Op.values()) {
      assertTrue(ops.contains(op.wireName()), "no corpus call for " + op.wireName());
    }
    List<String> answers = run(calls);
    for (int i = 0; i < calls.size(); i++) {
      assertTrue(!answers.get(i).startsWith("error:") && ResultText.isOneLine(answers.get(i)), calls.get(i) + " -> " + answers.get(i));
    }
  }

  /** Runs every call through a catalog built now, under whatever defaults are in force. */
  private static List<String> run(List<JsonNode> calls) {
    Invoker invoker = new Invoker(
        ToolCatalog.of(ToolRegistry.of(List.of(new DatesTool(), new DatesToolV2())), new SpecLoader(DatesCalls.JSON)), DatesCalls.CLOCK);
    List<String> answers = new ArrayList<>();
    for (JsonNode call : calls) {
      Outcome outcome = invoker.invoke(CallRequest.of(call.get("tool").asString(), call.get("version").asInt(), call.get("args")));
      answers.add(outcome.text());
    }
    return answers;
  }

  private String op(JsonNode call) {
    JsonNode args = call.get("args");
    if (args.has("op")) {
      return args.get("op").asString();
    }
    try {
      return TextForm.parse(args.get("text").asString()).get(CanonicalForm.OP);
    } catch (reckoner.tool.ToolException e) {
      throw new AssertionError(e);
    }
  }

  private static List<JsonNode> corpus() throws IOException {
    List<JsonNode> calls = new ArrayList<>();
    try (InputStream in = DatesDeterminismTest.class.getClassLoader().getResourceAsStream(CORPUS)) {
      assertTrue(in != null, "missing test resource " + CORPUS);
      BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
      for (String line = reader.readLine(); line != null; line = reader.readLine()) {
        if (!line.isBlank()) {
          calls.add(DatesCalls.json(line));
        }
      }
    }
    return calls;
  }
}
