package reckoner.dates;

import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.List;
import java.util.OptionalInt;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.spec.Json;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.tool.ToolRegistry;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** Calls dates@1 as a caller does: through the schema, canonicalize and invoke of the real Invoker. */
final class DatesCalls {
  /** The fixed server clock of these tests; a call that needs "now" and lacks as_of sees this instant. */
  static final Instant NOW = Instant.parse("2031-05-17T09:30:00Z");
  static final Clock CLOCK = Clock.fixed(NOW, ZoneOffset.UTC);
  static final JsonMapper JSON = Json.newMapper();
  static final ToolCatalog CATALOG = ToolCatalog.of(ToolRegistry.of(List.of(new DatesTool())), new SpecLoader(JSON));
  static final Invoker INVOKER = new Invoker(CATALOG, CLOCK);

  private DatesCalls() {}

  /** Runs the call whose arguments are the JSON object {@code args}. */
  static Outcome call(String args) {
    return INVOKER.invoke(CallRequest.of("dates", 1, json(args)));
  }

  /** Runs the call with a reference time from a header, as the HTTP layer passes Reckoner-As-Of. */
  static Outcome callWithHeader(String args, String asOf) {
    return INVOKER.invoke(new CallRequest("dates", OptionalInt.of(1), json(args), asOf, null, null));
  }

  /** The answer text of a call that must succeed. */
  static String text(String args) {
    Outcome outcome = call(args);
    if (!outcome.isOk()) {
      throw new AssertionError("expected an answer to " + args + " but got " + outcome.text());
    }
    return outcome.text();
  }

  /** The answer text of the text form {@code text}. */
  static String say(String text) {
    return text("{\"text\":" + JSON.writeValueAsString(text) + "}");
  }

  static JsonNode json(String args) {
    return JSON.readTree(args);
  }
}
