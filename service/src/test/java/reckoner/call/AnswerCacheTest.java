package reckoner.call;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Clock;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalInt;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import reckoner.Tools;
import reckoner.spec.Json;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.Tool;
import reckoner.tool.ToolId;
import reckoner.tool.ToolRegistry;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

final class AnswerCacheTest {
  private static final JsonMapper JSON = Json.newMapper();
  private static final ToolCatalog CATALOG = ToolCatalog.of(ToolRegistry.of(Tools.demo()), new SpecLoader(JSON));

  /** A corpus of calls with many repeats, across tools and both argument forms. */
  static List<CallRequest> corpus(int size, long seed) {
    SplittableRandom r = new SplittableRandom(seed);
    List<CallRequest> calls = new ArrayList<>(size);
    String[] exprs = {"1/3", "2^10", "sqrt(2)", "1/0", "x", "pi*2", "22/7", "1e3%7", "ln(10)", "-2^2"};
    for (int i = 0; i < size; i++) {
      String expr = exprs[r.nextInt(exprs.length)] + (r.nextInt(4) == 0 ? "+" + r.nextInt(2000) : "");
      String args = r.nextBoolean()
          ? "{\"text\":\"" + expr + "\"}"
          : "{\"expr\":\"" + expr + "\",\"digits\":" + (1 + r.nextInt(12)) + ",\"rounding\":\"half_up\"}";
      calls.add(new CallRequest("arith", OptionalInt.of(1), JSON.readTree(args), null, null, null));
    }
    return calls;
  }

  @Test
  void cachedAnswers_areByteIdenticalToUncached_on50000CallsWithRepeats() {
    Invoker plain = new Invoker(CATALOG, Clock.systemUTC());
    Invoker cached = new Invoker(CATALOG, Clock.systemUTC(), AnswerCache.ofMaximumSize(100_000));
    int hits = 0;
    int keyed = 0;
    java.util.Set<Arguments> distinct = new java.util.HashSet<>();
    for (CallRequest call : corpus(50_000, 7)) {
      Outcome a = plain.invoke(call);
      Outcome b = cached.invoke(call);
      assertFalse(a.cached());
      assertEquals(a.text(), b.text());
      assertEquals(a.isOk(), b.isOk());
      assertEquals(a.canonical(), b.canonical());
      hits += b.cached() ? 1 : 0;
      if (a.canonical().isPresent()) {
        keyed++;
        distinct.add(a.canonical().get());
      }
    }
    // Nothing is evicted at this size, so every repeat of a canonical form is a hit, and only repeats are.
    assertEquals(keyed - distinct.size(), hits);
    assertTrue(hits > 25_000, "the corpus repeats: " + hits);
  }

  @Test
  void answersThatReadTheClock_areNeverCached() {
    Tool clockTool = new Tool() {
      public ToolId id() {
        return ToolId.of("arith", 1); // the arith spec validates {"expr":...}; the answer is the clock
      }

      public Arguments canonicalize(Arguments args) {
        return args;
      }

      public Answer invoke(Arguments canonical, CallContext context) {
        return Answer.fromClock(context.clock().instant().toString(), context.clock().instant());
      }
    };
    ToolCatalog catalog = ToolCatalog.of(ToolRegistry.of(List.of(clockTool)), new SpecLoader(JSON));
    java.util.concurrent.atomic.AtomicLong millis = new java.util.concurrent.atomic.AtomicLong(0);
    Clock ticking = new Clock() {
      public java.time.ZoneId getZone() { return java.time.ZoneOffset.UTC; }
      public Clock withZone(java.time.ZoneId zone) { return this; }
      public java.time.Instant instant() { return java.time.Instant.ofEpochMilli(millis.addAndGet(1000)); }
    };
    Invoker invoker = new Invoker(catalog, ticking, AnswerCache.ofMaximumSize(100));
    JsonNode args = JSON.readTree("{\"expr\":\"now\"}");
    Outcome first = invoker.invoke(CallRequest.of("arith", 1, args));
    Outcome second = invoker.invoke(CallRequest.of("arith", 1, args));
    assertFalse(second.cached());
    assertTrue(!first.text().equals(second.text()), first.text() + " vs " + second.text());
  }

