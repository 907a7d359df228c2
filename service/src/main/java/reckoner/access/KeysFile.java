package reckoner.access;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.HashSet;
import java.util.HexFormat;
import java.util.List;
import java.util.Set;
import tools.jackson.core.JacksonException;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Reads the keys file: JSON Lines, one key a line,
 * {@code {"id":"…","secret_sha256":"<64 hex digits>","scopes":["invoke","ledger:read","admin"],"rate_per_s":N?}}.
 * Blank lines and lines starting with {@code #} are skipped. The whole file is refused, naming the
 * line, if any line is not such a key, two keys share an id or a digest, or a member is unknown.
 */
final class KeysFile {
  private static final Set<String> MEMBERS = Set.of("id", "secret_sha256", "scopes", "rate_per_s");
  /** Largest keys file read; a bigger one is refused (it is a short list of keys). */
  static final long MAX_BYTES = 1 << 20;

  private KeysFile() {}

  static KeyRing read(Path file, JsonMapper json) throws KeysFileException {
    String name = file.toString();
    byte[] bytes;
    try {
      if (Files.size(file) > MAX_BYTES) {
        throw new KeysFileException(name, 0, "larger than " + MAX_BYTES + " bytes");
      }
      bytes = Files.readAllBytes(file);
    } catch (IOException e) {
      throw new KeysFileException(name, 0, "cannot be read: " + e.getMessage());
    }
    String text;
    try {
      text = StandardCharsets.UTF_8.newDecoder().decode(java.nio.ByteBuffer.wrap(bytes)).toString();
    } catch (java.nio.charset.CharacterCodingException e) {
      throw new KeysFileException(name, 0, "is not UTF-8");
    }
    List<ApiKey> keys = new ArrayList<>();
    Set<String> ids = new HashSet<>();
    Set<String> digests = new HashSet<>();
    String[] lines = text.split("\n", -1);
    for (int i = 0; i < lines.length; i++) {
      String line = lines[i].strip();
      if (line.isEmpty() || line.startsWith("#")) {
        continue;
      }
      ApiKey key = parse(json, line, name, i + 1);
      if (!ids.add(key.id())) {
        throw new KeysFileException(name, i + 1, "a second key with id '" + key.id() + "'");
      }
      if (!digests.add(HexFormat.of().formatHex(key.digest()))) {
        throw new KeysFileException(name, i + 1, "key '" + key.id() + "' has the same secret_sha256 as an earlier key");
      }
      keys.add(key);
    }
    return new KeyRing(keys, HexFormat.of().formatHex(KeyRing.sha256(text)));
  }

  private static ApiKey parse(JsonMapper json, String line, String file, int n) throws KeysFileException {
    JsonNode node;
    try {
      node = json.readTree(line);
    } catch (JacksonException e) {
      throw new KeysFileException(file, n, "not a JSON object");
    }
    if (node == null || !node.isObject()) {
      throw new KeysFileException(file, n, "not a JSON object");
    }
    for (String member : node.propertyNames()) {
      if (!MEMBERS.contains(member)) {
        throw new KeysFileException(file, n, "unknown member '" + clip(member) + "'; known: id, secret_sha256, scopes, rate_per_s");
      }
    }
    JsonNode id = node.get("id");
    if (id == null || !id.isString() || !ApiKey.isValidId(id.stringValue())) {
      throw new KeysFileException(file, n, "id must be 1 to 64 letters, digits, '.', '_' or '-'");
    }
    JsonNode digest = node.get("secret_sha256");
    if (digest == null || !digest.isString() || !digest.stringValue().matches("[0-9a-fA-F]{64}")) {
      throw new KeysFileException(file, n, "secret_sha256 must be the 64 hex digits of the secret's SHA-256 digest");
    }
    JsonNode scopes = node.get("scopes");
    if (scopes == null || !scopes.isArray() || scopes.isEmpty()) {
      throw new KeysFileException(file, n, "scopes must be a list of one or more of invoke, ledger:read, admin");
    }
    Set<Scope> set = EnumSet.noneOf(Scope.class);
    for (JsonNode s : scopes) {
      Scope scope = s.isString() ? Scope.parse(s.stringValue()).orElse(null) : null;
      if (scope == null) {
        throw new KeysFileException(file, n, "unknown scope " + clip(s.toString()) + "; scopes are invoke, ledger:read, admin");
      }
      set.add(scope);
    }
    double rate = 0;
    JsonNode r = node.get("rate_per_s");
    if (r != null && !r.isNull()) {
      if (!r.isNumber() || !(r.doubleValue() > 0) || r.doubleValue() > 1e9) {
        throw new KeysFileException(file, n, "rate_per_s must be a number of calls a second above 0 (at most 1e9)");
      }
      rate = r.doubleValue();
    }
    return new ApiKey(id.stringValue(), HexFormat.of().parseHex(digest.stringValue().toLowerCase(java.util.Locale.ROOT)), set, rate);
  }

  private static String clip(String s) {
    return s.length() <= 40 ? s : s.substring(0, 37) + "...";
  }
}
