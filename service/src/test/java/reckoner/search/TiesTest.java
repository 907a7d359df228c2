package reckoner.search;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Equal scores are ordered by document id, then by passage position, in memory and on disk alike. */
final class TiesTest {
  @TempDir
  Path dir;

  private static final String SENTENCE = "The quay wall of the old harbour was rebuilt in dressed stone after the winter storms had"
      + " breached it twice, and the masons who did the work came over from the mainland with their own tools, cranes and"
      + " scaffolding poles, staying in the town for three whole seasons until it stood again.";

  private List<String> order(SearchStore store) {
    Collection t = store.snapshot().get("t").orElseThrow();
    return t.top(SearchTool.terms("quay", t.analyzer()), Optional.empty(), 10).stream()
        .map(h -> h.id() + "#" + h.position() + "@" + h.score()).toList();
  }

  @Test
  void equalScores_goToTheSmallerIdThenTheEarlierPassage() {
    // Written in an order unlike the expected one: the index sorts them.
    TestSearch.write(dir, "t.jsonl",
        TestSearch.doc("t", "zeta", "Quay", "the quay"),
        TestSearch.doc("t", "beta", "Wall", SENTENCE + " " + SENTENCE),
        TestSearch.doc("t", "alpha", "Quay", "the quay"),
        TestSearch.doc("t", "Zulu", "Quay", "the quay"));
    SearchStore memory = TestSearch.inMemory(dir, "t");
    List<String> hits = order(memory);
    // The three short documents score alike, above the long one; code point order puts "Zulu" before "alpha".
    assertEquals(List.of("Zulu#0", "alpha#0", "zeta#0", "beta#0", "beta#1"),
        hits.stream().map(h -> h.substring(0, h.indexOf('@'))).toList());
    assertEquals(hits.get(0).substring(hits.get(0).indexOf('@')), hits.get(2).substring(hits.get(2).indexOf('@')));
    assertEquals(hits.get(3).substring(hits.get(3).indexOf('@')), hits.get(4).substring(hits.get(4).indexOf('@')));
    assertEquals(hits, order(TestSearch.onDisk(dir, "t", dir.resolve("indexes"))));
  }
}
