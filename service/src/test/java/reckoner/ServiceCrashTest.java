package reckoner;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reckoner.ledger.LedgerCheck;

/**
 * The service as a separate process, called over HTTP from several threads and killed with
 * SIGKILL mid-stream, five times over one data dir: after each kill, every invocation id that was
 * acknowledged to a client (a 200 with its id, durability commit) is in the ledger, and
 * {@code PRAGMA integrity_check} says ok.
 */
final class ServiceCrashTest {
  private static final int KILLS = 5;
  private static final int THREADS = 4;

  @TempDir Path dir;

  @Test
  void killedWithSigkill_fiveTimes_everyAcknowledgedCallIsInTheLedger() throws Exception {
    List<String> acknowledged = new ArrayList<>();
    Pattern idPattern = Pattern.compile("\"invocation_id\":\"([0-9a-f-]{36})\"");
    for (int round = 0; round < KILLS; round++) {
      Process server = new ProcessBuilder(Path.of(System.getProperty("java.home"), "bin", "java").toString(), "-Xmx256m",
          "-cp", System.getProperty("java.class.path"), "reckoner.Main", "serve", "--port", "0", "--data-dir", dir.toString()).redirectErrorStream(true).start();
      int port = awaitPort(server);
      HttpClient client = HttpClient.newBuilder().version(HttpClient.Version.HTTP_1_1).connectTimeout(Duration.ofSeconds(5)).build();
      ConcurrentLinkedQueue<String> acks = new ConcurrentLinkedQueue<>();
      AtomicBoolean stop = new AtomicBoolean();
      List<Thread> callers = new ArrayList<>();
      int r = round;
      for (int t = 0; t < THREADS; t++) {
        int thread = t;
        Thread caller = new Thread(() -> {
          for (int i = 0; !stop.get(); i++) {
            String body = i % 10 == 3 ? "{\"expr\":\"1/0\"}" : "{\"expr\":\"" + r + "*1000+" + thread + "*100000+" + i + "\"}";
            try {
              HttpResponse<String> resp = client.send(HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + port + "/v1/tools/arith/1/invoke"))
                  .header("Content-Type", "application/json").header("Reckoner-Run", "crash-" + r)
                  .POST(HttpRequest.BodyPublishers.ofString(body)).timeout(Duration.ofSeconds(10)).build(), HttpResponse.BodyHandlers.ofString());
              Matcher m = idPattern.matcher(resp.body());
              if ((resp.statusCode() == 200 || resp.statusCode() == 422) && m.find()) {
                acks.add(m.group(1)); // answered: ok or a tool error, both recorded before the answer left
              }
            } catch (Exception e) {
              return; // the server is gone
            }
          }
        });
        caller.start();
        callers.add(caller);
      }
      int target = 200 + 150 * round;
      long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(120);
      while (acks.size() < target && System.nanoTime() < deadline) {
        Thread.sleep(5);
      }
      server.toHandle().destroyForcibly(); // SIGKILL on Linux: no shutdown hook, no drain
      assertTrue(server.waitFor(30, TimeUnit.SECONDS));
      stop.set(true);
      for (Thread c : callers) {
        c.join(TimeUnit.SECONDS.toMillis(30));
      }
      assertEquals(137, server.exitValue(), "killed by signal 9 (128 + 9)");
      assertTrue(acks.size() >= target, "round " + round + " acknowledged " + acks.size());
      acknowledged.addAll(acks);
      LedgerCheck.Report report = LedgerCheck.check(dir.resolve("ledger.db"), acknowledged);
      assertEquals("ok", report.integrity(), "round " + round);
      assertEquals(0, report.unnamed(), "round " + round + ": records whose names are not in the dictionary");
      assertEquals(List.of(), report.missing(), "round " + round + ": acknowledged but not in the ledger");
      assertTrue(report.invocations() >= acknowledged.size());
    }
  }

  private static int awaitPort(Process server) throws Exception {
    BufferedReader out = new BufferedReader(new InputStreamReader(server.getInputStream(), StandardCharsets.UTF_8));
    Pattern p = Pattern.compile("on http://127\\.0\\.0\\.1:(\\d+)");
    for (String line; (line = out.readLine()) != null; ) {
      Matcher m = p.matcher(line);
      if (m.find()) {
        Thread drain = new Thread(() -> out.lines().forEach(l -> { }), "server-output");
        drain.setDaemon(true);
        drain.start();
        return Integer.parseInt(m.group(1));
      }
    }
    throw new IllegalStateException("the service did not report its port");
  }
}
