package reckoner.ledger;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static reckoner.ledger.Fixtures.HERON;

import java.io.IOException;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Duration;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicLong;
import java.util.function.BooleanSupplier;
import org.junit.jupiter.api.Test;
import reckoner.call.InvocationIds;
import reckoner.ledger.InvocationQuery.Scope;
import reckoner.Prerequisites;

/**
 * PostgreSQL stopped in the middle of a run: calls in commit mode fail as unavailable, the writer
 * reports unhealthy, and after the server is back writing resumes by itself, with every
 * acknowledged record in the table. Needs {@code RECKONER_TEST_PG_URL}, {@code RECKONER_TEST_PG_DATA}
 * and {@code RECKONER_TEST_PG_BIN} (printed by {@code .ci/postgres.sh}); skipped without them.
 */
final class PostgresOutageTest {
  private static final String DATA = System.getenv("RECKONER_TEST_PG_DATA");
  private static final String BIN = System.getenv("RECKONER_TEST_PG_BIN");

  @Test
  void serverStoppedMidRun_callsFailThenResumeWithNoAcknowledgedRecordLost() throws Exception {
    Prerequisites.require(DATA != null && BIN != null, "RECKONER_TEST_PG_DATA and RECKONER_TEST_PG_BIN are not set (run .ci/postgres.sh)");
    String url = PostgresLedgerStoreTest.freshSchemaUrl("ledger_outage");
    InvocationIds ids = new InvocationIds(Clock.systemUTC());
    ConcurrentLinkedQueue<String> acknowledged = new ConcurrentLinkedQueue<>();
    AtomicLong refusedDuringOutage = new AtomicLong();
    AtomicBoolean outage = new AtomicBoolean();
    AtomicBoolean stop = new AtomicBoolean();
    LedgerStore store = LedgerStore.postgres(url, null, null, 4);
    LedgerWriter writer = LedgerWriter.start(store, LedgerWriter.Settings.defaults()
        .withBackoff(Duration.ofMillis(50), Duration.ofMillis(500)), LedgerStats.CommitListener.none());
    List<Thread> callers = new ArrayList<>();
    try {
      for (int t = 0; t < 4; t++) {
        boolean async = t == 3;
        Thread caller = new Thread(() -> {
          while (!stop.get()) {
            Invocation inv = Fixtures.call(0, 0, HERON).build();
            inv = Invocation.builder(ids.next().toString()).keyId(HERON).run("hedge-count-2").tool(inv.tool())
                .version(1).args(inv.args()).text(inv.text()).build();
            if (async) {
              if (writer.offer(inv)) {
                acknowledged.add(inv.id());
              }
            } else {
              try {
                writer.append(inv).get(30, TimeUnit.SECONDS);
                acknowledged.add(inv.id());
              } catch (ExecutionException e) {
                assertTrue(e.getCause() instanceof LedgerUnavailableException, e.toString());
                if (outage.get()) {
                  refusedDuringOutage.incrementAndGet();
                }
              } catch (Exception e) {
                throw new AssertionError(e);
              }
            }
            sleepMillis(1);
          }
        }, "caller-" + t);
        callers.add(caller);
        caller.start();
      }
      await(() -> acknowledged.size() > 200, 30);
      assertTrue(writer.isHealthy());

      outage.set(true);
      pgCtl("stop", "-m", "fast");
      await(() -> !writer.isHealthy(), 30);
      await(() -> refusedDuringOutage.get() > 0, 30);
      LedgerUnavailableException direct = org.junit.jupiter.api.Assertions.assertThrows(LedgerUnavailableException.class,
          () -> store.query(InvocationQuery.of(Scope.all())));
      assertEquals(LedgerUnavailableException.Reason.STORE_FAILED, direct.reason());
      sleepMillis(1000);
      assertFalse(writer.isHealthy());

      pgCtl("start", "-l", Path.of(DATA).resolveSibling("server.log").toString());
      outage.set(false);
      await(writer::isHealthy, 60);
      long before = writer.recordsWritten();
      await(() -> writer.recordsWritten() > before + 200, 30);
    } finally {
      stop.set(true);
      for (Thread caller : callers) {
        caller.join(60_000);
      }
      writer.close();
      if (!isRunning()) {
        pgCtl("start", "-l", Path.of(DATA).resolveSibling("server.log").toString()); // leave the server as found
      }
    }
    Set<String> stored = new HashSet<>();
    store.forEach(InvocationQuery.of(Scope.all()), inv -> stored.add(inv.id()));
    store.close();
    List<String> lost = acknowledged.stream().filter(id -> !stored.contains(id)).toList();
    assertEquals(List.of(), lost);
    assertEquals(0, writer.recordsLost());
    assertTrue(refusedDuringOutage.get() > 0);
  }

  private static boolean isRunning() throws IOException, InterruptedException {
    return run(List.of(BIN + "/pg_ctl", "-D", DATA, "status")) == 0;
  }

  private static void pgCtl(String... args) throws IOException, InterruptedException {
    List<String> command = new ArrayList<>(List.of(BIN + "/pg_ctl", "-D", DATA, "-w", "-t", "60"));
    command.addAll(List.of(args));
    int code = run(command);
    assertEquals(0, code, "pg_ctl " + String.join(" ", args));
  }

  /** Runs a command as the cluster's owner: as the postgres user when this JVM runs as root. */
  private static int run(List<String> command) throws IOException, InterruptedException {
    List<String> full = new ArrayList<>();
    if ("root".equals(System.getProperty("user.name"))) {
      full.addAll(List.of("runuser", "-u", "postgres", "--"));
    }
    full.addAll(command);
    Process p = new ProcessBuilder(full).redirectErrorStream(true).redirectOutput(ProcessBuilder.Redirect.DISCARD).start();
    if (!p.waitFor(90, TimeUnit.SECONDS)) {
      p.destroyForcibly();
      return -1;
    }
    return p.exitValue();
  }

  private static void await(BooleanSupplier condition, int seconds) {
    long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(seconds);
    while (!condition.getAsBoolean()) {
      if (System.nanoTime() > deadline) {
        throw new AssertionError("condition not reached within " + seconds + " s");
      }
      sleepMillis(10);
    }
  }

  private static void sleepMillis(long ms) {
    try {
      Thread.sleep(ms);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
  }
}
