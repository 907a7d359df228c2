package reckoner;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.PrintStream;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.List;
import java.util.OptionalInt;
import java.util.stream.Stream;
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
 * Replays every call of {@code corpus/*.jsonl} (test resources) and prints one line per call:
 * the file, the line number and the answer text. Run in-process and in forked JVMs with other
 * default locales and time zones; the bytes must match.
 */
public final class CorpusRunner {
  /** A fixed clock, so calls that read it give the same answer in every fork. */
  static final Clock CLOCK = Clock.fixed(Instant.parse("2030-06-15T12:00:00Z"), ZoneOffset.UTC);

  public static void main(String[] args) throws Exception {
    PrintStream out = new PrintStream(System.out, false, StandardCharsets.UTF_8);
    run(out);
    out.flush();
  }

  static void run(PrintStream out) throws IOException, URISyntaxException {
    JsonMapper json = Json.newMapper();
    Invoker invoker = new Invoker(ToolCatalog.of(ToolRegistry.of(Tools.demo()), new SpecLoader(json)), CLOCK);
    Path dir = Path.of(CorpusRunner.class.getClassLoader().getResource("corpus").toURI());
    List<Path> files;
    try (Stream<Path> s = Files.list(dir)) {
      files = s.filter(p -> p.toString().endsWith(".jsonl")).sorted().toList();
    }
    for (Path file : files) {
      try (BufferedReader r = new BufferedReader(new InputStreamReader(Files.newInputStream(file), StandardCharsets.UTF_8))) {
        String line;
        int n = 0;
        while ((line = r.readLine()) != null) {
          n++;
          if (line.isBlank()) {
            continue;
          }
          JsonNode call = json.readTree(line);
          CallRequest request = new CallRequest(call.get("tool").asString(), OptionalInt.of(call.get("version").asInt()),
              call.get("args"), call.has("as_of_header") ? call.get("as_of_header").asString() : null, null, null);
          Outcome o = invoker.invoke(request);
          out.print(file.getFileName() + ":" + n + "\t" + o.text() + "\n");
        }
      }
    }
  }
}
