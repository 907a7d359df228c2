package reckoner.http;

import io.javalin.http.Context;
import reckoner.data.ReloadReport;
import reckoner.search.SearchStore;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolError;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;

/**
 * Search collection administration: {@code GET /v1/admin/search} (the collections served, their
 * data versions, sizes, languages and where their indexes live) and {@code POST
 * /v1/admin/search/reload} (read every collection file again; swap only if all are sound). A
 * reload that keeps the old data answers 422 {@code data_error} with every problem's file, line
 * and reason.
 */
final class SearchRoutes {
  private final SearchStore store;
  private final Responses responses;

  SearchRoutes(SearchStore store, Responses responses) {
    this.store = store;
    this.responses = responses;
  }

  void show(Context ctx) {
    ObjectNode body = responses.object();
    body.put("default_collection", store.defaultCollection());
    ObjectNode collections = body.putObject("collections");
    for (SearchStore.CollectionInfo c : store.collections()) {
      collections.putObject(c.name())
          .put("data_version", c.dataVersion())
          .put("documents", c.documents())
          .put("passages", c.passages())
          .put("language", c.language())
          .put("index", c.onDisk() ? "disk" : "memory");
    }
    body.put("reloads", store.reloadSuccesses());
    body.put("failed_reloads", store.reloadFailures());
    responses.json(ctx, 200, body);
  }

  void reload(Context ctx) {
    ReloadReport report = store.reload();
    ObjectNode body;
    if (report.applied()) {
      body = responses.object();
    } else {
      ReloadReport.Problem first = report.problems().isEmpty() ? null : report.problems().get(0);
      body = responses.problemBody(ToolError.of(ErrorCode.DATA_ERROR, first == null ? "the collection files could not be read"
          : report.problems().size() + " problem(s) in the collection files; first: " + first
              + "; the old collections keep serving"), null);
      ctx.header(Responses.ERROR_CODE_HEADER, ErrorCode.DATA_ERROR.wireName());
    }
    body.put("applied", report.applied());
    ArrayNode files = body.putArray("files");
    for (ReloadReport.FileResult f : report.files()) {
      ObjectNode n = files.addObject().put("file", f.file()).put("documents", f.records());
      ArrayNode problems = n.putArray("problems");
      f.problems().forEach(p -> problems.addObject().put("file", p.file()).put("line", p.line()).put("reason", p.reason()));
    }
    ArrayNode collections = body.putArray("collections");
    for (ReloadReport.Change c : report.changes()) {
      ObjectNode n = collections.addObject().put("collection", c.name()).put("documents", c.records())
          .put("changed", c.isChanged());
      c.before().ifPresent(v -> n.put("data_version_before", v));
      c.after().ifPresent(v -> n.put("data_version_after", v));
    }
    ctx.status(report.applied() ? 200 : 422).contentType(report.applied() ? MediaTypes.JSON : MediaTypes.PROBLEM)
        .result(responses.json().writeValueAsBytes(body));
  }
}
