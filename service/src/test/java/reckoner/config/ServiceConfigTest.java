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

  /** Decimal prefixes are powers of 1000 and binary ones powers of 1024 (IEC 80000-13:2008, clause 4). */
  @org.junit.jupiter.params.ParameterizedTest
  @org.junit.jupiter.params.provider.CsvSource({
      "0, 0", "1500000, 1500000", "512B, 512", "20kB, 20000", "20KiB, 20480", "500MB, 500000000",
      "500 MB, 500000000", "3GB, 3000000000", "3GiB, 3221225472", "2T, 2000000000000", "2TiB, 2199023255552", "7M, 7000000"})
  void from_retentionMaxBytes_readsDecimalAndBinaryPrefixes(String text, long bytes) {
    assertEquals(bytes, ServiceConfig.from(Map.of("retention-max-bytes", text)).retentionMaxBytes());
  }

  @org.junit.jupiter.params.ParameterizedTest
  @org.junit.jupiter.params.provider.ValueSource(strings = {"", "-5", "5.5GB", "5 GB extra", "5KB", "5kiB", "5PB", "9999999TB", "lots"})
  void from_retentionMaxBytes_badSize_isRefusedNamingTheSetting(String text) {
    String message = assertThrows(ConfigException.class, () -> ServiceConfig.from(Map.of("retention-max-bytes", text))).getMessage();
    assertTrue(message.startsWith("retention-max-bytes"), message);
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
