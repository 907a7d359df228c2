package reckoner.ledger;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static reckoner.ledger.Fixtures.HERON;
import static reckoner.ledger.Fixtures.call;
import static reckoner.ledger.Fixtures.id;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.TimeUnit;
import java.util.function.BooleanSupplier;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import reckoner.ledger.LedgerUnavailableException.Reason;

final class LedgerWriterTest {
  private static final LedgerWriter.Settings FAST = LedgerWriter.Settings.defaults()
      .withBackoff(Duration.ofMillis(20), Duration.ofMillis(80)).withAppendWait(Duration.ofMillis(50))
      .withDrainTimeout(Duration.ofSeconds(5));

  private final FakeStore store = new FakeStore();
  private LedgerWriter writer;

  @AfterEach
  void tearDown() {
    store.open();
    store.failing = false;
    if (writer != null) {
      writer.close();
    }
  }

  private static Invocation rec(int i) {
    return call(i, 0, HERON).build();
  }

  private static LedgerUnavailableException failure(CompletableFuture<Void> f) throws InterruptedException {
    ExecutionException e = assertThrows(ExecutionException.class, () -> f.get(10, TimeUnit.SECONDS));
    return assertInstanceOf(LedgerUnavailableException.class, e.getCause());
  }

  private static void await(BooleanSupplier condition) throws InterruptedException {
    long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(10);
    while (!condition.getAsBoolean()) {
      if (System.nanoTime() > deadline) {
        throw new AssertionError("condition not reached within 10 s");
      }
      Thread.sleep(5);
    }
  }

  // ---- commit mode ----

  @Test
  void append_committed_completesOnlyAfterTheStoreHasIt() throws Exception {
    store.hold();
    writer = LedgerWriter.start(store, FAST, LedgerStats.CommitListener.none());
    CompletableFuture<Void> done = writer.append(rec(0));
    store.awaitFirstWrite();
    assertFalse(done.isDone());
    assertEquals(1, writer.queueDepth());
    store.open();
    done.get(10, TimeUnit.SECONDS);
    assertEquals(List.of(id(0, 0)), store.ids());
    assertEquals(0, writer.queueDepth());
    assertEquals(1, writer.recordsWritten());
    assertEquals(1, writer.commits());
  }

  @Test
  void append_whileACommitRuns_groupsTheWaitingRecordsIntoOneBatch() throws Exception {
    List<Integer> seen = new CopyOnWriteArrayList<>();
    store.hold();
    writer = LedgerWriter.start(store, FAST.withMaxBatch(8), (records, nanos) -> seen.add(records));
    List<CompletableFuture<Void>> futures = new ArrayList<>();
    futures.add(writer.append(rec(0)));
    store.awaitFirstWrite();
    for (int i = 1; i <= 20; i++) {
      futures.add(writer.append(rec(i)));
    }
    store.open();
    CompletableFuture.allOf(futures.toArray(new CompletableFuture[0])).get(10, TimeUnit.SECONDS);
    assertEquals(List.of(1, 8, 8, 4), store.sizes());
    // The listener runs after a batch's futures complete: wait for the last call before comparing.
    long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(10);
    while (seen.size() < 4 && System.nanoTime() < deadline) {
      Thread.sleep(1);
    }
    assertEquals(List.of(1, 8, 8, 4), seen);
    List<String> expected = new ArrayList<>();
    for (int i = 0; i <= 20; i++) {
      expected.add(id(i, 0));
    }
    assertEquals(expected, store.ids());
  }

  @Test
  void append_linger_waitsForMoreRecordsBeforeCommitting() throws Exception {
    writer = LedgerWriter.start(store, FAST.withLinger(Duration.ofMillis(300)), LedgerStats.CommitListener.none());
    CompletableFuture<Void> first = writer.append(rec(0));
    Thread.sleep(30);
    CompletableFuture<Void> second = writer.append(rec(1));
    CompletableFuture.allOf(first, second).get(10, TimeUnit.SECONDS);
    assertEquals(List.of(2), store.sizes());
  }

