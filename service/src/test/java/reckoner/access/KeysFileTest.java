package reckoner.access;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.SecureRandom;
import java.util.EnumSet;
import java.util.Set;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reckoner.spec.Json;
import tools.jackson.databind.json.JsonMapper;

/** The keys file as the contract's Access section describes it, and the keys it admits. */
final class KeysFileTest {
  private static final JsonMapper JSON = Json.newMapper();
  // SHA-256 of the ASCII text "abc": the first example of FIPS 180-2, Appendix B.1.
  private static final String ABC = "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad";

  @Test
  void read_goodFile_admitsItsSecrets(@TempDir Path dir) throws Exception {
    Path file = dir.resolve("keys.jsonl");
    Files.writeString(file, "# team keys\n{\"id\":\"team-a\",\"secret_sha256\":\"" + ABC + "\",\"scopes\":[\"invoke\",\"ledger:read\"],"
        + "\"rate_per_s\":2.5}\n\n{\"id\":\"ops\",\"secret_sha256\":\"" + ABC.toUpperCase().replace('B', 'C')
        + "\",\"scopes\":[\"admin\"]}\n");
    KeyRing ring = KeysFile.read(file, JSON);
    assertEquals(2, ring.keys().size());
    ApiKey a = ring.authenticate("abc").orElseThrow();
    assertEquals("team-a", a.id());
    assertEquals(EnumSet.of(Scope.INVOKE, Scope.LEDGER_READ), a.scopes());
    assertEquals(2.5, a.ratePerSecond());
    assertTrue(ring.authenticate("abd").isEmpty());
    assertTrue(ring.authenticate("").isEmpty());
    assertEquals(0, ring.byId("ops").orElseThrow().ratePerSecond());
    assertFalse(a.toString().contains(ABC), "a key's string form never shows its digest");
  }

  static Stream<Arguments> badLines() {
    String ok = "\"secret_sha256\":\"" + ABC + "\",\"scopes\":[\"invoke\"]";
    return Stream.of(
        Arguments.of("{\"id\":\"a\"," + ok + "}\nnot json", "keys.jsonl, line 2: not a JSON object"),
        Arguments.of("[1,2]", "keys.jsonl, line 1: not a JSON object"),
        Arguments.of("{" + ok + "}", "keys.jsonl, line 1: id must be 1 to 64 letters, digits, '.', '_' or '-'"),
        Arguments.of("{\"id\":\"a b\"," + ok + "}", "keys.jsonl, line 1: id must be 1 to 64 letters, digits, '.', '_' or '-'"),
        Arguments.of("{\"id\":\"a\",\"secret_sha256\":\"abc\",\"scopes\":[\"invoke\"]}",
            "keys.jsonl, line 1: secret_sha256 must be the 64 hex digits of the secret's SHA-256 digest"),
        Arguments.of("{\"id\":\"a\",\"secret_sha256\":\"" + ABC + "\",\"scopes\":[]}",
            "keys.jsonl, line 1: scopes must be a list of one or more of invoke, ledger:read, admin"),
        Arguments.of("{\"id\":\"a\",\"secret_sha256\":\"" + ABC + "\",\"scopes\":[\"write\"]}",
            "keys.jsonl, line 1: unknown scope \"write\"; scopes are invoke, ledger:read, admin"),
        Arguments.of("{\"id\":\"a\"," + ok + ",\"rate_per_s\":0}",
            "keys.jsonl, line 1: rate_per_s must be a number of calls a second above 0 (at most 1e9)"),
        Arguments.of("{\"id\":\"a\"," + ok + ",\"rate\":5}",
            "keys.jsonl, line 1: unknown member 'rate'; known: id, secret_sha256, scopes, rate_per_s"),
        Arguments.of("{\"id\":\"a\"," + ok + "}\n{\"id\":\"a\",\"secret_sha256\":\"" + ABC.replace('b', 'c') + "\",\"scopes\":[\"admin\"]}",
            "keys.jsonl, line 2: a second key with id 'a'"),
        Arguments.of("{\"id\":\"a\"," + ok + "}\n{\"id\":\"b\"," + ok + "}",
            "keys.jsonl, line 2: key 'b' has the same secret_sha256 as an earlier key"));
  }

  @ParameterizedTest
  @MethodSource("badLines")
  void read_badFile_isRefused_namingTheLine(String content, String message, @TempDir Path dir) throws Exception {
    Path file = dir.resolve("keys.jsonl");
    Files.writeString(file, content);
    KeysFileException e = assertThrows(KeysFileException.class, () -> KeysFile.read(file, JSON));
    assertEquals(dir.resolve(message).toString(), e.getMessage());
  }

  @Test
  void read_notUtf8_isRefused(@TempDir Path dir) throws Exception {
    Path file = dir.resolve("keys.jsonl");
    Files.write(file, new byte[] {'{', (byte) 0xff, '}'});
    assertTrue(assertThrows(KeysFileException.class, () -> KeysFile.read(file, JSON)).getMessage().endsWith(": is not UTF-8"));
  }

  @Test
  void keyMaker_lineAdmitsItsSecret_andNoOther(@TempDir Path dir) throws Exception {
    KeyMaker.NewKey k = KeyMaker.make("team-b", Set.of(Scope.LEDGER_READ, Scope.INVOKE), 100, new SecureRandom(), JSON);
    assertTrue(k.secret().startsWith("rk_") && k.secret().length() == 3 + 43, k.secret());
    assertFalse(k.line().contains(k.secret()), "the line holds the digest, not the secret");
    assertTrue(k.line().contains("\"scopes\":[\"invoke\",\"ledger:read\"]"), k.line());
    Path file = dir.resolve("keys.jsonl");
    Files.writeString(file, k.line() + "\n", StandardCharsets.UTF_8);
    KeyRing ring = KeysFile.read(file, JSON);
    assertEquals("team-b", ring.authenticate(k.secret()).orElseThrow().id());
    assertTrue(ring.authenticate(k.secret() + "x").isEmpty());
    KeyMaker.NewKey other = KeyMaker.make("team-b", Set.of(Scope.INVOKE), 0, new SecureRandom(), JSON);
    assertTrue(ring.authenticate(other.secret()).isEmpty(), "two secrets differ");
  }
}
