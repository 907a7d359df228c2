package reckoner.http;

import io.javalin.http.Context;
import java.io.BufferedWriter;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import reckoner.ledger.InvocationPage;
import reckoner.ledger.InvocationQuery;
import reckoner.ledger.LedgerSink;
import reckoner.ledger.LedgerStore;
import reckoner.tool.ToolException;

/**
 * The ledger's read side: {@code GET /v1/invocations} (one page, oldest first, with a cursor to
 * the next) and {@code GET /v1/invocations/export} (every match as NDJSON, streamed in constant
 * memory). A caller reads only its own key's invocations; until API keys exist every call is
 * made and read under the one anonymous key.
 */
final class LedgerRoutes {
  private final LedgerStore store;
  private final Responses responses;
  private final java.util.function.Supplier<reckoner.audit.Audit> audits;
  private final String build;

  LedgerRoutes(LedgerStore store, Responses responses, java.util.function.Supplier<reckoner.audit.Audit> audits, String build) {
    this.store = store;
    this.responses = responses;
    this.audits = audits;
    this.build = build;
  }

  /**
   * {@code POST /v1/admin/audit}: every record the filters select (those of {@code /v1/invocations},
   * plus {@code key}) run again on this build; the report names each answer that differs.
   */
  void audit(Context ctx) throws Exception {
    InvocationQuery query = parse(ctx, Access.caller(ctx));
    reckoner.audit.Audit audit = audits.get();
    store.forEach(query, audit::check);
    responses.json(ctx, 200, reckoner.audit.AuditReports.toJson(audit.report(), build, responses.json()));
  }

  void query(Context ctx) {
    InvocationQuery query = parse(ctx, Access.caller(ctx));
    if (query.limit() != null && query.limit() > InvocationQuery.MAX_PAGE_SIZE) {
      throw new ApiException(reckoner.tool.ErrorCode.INVALID_ARGUMENT, "limit must be at most " + InvocationQuery.MAX_PAGE_SIZE
          + " records a page but was " + query.limit() + "; follow \"next\" for more, or read every match from /v1/invocations/export");
    }
    InvocationPage page = store.query(query);
    ctx.status(200).contentType(MediaTypes.JSON).result(page.toJson());
  }

  void export(Context ctx) throws Exception {
    InvocationQuery query = parse(ctx, Access.caller(ctx)); // refuse bad filters before the 200 is sent
    ctx.status(200).contentType(MediaTypes.NDJSON);
    try (Writer out = new BufferedWriter(new OutputStreamWriter(ctx.outputStream(), StandardCharsets.UTF_8), 1 << 16)) {
      store.exportNdjson(query, out);
    }
  }

  /**
   * The caller's query: its own key's records, or, for an admin key, every key's, narrowed by the
   * parameter {@code key} when given. A key without admin may name only itself.
   */
  private static InvocationQuery parse(Context ctx, Caller caller) {
    java.util.Map<String, java.util.List<String>> params = new java.util.LinkedHashMap<>(ctx.queryParamMap());
    java.util.List<String> key = params.remove("key");
    if (key != null && (key.size() != 1 || key.get(0).isEmpty())) {
      throw new ApiException(reckoner.tool.ErrorCode.INVALID_ARGUMENT, "query parameter 'key' must be given once, a key id");
    }
    InvocationQuery.Scope scope;
    if (caller.readsAllRecords()) {
      scope = key == null ? InvocationQuery.Scope.all() : InvocationQuery.Scope.key(key.get(0));
    } else if (key == null || key.get(0).equals(caller.keyId())) {
      scope = InvocationQuery.Scope.key(caller.keyId());
    } else {
      throw new ApiException(reckoner.tool.ErrorCode.FORBIDDEN, "key '" + caller.keyId()
          + "' reads only its own records; reading another key's needs the admin scope");
    }
    try {
      return InvocationQuery.fromParameters(scope, params);
    } catch (ToolException e) {
      throw new ApiException(e.error().code(), e.error().detail());
    }
  }
}
