package reckoner.ledger;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.time.Clock;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import reckoner.Service;
import reckoner.config.ServiceConfig;
import reckoner.Prerequisites;

/**
 * The whole service on a PostgreSQL ledger, with PostgreSQL stopped mid-run: calls answer 503
 * unavailable with Retry-After and readiness turns false; after PostgreSQL restarts, calls and
 * writes resume by themselves, and every call acknowledged before, during or after is in the
 * ledger. Needs the cluster of {@code .ci/postgres.sh}; skipped without it.
 */
final class ServiceOutageTest {
  private static final String DATA = System.getenv("RECKONER_TEST_PG_DATA");
  private static final String BIN = System.getenv("RECKONER_TEST_PG_BIN");
  private static final Pattern ID = Pattern.compile("\"invocation_id\":\"([0-9a-f-]{36})\"");

  @Test
  void postgresStoppedMidRun_callsAre503_thenResume_withNoAcknowledgedCallLost() throws Exception {
    Prerequisites.require(DATA != null && BIN != null, "RECKONER_TEST_PG_DATA and RECKONER_TEST_PG_BIN are not set (run .ci/postgres.sh)");
    String url = PostgresLedgerStoreTest.freshSchemaUrl("service_outage");
    Service service = Service.start(ServiceConfig.from(Map.of("port", "0", "data-dir", Files.createTempDirectory("outage").toString(),
        "ledger", "postgresql", "ledger-url", url)), Clock.systemUTC());
    HttpClient client = HttpClient.newBuilder().version(HttpClient.Version.HTTP_1_1).build();
    List<String> acknowledged = new ArrayList<>();
    try {
      for (int i = 0; i < 20; i++) {
        HttpResponse<String> r = invoke(client, service.port(), i);
        assertEquals(200, r.statusCode(), r.body());
        acknowledged.add(id(r));
      }
      pgCtl("stop", "-m", "fast");
      try {
        HttpResponse<String> during = invoke(client, service.port(), 1000);
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(60);
        while (during.statusCode() == 200 && System.nanoTime() < deadline) { // a commit already under way may still land
          acknowledged.add(id(during));
          during = invoke(client, service.port(), 1000);
        }
        assertEquals(503, during.statusCode(), during.body());
        assertTrue(during.body().contains("\"code\":\"unavailable\""), during.body());
        assertTrue(during.headers().firstValue("Retry-After").isPresent(), "Retry-After is sent");
        assertEquals(503, get(client, service.port(), "/health/ready").statusCode());
      } finally {
        pgCtl("start", "-l", DATA + "/../server.log");
      }
      HttpResponse<String> after = invoke(client, service.port(), 2000);
      long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(90);
      while (after.statusCode() != 200 && System.nanoTime() < deadline) {
        Thread.sleep(100);
        after = invoke(client, service.port(), 2000);
      }
      assertEquals(200, after.statusCode(), "calls resume by themselves: " + after.body());
      acknowledged.add(id(after));
      for (int i = 0; i < 20; i++) {
        HttpResponse<String> r = invoke(client, service.port(), 3000 + i);
        assertEquals(200, r.statusCode());
        acknowledged.add(id(r));
      }
      assertEquals(200, get(client, service.port(), "/health/ready").statusCode());
      String export = get(client, service.port(), "/v1/invocations/export?run=outage").body();
      for (String id : acknowledged) {
        assertTrue(export.contains("\"id\":\"" + id + "\""), "acknowledged and in the ledger: " + id);
      }
    } finally {
      service.close();
    }
  }

  private static HttpResponse<String> invoke(HttpClient client, int port, int i) throws Exception {
    return client.send(HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + port + "/v1/tools/arith/1/invoke"))
        .header("Content-Type", "application/json").header("Reckoner-Run", "outage").timeout(Duration.ofSeconds(60))
        .POST(HttpRequest.BodyPublishers.ofString("{\"expr\":\"" + i + "+1\"}")).build(), HttpResponse.BodyHandlers.ofString());
  }

  private static HttpResponse<String> get(HttpClient client, int port, String path) throws Exception {
    return client.send(HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + port + path)).build(), HttpResponse.BodyHandlers.ofString());
  }

  private static String id(HttpResponse<String> r) {
    Matcher m = ID.matcher(r.body());
    assertTrue(m.find(), r.body());
    return m.group(1);
  }

  private static void pgCtl(String... args) throws Exception {
    List<String> command = new ArrayList<>();
    if ("root".equals(System.getProperty("user.name"))) {
      command.addAll(List.of("runuser", "-u", "postgres", "--"));
    }
    command.addAll(List.of(BIN + "/pg_ctl", "-D", DATA, "-w", "-t", "60"));
    command.addAll(List.of(args));
    Process p = new ProcessBuilder(command).redirectErrorStream(true).redirectOutput(ProcessBuilder.Redirect.DISCARD).start();
    assertTrue(p.waitFor(90, TimeUnit.SECONDS));
    assertEquals(0, p.exitValue(), "pg_ctl " + String.join(" ", args));
  }
}
