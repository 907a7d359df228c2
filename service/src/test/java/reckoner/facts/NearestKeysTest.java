package reckoner.facts;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.AlphaChars;
import net.jqwik.api.constraints.Size;
import net.jqwik.api.constraints.StringLength;
import org.apache.commons.text.similarity.LevenshteinDistance;
import org.junit.jupiter.api.Test;

/** Nearest-key suggestions: bounded, ordered, one per key, and the filters never drop a true match. */
final class NearestKeysTest {
  private static NearestKeys of(String... names) {
    List<Integer> owners = new ArrayList<>();
    for (int i = 0; i < names.length; i++) {
      owners.add(i);
    }
    return new NearestKeys(List.of(names), List.of(names), owners);
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
        List.of("Harbour Master", "harbour masters", "Pier"), List.of(0, 0, 1));
    assertEquals(List.of("Harbour Master"), keys.near("harbour mastr"));
  }

  @Test
  void thresholdFor_growsWithLength() {
    assertEquals(List.of(1, 1, 2, 2, 3, 3, 4), List.of("a", "abcd", "abcde", "abcdefgh", "abcdefghi", "abcdefghijklmn",
        "abcdefghijklmno").stream().map(NearestKeys::thresholdFor).toList());
  }

  @Property(tries = 200)
  void near_findsEveryNameWithinTheThreshold(@ForAll @Size(min = 1, max = 30) List<@AlphaChars @StringLength(min = 1, max = 12) String> names,
      @ForAll @AlphaChars @StringLength(min = 1, max = 12) String key) {
    List<String> distinct = names.stream().distinct().toList();
    List<Integer> owners = new ArrayList<>();
    for (int i = 0; i < distinct.size(); i++) {
      owners.add(i);
    }
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
    assertEquals(expected, new NearestKeys(distinct, distinct, owners).near(key));
  }
}
