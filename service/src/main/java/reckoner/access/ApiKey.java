package reckoner.access;

import java.util.EnumSet;
import java.util.Objects;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * One API key as the keys file describes it: its id (what the ledger records), the SHA-256 digest
 * of its secret, its scopes, and its rate limit in calls per second (0: none). Immutable.
 */
public final class ApiKey {
  private static final Pattern ID = Pattern.compile("[A-Za-z0-9][A-Za-z0-9._-]{0,63}");

  private final String id;
  private final byte[] secretSha256;
  private final Set<Scope> scopes;
  private final double ratePerSecond;

  ApiKey(String id, byte[] secretSha256, Set<Scope> scopes, double ratePerSecond) {
    Objects.requireNonNull(id, "id");
    if (!ID.matcher(id).matches()) {
      throw new IllegalArgumentException("id must be 1 to 64 letters, digits, '.', '_' or '-', starting with a letter or digit");
    }
    if (secretSha256.length != 32) {
      throw new IllegalArgumentException("secret_sha256 must be 32 bytes");
    }
    if (scopes.isEmpty()) {
      throw new IllegalArgumentException("scopes must name at least one scope");
    }
    if (!(ratePerSecond >= 0) || Double.isInfinite(ratePerSecond)) {
      throw new IllegalArgumentException("rate_per_s must be a positive number");
    }
    this.id = id;
    this.secretSha256 = secretSha256.clone();
    this.scopes = java.util.Collections.unmodifiableSet(EnumSet.copyOf(scopes));
    this.ratePerSecond = ratePerSecond;
  }

  /** Whether {@code id} may name a key. */
  public static boolean isValidId(String id) {
    return id != null && ID.matcher(id).matches();
  }

  public String id() {
    return id;
  }

  public Set<Scope> scopes() {
    return scopes;
  }

  /** Calls a second this key may make; 0 means no limit. */
  public double ratePerSecond() {
    return ratePerSecond;
  }

  public boolean has(Scope scope) {
    return scopes.contains(scope);
  }

  /** Compares a digest with this key's, in time that does not depend on where they differ. */
  boolean digestEquals(byte[] digest) {
    return java.security.MessageDigest.isEqual(secretSha256, digest);
  }

  byte[] digest() {
    return secretSha256.clone();
  }

  @Override
  public String toString() {
    return "ApiKey[" + id + " " + scopes + (ratePerSecond > 0 ? " " + ratePerSecond + "/s" : "") + "]"; // never the digest
  }
}
