package reckoner.search;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * BM25 as Lucene computes it, against an independent computation of the published formula
 * (S. Robertson and H. Zaragoza, 2009, "The Probabilistic Relevance Framework: BM25 and Beyond",
 * Foundations and Trends in Information Retrieval 3(4): a term's weight is tf (k1 + 1) / (tf + k1
 * ((1 - b) + b dl / avdl)) times its idf; quoted from memory, the paper was not at hand), on a
 * hand-made collection of one-passage documents. Two departures of Lucene's BM25Similarity are
 * applied to the formula, as its documentation states them: the idf is log(1 + (N - n + 0.5) / (n
 * + 0.5)), which cannot go negative (BM25Similarity javadoc, Lucene 9.12.3, method idf), and the
 * constant factor (k1 + 1) is left out, which changes no ranking (Lucene change "Remove k1+1
 * constant factor from BM25 formula numerator", 2018). Passage lengths here are at most 10 terms,
 * which Lucene's one-byte length encoding (SmallFloat.intToByte4) stores exactly: every length up
 * to 40 round-trips, 41 reads back as 40 (checked with Lucene 9.12.3's SmallFloat). So the scores
 * agree to float precision: a relative difference under 1e-6 is allowed.
 */
final class Bm25Test {
  @TempDir
  static Path dir;

  private static SearchStore store;

  /** The documents: language none (lower-casing only), so the terms are the lower-cased words. */
  private static final String[][] DOCS = {
      {"a", "Gannets", "gannets dive for fish near the rock"},
      {"b", "Seals", "grey seals rest on the rock at low tide"},
      {"c", "Rock", "the rock light stands on the rock"},
      {"d", "Ferry", "the ferry sails at dawn"},
      {"e", "Tide", "the tide turns at dawn and at dusk"}};

  @BeforeAll
  static void load() {
    List<String> lines = new ArrayList<>();
    lines.add("{\"collection\":\"hand\",\"options\":{\"language\":\"none\"}}");
    for (String[] d : DOCS) {
      lines.add(TestSearch.doc("hand", d[0], d[1], d[2]));
    }
    TestSearch.write(dir, "hand.jsonl", lines.toArray(new String[0]));
    store = TestSearch.inMemory(dir, "hand");
  }

  private static Collection hand() {
    return store.snapshot().get("hand").orElseThrow();
  }

  /* ---------------- the independent computation ---------------- */

  private static List<String> words(String text) {
    List<String> words = new ArrayList<>();
    for (String w : text.toLowerCase(Locale.ROOT).split("[^a-z]+")) {
      if (!w.isEmpty()) {
        words.add(w);
      }
    }
    return words;
  }

  /** Each passage's words: the title, then the text (the passage rule puts the title in front). */
  private static Map<String, List<String>> passages() {
    Map<String, List<String>> passages = new HashMap<>();
    for (String[] d : DOCS) {
      passages.put(d[0], words(d[1] + " " + d[2]));
    }
    return passages;
  }

  private static double formula(List<String> queryWords, List<String> passage, Map<String, List<String>> all) {
    double k1 = 1.2;
    double b = 0.75;
    int n = all.size();
    double avdl = all.values().stream().mapToInt(List::size).sum() / (double) n;
    double score = 0;
    for (String t : new LinkedHashSet<>(queryWords)) {
      long df = all.values().stream().filter(p -> p.contains(t)).count();
      long tf = passage.stream().filter(t::equals).count();
      if (tf == 0) {
        continue;
      }
      double idf = Math.log(1 + (n - df + 0.5) / (df + 0.5));
      double w = tf * (k1 + 1) / (tf + k1 * ((1 - b) + b * passage.size() / avdl));
      score += idf * w / (k1 + 1);
    }
    return score;
  }

  @ParameterizedTest(name = "{0}")
  @CsvSource({"rock", "dawn", "tide dawn", "gannets seals", "the rock", "at at dawn", "light stands on the rock"})
  void score_ofEveryMatchingPassage_agreesWithThePublishedFormula(String query) {
    Map<String, List<String>> all = passages();
    List<Collection.Hit> hits = hand().top(words(query), Optional.empty(), 10);
    for (Collection.Hit hit : hits) {
      double expected = formula(words(query), all.get(hit.id()), all);
      assertEquals(expected, hit.score(), expected * 1e-6, "passage " + hit.id() + " for '" + query + "'");
    }
    long matching = all.values().stream().filter(p -> words(query).stream().anyMatch(p::contains)).count();
    assertEquals(matching, hits.size(), "every passage holding a query word is a hit");
  }

  @Test
  void lengthEncoding_isExactUpToFortyTerms_soTheComparisonNeedsNoRounding() {
    for (int length = 0; length <= 40; length++) {
      assertEquals(length, org.apache.lucene.util.SmallFloat.byte4ToInt(org.apache.lucene.util.SmallFloat.intToByte4(length)));
    }
    assertEquals(40, org.apache.lucene.util.SmallFloat.byte4ToInt(org.apache.lucene.util.SmallFloat.intToByte4(41)));
    assertTrue(passages().values().stream().allMatch(p -> p.size() <= 40));
  }

  /* ---------------- rankings worked out by hand ---------------- */

  // Passage lengths (title + text): a 8, b 10, c 8, d 6, e 9; average 8.2. Document frequencies:
  // rock 3 (a, b, c), dawn 2 (d, e), tide 2 (b, e), gannets 1 (a, twice), seals 1 (b, twice).
  @ParameterizedTest(name = "{0}")
  @CsvSource(delimiter = '|', value = {
      "rock|c a b",            // c holds rock three times; a and b once each, a is shorter
      "dawn|d e",              // once each; d is shorter
      "tide dawn|e d b",       // e holds both (tide twice); d and b one each with equal idf, d shorter
      "gannets seals|a b",     // twice each with equal idf; a is shorter
      "ferry rock|d c a b"})   // ferry (df 1, twice in d) outweighs rock (df 3)
  void ranking_matchesTheRankingWorkedOutByHand(String query, String expected) {
    List<String> ids = hand().top(words(query), Optional.empty(), 10).stream().map(Collection.Hit::id).toList();
    assertEquals(List.of(expected.split(" ")), ids);
  }

  @Test
  void ranking_byTheIndependentFormula_isTheSameAsLucenes() {
    Map<String, List<String>> all = passages();
    for (String query : List.of("rock", "dawn", "tide dawn", "gannets seals", "ferry rock", "the at on")) {
      List<String> byFormula = all.keySet().stream()
          .filter(id -> words(query).stream().anyMatch(all.get(id)::contains))
          .sorted((x, y) -> {
            int c = Double.compare(formula(words(query), all.get(y), all), formula(words(query), all.get(x), all));
            return c != 0 ? c : x.compareTo(y);
          }).toList();
      List<String> byLucene = hand().top(words(query), Optional.empty(), 10).stream().map(Collection.Hit::id).toList();
      assertEquals(byFormula, byLucene, query);
    }
  }
}
