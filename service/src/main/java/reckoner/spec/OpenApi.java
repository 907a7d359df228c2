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
    ObjectNode batch = withJsonBody(json, plain(json, "batch",
        "Many calls: JSON {\"calls\":[...]} (at most 10,000), answered {\"results\":[...]} in call order; or NDJSON "
            + "(application/x-ndjson) streamed one call a line, answered one result a line in the same order",
        "application/json", "BatchResult"), "BatchRequest");
    batch.withObject("/requestBody/content").putObject("application/x-ndjson").putObject("schema").put("type", "string")
        .put("description", "One BatchCall object (see components) a line, UTF-8, each line at most max-batch-bytes");
    batch.withObject("/responses/200/content").putObject("application/x-ndjson").putObject("schema").put("type", "string")
        .put("description", "One CallResult object a line, in the order of the calls");
    idempotent(batch);
    problems(batch, "409", "400", "406", "413", "415", "422", "503");
    paths.putObject("/v1/batch").set("post", batch);

    ObjectNode splice = withJsonBody(json, plain(json, "splice",
        "One call as a model wrote it (arith(1250/4000)); answers with the text and the spliced form", "application/json",
        "SpliceResult"), "SpliceRequest");
    splice.withObject("/requestBody/content").putObject("text/plain").putObject("schema").put("type", "string")
        .put("description", "The call itself, with or without the markup around it");
    splice.withObject("/responses/200/content").putObject("text/plain").putObject("schema").put("type", "string")
        .put("description", "The line the document would hold for the call");
    idempotent(splice);
    problems(splice, "409", "400", "404", "406", "413", "415", "422", "503");
    paths.putObject("/v1/splice").set("post", splice);

    ObjectNode fill = withJsonBody(json, plain(json, "fill",
        "A document with calls in markup; every unanswered call answered and spliced in place, with per-call outcomes",
        "application/json", "FillResult"), "FillRequest");
    fill.withObject("/requestBody/content").putObject("text/plain").putObject("schema").put("type", "string")
        .put("description", "The document itself, filled with the server's markup and on_error splice_error");
    fill.withObject("/responses/200/content").putObject("text/plain").putObject("schema").put("type", "string")
        .put("description", "The filled document");
    idempotent(fill);
    problems(fill, "409", "400", "406", "413", "415", "503");
    paths.putObject("/v1/fill").set("post", fill);

    ObjectNode invocations = plain(json, "invocations",
        "Ledger query, one page oldest first: run, tool, version, outcome, ref_prefix, since, until, limit (at most 1000), "
            + "after (cursor)", "application/json", "InvocationPage");
    ledgerParameters(invocations);
    problems(invocations, "400", "503");
    paths.putObject("/v1/invocations").set("get", invocations);
    ObjectNode export = plain(json, "exportInvocations", "The same filters, every match streamed as NDJSON, one Invocation a line",
        "application/x-ndjson", null);
    ledgerParameters(export);
    problems(export, "400", "503");
    paths.putObject("/v1/invocations/export").set("get", export);
    ObjectNode audit = plain(json, "audit", "Run every recorded call the filters select again on this build, with its recorded "
        + "reference time and data version; report each answer that differs, byte for byte, by tool version, and the records "
        + "that cannot be checked (their data no longer loaded) apart", "application/json", null);
    ledgerParameters(audit);
    problems(audit, "400", "503");
    paths.putObject("/v1/admin/audit").set("post", audit);
    paths.putObject("/v1/admin/facts").set("get", plain(json, "factSets", "The fact sets served and their data versions",
        "application/json", null));
    ObjectNode reload = plain(json, "reloadFacts",
        "Read every fact file again; swap atomically only if all are sound (422 data_error otherwise)", "application/json", null);
    problems(reload, "422");
    paths.putObject("/v1/admin/facts/reload").set("post", reload);
    paths.putObject("/v1/admin/search").set("get", plain(json, "searchCollections",
        "The search collections served, their data versions and passage counts", "application/json", null));
    ObjectNode searchReload = plain(json, "reloadSearch",
        "Read every collection file again; swap atomically only if all are sound (422 data_error otherwise)", "application/json", null);
    problems(searchReload, "422");
    paths.putObject("/v1/admin/search/reload").set("post", searchReload);
    paths.putObject("/v1/admin/keys").set("get", plain(json, "apiKeys",
        "The API keys in force: ids, scopes and rates (never their digests), and why the last reload was refused, if it was",
        "application/json", null));
    ObjectNode keysReload = plain(json, "reloadKeys",
        "Read the keys file again; swap only if it is sound (422 data_error otherwise, the old keys staying in force)",
        "application/json", null);
    problems(keysReload, "400", "422");
    paths.putObject("/v1/admin/keys/reload").set("post", keysReload);
    paths.putObject("/status").set("get", plain(json, "status", "A live page for ops: rates, errors, latency per tool",
        "text/html", null));
    paths.putObject("/status.json").set("get", plain(json, "statusHistory",
        "What the status page draws: per tool, 15 minutes of rates, errors and latency percentiles; ledger and cache health; "
            + "version and uptime", "application/json", null));
    paths.putObject("/openapi.json").set("get", plain(json, "openApi", "This document", "application/json", null));
    paths.putObject("/health/live").set("get", plain(json, "live", "Liveness: the process answers", "application/json", null));
    ObjectNode ready = plain(json, "ready", "Readiness: tools loaded and the ledger writable", "application/json", null);
    ready.withObject("/responses").putObject("503").put("description", "Not ready: the ledger cannot be written now")
        .putObject("content").putObject("application/json").putObject("schema").put("type", "object");
    paths.putObject("/health/ready").set("get", ready);
    paths.putObject("/metrics").set("get", plain(json, "metrics", "Prometheus text exposition", "text/plain", null));
    paths.putObject("/problems/{code}").set("get", problemType(json));
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
    header(params, "Idempotency-Key", "Names the call for retries: sent again with the same body, it is answered from its "
        + "record (replayed: true) and not run or recorded again; with another body it is 409 idempotency_conflict");
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
    for (String status : new String[] {"400", "404", "406", "409", "413", "415", "422", "503"}) {
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

  /** A GET or POST whose 200 answer is {@code mediaType}, described by {@code schemaName} from the components (or loosely). */
  private static ObjectNode plain(JsonMapper json, String id, String summary, String mediaType, String schemaName) {
    ObjectNode op = json.createObjectNode();
    op.put("operationId", id);
    op.put("summary", summary);
    ObjectNode schema = op.putObject("responses").putObject("200").put("description", summary)
        .putObject("content").putObject(mediaType).putObject("schema");
    if (schemaName != null) {
      schema.put("$ref", "#/components/schemas/" + schemaName);
    } else {
      schema.put("type", mediaType.equals("application/json") ? "object" : "string");
    }
    return op;
  }

  private static ObjectNode withJsonBody(JsonMapper json, ObjectNode op, String schemaName) {
    ObjectNode body = op.putObject("requestBody");
    body.put("required", true);
    body.putObject("content").putObject("application/json").putObject("schema").put("$ref", "#/components/schemas/" + schemaName);
    return op;
  }

  /** The refusals an operation can answer, each an RFC 9457 problem or, with Accept: text/plain, its line. */
  private static void problems(ObjectNode op, String... statuses) {
    ObjectNode responses = op.withObject("/responses");
    for (String status : statuses) {
      ObjectNode r = responses.putObject(status);
      r.put("description", "An RFC 9457 problem with a stable code; with Accept: text/plain, the one-line error text "
          + "(code in the Reckoner-Error-Code header)");
      ObjectNode c = r.putObject("content");
      c.putObject("application/problem+json").putObject("schema").put("$ref", "#/components/schemas/Problem");
      c.putObject("text/plain").putObject("schema").put("type", "string");
    }
  }

  /** The Idempotency-Key header of a batch, splice or fill: it names the request, and each call in it by its id or position. */
  private static void idempotent(ObjectNode op) {
    header(op.withArray("parameters"), "Idempotency-Key", "Names the request for retries: sent again with the same "
        + "content, the calls it recorded are answered from the ledger (replayed: true) and only the rest run; with other "
        + "content it is 409 idempotency_conflict. In a batch each line's id (or its line number) names the call.");
  }

  private static void ledgerParameters(ObjectNode op) {
    ArrayNode params = op.putArray("parameters");
    query(params, "run", "string", "Only this run tag");
    query(params, "tool", "string", "Only this tool name");
    query(params, "version", "integer", "Only this tool version");
    query(params, "outcome", "string", "ok, error (any error code), or one error code");
    query(params, "ref_prefix", "string", "Only refs that start with this");
    query(params, "since", "string", "Only records at or after this ISO 8601 instant");
    query(params, "until", "string", "Only records before this ISO 8601 instant");
    query(params, "limit", "integer", "At most this many records (a page: 1 to 1000, default 100)");
    query(params, "after", "string", "The cursor: records after this id (a page's next)");
    query(params, "key", "string", "Only this key's records (an admin key only; other keys read only their own)");
  }

  private static void query(ArrayNode params, String name, String type, String description) {
    ObjectNode p = params.addObject();
    p.put("name", name);
    p.put("in", "query");
    p.put("required", false);
    p.put("description", description);
    p.putObject("schema").put("type", type);
  }

  private static ObjectNode problemType(JsonMapper json) {
    ObjectNode op = json.createObjectNode();
    op.put("operationId", "problemType");
    op.put("summary", "What a problem type (an error code) means: its title and HTTP status");
    ObjectNode p = op.putArray("parameters").addObject();
    p.put("name", "code");
    p.put("in", "path");
    p.put("required", true);
    p.putObject("schema").put("type", "string");
    op.putObject("responses").putObject("200").put("description", "The code, its title and status")
        .putObject("content").putObject("application/json").putObject("schema").put("type", "object");
    problems(op, "404");
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

    callSchemas(schemas);

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

  /** The bodies of batch, splice and fill, and the shapes of their results and of ledger records. */
  private static void callSchemas(ObjectNode schemas) {
    ObjectNode call = object(schemas, "BatchCall", "One call of a batch", "tool", "args");
    ObjectNode cp = call.withObject("/properties");
    cp.putObject("id").put("description", "The caller's id for the call, echoed in its result").putArray("type")
        .add("string").add("integer").add("null");
    cp.putObject("tool").put("type", "string").put("description", "A tool name, such as arith");
    cp.putObject("version").put("type", "integer").put("minimum", 1).put("description", "A version; absent: the newest");
    cp.putObject("args").put("type", "object").put("description", "The tool version's arguments (its argument schema)");
    tag(cp, "ref", "The caller's ref tag for this call");
    tag(cp, "run", "The caller's run tag for this call (over the Reckoner-Run header)");

    ObjectNode request = object(schemas, "BatchRequest", "A JSON batch", "calls");
    request.withObject("/properties").putObject("calls").put("type", "array").put("maxItems", 10_000)
        .putObject("items").put("$ref", "#/components/schemas/BatchCall");

    ObjectNode result = schemas.putObject("CallResult");
    result.put("type", "object");
    result.put("description", "One call's result: ok with text, or refused with code, detail and the one-line text");
    result.putArray("required").add("ok").add("text");
    ObjectNode rp = result.putObject("properties");
    rp.putObject("id").put("description", "The call's id, as sent").putArray("type").add("string").add("integer").add("null");
    rp.putObject("ok").put("type", "boolean");
    rp.putObject("tool").put("type", "string");
    rp.putObject("version").put("type", "integer");
    rp.putObject("text").put("type", "string").put("description", "The answer, or the error line error: CODE: DETAIL");
    rp.putObject("cached").put("type", "boolean");
    rp.putObject("data_version").put("type", "string");
    rp.putObject("as_of").put("type", "string").put("format", "date-time");
    rp.putObject("code").put("type", "string").put("description", "The error code (when ok is false)");
    rp.putObject("detail").put("type", "string");
    rp.putObject("suggestions").put("type", "array").putObject("items").put("type", "string");
    rp.putObject("invocation_id").put("type", "string").put("format", "uuid");
    rp.putObject("line").put("type", "integer").put("description", "The NDJSON line of a line that never became a call");

    ObjectNode batchResult = object(schemas, "BatchResult", "A JSON batch's results, in call order", "results");
    batchResult.withObject("/properties").putObject("results").put("type", "array").putObject("items")
        .put("$ref", "#/components/schemas/CallResult");

    ObjectNode markup = object(schemas, "Markup", "Splice markup strings; absent ones are the server's");
    ObjectNode mp = markup.withObject("/properties");
    for (String name : new String[] {"open", "separator", "close"}) {
      mp.putObject(name).put("type", "string").put("minLength", 1).put("maxLength", 64);
    }

    ObjectNode splice = object(schemas, "SpliceRequest", "One call as written, with or without the markup around it", "call");
    splice.withObject("/properties").putObject("call").put("type", "string");
    splice.withObject("/properties").putObject("markup").put("$ref", "#/components/schemas/Markup");

    ObjectNode spliced = schemas.putObject("SpliceResult");
    spliced.put("description", "The call's result, the call as read, and the call as the document would hold it");
    ArrayNode all = spliced.putArray("allOf");
    all.addObject().put("$ref", "#/components/schemas/CallResult");
    ObjectNode extra = all.addObject();
    extra.put("type", "object");
    extra.putObject("properties").putObject("call").put("type", "string");
    extra.withObject("/properties").putObject("spliced").put("type", "string");

    ObjectNode fill = object(schemas, "FillRequest", "A document with calls in markup", "document");
    ObjectNode fp = fill.withObject("/properties");
    fp.putObject("document").put("type", "string");
    fp.putObject("markup").put("$ref", "#/components/schemas/Markup");
    fp.putObject("on_error").put("description", "What a failed call leaves (default splice_error)").putArray("enum")
        .add("splice_error").add("drop").add("keep");

    ObjectNode filled = object(schemas, "FillResult", "The filled document and each call's outcome, in document order",
        "document", "calls", "malformed", "summary");
    ObjectNode flp = filled.withObject("/properties");
    flp.putObject("document").put("type", "string");
    ObjectNode callItem = flp.putObject("calls").put("type", "array").putObject("items");
    ArrayNode callAll = callItem.putArray("allOf");
    callAll.addObject().put("$ref", "#/components/schemas/CallResult");
    ObjectNode where = callAll.addObject();
    where.put("type", "object");
    where.putObject("properties").putObject("position").put("type", "integer").put("description", "In Unicode code points");
    where.withObject("/properties").putObject("call").put("type", "string");
    ObjectNode bad = flp.putObject("malformed").put("type", "array").putObject("items");
    bad.put("type", "object");
    ObjectNode bp = bad.putObject("properties");
    bp.putObject("position").put("type", "integer");
    bp.putObject("code").put("type", "string");
    bp.putObject("detail").put("type", "string");
    bp.putObject("text").put("type", "string");
    ObjectNode summary = flp.putObject("summary");
    summary.put("type", "object");
    ObjectNode sp = summary.putObject("properties");
    for (String name : new String[] {"calls", "ok", "errors", "malformed"}) {
      sp.putObject(name).put("type", "integer");
    }

    ObjectNode invocation = object(schemas, "Invocation", "The ledger's record of one call", "id", "ts", "key_id", "tool",
        "text", "outcome", "cached", "elapsed_us");
    ObjectNode ivp = invocation.withObject("/properties");
    ivp.putObject("id").put("type", "string").put("format", "uuid").put("description", "UUIDv7: time-ordered");
    ivp.putObject("ts").put("type", "string").put("format", "date-time");
    for (String name : new String[] {"key_id", "tool", "text", "outcome"}) {
      ivp.putObject(name).put("type", "string");
    }
    for (String name : new String[] {"run", "ref", "data_version", "as_of"}) {
      ivp.putObject(name).putArray("type").add("string").add("null");
    }
    ivp.putObject("version").putArray("type").add("integer").add("null");
    ivp.putObject("args").put("description", "The canonical arguments").putArray("type").add("object").add("null");
    ivp.putObject("cached").put("type", "boolean");
    ivp.putObject("elapsed_us").put("type", "integer");

    ObjectNode page = object(schemas, "InvocationPage", "One page of matches, oldest first", "invocations", "next");
    page.withObject("/properties").putObject("invocations").put("type", "array").putObject("items")
        .put("$ref", "#/components/schemas/Invocation");
    page.withObject("/properties").putObject("next").put("description", "The cursor for the next page (after=), or null")
        .putArray("type").add("string").add("null");
  }

  private static ObjectNode object(ObjectNode schemas, String name, String description, String... required) {
    ObjectNode o = schemas.putObject(name);
    o.put("type", "object");
    o.put("description", description);
    if (required.length > 0) {
      ArrayNode r = o.putArray("required");
      for (String field : required) {
        r.add(field);
      }
    }
    o.putObject("properties");
    return o;
  }

  private static void tag(ObjectNode properties, String name, String description) {
    properties.putObject(name).put("type", "string").put("minLength", 1).put("maxLength", 200)
        .put("pattern", "^[ -~]+$").put("description", description + ": 1 to 200 printable ASCII characters");
  }
}
