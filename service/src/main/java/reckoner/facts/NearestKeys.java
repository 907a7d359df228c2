package reckoner.facts;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.apache.commons.text.similarity.LevenshteinDistance;

/**
 * Finds the names nearest to a missed key: Levenshtein distance (in UTF-16 units) over normalised
 * names, bounded by a threshold that grows with the key's length (1 up to 4 characters, 2 up to 8,
 * 3 up to 14, else 4), nearest first, ties by name in code-unit order, one suggestion per key.
 *
 * <p>Up to {@link #EXACT_SCAN_LIMIT} names every name is a candidate, after two cheap filters that
 * never drop a match: the length difference, and a 64-bit sketch of the characters present (one
 * edit changes at most two of its bits). Above that, a full scan would cost tens of milliseconds
 * per miss, so the candidates are the {@link #WINDOW} names on either side of the key in sorted
 * order and in sorted order of reversed names: the names sharing the longest prefix or suffix with
 * it. A single edit anywhere leaves a long common prefix or suffix, so typing slips are still
 * found; the suggestions are then the nearest of those candidates, not necessarily of all names.
 * The sorted orders are built with the set, before it serves. Immutable; thread-safe.
 */
final class NearestKeys {
  static final int MAX_SUGGESTIONS = 3;
  static final int EXACT_SCAN_LIMIT = 20_000;
  static final int WINDOW = 64;

  private final String[] names;     // normalised names, keys and aliases
  private final String[] shown;     // each name as the file wrote it
  private final int[] owner;        // index of the key each name belongs to
  private final long[] sketches;
  private final int exactScanLimit;
  private final int[] byName;          // name indexes in name order (large sets only)
  private final int[] byReversedName;  // name indexes in order of the reversed names (large sets only)

  NearestKeys(List<String> names, List<String> shown, int[] owner) {
    this(names, shown, owner, EXACT_SCAN_LIMIT);
  }

  /**
   * @param names the normalised names
   * @param shown each name as written
   * @param owner for each name, the number of the key it belongs to (names of one key share it)
   * @param exactScanLimit the most names searched by a full scan
   */
  NearestKeys(List<String> names, List<String> shown, int[] owner, int exactScanLimit) {
    int n = names.size();
    if (shown.size() != n || owner.length != n) {
      throw new IllegalArgumentException("names, shown and owner differ in length");
    }
    this.names = names.toArray(new String[0]);
    this.shown = shown.toArray(new String[0]);
    this.owner = owner.clone();
    this.sketches = new long[n];
    for (int i = 0; i < n; i++) {
      this.sketches[i] = sketch(this.names[i]);
    }
    this.exactScanLimit = exactScanLimit;
    if (n > exactScanLimit) {
      String[] reversed = new String[n]; // only while sorting: String.compareTo is much faster than a comparator
      for (int i = 0; i < n; i++) {
        reversed[i] = reverseUnits(this.names[i]);
      }
      this.byName = order(this.names);
      this.byReversedName = order(reversed);
    } else {
      this.byName = null;
      this.byReversedName = null;
    }
  }

  static int thresholdFor(String key) {
    int length = key.length();
    return length <= 4 ? 1 : length <= 8 ? 2 : length <= 14 ? 3 : 4;
  }

  /** Up to {@link #MAX_SUGGESTIONS} names near {@code key}, as written in the files. */
  List<String> near(String key) {
    Search search = new Search(key);
    if (names.length <= exactScanLimit) {
      for (int i = 0; i < names.length; i++) {
        search.consider(i);
      }
    } else {
      considerWindow(search, byName, key, false);
      considerWindow(search, byReversedName, key, true);
    }
    return search.result();
  }

  private void considerWindow(Search search, int[] order, String key, boolean reversedOrder) {
    int lo = 0;
    int hi = order.length;
    while (lo < hi) { // the first position whose name is not below the key in this order
      int mid = (lo + hi) >>> 1;
      String name = names[order[mid]];
      if ((reversedOrder ? compareReversed(name, key) : name.compareTo(key)) < 0) {
        lo = mid + 1;
      } else {
        hi = mid;
      }
    }
    for (int p = Math.max(0, lo - WINDOW); p < Math.min(order.length, lo + WINDOW); p++) {
      search.consider(order[p]);
    }
  }

