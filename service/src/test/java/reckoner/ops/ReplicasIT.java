package reckoner.ops;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.net.ServerSocket;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.Statement;
import java.time.Duration;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Replicas for real, on loopback: three service processes on one PostgreSQL ledger behind
 * Debian's haproxy, a mixed load (invoke, batch, splice, fill) through the balancer, one replica
 * killed with SIGKILL and another stopped with SIGTERM while it runs. Every call carries a ref of
 * its own, so a call recorded twice would show. Afterwards: every acknowledged call (an answer
 * with its invocation id) is in the ledger exactly once under its id, no call is recorded twice,
 * the ids are unique across replicas, and each replica, restarted, exports every record of the run.
 *
 * <p>PostgreSQL comes from {@code RECKONER_TEST_PG_URL} (as {@code .ci/postgres.sh} prints it);
 * the test works in a database of its own, {@code reckoner_replicas}, made anew each run.
 */
final class ReplicasIT {
  private static final JsonMapper JSON = JsonMapper.builder().build();
  private static final String RUN = "replicas-brindlecove";
  private static final int CLIENTS = 4;

  @TempDir Path dir;

  /** What the clients were told: ref to invocation id, for every call answered with an id. */
  private final Map<String, String> acknowledged = new ConcurrentHashMap<>();
  private final AtomicInteger unanswered = new AtomicInteger();
  private final AtomicInteger sent = new AtomicInteger();

  @Test
  void killedAndStoppedReplicas_loseNoAcknowledgedCall_andRecordNoCallTwice() throws Exception {
    Path haproxy = Repo.program("/usr/sbin/haproxy", "haproxy");
    String adminUrl = System.getenv("RECKONER_TEST_PG_URL");
    if (adminUrl == null) {
      String message = "RECKONER_TEST_PG_URL is not set: start PostgreSQL with eval \"$(bash .ci/postgres.sh)\"";
      if (Repo.inCi()) {
        fail(message);
      }
      Assumptions.abort(message);
    }
    String url = freshDatabase(adminUrl, "reckoner_replicas");
    Map<String, String> env = Map.of("RECKONER_LEDGER_POOL_SIZE", "4");
    String[] args = {"--port", "0", "--ledger", "postgresql", "--ledger-url", url, "--durability", "commit"};

    List<ServiceProcess> replicas = new ArrayList<>();
    Process balancer = null;
    try {
      for (int i = 0; i < 3; i++) { // one after the other: the first creates the schema
        replicas.add(ServiceProcess.serve(env, with(args, "--data-dir", dir.resolve("r" + i).toString())));
      }
      int front = freePort();
      balancer = startHaproxy(haproxy, front, replicas);
      HttpClient client = HttpClient.newBuilder().version(HttpClient.Version.HTTP_1_1).connectTimeout(Duration.ofSeconds(3)).build();
      awaitReady(client, front);

      AtomicBoolean stop = new AtomicBoolean();
      List<Thread> clients = new ArrayList<>();
      for (int t = 0; t < CLIENTS; t++) {
        int thread = t;
        Thread c = new Thread(() -> load(client, front, thread, stop), "replica-client-" + t);
        c.start();
        clients.add(c);
      }
      Thread.sleep(6_000);
      int killedExit = replicas.get(0).kill();       // SIGKILL: no drain, connections cut
      Thread.sleep(5_000);
      int stoppedExit = replicas.get(1).stop();      // SIGTERM: finishes what it has, drains the ledger
      Thread.sleep(6_000);
      stop.set(true);
      for (Thread c : clients) {
        c.join(60_000);
      }
      assertEquals(137, killedExit, "SIGKILL");
      assertEquals(143, stoppedExit, "SIGTERM, handled");
      assertTrue(replicas.get(1).lines().stream().anyMatch(l -> l.contains("\"message\":\"stopped in ")),
          "the stopped replica logged its drain");
      for (int i = 0; i < 3; i++) {
        assertTrue(replicas.get(i).lines().stream().anyMatch(l -> l.contains("\"logger_name\":\"reckoner.access\"")
            && l.contains("\"method\":\"POST\"")), "replica " + i + " answered calls through the balancer");
      }
      assertTrue(acknowledged.size() >= 200, "a real load: " + acknowledged.size() + " calls acknowledged of " + sent.get());

      Map<String, List<String>> ledger = recordsByRef(url);
      List<String> problems = new ArrayList<>();
      acknowledged.forEach((ref, id) -> {
        List<String> ids = ledger.getOrDefault(ref, List.of());
        if (!ids.equals(List.of(id))) {
          problems.add(ref + ": acknowledged as " + id + ", in the ledger as " + ids);
        }
      });
      ledger.forEach((ref, ids) -> {
        if (ids.size() > 1) {
          problems.add(ref + ": recorded " + ids.size() + " times " + ids);
        }
      });
      assertEquals(List.of(), problems.subList(0, Math.min(20, problems.size())), problems.size() + " problems");
      Set<String> allIds = new TreeSet<>();
      ledger.values().forEach(allIds::addAll);
      assertEquals(ledger.values().stream().mapToInt(List::size).sum(), allIds.size(), "ids unique across replicas");
      assertEquals(new HashSet<>(acknowledged.values()).size(), acknowledged.size());
      System.out.printf(java.util.Locale.ROOT, "ReplicasIT: %d requests sent, %d calls acknowledged, %d requests unanswered"
          + " (cut or 5xx), %d calls recorded%n", sent.get(), acknowledged.size(), unanswered.get(), allIds.size());

      // Every replica, the two restarted ones included, answers a query with every record of the run.
      replicas.set(0, ServiceProcess.serve(env, with(args, "--data-dir", dir.resolve("r0").toString())));
      replicas.set(1, ServiceProcess.serve(env, with(args, "--data-dir", dir.resolve("r1").toString())));
      for (ServiceProcess replica : replicas) {
        assertEquals(allIds, export(client, replica.port()), "the export of the replica on port " + replica.port());
      }
    } finally {
      if (balancer != null) {
        balancer.toHandle().destroy();
        balancer.waitFor(10, TimeUnit.SECONDS);
      }
      for (ServiceProcess r : replicas) {
        r.close();
      }
    }
  }

