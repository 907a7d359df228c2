package reckoner.http;

import io.javalin.security.RouteRole;
import java.util.Optional;
import reckoner.access.Scope;

/** What a route asks of its caller: nothing, or a key with a scope. Every route names one. */
enum Need implements RouteRole {
  /** Open to anyone who can reach the port: health, metrics, the OpenAPI document, tool specs, problem types. */
  OPEN(null),
  /** A key with {@code invoke}: tools, batch, splice, fill. */
  INVOKE(Scope.INVOKE),
  /** A key with {@code ledger:read} (its own records) or {@code admin} (every key's). */
  LEDGER_READ(Scope.LEDGER_READ),
  /** A key with {@code admin}: reloads, the key list, the status page. */
  ADMIN(Scope.ADMIN);

  private final Scope scope;

  Need(Scope scope) {
    this.scope = scope;
  }

  /** The scope a key needs, empty for an open route. */
  Optional<Scope> scope() {
    return Optional.ofNullable(scope);
  }
}