  @Test
  void offer_aBatchOfAsyncRecordsWaitsForCompany_aCommitEndsTheWait() throws Exception {
    writer = LedgerWriter.start(store, FAST.withAsyncLinger(Duration.ofSeconds(5)), LedgerStats.CommitListener.none());
    assertTrue(writer.offer(rec(0)));
    Thread.sleep(30);
    assertTrue(writer.offer(rec(1)));
    long start = System.nanoTime();
    writer.append(rec(2)).get(10, TimeUnit.SECONDS);
    long waited = System.nanoTime() - start;
    assertEquals(List.of(3), store.sizes()); // one commit for all three
    assertTrue(waited < TimeUnit.SECONDS.toNanos(4), "the commit record did not wait out the async linger: " + waited);
  }

  @Test
  void append_queueFull_failsWithQueueFullAfterWaiting() throws Exception {
    store.hold();
    writer = LedgerWriter.start(store, FAST.withQueueCapacity(2), LedgerStats.CommitListener.none());
    CompletableFuture<Void> a = writer.append(rec(0));
    CompletableFuture<Void> b = writer.append(rec(1));
    LedgerUnavailableException e = failure(writer.append(rec(2)));
    assertEquals(Reason.QUEUE_FULL, e.reason());
    assertEquals("the ledger's queue is full (2 records)", e.getMessage());
    assertEquals(Duration.ofSeconds(1), e.retryAfter());
    store.open();
    CompletableFuture.allOf(a, b).get(10, TimeUnit.SECONDS);
    assertEquals(List.of(id(0, 0), id(1, 0)), store.ids());
    assertEquals(1, writer.recordsRefused());
  }

  @Test
  void append_storeFails_failsPendingAndNewAppendsThenResumesWhenStoreReturns() throws Exception {
    store.failing = true;
    writer = LedgerWriter.start(store, FAST.withBackoff(Duration.ofMillis(300), Duration.ofMillis(300)),
        LedgerStats.CommitListener.none());
    LedgerUnavailableException e = failure(writer.append(rec(0)));
    assertEquals(Reason.STORE_FAILED, e.reason());
    assertEquals("the ledger cannot be written: fake store: disk full", e.getMessage());
    assertFalse(writer.isHealthy());
    // Within the backoff, a new append fails at once, without reaching the store.
    LedgerUnavailableException fast = failure(writer.append(rec(1)));
    assertEquals(Reason.STORE_FAILED, fast.reason());
    assertTrue(writer.writeFailures() >= 1);
    store.failing = false;
    await(writer::isHealthy); // the writer probes on its own
    writer.append(rec(2)).get(10, TimeUnit.SECONDS);
    assertEquals(List.of(id(2, 0)), store.ids()); // the failed calls were told so, and are not written later
    assertEquals(2, writer.recordsRefused());
  }

  @Test
  void append_storeThrowsAnError_failsTheCallAndTheWriterLivesOn() throws Exception {
    store.failingWithError = true;
    writer = LedgerWriter.start(store, FAST, LedgerStats.CommitListener.none());
    LedgerUnavailableException e = failure(writer.append(rec(0)));
    assertEquals("the ledger cannot be written: driver assertion on a dropped connection", e.getMessage());
    assertTrue(writer.offer(rec(1)));
    store.failingWithError = false;
    await(() -> writer.recordsWritten() == 1);
    writer.append(rec(2)).get(10, TimeUnit.SECONDS);
    assertEquals(List.of(id(1, 0), id(2, 0)), store.ids());
  }

  // ---- async mode ----

