package reckoner;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.spec.Json;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.tool.ToolRegistry;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Version 1 of every tool answers exactly as when it was published: every call of {@code
 * golden/v1.jsonl} (recorded by {@link GoldenRecorder} on the publishing build) gives the same text,
 * outcome and data version, byte for byte. A failure here means a change altered a published
 * answer: put the change in a new version instead.
 */
final class GoldenV1Test {
  @Test
  void everyRecordedCall_answersAsRecorded() throws Exception {
    JsonMapper json = Json.newMapper();
    Invoker invoker = new Invoker(ToolCatalog.of(ToolRegistry.of(Tools.demo()), new SpecLoader(json)), CorpusRunner.CLOCK);
    List<String> differences = new ArrayList<>();
    int calls = 0;
    try (InputStream in = GoldenV1Test.class.getResourceAsStream("/golden/v1.jsonl");
        BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
      for (String line; (line = r.readLine()) != null; ) {
        JsonNode call = json.readTree(line);
        calls++;
        JsonNode header = call.get("as_of_header");
        Outcome o = invoker.invoke(new CallRequest(call.get("tool").asString(), OptionalInt.of(call.get("version").asInt()),
            call.get("args"), header == null ? null : header.asString(), null, null));
        String outcome = o.error().map(e -> e.code().wireName()).orElse("ok");
        String dataVersion = o.answer().flatMap(a -> a.dataVersion()).orElse(null);
        JsonNode recordedVersion = call.get("data_version");
        if (!o.text().equals(call.get("text").asString()) || !outcome.equals(call.get("outcome").asString())
            || !java.util.Objects.equals(dataVersion, recordedVersion == null ? null : recordedVersion.asString())) {
          differences.add(call.get("tool").asString() + " " + call.get("args") + ": recorded " + call.get("outcome") + " "
              + call.get("text") + ", now " + outcome + " \"" + o.text() + "\"");
        }
      }
    }
    assertTrue(calls >= 5000, "the golden file holds " + calls + " calls");
    assertEquals(List.of(), differences.subList(0, Math.min(20, differences.size())),
        differences.size() + " of " + calls + " version 1 answers changed");
  }
}