  /** Name indexes sorted by {@code sortKeys} (stable merge sort on primitives: no boxing, no comparator). */
  private static int[] order(String[] sortKeys) {
    int[] order = new int[sortKeys.length];
    for (int i = 0; i < order.length; i++) {
      order[i] = i;
    }
    mergeSort(order, new int[order.length], 0, order.length, sortKeys);
    return order;
  }

  private static void mergeSort(int[] a, int[] tmp, int from, int to, String[] keys) {
    if (to - from <= 16) {
      for (int i = from + 1; i < to; i++) { // insertion sort for short runs
        int v = a[i];
        int j = i - 1;
        while (j >= from && keys[a[j]].compareTo(keys[v]) > 0) {
          a[j + 1] = a[j];
          j--;
        }
        a[j + 1] = v;
      }
      return;
    }
    int mid = (from + to) >>> 1;
    mergeSort(a, tmp, from, mid, keys);
    mergeSort(a, tmp, mid, to, keys);
    if (keys[a[mid - 1]].compareTo(keys[a[mid]]) <= 0) {
      return; // already in order: common for names written in order
    }
    System.arraycopy(a, from, tmp, from, to - from);
    int i = from;
    int j = mid;
    for (int k = from; k < to; k++) {
      a[k] = j >= to || (i < mid && keys[tmp[i]].compareTo(keys[tmp[j]]) <= 0) ? tmp[i++] : tmp[j++];
    }
  }

  /** {@code s} with its UTF-16 units in reverse order (surrogate pairs too, unlike StringBuilder.reverse). */
  static String reverseUnits(String s) {
    char[] units = new char[s.length()];
    for (int i = 0; i < units.length; i++) {
      units[i] = s.charAt(units.length - 1 - i);
    }
    return new String(units);
  }

  /** The order of {@link #reverseUnits} strings by String.compareTo, without reversing them. */
  static int compareReversed(String a, String b) {
    int i = a.length() - 1;
    int j = b.length() - 1;
    while (i >= 0 && j >= 0) {
      char x = a.charAt(i--);
      char y = b.charAt(j--);
      if (x != y) {
        return Character.compare(x, y);
      }
    }
    return Integer.compare(a.length(), b.length());
  }

  /** One search: the best few candidates so far (distance, then name), one per owning key. */
  private final class Search {
    private final String key;
    private final int threshold;
    private final long sketch;
    private final LevenshteinDistance distance;
    private final int[] best = new int[MAX_SUGGESTIONS];
    private final int[] bestDistance = new int[MAX_SUGGESTIONS];
    private int found;

    Search(String key) {
      this.key = key;
      this.threshold = thresholdFor(key);
      this.sketch = sketch(key);
      this.distance = new LevenshteinDistance(threshold);
    }

    void consider(int i) {
      String name = names[i];
      if (Math.abs(name.length() - key.length()) > threshold || Long.bitCount(sketch ^ sketches[i]) > 2 * threshold) {
        return;
      }
      for (int k = 0; k < found; k++) {
        if (best[k] == i) {
          return; // met twice through overlapping windows
        }
      }
      int d = distance.apply(key, name);
      if (d >= 0) {
        offer(i, d);
      }
    }

    List<String> result() {
      List<String> result = new ArrayList<>(found);
      for (int k = 0; k < found; k++) {
        result.add(shown[best[k]]);
      }
      return result;
    }

    private void offer(int candidate, int d) {
      for (int k = 0; k < found; k++) {
        if (owner[best[k]] == owner[candidate]) {
          if (isBetter(d, candidate, bestDistance[k], best[k])) {
            System.arraycopy(best, k + 1, best, k, found - k - 1);
            System.arraycopy(bestDistance, k + 1, bestDistance, k, found - k - 1);
            found--;
            insert(candidate, d);
          }
          return;
        }
      }
      insert(candidate, d);
    }

    private void insert(int candidate, int d) {
      int at = found;
      while (at > 0 && isBetter(d, candidate, bestDistance[at - 1], best[at - 1])) {
        at--;
      }
      if (at >= MAX_SUGGESTIONS) {
        return;
      }
      int last = Math.min(found, MAX_SUGGESTIONS - 1);
      for (int k = last; k > at; k--) {
        best[k] = best[k - 1];
        bestDistance[k] = bestDistance[k - 1];
      }
      best[at] = candidate;
      bestDistance[at] = d;
      found = Math.min(found + 1, MAX_SUGGESTIONS);
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
