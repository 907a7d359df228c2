package reckoner.facts;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.text.similarity.LevenshteinDistance;

/**
 * Finds the names nearest to a missed key: Levenshtein distance (in UTF-16 units) over normalised
 * names, bounded by a threshold that grows with the key's length (1 up to 4 characters, 2 up to 8,
 * 3 up to 14, else 4), nearest first, ties by name in code-unit order, one suggestion per key. Two
 * cheap filters skip most names before the distance runs: the length difference, and a 64-bit
 * sketch of the characters present (one edit changes at most two of its bits). Immutable;
 * thread-safe.
 */
final class NearestKeys {
  static final int MAX_SUGGESTIONS = 3;

  private final String[] names;     // normalised names, keys and aliases
  private final String[] shown;     // each name as the file wrote it
  private final int[] owner;        // index of the key each name belongs to
  private final long[] sketches;

  NearestKeys(List<String> names, List<String> shown, List<Integer> owner) {
    int n = names.size();
    this.names = names.toArray(new String[0]);
    this.shown = shown.toArray(new String[0]);
    this.owner = new int[n];
    this.sketches = new long[n];
    for (int i = 0; i < n; i++) {
      this.owner[i] = owner.get(i);
      this.sketches[i] = sketch(this.names[i]);
    }
  }

  static int thresholdFor(String key) {
    int length = key.length();
    return length <= 4 ? 1 : length <= 8 ? 2 : length <= 14 ? 3 : 4;
  }

  /** Up to {@link #MAX_SUGGESTIONS} names near {@code key}, as written in the files. */
  List<String> near(String key) {
    int threshold = thresholdFor(key);
    LevenshteinDistance distance = new LevenshteinDistance(threshold);
    long sketch = sketch(key);
    int[] best = new int[MAX_SUGGESTIONS];
    int[] bestDistance = new int[MAX_SUGGESTIONS];
    int found = 0;
    for (int i = 0; i < names.length; i++) {
      String name = names[i];
      if (Math.abs(name.length() - key.length()) > threshold
          || Long.bitCount(sketch ^ sketches[i]) > 2 * threshold) {
        continue;
      }
      int d = distance.apply(key, name);
      if (d < 0) {
        continue;
      }
      found = offer(best, bestDistance, found, i, d);
    }
    List<String> result = new ArrayList<>(found);
    for (int k = 0; k < found; k++) {
      result.add(shown[best[k]]);
    }
    return result;
  }

  /** Keeps the best few (distance, then name), one per owning key. Returns the new count. */
  private int offer(int[] best, int[] bestDistance, int found, int candidate, int d) {
    for (int k = 0; k < found; k++) {
      if (owner[best[k]] == owner[candidate]) {
        if (isBetter(d, candidate, bestDistance[k], best[k])) {
          remove(best, bestDistance, found, k);
          return insert(best, bestDistance, found - 1, candidate, d);
        }
        return found;
      }
    }
    return insert(best, bestDistance, found, candidate, d);
  }

  private int insert(int[] best, int[] bestDistance, int found, int candidate, int d) {
    int at = found;
    while (at > 0 && isBetter(d, candidate, bestDistance[at - 1], best[at - 1])) {
      at--;
    }
    if (at >= best.length) {
      return found;
    }
    int last = Math.min(found, best.length - 1);
    for (int k = last; k > at; k--) {
      best[k] = best[k - 1];
      bestDistance[k] = bestDistance[k - 1];
    }
    best[at] = candidate;
    bestDistance[at] = d;
    return Math.min(found + 1, best.length);
  }

  private static void remove(int[] best, int[] bestDistance, int found, int k) {
    for (int j = k; j < found - 1; j++) {
      best[j] = best[j + 1];
      bestDistance[j] = bestDistance[j + 1];
    }
  }

  private boolean isBetter(int d, int candidate, int otherDistance, int other) {
    return d != otherDistance ? d < otherDistance : names[candidate].compareTo(names[other]) < 0;
  }

  /** One bit per character present, hashed into 64 bits. */
  private static long sketch(String s) {
    long bits = 0;
    for (int i = 0; i < s.length(); i++) {
      bits |= 1L << ((s.charAt(i) * 0x9E3779B1) >>> 26);
    }
    return bits;
  }
}
