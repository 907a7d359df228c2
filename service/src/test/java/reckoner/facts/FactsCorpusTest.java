package reckoner.facts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import org.junit.jupiter.api.Test;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import tools.jackson.databind.JsonNode;

/**
 * The determinism corpus {@code corpus/facts.jsonl}: representative facts@1 calls over the demo
 * data. Each must answer from the data alone (never the clock), name its data version, and give
 * the same bytes when asked again.
 */
final class FactsCorpusTest {
  private static List<JsonNode> corpus() throws IOException {
    try (InputStream in = FactsCorpusTest.class.getClassLoader().getResourceAsStream("corpus/facts.jsonl")) {
      return new String(in.readAllBytes(), StandardCharsets.UTF_8).lines()
          .filter(l -> !l.isBlank()).map(TestFacts.JSON::readTree).toList();
    }
  }

  @Test
  void corpus_holdsAtLeastThirtyFactsCalls() throws IOException {
    List<JsonNode> calls = corpus();
    assertTrue(calls.size() >= 30, "calls: " + calls.size());
    calls.forEach(c -> {
      assertEquals("facts", c.get("tool").asString());
      assertEquals(1, c.get("version").asInt());
    });
  }

  @Test
  void corpus_everyCallAnswersFromTheDataAloneAndRepeatsItself() throws IOException {
    Invoker first = TestFacts.invoker(TestFacts.demo());
    Invoker second = TestFacts.invoker(TestFacts.demo()); // a fresh load gives the same bytes
    for (JsonNode call : corpus()) {
      Outcome a = first.invoke(CallRequest.of("facts", 1, call.get("args")));
      Outcome b = second.invoke(CallRequest.of("facts", 1, call.get("args")));
      assertTrue(a.isOk(), () -> call + " -> " + a.text());
      assertTrue(a.answer().get().cacheable(), () -> call + " read the clock");
      assertEquals(a.text(), b.text(), call::toString);
      assertEquals(a.answer().get().dataVersion(), b.answer().get().dataVersion());
      assertTrue(a.answer().get().dataVersion().isPresent());
    }
  }
}
