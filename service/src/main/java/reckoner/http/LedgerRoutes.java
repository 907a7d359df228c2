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

  LedgerRoutes(LedgerStore store, Responses responses) {
    this.store = store;
    this.responses = responses;
  }

  void query(Context ctx) {
    InvocationQuery query = parse(ctx);
    if (query.limit() != null && query.limit() > InvocationQuery.MAX_PAGE_SIZE) {
      throw new ApiException(reckoner.tool.ErrorCode.INVALID_ARGUMENT, "limit must be at most " + InvocationQuery.MAX_PAGE_SIZE
          + " records a page but was " + query.limit() + "; follow \"next\" for more, or read every match from /v1/invocations/export");
    }
    InvocationPage page = store.query(query);
    ctx.status(200).contentType(MediaTypes.JSON).result(page.toJson());
  }

  void export(Context ctx) throws Exception {
    InvocationQuery query = parse(ctx); // refuse bad filters before the 200 is sent
    ctx.status(200).contentType(MediaTypes.NDJSON);
    try (Writer out = new BufferedWriter(new OutputStreamWriter(ctx.outputStream(), StandardCharsets.UTF_8), 1 << 16)) {
      store.exportNdjson(query, out);
    }
  }

  private static InvocationQuery parse(Context ctx) {
    try {
      return InvocationQuery.fromParameters(InvocationQuery.Scope.key(LedgerSink.ANONYMOUS), ctx.queryParamMap());
    } catch (ToolException e) {
      throw new ApiException(e.error().code(), e.error().detail());
    }
  }
}
