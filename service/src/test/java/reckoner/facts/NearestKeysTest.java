package reckoner.facts;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.lists;
import static org.quicktheories.generators.SourceDSL.strings;

import org.quicktheories.core.Gen;
import org.quicktheories.impl.Constraint;
import org.apache.commons.text.similarity.LevenshteinDistance;
import org.junit.jupiter.api.Test;

/** Nearest-key suggestions: bounded, ordered, one per key, and the filters never drop a true match. */
final class NearestKeysTest {
  private static int[] ownEach(int n) {
    return java.util.stream.IntStream.range(0, n).toArray();
  }

  private static NearestKeys of(String... names) {
    return new NearestKeys(List.of(names), List.of(names), ownEach(names.length));
  }

  @Test
  void near_ordersByDistanceThenName_andStopsAtThree() {
    NearestKeys keys = of("harbour", "harbours", "harbor", "arbour", "harbour master", "zebra");
    // harbourr: harbour 1, harbours 1, then arbour 2 and harbor 2 (the tie goes by name), harbour master 7
    assertEquals(List.of("harbour", "harbours", "arbour"), keys.near("harbourr"));
  }

  @Test
  void near_isBoundedByKeyLength() {
    assertEquals(List.of(), of("abcd").near("wxyz")); // 4 edits, threshold 1 for short keys
    assertEquals(List.of("abcd"), of("abcd").near("abce"));
  }

  @Test
  void near_suggestsOneNamePerKey() {
    NearestKeys keys = new NearestKeys(List.of("harbour master", "harbour masters", "pier"),
        List.of("Harbour Master", "harbour masters", "Pier"), new int[] {0, 0, 1});
    assertEquals(List.of("Harbour Master"), keys.near("harbour mastr"));
  }

  @Test
  void near_largeSet_findsSingleSlipsAnywhereThroughTheSortedWindows() {
    List<String> names = new ArrayList<>();
    for (int i = 0; i < 5000; i++) {
      names.add(String.format(java.util.Locale.ROOT, "mooring permit mp-%07d", i * 7919 % 1_000_000));
    }
    NearestKeys windowed = new NearestKeys(names, names, ownEach(names.size()), 100); // force the windowed search
    String target = names.get(1234);
    List<String> slips = List.of(
        "m" + target.substring(2),                          // a deletion at the start
        target.substring(0, 10) + "x" + target.substring(11), // a substitution in the middle
        target + "9",                                       // an insertion at the end
        target.replace("mp-", "mp-9"));                     // an insertion among the digits
    for (String slip : slips) {
      assertEquals(target, windowed.near(slip).get(0), slip);
    }
  }

  @Test
  void near_largeSet_agreesWithTheExactScanOnSingleSlips() {
    List<String> names = new ArrayList<>();
    java.util.SplittableRandom random = new java.util.SplittableRandom(5);
    for (int i = 0; i < 3000; i++) {
      names.add("harbour " + Long.toString(random.nextLong(1L << 40), 36));
    }
    NearestKeys exact = new NearestKeys(names, names, ownEach(names.size()), Integer.MAX_VALUE);
    NearestKeys windowed = new NearestKeys(names, names, ownEach(names.size()), 100);
    for (int i = 0; i < 300; i++) {
      String name = names.get(random.nextInt(names.size()));
      int at = random.nextInt(name.length());
      String slip = name.substring(0, at) + (char) ('a' + random.nextInt(26)) + name.substring(at + 1);
      assertEquals(exact.near(slip).get(0), windowed.near(slip).get(0), slip);
    }
  }

  @Test
  void compareReversed_isTheOrderOfReversedStrings() {
    Gen<String> shortStrings = strings().allPossible().ofLengthBetween(0, 6);
    qt().withExamples(300).withFixedSeed(11L).forAll(shortStrings, shortStrings).checkAssert((a, b) -> {
      int expected = Integer.signum(NearestKeys.reverseUnits(a).compareTo(NearestKeys.reverseUnits(b)));
      assertEquals(expected, Integer.signum(NearestKeys.compareReversed(a, b)));
    });
  }

  /** Letters A-Z and a-z, 1 to 12 of them. */
  private static Gen<String> alphaWords() {
    return in -> {
      int length = (int) in.next(Constraint.between(1, 12));
      StringBuilder sb = new StringBuilder(length);
      for (int i = 0; i < length; i++) {
        int c = (int) in.next(Constraint.between(0, 51));
        sb.append((char) (c < 26 ? 'a' + c : 'A' + c - 26));
      }
      return sb.toString();
    };
  }

  @Test
  void reverseUnits_reversesSurrogatePairsUnitByUnit() {
    assertEquals("\uDE00\uD83Dba", NearestKeys.reverseUnits("ab\uD83D\uDE00"));
  }

  @Test
  void thresholdFor_growsWithLength() {
    assertEquals(List.of(1, 1, 2, 2, 3, 3, 4), List.of("a", "abcd", "abcde", "abcdefgh", "abcdefghi", "abcdefghijklmn",
        "abcdefghijklmno").stream().map(NearestKeys::thresholdFor).toList());
  }

  @Test
  void near_findsEveryNameWithinTheThreshold() {
    qt().withExamples(200).withFixedSeed(12L).forAll(lists().of(alphaWords()).ofSizeBetween(1, 30), alphaWords())
        .checkAssert(this::near_findsEveryNameWithinTheThreshold);
  }

  private void near_findsEveryNameWithinTheThreshold(List<String> names, String key) {
    List<String> distinct = names.stream().distinct().toList();
    int threshold = NearestKeys.thresholdFor(key);
    LevenshteinDistance plain = LevenshteinDistance.getDefaultInstance();
    List<String> expected = distinct.stream()
        .filter(n -> plain.apply(key, n) <= threshold)
        .sorted((a, b) -> {
          int d = Integer.compare(plain.apply(key, a), plain.apply(key, b));
          return d != 0 ? d : a.compareTo(b);
        })
        .limit(NearestKeys.MAX_SUGGESTIONS)
        .toList();
    assertEquals(expected, new NearestKeys(distinct, distinct, ownEach(distinct.size())).near(key));
  }
}
