package reckoner.search;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicBoolean;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reckoner.tool.Arguments;

/**
 * Searches running while reloads swap collections in and out: every answer comes whole from one
 * version or the other, and no search ever meets a closed index (the released index closes only
 * after the last search using it).
 */
final class SearchReloadConcurrencyTest {
  @TempDir
  Path dir;

  private static final String OLD = TestSearch.doc("c", "1", "Ferry", "The ferry leaves at eight.");
  private static final String NEW = TestSearch.doc("c", "1", "Ferry", "The ferry leaves at nine.");

  @Test
  void searchesDuringReloads_onDisk_seeOneVersionWhole() throws Exception {
    run(true);
  }

  @Test
  void searchesDuringReloads_inMemory_seeOneVersionWhole() throws Exception {
    run(false);
  }

  private void run(boolean onDisk) throws Exception {
    TestSearch.write(dir, "c.jsonl", OLD);
    SearchStore store = onDisk ? TestSearch.onDisk(dir, "c", dir.resolve("indexes")) : TestSearch.inMemory(dir, "c");
    SearchTool tool = new SearchTool(store);
    Set<String> seen = ConcurrentHashMap.newKeySet();
    AtomicBoolean stop = new AtomicBoolean();
    ExecutorService pool = Executors.newFixedThreadPool(2);
    List<Future<Integer>> searchers = new ArrayList<>();
    for (int t = 0; t < 2; t++) {
      searchers.add(pool.submit(() -> {
        int n = 0;
        while (!stop.get()) {
          seen.add(tool.invoke(tool.canonicalize(Arguments.of("query", "ferry leaves")), TestSearch.CONTEXT).text());
          n++;
        }
        return n;
      }));
    }
    for (int i = 0; i < 12; i++) {
      TestSearch.write(dir, "c.jsonl", i % 2 == 0 ? NEW : OLD);
      assertTrue(store.reload().applied());
    }
    stop.set(true);
    int searches = 0;
    for (Future<Integer> f : searchers) {
      searches += f.get(); // rethrows any failure of a search
    }
    pool.shutdown();
    assertTrue(searches > 0);
    assertTrue(Set.of("Ferry: The ferry leaves at eight.", "Ferry: The ferry leaves at nine.").containsAll(seen), seen.toString());
    assertEquals("Ferry: The ferry leaves at eight.", TestSearch.answer(tool, Arguments.of("query", "ferry leaves")));
    assertEquals(13, store.reloadSuccesses(), "the first load and twelve reloads");
    assertEquals(0, store.reloadFailures());
  }
}
