package reckoner.conformance;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.ServerSocket;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import reckoner.spec.Json;
import tools.jackson.databind.json.JsonMapper;

/**
 * README, section "Settings", and the contract's "Running": the jar takes each setting as a flag, an
 * environment variable or a file key, in that precedence, and refuses what it cannot use with one
 * line (every setting in all three forms is checked in-process by {@code SettingsTest}).
 */
final class ReadmeSettingsIT {
  private static final JsonMapper JSON = Json.newMapper();

  private static String fillOpen(JarServer server) {
    String body = JSON.readTree(server.postJson("/v1/fill", "{\"document\":\"[[arith@1(1+1)]] <:arith@1(2+2):>\"}").body())
        .get("document").asString();
    return body;
  }

  @Test
  @DisplayName("Running: serve --port N --data-dir DIR; the data dir holds the ledger and facts/")
  void serve_portAndDataDir() throws Exception {
    Path dir = Files.createTempDirectory("running");
    try (JarServer server = JarServer.start("running", dir, List.of(), Map.of())) {
      assertEquals(200, server.get("/health/ready").statusCode());
      assertTrue(Files.exists(dir.resolve("ledger.db")));
      assertTrue(Files.isDirectory(dir.resolve("facts")));
      assertTrue(server.output().contains("serving") && server.output().contains("127.0.0.1:" + server.port()), server.output());
      assertTrue(server.output().contains("loopback only"), "says it listens on loopback only without keys: " + server.output());
    }
  }

  @Test
  @DisplayName("Settings: flag over environment over file; each form takes effect")
  void precedence_onTheRealJar() throws Exception {
    Path dir = Files.createTempDirectory("settings");
    Path config = dir.resolve("reckoner.properties");
    Files.writeString(config, "markup-open=[[\nmarkup-close=]]\ncache-size=0\n");
    try (JarServer fileOnly = JarServer.start("settings-file", List.of("--config", config.toString()), Map.of())) {
      assertEquals("[[arith@1(1+1) :: 2]] <:arith@1(2+2):>", fillOpen(fileOnly));
    }
    try (JarServer envOverFile = JarServer.start("settings-env", List.of(),
        Map.of("RECKONER_CONFIG", config.toString(), "RECKONER_MARKUP_SEPARATOR", " ~ "))) {
      assertEquals("[[arith@1(1+1) ~ 2]] <:arith@1(2+2):>", fillOpen(envOverFile));
    }
    try (JarServer flagOverEnv = JarServer.start("settings-flag", List.of("--config", config.toString(), "--markup-open", "<:",
        "--markup-close", ":>"), Map.of("RECKONER_MARKUP_OPEN", "[["))) {
      assertEquals("[[arith@1(1+1)]] <:arith@1(2+2) :: 4:>", fillOpen(flagOverEnv));
    }
  }

  @Test
  @DisplayName("Settings: a bad or unknown setting stops the start with one line naming it")
  void badSetting_oneLine() throws Exception {
    Path dir = Files.createTempDirectory("bad-settings");
    for (List<String> args : List.of(List.of("--port", "eighty"), List.of("--durability", "sometimes"),
        List.of("--retention-max-bytes", "5 KB"), List.of("--host", "0.0.0.0"))) {
      JarServer.Run run = JarServer.run(dir, concat(List.of("serve", "--data-dir", dir.toString()), args), Map.of(),
          Duration.ofMinutes(1));
      assertEquals(2, run.exitCode(), run.output());
      List<String> lines = run.output().lines().filter(l -> l.startsWith("reckoner: ")).toList();
      assertEquals(1, lines.size(), run.output());
      assertTrue(lines.get(0).contains(args.get(0).substring(2)), lines.get(0));
      assertFalse(run.output().contains("\tat "), "no stack trace: " + run.output());
    }
    Files.writeString(dir.resolve("bad.properties"), "colour=blue\n");
    JarServer.Run unknown = JarServer.run(dir, List.of("serve", "--config", dir.resolve("bad.properties").toString()), Map.of(),
        Duration.ofMinutes(1));
    assertEquals(2, unknown.exitCode());
    assertTrue(unknown.output().contains("unknown setting(s) [colour]"), unknown.output());
  }

  @Test
  @DisplayName("Settings: a taken port is one line naming the address, and nothing is started")
  void takenPort_oneLine() throws Exception {
    try (ServerSocket taken = new ServerSocket(0, 1, java.net.InetAddress.getLoopbackAddress())) {
      Path dir = Files.createTempDirectory("taken-port");
      JarServer.Run run = JarServer.run(dir, List.of("serve", "--port", Integer.toString(taken.getLocalPort()), "--data-dir",
          dir.toString()), Map.of(), Duration.ofMinutes(1));
      assertEquals(2, run.exitCode());
      assertEquals(List.of("reckoner: cannot listen on 127.0.0.1:" + taken.getLocalPort()
          + ": the port is in use by another process; stop it or choose another with --port"),
          run.output().lines().filter(l -> !l.contains(" INFO ") && !l.contains("\"level\"")).toList());
      assertFalse(Files.exists(dir.resolve("ledger.db")), "the ledger is not opened");
    }
  }

  private static List<String> concat(List<String> a, List<String> b) {
    List<String> out = new java.util.ArrayList<>(a);
    out.addAll(b);
    return out;
  }
}
