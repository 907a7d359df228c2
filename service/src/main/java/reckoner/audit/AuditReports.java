package reckoner.audit;

import java.util.Map;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;

/** An audit's report as JSON: counts, per tool version, the reasons records were not checkable, and the differences. */
public final class AuditReports {
  private AuditReports() {}

  public static ObjectNode toJson(Audit.Report r, String build, JsonMapper json) {
    ObjectNode o = json.createObjectNode();
    o.put("build", build);
    o.put("records", r.records());
    o.put("same", r.same());
    o.put("different", r.different());
    o.put("not_checkable", r.notCheckable());
    ObjectNode by = o.putObject("by_tool_version");
    for (Map.Entry<String, long[]> e : r.byToolVersion().entrySet()) {
      by.putObject(e.getKey()).put("same", e.getValue()[0]).put("different", e.getValue()[1]).put("not_checkable", e.getValue()[2]);
    }
    ObjectNode reasons = o.putObject("not_checkable_reasons");
    r.reasons().forEach(reasons::put);
    ArrayNode diffs = o.putArray("differences");
    for (Audit.Difference d : r.differences()) {
      ObjectNode n = diffs.addObject();
      n.put("id", d.id());
      n.put("tool", d.tool());
      n.put("version", d.version());
      n.set("args", json.readTree(d.args()));
      n.putObject("recorded").put("outcome", d.recordedOutcome()).put("text", d.recordedText());
      n.putObject("now").put("outcome", d.nowOutcome()).put("text", d.nowText());
    }
    if (r.different() > r.differences().size()) {
      o.put("differences_not_listed", r.different() - r.differences().size());
    }
    return o;
  }

  /** One record of a ledger export line ({@link reckoner.ledger.Invocation#toJson()}), read back. */
  public static reckoner.ledger.Invocation fromExportLine(String line, JsonMapper json) {
    tools.jackson.databind.JsonNode n = json.readTree(line);
    reckoner.ledger.Invocation.Builder b = reckoner.ledger.Invocation.builder(n.get("id").asString())
        .keyId(n.get("key_id").asString()).run(text(n, "run")).ref(text(n, "ref")).tool(n.get("tool").asString())
        .version(n.path("version").isNull() || n.path("version").isMissingNode() ? null : n.get("version").asInt())
        .args(n.path("args").isObject() ? json.writeValueAsString(n.get("args")) : null).text(n.get("text").asString())
        .outcome(n.get("outcome").asString()).cached(n.path("cached").asBoolean()).elapsedUs(n.path("elapsed_us").asLong())
        .dataVersion(text(n, "data_version")).asOf(text(n, "as_of"));
    return b.build();
  }

  private static String text(tools.jackson.databind.JsonNode n, String field) {
    tools.jackson.databind.JsonNode v = n.get(field);
    return v == null || v.isNull() ? null : v.asString();
  }
}
