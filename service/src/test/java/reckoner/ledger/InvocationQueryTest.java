package reckoner.ledger;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static reckoner.ledger.Fixtures.HERON;
import static reckoner.ledger.Fixtures.id;

import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reckoner.ledger.InvocationQuery.Scope;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

final class InvocationQueryTest {
  private static Map<String, List<String>> params(String... nameValue) {
    Map<String, List<String>> m = new LinkedHashMap<>();
    for (int i = 0; i < nameValue.length; i += 2) {
      m.computeIfAbsent(nameValue[i], k -> new java.util.ArrayList<>()).add(nameValue[i + 1]);
    }
    return m;
  }

  @Test
  void fromParameters_everyFilter_isParsed() throws ToolException {
    String after = id(3, 0).toUpperCase(java.util.Locale.ROOT);
    InvocationQuery q = InvocationQuery.fromParameters(Scope.key(HERON), params(
        "run", "orchard-survey-7", "tool", "arith@1", "outcome", "error", "ref_prefix", "plot-12:",
        "since", "2031-05-17T09:00:00Z", "until", "2031-05-17T11:30:00+02:00", "limit", "25", "after", after));
    assertEquals(new InvocationQuery(Scope.key(HERON), "orchard-survey-7", "arith", 1, "error", "plot-12:",
        Instant.parse("2031-05-17T09:00:00Z"), Instant.parse("2031-05-17T09:30:00Z"), id(3, 0), 25), q);
    assertEquals(25, q.pageSize());
    assertEquals(InvocationQuery.of(Scope.all()).withTool("dates").withVersion(2),
        InvocationQuery.fromParameters(Scope.all(), params("tool", "dates", "version", "2")));
  }

  @Test
  void fromParameters_none_isEveryRecordOfTheScopeWithTheDefaultPage() throws ToolException {
    InvocationQuery q = InvocationQuery.fromParameters(Scope.all(), Map.of());
    assertEquals(InvocationQuery.of(Scope.all()), q);
    assertEquals(100, q.pageSize());
    assertEquals(1000, q.withLimit(5000).pageSize());
  }

  static Stream<Arguments> badParameters() {
    return Stream.of(
        Arguments.of(params("runn", "x"),
            "unknown query parameter 'runn'; known: run, tool, version, outcome, ref_prefix, since, until, limit, after"),
        Arguments.of(params("run", "a", "run", "b"), "query parameter 'run' must be given once but was given 2 times"),
        Arguments.of(params("run", ""), "query parameter 'run' must not be empty"),
        Arguments.of(params("tool", "Arith"), "query parameter 'tool' must be a tool name or NAME@VERSION but was 'Arith'"),
        Arguments.of(params("tool", "arith@0"), "query parameter 'tool' must hold a positive whole version number but was '0'"),
        Arguments.of(params("version", "1.5"), "query parameter 'version' must hold a positive whole version number but was '1.5'"),
        Arguments.of(params("outcome", "failed"),
            "query parameter 'outcome' must be ok, error or an error code such as syntax_error but was 'failed'"),
        Arguments.of(params("since", "2031-05-17"),
            "query parameter 'since' must be an ISO 8601 instant such as 2031-05-17T09:30:00Z but was '2031-05-17'"),
        Arguments.of(params("limit", "0"), "query parameter 'limit' must be a whole number from 1 but was '0'"),
        Arguments.of(params("limit", "-5"), "query parameter 'limit' must be a whole number from 1 but was '-5'"),
        Arguments.of(params("limit", "99999999999"), "query parameter 'limit' must be a whole number from 1 but was '99999999999'"),
        Arguments.of(params("after", "plot-12"), "query parameter 'after' must be an invocation id (a UUID) but was 'plot-12'"),
        Arguments.of(params("since", "2031-05-17T10:00:00Z", "until", "2031-05-17T09:00:00Z"),
            "'since' must be before 'until' but was 2031-05-17T10:00:00Z and 2031-05-17T09:00:00Z"));
  }

  @ParameterizedTest
  @MethodSource("badParameters")
  void fromParameters_badValue_isInvalidArgumentSayingWhatWasExpected(Map<String, List<String>> params, String detail) {
    ToolException e = assertThrows(ToolException.class, () -> InvocationQuery.fromParameters(Scope.all(), params));
    assertEquals(ErrorCode.INVALID_ARGUMENT, e.error().code());
    assertEquals(detail, e.error().detail());
  }

  @Test
  void scope_keyAndAll_areDistinctAndNeverConfused() {
    assertTrue(Scope.all().isAll());
    assertFalse(Scope.key(HERON).isAll());
    assertEquals(HERON, Scope.key(HERON).keyId());
    assertEquals(Scope.key(HERON), Scope.key(HERON));
    assertFalse(Scope.key(HERON).equals(Scope.all()));
    assertThrows(NullPointerException.class, () -> Scope.key(null));
    assertThrows(IllegalArgumentException.class, () -> Scope.key(""));
    assertThrows(IllegalStateException.class, () -> Scope.all().keyId());
    assertEquals("key key-heron", Scope.key(HERON).toString());
  }

  @Test
  void constructor_invalidFilters_areRefused() {
    InvocationQuery q = InvocationQuery.of(Scope.all());
    assertThrows(IllegalArgumentException.class, () -> q.withOutcome("failed"));
    assertThrows(IllegalArgumentException.class, () -> q.withLimit(0));
    assertThrows(IllegalArgumentException.class, () -> q.withRun(""));
    assertThrows(IllegalArgumentException.class, () -> q.withAfter("not-an-id"));
    assertThrows(NullPointerException.class, () -> InvocationQuery.of(null));
  }
}
