package reckoner.http;

import io.javalin.http.Context;
import reckoner.access.ApiKey;
import reckoner.access.KeyStore;
import reckoner.access.Scope;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolError;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;

/**
 * Key administration: {@code GET /v1/admin/keys} (the keys in force: ids, scopes and rates, never
 * digests) and {@code POST /v1/admin/keys/reload} (read the keys file again; swap only if it is
 * sound, else 422 {@code data_error} with the reason and the old keys still in force).
 */
final class KeysRoutes {
  private final KeyStore store; // null: no keys file
  private final Responses responses;

  KeysRoutes(KeyStore store, Responses responses) {
    this.store = store;
    this.responses = responses;
  }

  void show(Context ctx) {
    ObjectNode body = responses.object();
    if (store == null) {
      body.putNull("file");
      body.putArray("keys");
      responses.json(ctx, 200, body);
      return;
    }
    body.put("file", store.file().toString());
    ArrayNode keys = body.putArray("keys");
    for (ApiKey k : store.ring().keys()) {
      ObjectNode n = keys.addObject();
      n.put("id", k.id());
      ArrayNode scopes = n.putArray("scopes");
      for (Scope s : Scope.values()) {
        if (k.has(s)) {
          scopes.add(s.wireName());
        }
      }
      if (k.ratePerSecond() > 0) {
        n.put("rate_per_s", k.ratePerSecond());
      }
    }
    if (store.lastProblem() != null) {
      body.put("last_reload_problem", store.lastProblem());
    }
    responses.json(ctx, 200, body);
  }

  void reload(Context ctx) {
    if (store == null) {
      throw new ApiException(ErrorCode.INVALID_ARGUMENT, "this server has no keys file (setting keys-file)");
    }
    KeyStore.Reload r = store.reload();
    if (!r.applied()) {
      responses.problem(ctx, ToolError.of(ErrorCode.DATA_ERROR, "the keys file was refused and the old keys stay in force: "
          + r.problem()), java.util.Map.of());
      return;
    }
    responses.json(ctx, 200, responses.object().put("applied", true).put("changed", r.changed()).put("keys", r.keys()));
  }
}
