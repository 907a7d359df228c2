package reckoner.facts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.time.Duration;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reckoner.data.DataWatcher;
import reckoner.data.ReloadReport;

/** Reloading on file change: a change must hold still for one poll, bad files are tried once, and close() stops it. */
final class FactsWatcherTest {
  private static final String ONE = "{\"set\":\"s\",\"key\":\"k\",\"value\":\"one\"}";
  private static final String TWO = "{\"set\":\"s\",\"key\":\"k\",\"value\":\"two\"}";

  @TempDir
  Path dir;

  @Test
  void pollOnce_noChange_doesNothing() {
    TestFacts.write(dir, "a.jsonl", ONE);
    FactStore store = TestFacts.open(dir, "s");
    DataWatcher watcher = DataWatcher.over(store.data(), Duration.ofSeconds(1));
    assertNull(watcher.pollOnce());
    assertNull(watcher.pollOnce());
    assertEquals(1, store.reloadSuccesses());
  }

  @Test
  void pollOnce_change_reloadsOnceItHoldsStillForOnePoll() {
    TestFacts.write(dir, "a.jsonl", ONE);
    FactStore store = TestFacts.open(dir, "s");
    Optional<String> before = store.dataVersion("s");
    DataWatcher watcher = DataWatcher.over(store.data(), Duration.ofSeconds(1));
    TestFacts.write(dir, "a.jsonl", TWO);
    assertNull(watcher.pollOnce()); // seen, waiting to settle
    ReloadReport report = watcher.pollOnce();
    assertTrue(report.applied());
    assertNotEquals(before, store.dataVersion("s"));
    assertNull(watcher.pollOnce());
  }

  @Test
  void pollOnce_fileStillChanging_waitsAgain() {
    TestFacts.write(dir, "a.jsonl", ONE);
    FactStore store = TestFacts.open(dir, "s");
    DataWatcher watcher = DataWatcher.over(store.data(), Duration.ofSeconds(1));
    TestFacts.write(dir, "a.jsonl", TWO);
    assertNull(watcher.pollOnce());
    TestFacts.write(dir, "a.jsonl", ONE, TWO.replace("\"k\"", "\"j\""));
    assertNull(watcher.pollOnce()); // changed again since the last look
    assertTrue(watcher.pollOnce().applied());
    assertEquals(2, store.reloadSuccesses());
  }

  @Test
  void pollOnce_badFile_isRefusedOnceAndNotRetriedUntilItChanges() {
    TestFacts.write(dir, "a.jsonl", ONE);
    FactStore store = TestFacts.open(dir, "s");
    Optional<String> before = store.dataVersion("s");
    DataWatcher watcher = DataWatcher.over(store.data(), Duration.ofSeconds(1));
    TestFacts.write(dir, "a.jsonl", "{broken");
    watcher.pollOnce();
    ReloadReport refused = watcher.pollOnce();
    assertFalse(refused.applied());
    assertEquals(before, store.dataVersion("s"));
    assertNull(watcher.pollOnce());
    assertNull(watcher.pollOnce());
    assertEquals(1, store.reloadFailures());
    TestFacts.write(dir, "a.jsonl", TWO);
    watcher.pollOnce();
    assertTrue(watcher.pollOnce().applied());
  }

  @Test
  void pollOnce_afterAnAdminReload_seesNoChange() {
    TestFacts.write(dir, "a.jsonl", ONE);
    FactStore store = TestFacts.open(dir, "s");
    DataWatcher watcher = DataWatcher.over(store.data(), Duration.ofSeconds(1));
    TestFacts.write(dir, "a.jsonl", TWO);
    store.reload();
    assertNull(watcher.pollOnce());
    assertNull(watcher.pollOnce());
    assertEquals(2, store.reloadSuccesses());
  }

  @Test
  void start_reloadsInTheBackground_andCloseStopsIt() throws InterruptedException {
    TestFacts.write(dir, "a.jsonl", ONE);
    FactStore store = TestFacts.open(dir, "s");
    Optional<String> one = store.dataVersion("s");
    try (DataWatcher watcher = DataWatcher.over(store.data(), Duration.ofMillis(20)).start()) {
      TestFacts.write(dir, "a.jsonl", TWO);
      long deadline = System.nanoTime() + Duration.ofSeconds(20).toNanos();
      while (store.dataVersion("s").equals(one) && System.nanoTime() < deadline) {
        Thread.sleep(10);
      }
      assertNotEquals(one, store.dataVersion("s"), "the watcher reloaded the changed file");
    }
    assertFalse(Thread.getAllStackTraces().keySet().stream()
        .anyMatch(t -> t.getName().equals("facts-watcher") && t.isAlive()), "the polling thread has stopped");
    Optional<String> two = store.dataVersion("s");
    TestFacts.write(dir, "a.jsonl", ONE, TWO.replace("\"k\"", "\"j\""));
    Thread.sleep(200); // ten polling intervals: a running watcher would have reloaded by now
    assertEquals(two, store.dataVersion("s"));
  }

  @Test
  void over_nonPositiveInterval_isRefused() {
    TestFacts.write(dir, "a.jsonl", ONE);
    FactStore store = TestFacts.open(dir, "s");
    assertThrows(IllegalArgumentException.class, () -> DataWatcher.over(store.data(), Duration.ZERO));
  }
}
