package reckoner.spec;

import java.util.Locale;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolId;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;

/**
 * Assembles the OpenAPI 3.1 document from the served specs: one concrete path per tool version,
 * whose request schema is that version's argument schema and whose examples are its worked
 * examples. Built once at start; the result is immutable by convention (callers do not mutate it).
 */
public final class OpenApi {
  private OpenApi() {}

  public static ObjectNode assemble(ToolCatalog catalog, JsonMapper json, String serviceVersion) {
    ObjectNode doc = json.createObjectNode();
    doc.put("openapi", "3.1.0");
    ObjectNode info = doc.putObject("info");
    info.put("title", "Reckoner");
    info.put("version", serviceVersion);
    info.put("description", "Deterministic, versioned tools over HTTP. Every tool version's arguments are described by the "
        + "JSON Schema in its spec; the same arguments always give the same one-line text.");
    doc.putArray("tags").addObject().put("name", "tools");
    ObjectNode paths = doc.putObject("paths");
    ObjectNode schemas = doc.putObject("components").putObject("schemas");
    commonSchemas(schemas);

    paths.putObject("/v1/tools").set("get", operation(json, "listTools", "The tools and versions served",
        "#/components/schemas/ToolList"));
    for (ToolCatalog.Entry entry : catalog.all()) {
      ToolId id = entry.tool().id();
      String schemaName = id.name() + "_" + id.version() + "_arguments";
      schemas.set(schemaName, entry.spec().argumentSchema());
      String base = "/v1/tools/" + id.name() + "/" + id.version();
      ObjectNode describe = operation(json, "describe_" + id.name() + "_" + id.version(),
          "The spec of " + id + ": its argument schema, description and worked examples", null);
      describe.putObject("responses").putObject("200").put("description", "The spec document (a JSON Schema 2020-12 document)")
          .putObject("content").putObject("application/json").putObject("schema").put("type", "object");
      paths.putObject(base).set("get", describe);
      paths.putObject(base + "/invoke").set("post", invoke(json, entry, schemaName));
    }
    paths.putObject("/v1/batch").set("post", withBody(json, plain(json, "batch",
        "Many calls: JSON {\"calls\":[{id,tool,version,args,ref}]} (at most 10,000), or NDJSON streamed one call a line; results in call order",
        "application/json"), "application/json", "application/x-ndjson"));
    paths.putObject("/v1/splice").set("post", withBody(json, plain(json, "splice",
        "One call as a model wrote it (arith(1250/4000)); answers with the text and the spliced form", "application/json"),
        "application/json", "text/plain"));
    paths.putObject("/v1/fill").set("post", withBody(json, plain(json, "fill",
        "A document with calls in markup; every unanswered call answered and spliced in place, with per-call outcomes",
        "application/json"), "application/json", "text/plain"));
    paths.putObject("/v1/invocations").set("get", plain(json, "invocations",
        "Ledger query: run, tool, version, outcome, ref_prefix, since, until, limit, after (cursor)", "application/json"));
    paths.putObject("/v1/invocations/export").set("get", plain(json, "exportInvocations",
        "The same filters, every match streamed as NDJSON", "application/x-ndjson"));
    paths.putObject("/v1/admin/facts").set("get", plain(json, "factSets", "The fact sets served and their data versions",
        "application/json"));
    paths.putObject("/v1/admin/facts/reload").set("post", plain(json, "reloadFacts",
        "Read every fact file again; swap atomically only if all are sound (422 data_error otherwise)", "application/json"));
    paths.putObject("/status").set("get", plain(json, "status", "A live page for ops: rates, errors, latency per tool",
        "text/html"));
    paths.putObject("/openapi.json").set("get", plain(json, "openApi", "This document", "application/json"));
    paths.putObject("/health/live").set("get", plain(json, "live", "Liveness: the process answers", "application/json"));
    paths.putObject("/health/ready").set("get", plain(json, "ready", "Readiness: tools loaded and the ledger writable", "application/json"));
    paths.putObject("/metrics").set("get", plain(json, "metrics", "Prometheus text exposition", "text/plain"));
    return doc;
  }

