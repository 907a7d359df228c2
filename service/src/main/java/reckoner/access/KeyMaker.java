package reckoner.access;

import java.security.SecureRandom;
import java.util.Base64;
import java.util.HexFormat;
import java.util.Set;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;

/** Makes a new key: a random secret and the keys-file line that admits it. */
public final class KeyMaker {
  /** Secret bytes: 256 bits from the platform's strong random source. */
  static final int SECRET_BYTES = 32;
  /** Every secret starts with this, so a leaked one is easy to recognise in logs and code scans. */
  public static final String PREFIX = "rk_";

  private KeyMaker() {}

  /** A new key: its secret (shown once, never stored) and its line for the keys file. */
  public record NewKey(String secret, String line) {}

  public static NewKey make(String id, Set<Scope> scopes, double ratePerSecond, SecureRandom random, JsonMapper json) {
    if (!ApiKey.isValidId(id)) {
      throw new IllegalArgumentException("the id must be 1 to 64 letters, digits, '.', '_' or '-', starting with a letter or digit");
    }
    if (scopes.isEmpty()) {
      throw new IllegalArgumentException("give at least one scope: invoke, ledger:read or admin");
    }
    byte[] bytes = new byte[SECRET_BYTES];
    random.nextBytes(bytes);
    String secret = PREFIX + Base64.getUrlEncoder().withoutPadding().encodeToString(bytes);
    ObjectNode line = json.createObjectNode();
    line.put("id", id);
    line.put("secret_sha256", HexFormat.of().formatHex(KeyRing.sha256(secret)));
    ArrayNode s = line.putArray("scopes");
    for (Scope scope : Scope.values()) {
      if (scopes.contains(scope)) {
        s.add(scope.wireName());
      }
    }
    if (ratePerSecond > 0) {
      line.put("rate_per_s", ratePerSecond);
    }
    return new NewKey(secret, json.writeValueAsString(line));
  }
}
