package reckoner.facts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.stream.Stream;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestFactory;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.spec.ToolCatalog;

/**
 * Every worked example of {@code tool-specs/facts/1.json}, run through the real Invoker over the
 * demo data with the same fixed clock as the suite-wide spec examples test. (facts@1 needs a
 * store, so it is not in {@code Tools.standard()}, and that test does not see it.)
 */
final class FactsSpecExamplesTest {
  private static final Invoker INVOKER = TestFacts.invoker(TestFacts.demo());
  private static final ToolCatalog.Entry ENTRY = INVOKER.catalog().find(FactsTool.ID).orElseThrow();

  @TestFactory
  Stream<DynamicTest> everyWorkedExample_givesItsStatedAnswer() {
    return ENTRY.spec().examples().stream().map(example -> DynamicTest.dynamicTest(example.title(), () -> {
      Outcome outcome = INVOKER.invoke(CallRequest.of("facts", 1, example.args()));
      if (example.expectsError()) {
        assertTrue(outcome.error().isPresent(), () -> "expected " + example.error() + " but got " + outcome.text());
        assertEquals(example.error(), outcome.error().get().code().wireName(), outcome::text);
      } else {
        assertEquals(example.text(), outcome.text(), () -> "args " + example.args());
        assertTrue(outcome.answer().get().dataVersion().isPresent(), "every answer names its data version");
      }
    }));
  }

  @Test
  void spec_hasAtLeastTenExamples() {
    assertTrue(ENTRY.spec().examples().size() >= 10);
  }

  @Test
  void spec_declaresAsOf_soTheHeaderFillsIt() {
    assertTrue(ENTRY.spec().declaresArgument("as_of"));
  }
}
