package reckoner.call;

import java.util.Objects;
import java.util.OptionalInt;
import tools.jackson.databind.JsonNode;

/**
 * One call as a caller sent it: a tool name, a version (empty for the newest), the JSON
 * arguments, and the tags the call travels with. Immutable.
 *
 * @param asOf the reference time from a header ({@code Reckoner-As-Of}); it fills the tool's
 *     {@code as_of} argument when the arguments lack one and the tool takes one; may be null
 * @param run caller's run tag, may be null
 * @param ref caller's ref tag, may be null
 * @param keyId the id of the API key the call is made under; null for the anonymous key (no keys file)
 * @param idempotencyKey what names the call for retries (the caller's {@code Idempotency-Key}, and for
 *     a call in a batch or a fill its id there), or null; recorded with the invocation
 * @param requestHash a digest of the request's content under that key, or null
 */
public record CallRequest(String tool, OptionalInt version, JsonNode args, String asOf, String run, String ref, String keyId,
    String idempotencyKey, String requestHash) {
  public CallRequest {
    Objects.requireNonNull(tool, "tool");
    Objects.requireNonNull(version, "version");
    Objects.requireNonNull(args, "args");
    if ((idempotencyKey == null) != (requestHash == null)) {
      throw new IllegalArgumentException("an idempotency key and a request hash come together");
    }
  }

  /** A call under {@code keyId}, without an idempotency key. */
  public CallRequest(String tool, OptionalInt version, JsonNode args, String asOf, String run, String ref, String keyId) {
    this(tool, version, args, asOf, run, ref, keyId, null, null);
  }

  /** A call under the anonymous key. */
  public CallRequest(String tool, OptionalInt version, JsonNode args, String asOf, String run, String ref) {
    this(tool, version, args, asOf, run, ref, null);
  }

  /** A copy named for retries by {@code idempotencyKey}, with the digest of its request. This instance is unaffected. */
  public CallRequest withIdempotency(String idempotencyKey, String requestHash) {
    return new CallRequest(tool, version, args, asOf, run, ref, keyId, idempotencyKey, requestHash);
  }

  public static CallRequest of(String tool, int version, JsonNode args) {
    return new CallRequest(tool, OptionalInt.of(version), args, null, null, null);
  }
}
