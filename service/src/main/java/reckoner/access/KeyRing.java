package reckoner.access;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.List;
import java.util.Optional;

/**
 * The keys in force: an immutable list, and the one place a presented secret is checked. Every
 * check digests the secret once and compares the digest with every key's, whole, in constant time,
 * so neither the time taken nor an early exit tells which key or which byte came close.
 */
public final class KeyRing {
  private static final KeyRing EMPTY = new KeyRing(List.of(), "");
  private final List<ApiKey> keys;
  private final String digest; // of the file's content, to tell a real change from a touch

  KeyRing(List<ApiKey> keys, String digest) {
    this.keys = List.copyOf(keys);
    this.digest = digest;
  }

  static KeyRing empty() {
    return EMPTY;
  }

  public List<ApiKey> keys() {
    return keys;
  }

  String contentDigest() {
    return digest;
  }

  /** The key whose secret is {@code secret}, if any. */
  public Optional<ApiKey> authenticate(String secret) {
    byte[] presented = sha256(secret);
    ApiKey found = null;
    for (ApiKey k : keys) { // no early exit: the same work whichever key matches
      if (k.digestEquals(presented) && found == null) {
        found = k;
      }
    }
    return Optional.ofNullable(found);
  }

  /** The key named {@code id}, if any. */
  public Optional<ApiKey> byId(String id) {
    return keys.stream().filter(k -> k.id().equals(id)).findFirst();
  }

  static byte[] sha256(String secret) {
    try {
      return MessageDigest.getInstance("SHA-256").digest(secret.getBytes(StandardCharsets.UTF_8));
    } catch (NoSuchAlgorithmException e) {
      throw new AssertionError("every Java platform has SHA-256", e);
    }
  }
}
