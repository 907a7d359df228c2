package reckoner.results;

import reckoner.call.Outcome;
import reckoner.splice.Filler;
import reckoner.tool.Answer;
import reckoner.tool.ToolError;
import reckoner.tool.ToolId;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;

/** Writes results into Jackson object nodes; members in a fixed order, so equal results are equal bytes. */
public final class ResultJson {
  private ResultJson() {}

  /** {@code {"id","ok":true,"tool","version","text",...}} or {@code {"id","ok":false,...,"code","detail","text"}}; id omitted when null. */
  public static ObjectNode outcome(ObjectNode node, JsonNode id, Outcome outcome) {
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

  /** An error result for a batch line that never became a call (unparseable, missing fields); line 0 is omitted. */
  public static ObjectNode refused(ObjectNode node, JsonNode id, ToolError error, long line) {
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

  /**
   * A filled document: {@code {"document","calls":[{"position","call",...outcome}],"malformed":[{"position",
   * "code","detail","text"}],"summary":{"calls","ok","errors","malformed"}}}.
   */
  public static ObjectNode filled(ObjectNode node, Filler.Filled filled) {
    node.put("document", filled.document());
    ArrayNode calls = node.putArray("calls");
    int errors = 0;
    for (Filler.Spliced c : filled.calls()) {
      ObjectNode n = calls.addObject();
      n.put("position", c.position());
      n.put("call", c.call().toString());
      outcome(n, null, c.outcome());
      if (c.replayed()) {
        n.put("replayed", true);
      }
      errors += c.isOk() ? 0 : 1;
    }
    ArrayNode malformed = node.putArray("malformed");
    for (Filler.Malformed m : filled.malformed()) {
      ObjectNode n = malformed.addObject();
      n.put("position", m.position());
      n.put("code", m.error().code().wireName());
      n.put("detail", m.error().detail());
      n.put("text", m.error().text());
    }
    ObjectNode summary = node.putObject("summary");
    summary.put("calls", filled.calls().size());
    summary.put("ok", filled.calls().size() - errors);
    summary.put("errors", errors);
    summary.put("malformed", filled.malformed().size());
    return node;
  }

  private static void tool(ObjectNode node, ToolId id) {
    node.put("tool", id.name());
    node.put("version", id.version());
  }
}
