package reckoner.call;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Clock;
import java.util.List;
import java.util.OptionalInt;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import reckoner.spec.Json;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.ErrorCode;
import reckoner.tool.Tool;
import reckoner.tool.ToolException;
import reckoner.tool.ToolId;
import reckoner.tool.ToolRegistry;
import tools.jackson.databind.json.JsonMapper;

/** Each call's deadline and the bound on argument length (settings call-deadline-ms and max-argument-chars). */
final class InvokerDeadlineTest {
  private static final JsonMapper JSON = Json.newMapper();

  /** A tool that takes as long as it is asked: sleeping, or busy and checking its deadline. */
  static final class Sleeper implements Tool {
    final AtomicInteger runs = new AtomicInteger();

    @Override
    public ToolId id() {
      return ToolId.of("sleeper", 1);
    }

    @Override
    public Arguments canonicalize(Arguments args) {
      return args.without("text");
    }

    @Override
    public Answer invoke(Arguments canonical, CallContext context) throws ToolException {
      runs.incrementAndGet();
      long ms = ((java.math.BigDecimal) canonical.asMap().get("ms")).longValue();
      boolean cooperative = Boolean.TRUE.equals(canonical.asMap().get("cooperative"));
      long end = System.nanoTime() + TimeUnit.MILLISECONDS.toNanos(ms);
      while (System.nanoTime() < end) {
        if (cooperative) {
          context.checkDeadline();
        } else {
          try {
            Thread.sleep(1);
          } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
          }
        }
      }
      return Answer.of("slept");
    }
  }

  private final Sleeper sleeper = new Sleeper();
  private final Invoker invoker = new Invoker(ToolCatalog.of(ToolRegistry.of(List.of(sleeper)), new SpecLoader(JSON)),
      Clock.systemUTC(), new InvocationIds(Clock.systemUTC()), AnswerCache.ofMaximumSize(100), InvocationSink.none(),
      new Invoker.Limits(50, TimeUnit.MILLISECONDS.toNanos(50)));

  private Outcome call(String args) {
    return invoker.invoke(new CallRequest("sleeper", OptionalInt.of(1), JSON.readTree(args), null, null, null));
  }

  @Test
  void callPastItsDeadline_answersLimitExceeded_andIsNeverCached() {
    Outcome late = call("{\"ms\":200}");
    assertEquals(ErrorCode.LIMIT_EXCEEDED, late.error().orElseThrow().code());
    assertTrue(late.text().startsWith("error: limit_exceeded: the call ran past its deadline of 50 ms"), late.text());
    Outcome again = call("{\"ms\":200}");
    assertFalse(again.cached(), "a deadline depends on the load, not on the arguments");
    assertEquals(2, sleeper.runs.get());
  }

  @Test
  @Timeout(value = 10, unit = TimeUnit.SECONDS)
  void toolThatChecksItsDeadline_stopsThere_andItsThreadIsFreeAgain() {
    Outcome stopped = call("{\"ms\":60000,\"cooperative\":true}"); // would take a minute
    assertEquals(ErrorCode.LIMIT_EXCEEDED, stopped.error().orElseThrow().code());
    assertTrue(stopped.elapsedNanos() < TimeUnit.SECONDS.toNanos(10));
  }

  @Test
  void callWithinItsDeadline_isAnswered_andCached() {
    assertEquals("slept", call("{\"ms\":1}").text());
    assertTrue(call("{\"ms\":1}").cached());
  }

  @Test
  void argumentLongerThanTheBound_isLimitExceeded_beforeTheToolRuns() {
    Outcome o = call("{\"ms\":0,\"text\":\"" + "x".repeat(51) + "\"}");
    assertEquals("error: limit_exceeded: argument 'text' has 51 characters; the server takes at most 50 (setting max-argument-chars)",
        o.text());
    assertEquals(0, sleeper.runs.get());
  }
}
