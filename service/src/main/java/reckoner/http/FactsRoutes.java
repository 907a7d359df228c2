package reckoner.http;

import io.javalin.http.Context;
import reckoner.facts.FactStore;
import reckoner.data.ReloadReport;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolError;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;

/**
 * Fact-set administration: {@code GET /v1/admin/facts} (the sets served and their data versions)
 * and {@code POST /v1/admin/facts/reload} (read every file again; swap only if all are sound).
 * A reload that keeps the old data answers 422 {@code data_error} with every problem's file, line
 * and reason.
 */
final class FactsRoutes {
  private final FactStore store;
  private final Responses responses;

  FactsRoutes(FactStore store, Responses responses) {
    this.store = store;
    this.responses = responses;
  }

  void show(Context ctx) {
    ObjectNode body = responses.object();
    body.put("default_set", store.defaultSet());
    ObjectNode sets = body.putObject("sets");
    store.dataVersions().forEach(sets::put);
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
      body = responses.problemBody(ToolError.of(ErrorCode.DATA_ERROR, first == null ? "the fact files could not be read"
          : report.problems().size() + " problem(s) in the fact files; first: " + first + "; the old data keeps serving"), null);
      ctx.header(Responses.ERROR_CODE_HEADER, ErrorCode.DATA_ERROR.wireName());
    }
    body.put("applied", report.applied());
    ArrayNode files = body.putArray("files");
    for (ReloadReport.FileResult f : report.files()) {
      ObjectNode n = files.addObject().put("file", f.file()).put("facts", f.records());
      ArrayNode problems = n.putArray("problems");
      f.problems().forEach(p -> problems.addObject().put("file", p.file()).put("line", p.line()).put("reason", p.reason()));
    }
    ArrayNode sets = body.putArray("sets");
    for (ReloadReport.Change c : report.changes()) {
      ObjectNode n = sets.addObject().put("set", c.name()).put("facts", c.records()).put("changed", c.isChanged());
      c.before().ifPresent(v -> n.put("data_version_before", v));
      c.after().ifPresent(v -> n.put("data_version_after", v));
    }
    ctx.status(report.applied() ? 200 : 422).contentType(report.applied() ? MediaTypes.JSON : MediaTypes.PROBLEM)
        .result(responses.json().writeValueAsBytes(body));
  }
}
