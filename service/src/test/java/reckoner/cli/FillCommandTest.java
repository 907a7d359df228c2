package reckoner.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reckoner.Tools;
import reckoner.call.AnswerCache;
import reckoner.call.Invoker;
import reckoner.spec.Json;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.splice.Filler;
import reckoner.splice.Markup;
import reckoner.splice.OnError;
import reckoner.tool.ToolRegistry;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

final class FillCommandTest {
  private static final JsonMapper JSON = Json.newMapper();

  @Test
  void run_fillsEveryDocument_inOrder_andSummarises(@TempDir Path dir) throws Exception {
    Path in = dir.resolve("docs.jsonl");
    StringBuilder sb = new StringBuilder();
    for (int i = 0; i < 3000; i++) {
      sb.append(i == 17 ? "not json\n" : "{\"id\":" + i + ",\"document\":\"n=" + i + ": <:arith(" + (i % 10) + "/4):> and <:arith(1/0):>\"}\n");
    }
    Files.writeString(in, sb.toString());
    Path out = dir.resolve("filled.jsonl");
    Invoker invoker = new Invoker(ToolCatalog.of(ToolRegistry.of(Tools.demo()), new SpecLoader(JSON)), Clock.systemUTC(),
        AnswerCache.ofMaximumSize(1000));
    ExecutorService pool = Executors.newFixedThreadPool(2);
    ByteArrayOutputStream progress = new ByteArrayOutputStream();
    FillCommand.Summary s;
    try {
      s = new FillCommand(new Filler(invoker), JSON, pool).run(in, out, new FillCommand.Options(Markup.DEFAULT, OnError.SPLICE_ERROR, "test-run", null),
          new PrintStream(progress, true, StandardCharsets.UTF_8), true);
    } finally {
      pool.shutdown();
    }
    List<String> lines = Files.readAllLines(out);
    assertEquals(3000, lines.size());
    for (int i = 0; i < 3000; i++) {
      JsonNode n = JSON.readTree(lines.get(i));
      if (i == 17) {
        assertTrue(n.has("error"));
        continue;
      }
      assertEquals(i, n.get("id").asInt());
      String expected = new java.math.BigDecimal(i % 10).divide(new java.math.BigDecimal(4)).setScale(2, java.math.RoundingMode.HALF_EVEN)
          .stripTrailingZeros().toPlainString();
      assertEquals("n=" + i + ": <:arith(" + (i % 10) + "/4) :: " + expected + ":> and <:arith(1/0) :: error: domain_error: division by zero:>",
          n.get("document").asString());
    }
    assertEquals(2999, s.documents());
    assertEquals(1, s.badLines());
    assertEquals(5998, s.calls());
    assertEquals(2999, s.ok());
    assertEquals(java.util.Map.of("domain_error", 2999L), s.errorsByCode());
    assertTrue(s.cacheHitRatio() > 0.99, "ten distinct calls and one error repeated: " + s.cacheHitRatio());
    String bar = progress.toString(StandardCharsets.UTF_8);
    assertTrue(bar.contains("100%") && bar.contains("done in"), bar);
    assertTrue(s.describe().contains("domain_error"), s.describe());
  }

  @Test
  void progressLine_showsShareRateAndTimeLeft() {
    long[] now = {0};
    Progress p = new Progress(new PrintStream(new ByteArrayOutputStream()), 1000, false, () -> now[0]);
    p.read(250);
    p.done(10);
    now[0] = 2_000_000_000L; // 2 s in, a quarter read: 6 s left
    assertEquals("[#######.....................]  25%  1 docs  10 calls  5 calls/s  00:06 left", p.line(now[0], false));
  }

  @Test
  void refOf_percentEncodesWhatIsNotPrintableAscii_reversibly() {
    assertEquals("doc-d%C3%B6c-1", FillCommand.refOf(JSON.getNodeFactory().stringNode("döc-1")));
    assertEquals("doc-100%25 sure", FillCommand.refOf(JSON.getNodeFactory().stringNode("100% sure")));
    assertEquals("doc-42", FillCommand.refOf(JSON.getNodeFactory().numberNode(42)));
    assertEquals("doc-a%0Ab", FillCommand.refOf(JSON.getNodeFactory().stringNode("a\nb")));
    String id = "é😀%\t z";
    String ref = FillCommand.refOf(JSON.getNodeFactory().stringNode(id));
    assertEquals(id, java.net.URLDecoder.decode(ref.substring(4).replace("+", "%2B"), StandardCharsets.UTF_8));
  }

  @Test
  void run_asOf_fromTheLineOverTheOption_andIdsThatCannotBeRefs_refused(@TempDir Path dir) throws Exception {
    Path in = dir.resolve("docs.jsonl");
    Files.writeString(in, String.join("\n",
        "{\"id\":\"döc-1\",\"document\":\"<:dates@1(45 days ago):>\"}",
        "{\"id\":2,\"document\":\"<:dates@1(45 days ago):>\",\"as_of\":\"2019-06-14\"}",
        "{\"id\":{\"a\":1},\"document\":\"<:arith(1):>\"}",
        "{\"id\":3,\"document\":\"<:arith(1):>\",\"as_of\":\"yesterday\"}",
        "{\"id\":\"" + "x".repeat(200) + "\",\"document\":\"<:arith(1):>\"}") + "\n");
    Path out = dir.resolve("filled.jsonl");
    Invoker invoker = new Invoker(ToolCatalog.of(ToolRegistry.of(Tools.demo()), new SpecLoader(JSON)), Clock.systemUTC());
    ExecutorService pool = Executors.newFixedThreadPool(2);
    FillCommand.Summary s;
    try {
      s = new FillCommand(new Filler(invoker), JSON, pool).run(in, out,
          new FillCommand.Options(Markup.DEFAULT, OnError.SPLICE_ERROR, null, "2024-03-01"),
          new PrintStream(new ByteArrayOutputStream(), true, StandardCharsets.UTF_8), false);
    } finally {
      pool.shutdown();
    }
    List<String> lines = Files.readAllLines(out);
    assertEquals("<:dates@1(45 days ago) :: 2024-01-16:>", JSON.readTree(lines.get(0)).get("document").asString());
    assertEquals("<:dates@1(45 days ago) :: 2019-04-30:>", JSON.readTree(lines.get(1)).get("document").asString());
    assertTrue(JSON.readTree(lines.get(0)).get("calls").get(0).get("invocation_id").asString().matches("[0-9a-f-]{36}"));
    assertEquals("line 3: the id must be a string or a whole number, so that the calls' refs can name it",
        JSON.readTree(lines.get(2)).get("error").asString());
    assertTrue(JSON.readTree(lines.get(3)).get("error").asString().startsWith("line 4: as_of must be an ISO 8601 date"));
    assertTrue(JSON.readTree(lines.get(4)).get("error").asString().startsWith("line 5: the id is too long"));
    assertEquals(2, s.documents());
    assertEquals(3, s.badLines());
  }
}
