package reckoner.ledger;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static reckoner.ledger.Fixtures.HERON;
import static reckoner.ledger.Fixtures.T0;
import static reckoner.ledger.Fixtures.call;
import static reckoner.ledger.Fixtures.id;

import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;
import reckoner.Tools;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.spec.Json;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.tool.ToolRegistry;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

final class InvocationTest {
  private static final JsonMapper JSON = Json.newMapper();

  // ---- validation ----

  @Test
  void constructor_idNotUuidV7_isRefused() {
    IllegalArgumentException notUuid = assertThrows(IllegalArgumentException.class,
        () -> Invocation.builder("plot-12").keyId(HERON).tool("arith").text("1").build());
    assertEquals("id must be a UUID: plot-12", notUuid.getMessage());
    IllegalArgumentException v4 = assertThrows(IllegalArgumentException.class,
        () -> Invocation.builder("3f2b8c1e-5d4a-4b6c-9e7f-0a1b2c3d4e5f").keyId(HERON).tool("arith").text("1").build());
    assertEquals("id must be a UUIDv7 in lower-case canonical form: 3f2b8c1e-5d4a-4b6c-9e7f-0a1b2c3d4e5f", v4.getMessage());
    String upper = id(0, 0).toUpperCase(java.util.Locale.ROOT);
    assertThrows(IllegalArgumentException.class, () -> Invocation.builder(upper).keyId(HERON).tool("arith").text("1").build());
  }

  @Test
  void constructor_badFields_areRefusedWithTheirName() {
    assertEquals("keyId must not be empty", assertThrows(IllegalArgumentException.class,
        () -> call(0, 0, "").build()).getMessage());
    assertEquals("version must be positive: 0", assertThrows(IllegalArgumentException.class,
        () -> call(0, 0, HERON).version(0).build()).getMessage());
    assertEquals("outcome must be 'ok' or an error code: Domain Error", assertThrows(IllegalArgumentException.class,
        () -> call(0, 0, HERON).outcome("Domain Error").build()).getMessage());
    assertEquals("args must be a JSON object: [1]", assertThrows(IllegalArgumentException.class,
        () -> call(0, 0, HERON).args("[1]").build()).getMessage());
    assertEquals("elapsedUs must not be negative: -1", assertThrows(IllegalArgumentException.class,
        () -> call(0, 0, HERON).elapsedUs(-1).build()).getMessage());
    assertThrows(NullPointerException.class, () -> call(0, 0, HERON).text(null).build());
  }

  @Test
  void ts_isTheMillisecondInTheId() {
    assertEquals(T0.plusMillis(1234), call(1234, 7, HERON).build().ts());
  }

  @Test
  void equalFields_giveEqualRecords() {
    assertEquals(call(5, 1, HERON).run("orchard-survey-7").build(), call(5, 1, HERON).run("orchard-survey-7").build());
    assertEquals(call(5, 1, HERON).build().hashCode(), call(5, 1, HERON).build().hashCode());
    assertFalse(call(5, 1, HERON).build().equals(call(5, 1, HERON).cached(true).build()));
  }

  // ---- JSON ----

  @Test
  void toJson_everyFieldInContractOrder() {
    Invocation inv = call(1, 0, HERON).run("orchard-survey-7").ref("plot-12:\"row\"\n3").cached(true)
        .dataVersion("sha256:0f1e").asOf("2031-05-17").build();
    assertEquals("{\"id\":\"" + id(1, 0) + "\",\"ts\":\"2031-05-17T09:30:00.001Z\",\"key_id\":\"key-heron\","
        + "\"run\":\"orchard-survey-7\",\"ref\":\"plot-12:\\\"row\\\"\\n3\",\"tool\":\"arith\",\"version\":1,"
        + "\"args\":{\"expr\":\"1250/4000\",\"places\":2,\"rounding\":\"half_even\"},\"text\":\"0.31\",\"outcome\":\"ok\","
        + "\"cached\":true,\"elapsed_us\":42,\"data_version\":\"sha256:0f1e\",\"as_of\":\"2031-05-17\","
        + "\"idempotency_key\":null}", inv.toJson());
  }

  /** Escapes as RFC 8259, section 7 requires; Jackson, a general-purpose parser, reads them back. */
  @Test
  void toJson_controlAndSeparatorCharacters_parseBackToTheSameText() {
    String odd = "a\u0001b\u2028c\\d\te\u00e9\uD83C\uDF33";
    Invocation inv = call(0, 0, HERON).ref(odd).text(odd).version(null).args(null).build();
    JsonNode node = JSON.readTree(inv.toJson());
    assertEquals(odd, node.get("ref").stringValue());
    assertEquals(odd, node.get("text").stringValue());
    assertTrue(node.get("version").isNull());
    assertTrue(node.get("args").isNull());
  }

  @Test
  void pageToJson_listsRecordsAndCursor() {
    InvocationPage page = new InvocationPage(java.util.List.of(call(0, 0, HERON).build()), java.util.Optional.of(id(0, 0)));
    JsonNode node = JSON.readTree(page.toJson());
    assertEquals(id(0, 0), node.get("next").stringValue());
    assertEquals(id(0, 0), node.get("invocations").get(0).get("id").stringValue());
    assertEquals("{\"invocations\":[],\"next\":null}", new InvocationPage(java.util.List.of(), java.util.Optional.empty()).toJson());
  }

  // ---- from a call the Invoker ran ----

  private static final Clock CLOCK = Clock.fixed(Instant.parse("2031-05-17T09:30:00Z"), ZoneOffset.UTC);
  private static final Invoker INVOKER =
      new Invoker(ToolCatalog.of(ToolRegistry.of(Tools.demo()), new SpecLoader(JSON)), CLOCK);

  @Test
  void of_answeredCall_recordsCanonicalArgumentsAndText() {
    CallRequest request = new CallRequest("arith", OptionalInt.of(1), JSON.readTree("{\"text\":\"1250/4000\"}"), null,
        "orchard-survey-7", "plot-12:row-3");
    Outcome outcome = INVOKER.invoke(request);
    Invocation inv = Invocation.of(request, outcome, HERON, false);
    assertEquals(outcome.invocationId(), inv.id());
    assertEquals("arith", inv.tool());
    assertEquals(1, inv.version());
    assertEquals(outcome.canonical().get().toCanonicalJson(), inv.args());
    assertEquals("0.31", inv.text()); // 1250/4000 = 0.3125, half_even to 2 places (arithmetic by hand)
    assertEquals("ok", inv.outcome());
    assertEquals("orchard-survey-7", inv.run());
    assertEquals("plot-12:row-3", inv.ref());
    assertEquals(CLOCK.millis(), inv.ts().toEpochMilli());
    assertEquals(null, inv.asOf());
  }

  @Test
  void of_unknownTool_recordsTheNameAsAskedAndTheCode() {
    CallRequest request = CallRequest.of("sundial", 3, JSON.readTree("{}"));
    Outcome outcome = INVOKER.invoke(request);
    Invocation inv = Invocation.of(request, outcome, HERON, false);
    assertEquals("sundial", inv.tool());
    assertEquals(3, inv.version());
    assertEquals(null, inv.args());
    assertEquals("unknown_tool", inv.outcome());
    assertEquals(outcome.text(), inv.text());
    assertFalse(inv.isOk());
  }
}
