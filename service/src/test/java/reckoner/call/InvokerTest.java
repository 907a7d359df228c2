package reckoner.call;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Clock;
import java.util.OptionalInt;
import java.util.UUID;
import org.junit.jupiter.api.Test;
import reckoner.Tools;
import reckoner.spec.Json;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolRegistry;
import tools.jackson.databind.json.JsonMapper;

final class InvokerTest {
  private static final JsonMapper JSON = Json.newMapper();
  private final Invoker invoker = new Invoker(ToolCatalog.of(ToolRegistry.of(Tools.demo()), new SpecLoader(JSON)), Clock.systemUTC());

  private Outcome call(String tool, OptionalInt version, String args) {
    return invoker.invoke(new CallRequest(tool, version, JSON.readTree(args), null, null, null));
  }

  @Test
  void invoke_textAndStructuredForms_shareOneCanonicalForm() {
    Outcome a = call("arith", OptionalInt.of(1), "{\"text\":\"1250/4000\"}");
    Outcome b = call("arith", OptionalInt.of(1), "{\"expr\":\"1250/4000\",\"places\":2.0}");
    assertEquals("0.31", a.text());
    assertEquals(a.canonical(), b.canonical());
    assertEquals(a.text(), b.text());
  }

  @Test
  void invoke_withoutVersion_usesTheNewest() {
    Outcome o = call("arith", OptionalInt.empty(), "{\"expr\":\"2+2\"}");
    assertEquals("4", o.text());
    assertEquals("arith@2", o.tool().get().toString());
  }

  @Test
  void invoke_unknownToolOrVersion_isUnknownToolWithSuggestions() {
    Outcome o = call("arith", OptionalInt.of(9), "{\"expr\":\"1\"}");
    assertEquals(ErrorCode.UNKNOWN_TOOL, o.error().get().code());
    assertEquals("error: unknown_tool: no version 9 of tool 'arith'; served versions: [1, 2] (did you mean: arith@1, arith@2?)", o.text());
    assertEquals(ErrorCode.UNKNOWN_TOOL, call("nope", OptionalInt.of(1), "{}").error().get().code());
    assertEquals(ErrorCode.UNKNOWN_TOOL, call("../etc", OptionalInt.of(1), "{}").error().get().code());
  }

  @Test
  void invoke_schemaViolation_isInvalidArgument_beforeTheToolRuns() {
    Outcome o = call("arith", OptionalInt.of(1), "{\"expr\":\"1/0\",\"colour\":\"red\"}");
    assertEquals("error: invalid_argument: unknown argument 'colour'", o.text());
    assertTrue(o.canonical().isEmpty());
  }

  @Test
  void invocationIds_areVersion7_andIncreaseInCallOrder() {
    InvocationIds ids = new InvocationIds(Clock.systemUTC());
    UUID previous = ids.next();
    for (int i = 0; i < 10_000; i++) {
      UUID next = ids.next();
      assertEquals(7, next.version());
      assertEquals(2, next.variant());
      assertTrue(next.toString().compareTo(previous.toString()) > 0, previous + " < " + next);
      previous = next;
    }
  }

  @Test
  void invocationIds_fromManyThreads_areUnique() throws Exception {
    InvocationIds ids = new InvocationIds(Clock.systemUTC());
    java.util.Set<UUID> seen = java.util.concurrent.ConcurrentHashMap.newKeySet();
    Thread[] threads = new Thread[4];
    for (int t = 0; t < threads.length; t++) {
      threads[t] = new Thread(() -> {
        for (int i = 0; i < 50_000; i++) {
          seen.add(ids.next());
        }
      });
      threads[t].start();
    }
    for (Thread t : threads) {
      t.join();
    }
    assertEquals(200_000, seen.size());
  }
}
