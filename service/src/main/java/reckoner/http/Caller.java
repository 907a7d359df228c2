package reckoner.http;

import java.util.Objects;
import reckoner.access.ApiKey;
import reckoner.access.Scope;
import reckoner.ledger.LedgerSink;

/**
 * Who made a request: an API key, or, on a server without a keys file (loopback only), the one
 * anonymous caller, who may do everything. Immutable.
 *
 * @param key the key, or null for the anonymous caller
 */
record Caller(ApiKey key) {
  static final Caller ANONYMOUS = new Caller(null);

  /** The id the ledger records the caller's calls under. */
  String keyId() {
    return key == null ? LedgerSink.ANONYMOUS : key.id();
  }

  /** The key id calls carry into the invoker: null for the anonymous caller. */
  String keyIdOrNull() {
    return key == null ? null : key.id();
  }

  boolean has(Scope scope) {
    Objects.requireNonNull(scope, "scope");
    return key == null || key.has(scope);
  }

  /** Whether the caller reads every key's records, not only its own. */
  boolean readsAllRecords() {
    return key == null || key.has(Scope.ADMIN);
  }
}
