package reckoner.ledger;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static reckoner.ledger.Fixtures.HERON;
import static reckoner.ledger.Fixtures.call;

import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reckoner.ledger.InvocationQuery.Scope;

/**
 * A full SQLite file, made real with {@code PRAGMA max_page_count} (SQLite then fails writes with
 * SQLITE_FULL, "database or disk is full", as on a full disk; SQLite documentation, "PRAGMA
 * max_page_count" and "Result and Error Codes", from memory). Commits land in the intake log, so
 * the first ones still succeed; once the records cannot move into the file, commit appends fail,
 * the writer turns unhealthy, accepted async records wait, and everything resumes when room returns,
 * with every committed record in the file.
 */
final class SqliteFullDiskTest {
  @TempDir Path dir;

  @Test
  void fullFile_turnsWriterUnhealthyAndResumesWhenRoomReturns() throws Exception {
    IntakeLedgerStore store = (IntakeLedgerStore) LedgerStore.sqlite(dir);
    LedgerWriter writer = LedgerWriter.start(store, LedgerWriter.Settings.defaults()
        .withBackoff(Duration.ofMillis(20), Duration.ofMillis(100)), LedgerStats.CommitListener.none());
    try {
      writer.append(call(0, 0, HERON).build()).get(10, TimeUnit.SECONDS);
      long moved = System.nanoTime() + TimeUnit.SECONDS.toNanos(10);
      while (store.recordsBehind() > 0 && System.nanoTime() < moved) {
        Thread.sleep(5); // the first record reaches the file before the file is made full
      }
      assertEquals(0, store.recordsBehind());
      store.sqlite().limitPages(store.sqlite().pageCount());
      List<Invocation> big = new ArrayList<>();
      for (int i = 1; i <= 200; i++) {
        big.add(call(i, 0, HERON).text("x".repeat(20_000)).build()); // each needs pages of its own
      }
      writer.append(big.get(0)).get(10, TimeUnit.SECONDS); // committed: in the intake log
      long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(10);
      while (store.moveFailure() == null && System.nanoTime() < deadline) {
        Thread.sleep(5);
      }
      assertTrue(store.moveFailure().contains("full"), store.moveFailure());
      assertEquals(1, store.recordsBehind());
      ExecutionException e = assertThrows(ExecutionException.class,
          () -> writer.append(big.get(1)).get(10, TimeUnit.SECONDS));
      LedgerUnavailableException cause = assertInstanceOf(LedgerUnavailableException.class, e.getCause());
      assertEquals(LedgerUnavailableException.Reason.STORE_FAILED, cause.reason());
      assertTrue(cause.getMessage().contains("full"), cause.getMessage());
      assertFalse(writer.isHealthy());
      for (Invocation inv : big.subList(2, big.size())) {
        assertTrue(writer.offer(inv)); // async: accepted, held through the outage
      }
      deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(5);
      while (writer.writeFailures() < 3 && System.nanoTime() < deadline) {
        Thread.sleep(10);
      }
      assertFalse(writer.isHealthy());
      store.sqlite().limitPages(0);
      deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(90); // generous: CI machines may be busy
      while ((writer.recordsWritten() < 200 || !writer.isHealthy()) && System.nanoTime() < deadline) {
        Thread.sleep(10);
      }
      assertTrue(writer.isHealthy());
      assertEquals(200, writer.recordsWritten()); // the first, big 0 and the 198 async ones; big 1 was refused
      assertEquals(200, store.forEach(InvocationQuery.of(Scope.all()), inv -> {}));
      writer.append(call(999, 0, HERON).build()).get(10, TimeUnit.SECONDS);
    } finally {
      writer.close();
      store.close();
    }
    LedgerCheck.Report report = LedgerCheck.check(dir.resolve("ledger.db"), List.of());
    assertEquals("ok", report.integrity());
    assertEquals(201, report.invocations());
    assertEquals(0, report.unnamed());
  }
}
