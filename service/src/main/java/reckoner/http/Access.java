package reckoner.http;

import io.javalin.http.Context;
import java.time.Duration;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import reckoner.access.ApiKey;
import reckoner.access.KeyStore;
import reckoner.access.RateLimits;
import reckoner.access.Scope;
import reckoner.access.StreamLimits;
import reckoner.tool.ErrorCode;

/**
 * The access check every matched route passes first ({@code beforeMatched}): an open route lets
 * anyone through; any other needs {@code Authorization: Bearer SECRET} of a key with the route's
 * scope: no or an unknown key is {@code 401 unauthorized} with {@code WWW-Authenticate: Bearer}, a
 * missing scope {@code 403 forbidden}. Without a keys file every caller is the anonymous caller.
 * Also the per-key rate limits and stream counts the routes apply. Secrets are never logged or
 * echoed: an error names the key's id, never what was sent.
 */
final class Access {
  private static final String CALLER = "reckoner.caller";
  /** Longest Authorization value read; a longer one is not a key of ours. */
  static final int MAX_AUTHORIZATION = 512;

  private final KeyStore keys; // null: no keys file
  private final RateLimits rates;
  private final StreamLimits streams;

  Access(KeyStore keys, RateLimits rates, StreamLimits streams) {
    this.keys = keys;
    this.rates = rates;
    this.streams = streams;
  }

  /** Whether the server checks keys at all. */
  boolean keysInForce() {
    return keys != null;
  }

  void check(Context ctx) {
    Need need = ctx.routeRoles().stream().filter(Need.class::isInstance).map(Need.class::cast).findFirst().orElse(Need.OPEN);
    if (need == Need.OPEN) {
      return;
    }
    if (keys == null) {
      ctx.attribute(CALLER, Caller.ANONYMOUS);
      return;
    }
    String header = ctx.header("Authorization");
    if (header == null || header.length() < 7 || !header.substring(0, 7).toLowerCase(Locale.ROOT).equals("bearer ")) {
      throw new ApiException(ErrorCode.UNAUTHORIZED, "this endpoint needs an API key: send Authorization: Bearer <secret>",
          Map.of("WWW-Authenticate", "Bearer realm=\"reckoner\""));
    }
    String secret = header.substring(7).strip();
    Optional<ApiKey> key = secret.isEmpty() || header.length() > MAX_AUTHORIZATION ? Optional.empty()
        : keys.ring().authenticate(secret);
    if (key.isEmpty()) {
      throw new ApiException(ErrorCode.UNAUTHORIZED, "the API key is not known (revoked, mistyped, or of another server)",
          Map.of("WWW-Authenticate", "Bearer realm=\"reckoner\", error=\"invalid_token\""));
    }
    Scope scope = need.scope().orElseThrow();
    boolean allowed = key.get().has(scope) || (scope == Scope.LEDGER_READ && key.get().has(Scope.ADMIN));
    if (!allowed) {
      throw new ApiException(ErrorCode.FORBIDDEN, "key '" + key.get().id() + "' lacks the scope " + scope.wireName()
          + " that this endpoint needs", Map.of("WWW-Authenticate",
              "Bearer realm=\"reckoner\", error=\"insufficient_scope\", scope=\"" + scope.wireName() + "\""));
    }
    ctx.attribute(CALLER, new Caller(key.get()));
  }

  /** The caller the check let through (the anonymous caller on an open route). */
  static Caller caller(Context ctx) {
    Caller c = ctx.attribute(CALLER);
    return c == null ? Caller.ANONYMOUS : c;
  }

  /** Takes {@code calls} from the caller's rate now, or refuses with {@code 429 rate_limited} and {@code Retry-After}. */
  void takeOrRefuse(Caller caller, long calls) {
    if (caller.key() == null) {
      return;
    }
    long burst = rates.burst(caller.key());
    if (calls > burst) {
      throw new ApiException(ErrorCode.LIMIT_EXCEEDED, "this request holds " + calls + " calls but key '" + caller.key().id()
          + "' may make at most " + burst + " at once (its rate and burst); send fewer, or stream them as NDJSON");
    }
    Duration wait = rates.tryTake(caller.key(), calls);
    if (!wait.isZero()) {
      long seconds = Math.max(1, (wait.toMillis() + 999) / 1000);
      throw new ApiException(ErrorCode.RATE_LIMITED, "key '" + caller.key().id() + "' is over its rate of "
          + rate(caller.key()) + " calls a second; retry after " + seconds + " s", Map.of("Retry-After", Long.toString(seconds)));
    }
  }

  /** Takes {@code calls} from the caller's rate, waiting for them: a stream over its rate slows down. */
  void take(Caller caller, long calls) throws InterruptedException {
    if (caller.key() != null) {
      rates.take(caller.key(), calls);
    }
  }

  /** A stream slot for the caller, or {@code 429 rate_limited} when its key has all its streams open. */
  AutoCloseable openStream(Caller caller) {
    return streams.open(caller.keyId()).orElseThrow(() -> new ApiException(ErrorCode.RATE_LIMITED, "key '" + caller.keyId()
        + "' has " + streams.perKey() + " streams open, its most; wait for one to end",
        Map.of("Retry-After", "1")));
  }

  private static String rate(ApiKey key) {
    double r = key.ratePerSecond();
    return r == Math.rint(r) ? Long.toString((long) r) : Double.toString(r);
  }
}
