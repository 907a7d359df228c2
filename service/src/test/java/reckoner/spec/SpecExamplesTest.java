package reckoner.spec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.stream.Stream;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestFactory;
import reckoner.Tools;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.tool.ToolRegistry;

/** Every worked example in every spec file runs here, so a spec cannot drift from its code. */
final class SpecExamplesTest {
  /** A fixed clock: examples that need "now" must pass as_of, and a fixed clock keeps the rest honest. */
  private static final Clock CLOCK = Clock.fixed(Instant.parse("2031-05-17T09:30:00Z"), ZoneOffset.UTC);
  private static final ToolCatalog CATALOG = ToolCatalog.of(ToolRegistry.of(Tools.demo()), new SpecLoader(Json.newMapper()));
  private static final Invoker INVOKER = new Invoker(CATALOG, CLOCK);

  @TestFactory
  Stream<DynamicTest> everyWorkedExample_givesItsStatedAnswer() {
    return CATALOG.all().stream().flatMap(entry -> entry.spec().examples().stream().map(example ->
        DynamicTest.dynamicTest(entry.tool().id() + ": " + example.title(), () -> {
          Outcome outcome = INVOKER.invoke(CallRequest.of(entry.tool().id().name(), entry.tool().id().version(), example.args()));
          if (example.expectsError()) {
            assertTrue(outcome.error().isPresent(), () -> "expected " + example.error() + " but got " + outcome.text());
            assertEquals(example.error(), outcome.error().get().code().wireName(), outcome::text);
          } else {
            assertEquals(example.text(), outcome.text(), () -> "args " + example.args());
          }
        })));
  }

  @Test
  void everyServedTool_hasAtLeastTenExamples() {
    CATALOG.all().forEach(entry -> assertTrue(entry.spec().examples().size() >= 10, entry.tool().id().toString()));
  }
}