  @Test
  void offer_queueFull_returnsFalseAtOnce() throws Exception {
    store.hold();
    writer = LedgerWriter.start(store, FAST.withQueueCapacity(3), LedgerStats.CommitListener.none());
    assertTrue(writer.offer(rec(0)));
    store.awaitFirstWrite();
    assertTrue(writer.offer(rec(1)));
    assertTrue(writer.offer(rec(2)));
    assertFalse(writer.offer(rec(3)));
    assertEquals(3, writer.queueDepth());
    assertEquals(1, writer.recordsRefused());
    store.open();
    await(() -> writer.recordsWritten() == 3);
    assertTrue(writer.offer(rec(4)));
    await(() -> writer.recordsWritten() == 4);
    assertEquals(List.of(id(0, 0), id(1, 0), id(2, 0), id(4, 0)), store.ids());
  }

  @Test
  void offer_storeFailsForAWhile_keepsEveryAcceptedRecordAndWritesItLater() throws Exception {
    store.failing = true;
    writer = LedgerWriter.start(store, FAST, LedgerStats.CommitListener.none());
    for (int i = 0; i < 50; i++) {
      assertTrue(writer.offer(rec(i)));
    }
    await(() -> writer.writeFailures() >= 3);
    assertFalse(writer.isHealthy());
    assertEquals(50, writer.queueDepth());
    store.failing = false;
    await(() -> writer.recordsWritten() == 50);
    assertTrue(writer.isHealthy());
    List<String> expected = new ArrayList<>();
    for (int i = 0; i < 50; i++) {
      expected.add(id(i, 0));
    }
    assertEquals(expected, store.ids());
    assertEquals(0, writer.queueDepth());
  }

  // ---- closing ----

  @Test
  void close_drainsEveryQueuedRecordBeforeReturning() throws Exception {
    store.hold();
    writer = LedgerWriter.start(store, FAST.withMaxBatch(100), LedgerStats.CommitListener.none());
    for (int i = 0; i < 1000; i++) {
      assertTrue(writer.offer(rec(i)));
    }
    store.open();
    writer.close();
    assertEquals(1000, store.ids().size());
    assertEquals(1000, writer.recordsWritten());
    assertEquals(0, writer.recordsLost());
  }

  @Test
  void close_storeDownPastTheDrainTimeout_countsAndLogsWhatIsNotWritten() throws Exception {
    store.failing = true;
    writer = LedgerWriter.start(store, FAST.withDrainTimeout(Duration.ofMillis(300)), LedgerStats.CommitListener.none());
    assertTrue(writer.offer(rec(0)));
    assertTrue(writer.offer(rec(1)));
    writer.close();
    assertEquals(2, writer.recordsLost());
    assertEquals(List.of(), store.ids());
  }

  @Test
  void afterClose_appendFailsClosedAndOfferRefuses() throws Exception {
    writer = LedgerWriter.start(store, FAST, LedgerStats.CommitListener.none());
    writer.close();
    assertEquals(Reason.CLOSED, failure(writer.append(rec(0))).reason());
    assertFalse(writer.offer(rec(1)));
    assertEquals(2, writer.recordsRefused());
  }

  @Test
  void listenerThrows_writeStillSucceeds() throws Exception {
    writer = LedgerWriter.start(store, FAST, (records, nanos) -> {
      throw new IllegalStateException("listener broke");
    });
    writer.append(rec(0)).get(10, TimeUnit.SECONDS);
    assertEquals(List.of(id(0, 0)), store.ids());
    assertTrue(writer.isHealthy());
  }

  @Test
  void settings_invalid_areRefused() {
    assertThrows(IllegalArgumentException.class, () -> LedgerWriter.Settings.defaults().withQueueCapacity(0));
    assertThrows(IllegalArgumentException.class, () -> LedgerWriter.Settings.defaults().withMaxBatch(0));
    assertThrows(IllegalArgumentException.class,
        () -> LedgerWriter.Settings.defaults().withBackoff(Duration.ofMillis(10), Duration.ofMillis(5)));
    assertThrows(IllegalArgumentException.class, () -> LedgerWriter.Settings.defaults().withLinger(Duration.ofMillis(-1)));
  }
}
