package reckoner.config;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

final class ServiceConfigTest {
  @Test
  void from_empty_givesTheDocumentedDefaults() {
    ServiceConfig c = ServiceConfig.from(Map.of());
    assertEquals("127.0.0.1", c.host());
    assertEquals(8080, c.port());
    assertEquals(Path.of("./data"), c.dataDir());
    assertEquals(1_048_576, c.maxBodyBytes());
    assertFalse(c.openAccess());
  }

  @Test
  void merge_flagBeatsEnvironmentBeatsFile(@TempDir Path dir) throws IOException {
    Path file = dir.resolve("reckoner.properties");
    Files.writeString(file, "port=7000\ndata-dir=/from/file\nmax-body-bytes=2048\n");
    Map<String, String> env = Map.of("RECKONER_PORT", "7001", "RECKONER_DATA_DIR", "/from/env", "PATH", "/bin");
    ServiceConfig c = ServiceConfig.from(ServiceConfig.merge(file, env, Map.of("port", "7002")));
    assertEquals(7002, c.port());
    assertEquals(Path.of("/from/env"), c.dataDir());
    assertEquals(2048, c.maxBodyBytes());
  }

  @Test
  void from_badValues_failNamingTheSetting() {
    assertEquals("port must be a whole number but was 'eighty'",
        assertThrows(ConfigException.class, () -> ServiceConfig.from(Map.of("port", "eighty"))).getMessage());
    assertEquals("port must be between 0 and 65535 but was 70000",
        assertThrows(ConfigException.class, () -> ServiceConfig.from(Map.of("port", "70000"))).getMessage());
    assertTrue(assertThrows(ConfigException.class, () -> ServiceConfig.from(Map.of("colour", "blue"))).getMessage()
        .startsWith("unknown setting(s) [colour]"));
    assertEquals("open-access must be true or false but was 'yes'",
        assertThrows(ConfigException.class, () -> ServiceConfig.from(Map.of("open-access", "yes"))).getMessage());
  }

  @Test
  void from_nonLoopbackHostWithoutOptIn_isRefused() {
    assertTrue(assertThrows(ConfigException.class, () -> ServiceConfig.from(Map.of("host", "0.0.0.0"))).getMessage()
        .startsWith("refusing to listen on 0.0.0.0 without API keys"));
    assertEquals("0.0.0.0", ServiceConfig.from(Map.of("host", "0.0.0.0", "open-access", "true")).host());
    assertEquals("::1", ServiceConfig.from(Map.of("host", "::1")).host());
    assertEquals("localhost", ServiceConfig.from(Map.of("host", "localhost")).host());
  }
}