  private static ObjectNode invoke(JsonMapper json, ToolCatalog.Entry entry, String schemaName) {
    ToolId id = entry.tool().id();
    ObjectNode op = json.createObjectNode();
    op.putArray("tags").add("tools");
    op.put("operationId", "invoke_" + id.name() + "_" + id.version());
    op.put("summary", entry.spec().summary());
    op.put("description", entry.spec().description());
    ArrayNode params = op.putArray("parameters");
    header(params, "Reckoner-Run", "Caller's run tag, recorded with the invocation");
    header(params, "Reckoner-Ref", "Caller's ref tag for this call, recorded with the invocation");
    if (entry.spec().declaresArgument("as_of")) {
      header(params, "Reckoner-As-Of", "Reference time (ISO 8601) used when the arguments carry no as_of");
    }
    ObjectNode body = op.putObject("requestBody");
    body.put("required", true);
    ObjectNode content = body.putObject("content");
    ObjectNode jsonBody = content.putObject("application/json");
    jsonBody.putObject("schema").put("$ref", "#/components/schemas/" + schemaName);
    ObjectNode examples = jsonBody.putObject("examples");
    int n = 0;
    for (ToolSpec.Example e : entry.spec().examples()) {
      ObjectNode ex = examples.putObject(String.format(Locale.ROOT, "example_%02d", ++n));
      ex.put("summary", e.title() + " -> " + (e.expectsError() ? "error " + e.error() : e.text()));
      ex.set("value", e.args());
    }
    content.putObject("text/plain").putObject("schema").put("type", "string")
        .put("description", "The free-text form: " + entry.spec().textForm());

    ObjectNode responses = op.putObject("responses");
    ObjectNode ok = responses.putObject("200");
    ok.put("description", "The answer");
    ObjectNode okContent = ok.putObject("content");
    okContent.putObject("application/json").putObject("schema").put("$ref", "#/components/schemas/InvokeResult");
    okContent.putObject("text/plain").putObject("schema").put("type", "string");
    for (String status : new String[] {"400", "404", "406", "413", "415", "422", "503"}) {
      ObjectNode r = responses.putObject(status);
      r.put("description", "An RFC 9457 problem with a stable code; with Accept: text/plain, the one-line error text");
      ObjectNode c = r.putObject("content");
      c.putObject("application/problem+json").putObject("schema").put("$ref", "#/components/schemas/Problem");
      c.putObject("text/plain").putObject("schema").put("type", "string");
    }
    return op;
  }

  private static void header(ArrayNode params, String name, String description) {
    ObjectNode p = params.addObject();
    p.put("name", name);
    p.put("in", "header");
    p.put("required", false);
    p.put("description", description);
    p.putObject("schema").put("type", "string").put("maxLength", 200);
  }

  private static ObjectNode operation(JsonMapper json, String id, String summary, String schemaRef) {
    ObjectNode op = json.createObjectNode();
    op.put("operationId", id);
    op.put("summary", summary);
    if (schemaRef != null) {
      op.putObject("responses").putObject("200").put("description", summary)
          .putObject("content").putObject("application/json").putObject("schema").put("$ref", schemaRef);
    }
    return op;
  }

  private static ObjectNode plain(JsonMapper json, String id, String summary, String mediaType) {
    ObjectNode op = json.createObjectNode();
    op.put("operationId", id);
    op.put("summary", summary);
    op.putObject("responses").putObject("200").put("description", summary)
        .putObject("content").putObject(mediaType).putObject("schema")
        .put("type", mediaType.equals("application/json") ? "object" : "string");
    return op;
  }

  private static ObjectNode withBody(JsonMapper json, ObjectNode op, String... mediaTypes) {
    ObjectNode body = op.putObject("requestBody");
    body.put("required", true);
    ObjectNode content = body.putObject("content");
    for (String type : mediaTypes) {
      content.putObject(type).putObject("schema").put("type", type.equals("application/json") ? "object" : "string");
    }
    return op;
  }

  private static void commonSchemas(ObjectNode schemas) {
    ObjectNode result = schemas.putObject("InvokeResult");
    result.put("type", "object");
    result.putArray("required").add("tool").add("version").add("text").add("cached").add("invocation_id");
    ObjectNode rp = result.putObject("properties");
    rp.putObject("tool").put("type", "string");
    rp.putObject("version").put("type", "integer");
    rp.putObject("text").put("type", "string").put("description", "The one-line answer");
    rp.putObject("cached").put("type", "boolean");
    rp.putObject("invocation_id").put("type", "string").put("format", "uuid");
    rp.putObject("data_version").put("type", "string").put("description", "Content digest of the data the answer came from");
    rp.putObject("as_of").put("type", "string").put("format", "date-time")
        .put("description", "Present when the server clock was read: the reference time used");
    rp.putObject("reading").put("type", "string")
        .put("description", "Present when the tool read a name by a default or by its context: which reading it took");

    ObjectNode problem = schemas.putObject("Problem");
    problem.put("type", "object");
    problem.put("description", "RFC 9457 problem details with a stable code and a splice-ready text");
    problem.putArray("required").add("type").add("title").add("status").add("detail").add("code").add("text");
    ObjectNode pp = problem.putObject("properties");
    pp.putObject("type").put("type", "string").put("format", "uri-reference");
    pp.putObject("title").put("type", "string");
    pp.putObject("status").put("type", "integer");
    pp.putObject("detail").put("type", "string");
    ArrayNode codes = pp.putObject("code").put("type", "string").putArray("enum");
    for (ErrorCode c : ErrorCode.values()) {
      codes.add(c.wireName());
    }
    pp.putObject("text").put("type", "string").put("description", "One line: error: CODE: DETAIL");
    pp.putObject("suggestions").put("type", "array").putObject("items").put("type", "string");
    pp.putObject("invocation_id").put("type", "string");

    ObjectNode list = schemas.putObject("ToolList");
    list.put("type", "object");
    ObjectNode item = list.putObject("properties").putObject("tools").put("type", "array").putObject("items");
    item.put("type", "object");
    ObjectNode ip = item.putObject("properties");
    for (String s : new String[] {"id", "name", "summary", "text_form", "spec", "invoke"}) {
      ip.putObject(s).put("type", "string");
    }
    ip.putObject("version").put("type", "integer");
    ip.putObject("default").put("type", "boolean");
  }
}