  @Test
  void dataVersion_isPartOfTheKey_soAReloadIsNeverServedStale() {
    String[] version = {"v1"};
    Tool dataTool = new Tool() {
      public ToolId id() {
        return ToolId.of("arith", 1);
      }

      public Arguments canonicalize(Arguments args) {
        return args;
      }

      public Answer invoke(Arguments canonical, CallContext context) {
        return Answer.of("answer from " + version[0]).withDataVersion(version[0]);
      }

      @Override
      public java.util.Optional<String> dataVersion(Arguments canonical) {
        return java.util.Optional.of(version[0]);
      }
    };
    ToolCatalog catalog = ToolCatalog.of(ToolRegistry.of(List.of(dataTool)), new SpecLoader(JSON));
    Invoker invoker = new Invoker(catalog, Clock.systemUTC(), AnswerCache.ofMaximumSize(100));
    JsonNode args = JSON.readTree("{\"expr\":\"k\"}");
    assertEquals("answer from v1", invoker.invoke(CallRequest.of("arith", 1, args)).text());
    assertTrue(invoker.invoke(CallRequest.of("arith", 1, args)).cached());
    version[0] = "v2"; // a reload
    Outcome after = invoker.invoke(CallRequest.of("arith", 1, args));
    assertEquals("answer from v2", after.text());
    assertFalse(after.cached());
  }

  @Test
  void realFactsReload_andDifferentAsOf_neverServeAStaleAnswer(@org.junit.jupiter.api.io.TempDir java.nio.file.Path dir)
      throws Exception {
    java.nio.file.Path file = dir.resolve("ops.jsonl");
    java.nio.file.Files.writeString(file, "{\"set\":\"ops\",\"key\":\"harbour master\",\"value\":\"Ilse Varrow\"}\n");
    reckoner.facts.FactStore store = reckoner.facts.FactStore.open(List.of(reckoner.data.DataSource.directory(dir)), "ops");
    ToolCatalog catalog = ToolCatalog.of(ToolRegistry.of(Tools.standard(store, reckoner.search.SearchStore.openDemo())), new SpecLoader(JSON));
    Invoker invoker = new Invoker(catalog, Clock.systemUTC(), AnswerCache.ofMaximumSize(1000));
    JsonNode key = JSON.readTree("{\"key\":\"Harbour  Master\"}");
    assertEquals("Ilse Varrow", invoker.invoke(CallRequest.of("facts", 1, key)).text());
    assertTrue(invoker.invoke(CallRequest.of("facts", 1, key)).cached());
    java.nio.file.Files.writeString(file, "{\"set\":\"ops\",\"key\":\"harbour master\",\"value\":\"Oren Tamsby\"}\n");
    assertTrue(store.reload().applied());
    Outcome after = invoker.invoke(CallRequest.of("facts", 1, key));
    assertEquals("Oren Tamsby", after.text());
    assertFalse(after.cached());

    // dates: the reference time is part of the canonical arguments, so another as_of is another entry.
    JsonNode march = JSON.readTree("{\"text\":\"45 days ago\",\"as_of\":\"2024-03-01\"}");
    JsonNode april = JSON.readTree("{\"text\":\"45 days ago\",\"as_of\":\"2024-04-01\"}");
    String first = invoker.invoke(CallRequest.of("dates", 1, march)).text();
    assertTrue(invoker.invoke(CallRequest.of("dates", 1, march)).cached());
    Outcome other = invoker.invoke(CallRequest.of("dates", 1, april));
    assertFalse(other.cached());
    assertTrue(!first.equals(other.text()), first + " vs " + other.text());
    // Without as_of the server clock is read: never from the cache.
    JsonNode today = JSON.readTree("{\"text\":\"today\"}");
    invoker.invoke(CallRequest.of("dates", 1, today));
    assertFalse(invoker.invoke(CallRequest.of("dates", 1, today)).cached());
  }
}
