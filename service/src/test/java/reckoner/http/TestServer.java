package reckoner.http;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.util.Map;
import reckoner.Service;
import reckoner.config.ServiceConfig;

/** Starts the real service on a free loopback port, once per test class that uses it. */
final class TestServer implements AutoCloseable {
  private final Service service;
  private final Path dataDir;

  private TestServer(Service service, Path dataDir) {
    this.service = service;
    this.dataDir = dataDir;
  }

  static TestServer start() {
    try {
      Path dir = Files.createTempDirectory("reckoner-test");
      ServiceConfig config = ServiceConfig.from(Map.of("port", "0", "data-dir", dir.toString(), "max-body-bytes", "65536"));
      return new TestServer(Service.start(config, Clock.systemUTC()), dir);
    } catch (IOException e) {
      throw new java.io.UncheckedIOException(e);
    }
  }

  int port() {
    return service.port();
  }

  Path dataDir() {
    return dataDir;
  }

  @Override
  public void close() {
    service.close();
  }
}
