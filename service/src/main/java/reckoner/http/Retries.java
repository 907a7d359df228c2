package reckoner.http;

import com.github.benmanes.caffeine.cache.Cache;
import com.github.benmanes.caffeine.cache.Caffeine;
import io.javalin.http.Context;
import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.Duration;
import java.util.Collection;
import java.util.HashMap;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import reckoner.ledger.Invocation;
import reckoner.ledger.LedgerStore;
import reckoner.tool.ErrorCode;

/**
 * Retries that record nothing twice ({@code Idempotency-Key}). Within one API key, the first request
 * with a key runs and its calls are recorded with the key (a batch's and a fill's calls with the key,
 * {@link Invocation#CALL_SEPARATOR} and their id or position) and a digest of the request; a later
 * request with the key and the same content is answered from those records ({@code "replayed":true},
 * no new record); the key with other content is {@code 409 idempotency_conflict}. A key in use by a
 * request still running is refused with 409 too, so that two attempts never run side by side in one
 * process; across replicas the ledger's unique index has the last word (see
 * {@link reckoner.ledger.SupersededException}). Thread-safe.
 */
final class Retries {
  static final String HEADER = "Idempotency-Key";
  static final String REPLAYED_HEADER = "Reckoner-Replayed";
  static final int MAX_KEY_LENGTH = 200;

  private final LedgerStore ledger;
  /**
   * Records of keyed calls answered in the last minutes, by API key and idempotency key: in async
   * durability an answer leaves before its record is committed, and a quick retry must still find it.
   */
  private final Cache<String, Invocation> recent = Caffeine.newBuilder().maximumSize(200_000)
      .expireAfterWrite(Duration.ofMinutes(10)).build();
  private final ConcurrentHashMap<String, Boolean> running = new ConcurrentHashMap<>();

  Retries(LedgerStore ledger) {
    this.ledger = ledger;
  }

  /** The request's idempotency key, or null without one; a malformed one is 400. */
  static String key(Context ctx) {
    String k = ctx.header(HEADER);
    if (k == null) {
      return null;
    }
    if (k.isEmpty() || k.length() > MAX_KEY_LENGTH || !k.chars().allMatch(c -> c >= 0x20 && c < 0x7f)) {
      throw new ApiException(ErrorCode.INVALID_ARGUMENT, HEADER + " must be 1 to " + MAX_KEY_LENGTH + " printable ASCII characters");
    }
    return k;
  }

  /** A key in use, until closed. */
  interface Running extends AutoCloseable {
    @Override
    void close();
  }

  /** Marks {@code key} of {@code caller} as in use until the returned handle is closed; 409 if it already is. */
  Running begin(Caller caller, String key) {
    String name = caller.keyId() + '\0' + key;
    if (running.putIfAbsent(name, Boolean.TRUE) != null) {
      throw new ApiException(ErrorCode.IDEMPOTENCY_CONFLICT, "a request with this " + HEADER
          + " is still running; send it again once that one has answered", Map.of("Retry-After", "1"));
    }
    return () -> running.remove(name);
  }

  /** The records of {@code caller} that hold any of {@code keys}: recent answers first, then the ledger. */
  Map<String, Invocation> recorded(Caller caller, Collection<String> keys) {
    Map<String, Invocation> found = new HashMap<>();
    List<String> missing = new java.util.ArrayList<>();
    for (String k : keys) {
      Invocation inv = recent.getIfPresent(caller.keyId() + '\0' + k);
      if (inv != null) {
        found.put(k, inv);
      } else {
        missing.add(k);
      }
    }
    if (!missing.isEmpty()) {
      found.putAll(ledger.findByIdempotencyKeys(caller.keyId(), missing));
    }
    return found;
  }

  /** The records of {@code caller} whose idempotency key starts with {@code key} and the separator (a fill's calls). */
  Map<String, Invocation> recordedUnder(Caller caller, String key, int most) {
    Map<String, Invocation> found = new HashMap<>();
    String prefix = key + Invocation.CALL_SEPARATOR;
    for (Invocation inv : ledger.findByIdempotencyPrefix(caller.keyId(), prefix, most)) {
      found.put(inv.idempotencyKey(), inv);
    }
    recent.asMap().forEach((name, inv) -> {
      if (name.startsWith(caller.keyId() + '\0') && inv.idempotencyKey().startsWith(prefix)) {
        found.putIfAbsent(inv.idempotencyKey(), inv);
      }
    });
    return found;
  }

  /** Keeps a keyed call's record for quick retries (see {@link #recent}). */
  void remember(Invocation inv) {
    if (inv.idempotencyKey() != null) {
      recent.put(inv.keyId() + '\0' + inv.idempotencyKey(), inv);
    }
  }

  /** Whether {@code recorded} was made by a request with this content; else the key names other content: 409. */
  static void requireSameRequest(Invocation recorded, String requestHash) {
    if (!recorded.requestHash().equals(requestHash)) {
      throw conflict();
    }
  }

  static ApiException conflict() {
    return new ApiException(ErrorCode.IDEMPOTENCY_CONFLICT, "this " + HEADER + " was used for a request with other content; "
        + "a retry must send the same request, and a new request needs a new key");
  }

  /** A digest of a request's parts, in order (each length-prefixed, so parts cannot run into each other). */
  static String hash(Object... parts) {
    try {
      MessageDigest d = MessageDigest.getInstance("SHA-256");
      for (Object p : parts) {
        byte[] bytes = p == null ? new byte[0] : p instanceof byte[] b ? b : p.toString().getBytes(StandardCharsets.UTF_8);
        int n = p == null ? -1 : bytes.length;
        d.update(new byte[] {(byte) (n >>> 24), (byte) (n >>> 16), (byte) (n >>> 8), (byte) n});
        d.update(bytes);
      }
      return HexFormat.of().formatHex(d.digest(), 0, 16);
    } catch (NoSuchAlgorithmException e) {
      throw new AssertionError("every Java platform has SHA-256", e);
    }
  }
}
