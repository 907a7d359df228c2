package reckoner.http;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.regex.Pattern;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.node.ObjectNode;

/**
 * Writes the route table's access rules into the OpenAPI document: a bearer security scheme, and on
 * each operation the scope it needs (none for an open one). Every operation must belong to a route
 * and every route must have an operation, or the server does not start: the document and the
 * server cannot disagree about what exists or who may call it.
 */
final class OpenApiSecurity {
  static final String SCHEME = "apiKey";

  private OpenApiSecurity() {}

  static void document(ObjectNode openApi, List<HttpApi.RouteInfo> routes, boolean keysInForce) {
    ObjectNode scheme = openApi.withObject("/components").withObject("/securitySchemes").putObject(SCHEME);
    scheme.put("type", "http");
    scheme.put("scheme", "bearer");
    scheme.put("description", "An API key's secret, as Authorization: Bearer <secret>. Scopes: invoke, ledger:read, admin."
        + (keysInForce ? "" : " This server has no keys file: it listens on loopback only and asks for no key."));
    List<HttpApi.RouteInfo> unmatched = new ArrayList<>(routes);
    for (Map.Entry<String, JsonNode> path : openApi.get("paths").properties()) {
      for (Map.Entry<String, JsonNode> op : path.getValue().properties()) {
        String method = op.getKey().toUpperCase(java.util.Locale.ROOT);
        HttpApi.RouteInfo route = routes.stream()
            .filter(r -> r.method().equals(method) && matches(r.path(), path.getKey())).findFirst()
            .orElseThrow(() -> new IllegalStateException("the OpenAPI document lists " + method + " " + path.getKey()
                + " but no route serves it"));
        unmatched.remove(route);
        ObjectNode operation = (ObjectNode) op.getValue();
        if (route.scope().equals("open")) {
          operation.putArray("security").addObject(); // {}: no key needed
        } else {
          operation.putArray("security").addObject().putArray(SCHEME).add(route.scope());
          ObjectNode responses = operation.withObject("/responses");
          problem(responses, "401", "No key, or an unknown one (WWW-Authenticate: Bearer)");
          problem(responses, "403", "The key lacks the scope " + route.scope());
          if (route.scope().equals("invoke")) {
            problem(responses, "429", "The key is over its rate, or has all its streams open (Retry-After)");
          }
        }
      }
    }
    if (!unmatched.isEmpty()) {
      throw new IllegalStateException("routes missing from the OpenAPI document: " + unmatched);
    }
  }

  /** Whether an OpenAPI path ({@code /v1/tools/arith/1/invoke}) is one of a route's ({@code /v1/tools/{name}/{version}/invoke}). */
  static boolean matches(String routePath, String openApiPath) {
    String regex = Pattern.quote(routePath).replaceAll("\\{[^}]+\\}", "\\\\E[^/]+\\\\Q");
    return openApiPath.matches(regex);
  }

  private static void problem(ObjectNode responses, String status, String description) {
    if (responses.has(status)) {
      return;
    }
    ObjectNode r = responses.putObject(status);
    r.put("description", description);
    ObjectNode c = r.putObject("content");
    c.putObject("application/problem+json").putObject("schema").put("$ref", "#/components/schemas/Problem");
    c.putObject("text/plain").putObject("schema").put("type", "string");
  }
}
