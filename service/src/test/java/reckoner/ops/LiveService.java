package reckoner.ops;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import reckoner.Service;
import reckoner.config.ServiceConfig;

/** The real service in this JVM on a free loopback port, and a mixed load of calls to send it. */
final class LiveService implements AutoCloseable {
  /** One call of each tool version served, and some that fail, as {tool path, JSON body}. */
  static final List<String[]> MIXED_CALLS = List.of(
      new String[] {"arith/1", "{\"expr\":\"1250/4000\"}"},
      new String[] {"arith/1", "{\"expr\":\"22/7\",\"digits\":5}"},
      new String[] {"arith/1", "{\"expr\":\"1/0\"}"},
      new String[] {"dates/1", "{\"text\":\"45 days ago\",\"as_of\":\"2031-06-14\"}"},
      new String[] {"dates/1", "{\"op\":\"weekday\",\"date\":\"2031-02-30\"}"},
      new String[] {"units/1", "{\"text\":\"3.5 km to mi\"}"},
      new String[] {"units/1", "{\"text\":\"3 parsecs to furlongs per fortnight\"}"},
      new String[] {"facts/1", "{\"key\":\"capital\"}"},
      new String[] {"facts/1", "{\"key\":\"presidnet\"}"});

  private final Service service;
  private final HttpClient client = HttpClient.newBuilder().version(HttpClient.Version.HTTP_1_1)
      .connectTimeout(Duration.ofSeconds(5)).build();

  private LiveService(Service service) {
    this.service = service;
  }

  static LiveService start() {
    try {
      Path dir = Files.createTempDirectory("reckoner-ops");
      return new LiveService(Service.start(ServiceConfig.from(Map.of("port", "0", "data-dir", dir.toString())), Clock.systemUTC()));
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  int port() {
    return service.port();
  }

  URI uri(String path) {
    return URI.create("http://127.0.0.1:" + port() + path);
  }

  /** Sends call {@code i} of {@link #MIXED_CALLS} (cycling) and returns the status. */
  int call(int i) {
    String[] call = MIXED_CALLS.get(Math.floorMod(i, MIXED_CALLS.size()));
    return post("/v1/tools/" + call[0] + "/invoke", call[1]).statusCode();
  }

  HttpResponse<String> post(String path, String json) {
    return send(HttpRequest.newBuilder(uri(path)).header("Content-Type", "application/json")
        .POST(HttpRequest.BodyPublishers.ofString(json)).timeout(Duration.ofSeconds(20)).build());
  }

  HttpResponse<String> get(String path) {
    return send(HttpRequest.newBuilder(uri(path)).GET().timeout(Duration.ofSeconds(20)).build());
  }

  private HttpResponse<String> send(HttpRequest request) {
    try {
      return client.send(request, HttpResponse.BodyHandlers.ofString());
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException(e);
    }
  }

  @Override
  public void close() {
    service.close();
  }
}