  private static String[] with(String[] args, String... more) {
    List<String> all = new ArrayList<>(List.of(args));
    all.addAll(List.of(more));
    return all.toArray(String[]::new);
  }

  // ---- the load ----

  /** One client: invoke, batch of three, splice and fill in turn, each call with a ref of its own. */
  private void load(HttpClient client, int front, int thread, AtomicBoolean stop) {
    long end = System.nanoTime() + TimeUnit.SECONDS.toNanos(90); // bounded whatever happens
    for (int i = 0; !stop.get() && System.nanoTime() < end; i++) {
      String ref = "c" + thread + "-" + i;
      try {
        switch (i % 4) {
          case 0 -> single(client, front, "/v1/tools/arith/1/invoke", ref,
              i % 20 == 0 ? "{\"expr\":\"1/0\"}" : "{\"expr\":\"" + thread + "*100000+" + i + "\"}");
          case 1 -> batch(client, front, ref);
          case 2 -> single(client, front, "/v1/splice", ref, "{\"call\":\"units(" + (i % 97) + " km to mi)\"}");
          default -> fill(client, front, ref, i);
        }
      } catch (IOException e) {
        unanswered.incrementAndGet(); // the balancer or a replica cut the connection: not acknowledged
      } catch (InterruptedException e) {
        return;
      }
    }
  }

