package reckoner.facts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Queue;
import java.util.SplittableRandom;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicLong;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.data.ReloadReport;

/**
 * Reloads under load: many threads call facts@1 through the Invoker while one thread swaps the
 * file between two versions (and now and then a malformed one). Every answer must come whole from
 * one version, with that version's data_version, and no call may fail.
 */
final class FactsReloadConcurrencyTest {
  private static final int KEYS = 200;
  private static final int CALLERS = 8;
  private static final int SWAPS = 150;

  @TempDir
  Path dir;

  private static String[] version(String tag) {
    List<String> lines = new ArrayList<>();
    for (int i = 0; i < KEYS; i++) {
      // two values per key, so that an answer mixing versions would show inside one text
      lines.add("{\"set\":\"s\",\"key\":\"k" + i + "\",\"value\":\"" + tag + "-" + i + "-first\"}");
      lines.add("{\"set\":\"s\",\"key\":\"k" + i + "\",\"value\":\"" + tag + "-" + i + "-second\"}");
    }
    return lines.toArray(new String[0]);
  }

  private String versionOf(String[] lines) throws Exception {
    Path d = Files.createTempDirectory(dir, "v");
    TestFacts.write(d, "facts.jsonl", lines);
    return TestFacts.open(d, "s").dataVersion("s").orElseThrow();
  }

  @Test
  void reloadUnderConcurrentCalls_everyAnswerFromOneWholeVersion() throws Exception {
    String[] a = version("A");
    String[] b = version("B");
    String versionA = versionOf(a);
    String versionB = versionOf(b);
    assertNotEquals(versionA, versionB);
    Path live = Files.createDirectory(dir.resolve("live"));
    TestFacts.write(live, "facts.jsonl", a);
    FactStore store = TestFacts.open(live, "s");
    Invoker invoker = TestFacts.invoker(store);

    Queue<String> wrong = new ConcurrentLinkedQueue<>();
    AtomicBoolean done = new AtomicBoolean();
    AtomicLong fromA = new AtomicLong();
    AtomicLong fromB = new AtomicLong();
    CountDownLatch started = new CountDownLatch(CALLERS);
    ExecutorService pool = Executors.newFixedThreadPool(CALLERS + 1);
    try {
      List<Future<?>> callers = new ArrayList<>();
      for (int t = 0; t < CALLERS; t++) {
        long seed = t;
        callers.add(pool.submit(() -> {
          SplittableRandom random = new SplittableRandom(seed);
          started.countDown();
          while (!done.get()) {
            int i = random.nextInt(KEYS);
            Outcome o = TestFacts.call(invoker, "{\"key\":\"K" + i + "\"}");
            if (!o.isOk()) {
              wrong.add("error: " + o.text());
              continue;
            }
            String version = o.answer().get().dataVersion().orElse("none");
            String tag = version.equals(versionA) ? "A" : version.equals(versionB) ? "B" : null;
            String expected = tag + "-" + i + "-first; " + tag + "-" + i + "-second";
            if (tag == null || !o.text().equals(expected)) {
              wrong.add(version + " answered " + o.text());
            }
            (tag != null && tag.equals("A") ? fromA : fromB).incrementAndGet();
          }
        }));
      }
      started.await(10, TimeUnit.SECONDS);
      Future<?> swapper = pool.submit(() -> {
        for (int s = 0; s < SWAPS; s++) {
          boolean toB = s % 2 == 0;
          TestFacts.write(live, "facts.jsonl", toB ? b : a);
          ReloadReport report = store.reload();
          if (!report.applied() || !store.dataVersion("s").orElseThrow().equals(toB ? versionB : versionA)) {
            wrong.add("swap " + s + " failed: " + report.summary());
          }
          if (s % 10 == 0) { // a malformed file must leave the current version serving
            String current = store.dataVersion("s").orElseThrow();
            TestFacts.write(live, "facts.jsonl", "{\"set\":\"s\",\"key\":\"k0\",\"value\":");
            if (store.reload().applied() || !store.dataVersion("s").orElseThrow().equals(current)) {
              wrong.add("a malformed file was applied at swap " + s);
            }
          }
        }
        return null;
      });
      swapper.get(120, TimeUnit.SECONDS);
      done.set(true);
      for (Future<?> f : callers) {
        f.get(30, TimeUnit.SECONDS);
      }
    } finally {
      done.set(true);
      pool.shutdownNow();
    }
    assertTrue(wrong.isEmpty(), () -> wrong.size() + " wrong answers, first: " + wrong.peek());
    assertTrue(fromA.get() > 0 && fromB.get() > 0, "both versions answered: A " + fromA + ", B " + fromB);
    assertEquals(SWAPS + 1, store.reloadSuccesses()); // the first load and every swap
    assertEquals(SWAPS / 10, store.reloadFailures());
    assertFalse(store.dataVersion("s").isEmpty());
  }
}
