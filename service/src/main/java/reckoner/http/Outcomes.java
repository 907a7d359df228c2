package reckoner.http;

import reckoner.call.Outcome;
import reckoner.tool.Answer;
import reckoner.tool.ToolError;
import reckoner.tool.ToolId;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.node.ObjectNode;

/** The JSON shape of one call's result, shared by invoke, batch, splice and fill. */
final class Outcomes {
  private Outcomes() {}

  /** {@code {"id","ok":true,"text",...}} or {@code {"id","ok":false,"code","detail","text"}}; id omitted when null. */
  static ObjectNode write(ObjectNode node, JsonNode id, Outcome outcome) {
    if (id != null) {
      node.set("id", id);
    }
    node.put("ok", outcome.isOk());
    outcome.tool().ifPresent(t -> tool(node, t));
    if (outcome.isOk()) {
      Answer a = outcome.answer().get();
      node.put("text", a.text());
      node.put("cached", outcome.cached());
      a.dataVersion().ifPresent(v -> node.put("data_version", v));
      a.clockReadAt().ifPresent(t -> node.put("as_of", t.toString()));
      a.note().ifPresent(n -> node.put("reading", n));
    } else {
      ToolError e = outcome.error().get();
      node.put("code", e.code().wireName());
      node.put("detail", e.detail());
      node.put("text", e.text());
      if (!e.suggestions().isEmpty()) {
        e.suggestions().forEach(node.putArray("suggestions")::add);
      }
    }
    node.put("invocation_id", outcome.invocationId());
    return node;
  }

  /** An error result for a batch line that never became a call (unparseable, missing fields). */
  static ObjectNode refused(ObjectNode node, JsonNode id, ToolError error, long line) {
    if (id != null) {
      node.set("id", id);
    }
    node.put("ok", false);
    node.put("code", error.code().wireName());
    node.put("detail", error.detail());
    node.put("text", error.text());
    if (line > 0) {
      node.put("line", line);
    }
    return node;
  }

  private static void tool(ObjectNode node, ToolId id) {
    node.put("tool", id.name());
    node.put("version", id.version());
  }
}