  private HttpResponse<String> post(HttpClient client, int front, String path, String ref, String body)
      throws IOException, InterruptedException {
    sent.incrementAndGet();
    HttpRequest.Builder b = HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + front + path))
        .header("Content-Type", "application/json").header("Reckoner-Run", RUN)
        .POST(HttpRequest.BodyPublishers.ofString(body)).timeout(Duration.ofSeconds(30));
    if (ref != null) {
      b.header("Reckoner-Ref", ref);
    }
    return client.send(b.build(), HttpResponse.BodyHandlers.ofString());
  }

  /** An invoke or a splice: acknowledged when the answer (200, or a tool's 4xx) carries an invocation id. */
  private void single(HttpClient client, int front, String path, String ref, String body) throws IOException, InterruptedException {
    HttpResponse<String> r = post(client, front, path, ref, body);
    if (r.statusCode() < 500 && r.body().startsWith("{")) {
      JsonNode n = JSON.readTree(r.body());
      if (n.has("invocation_id")) {
        acknowledged.put(ref, n.get("invocation_id").asString());
        return;
      }
    }
    unanswered.incrementAndGet();
  }

  private void batch(HttpClient client, int front, String ref) throws IOException, InterruptedException {
    StringBuilder body = new StringBuilder("{\"calls\":[");
    for (int k = 0; k < 3; k++) {
      body.append(k == 0 ? "" : ",").append("{\"id\":\"").append(k).append("\",\"tool\":\"dates\",\"ref\":\"").append(ref).append('.').append(k)
          .append("\",\"args\":{\"text\":\"").append(k + 1).append(" days ago\",\"as_of\":\"2031-03-0").append(k + 1).append("\"}}");
    }
    HttpResponse<String> r = post(client, front, "/v1/batch", null, body.append("]}").toString());
    if (r.statusCode() != 200) {
      unanswered.incrementAndGet();
      return;
    }
    for (JsonNode result : JSON.readTree(r.body()).get("results")) {
      if (result.has("invocation_id")) {
        acknowledged.put(ref + "." + result.get("id").asString(), result.get("invocation_id").asString());
      }
    }
  }

  private void fill(HttpClient client, int front, String ref, int i) throws IOException, InterruptedException {
    String doc = "{\"document\":\"Brindlecove shipped <<arith(" + i + "*12)>> crates.\"}";
    HttpResponse<String> r = post(client, front, "/v1/fill", ref, doc);
    if (r.statusCode() != 200) {
      unanswered.incrementAndGet();
      return;
    }
    JsonNode calls = JSON.readTree(r.body()).get("calls");
    if (calls.size() == 1 && calls.get(0).has("invocation_id")) {
      acknowledged.put(ref, calls.get(0).get("invocation_id").asString());
    }
  }

  // ---- reading the ledger ----

  /** The run's records straight from PostgreSQL: the call's ref to the ids recorded under it. */
  private static Map<String, List<String>> recordsByRef(String url) throws Exception {
    Map<String, List<String>> byRef = new HashMap<>();
    try (Connection c = DriverManager.getConnection(url);
         PreparedStatement s = c.prepareStatement("SELECT ref, id::text FROM invocations WHERE run = ?")) {
      s.setString(1, RUN);
      try (ResultSet rs = s.executeQuery()) {
        while (rs.next()) {
          // splice and fill record a call's position after the request's ref ("c1-7:pos-20"); each of ours has one call
          String ref = rs.getString(1).replaceFirst(":pos-\\d+$", "");
          byRef.computeIfAbsent(ref, k -> new ArrayList<>()).add(rs.getString(2));
        }
      }
    }
    return byRef;
  }

  /** Every id of the run, as one replica's export answers it. */
  private static Set<String> export(HttpClient client, int port) throws Exception {
    HttpResponse<String> r = client.send(HttpRequest.newBuilder(
        URI.create("http://127.0.0.1:" + port + "/v1/invocations/export?run=" + RUN)).timeout(Duration.ofSeconds(60)).build(),
        HttpResponse.BodyHandlers.ofString());
    assertEquals(200, r.statusCode(), r.body());
    Set<String> ids = new TreeSet<>();
    r.body().lines().filter(l -> !l.isBlank()).forEach(l -> ids.add(JSON.readTree(l).get("id").asString()));
    return ids;
  }

  // ---- PostgreSQL and haproxy ----

  /** Drops and creates {@code name} in the cluster of {@code adminUrl}; returns its URL. */
  private static String freshDatabase(String adminUrl, String name) throws Exception {
    try (Connection c = DriverManager.getConnection(adminUrl); Statement s = c.createStatement()) {
      s.execute("DROP DATABASE IF EXISTS " + name + " WITH (FORCE)");
      s.execute("CREATE DATABASE " + name);
    }
    return adminUrl.replaceFirst("/[^/?]+(\\?|$)", "/" + name + "$1");
  }

  private static int freePort() throws IOException {
    try (ServerSocket s = new ServerSocket(0, 1, java.net.InetAddress.getLoopbackAddress())) {
      return s.getLocalPort();
    }
  }

  /**
   * haproxy in the foreground: round robin over the replicas, each checked on /health/ready every
   * 300 ms. A request is sent again elsewhere only when its connection could not be made
   * (haproxy's default retry-on), so no call reaches two replicas.
   */
  private Process startHaproxy(Path haproxy, int front, List<ServiceProcess> replicas) throws IOException {
    StringBuilder cfg = new StringBuilder()
        .append("global\n  maxconn 512\n")
        .append("defaults\n  mode http\n  timeout connect 2s\n  timeout client 60s\n  timeout server 60s\n")
        .append("  retries 3\n  option redispatch\n")
        .append("frontend reckoner\n  bind 127.0.0.1:").append(front).append("\n  default_backend replicas\n")
        .append("backend replicas\n  balance roundrobin\n  option httpchk GET /health/ready\n  http-check expect status 200\n")
        .append("  default-server inter 300ms fall 2 rise 2\n");
    for (int i = 0; i < replicas.size(); i++) {
      cfg.append("  server r").append(i).append(" 127.0.0.1:").append(replicas.get(i).port()).append(" check\n");
    }
    Path file = dir.resolve("haproxy.cfg");
    Files.writeString(file, cfg, StandardCharsets.UTF_8);
    External check = External.run(dir, null, haproxy.toString(), "-c", "-f", file.toString());
    assertEquals(0, check.exitCode(), check.output());
    return new ProcessBuilder(haproxy.toString(), "-db", "-f", file.toString())
        .redirectErrorStream(true).redirectOutput(dir.resolve("haproxy.log").toFile()).start();
  }

  private static void awaitReady(HttpClient client, int front) throws Exception {
    long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(30);
    while (System.nanoTime() < deadline) {
      try {
        if (client.send(HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + front + "/health/ready")).build(),
            HttpResponse.BodyHandlers.discarding()).statusCode() == 200) {
          return;
        }
      } catch (IOException e) {
        // haproxy is not listening yet
      }
      Thread.sleep(100);
    }
    fail("haproxy did not answer /health/ready within 30 s");
  }
}
