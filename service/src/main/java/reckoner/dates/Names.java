package reckoner.dates;

/** Small text helpers for suggestions. Pure functions. */
final class Names {
  private Names() {}

  /** Levenshtein distance between two short strings. */
  static int editDistance(String a, String b) {
    return editDistance(a, b, Integer.MAX_VALUE - 1);
  }

  /**
   * Levenshtein distance, or {@code limit + 1} as soon as it must exceed {@code limit}: when every
   * cell of a row is above the limit, no later row can come back under it.
   */
  static int editDistance(String a, String b, int limit) {
    if (Math.abs(a.length() - b.length()) > limit) {
      return limit + 1;
    }
    int[] previous = new int[b.length() + 1];
    int[] current = new int[b.length() + 1];
    for (int j = 0; j <= b.length(); j++) {
      previous[j] = j;
    }
    for (int i = 1; i <= a.length(); i++) {
      current[0] = i;
      int rowMinimum = current[0];
      for (int j = 1; j <= b.length(); j++) {
        int substitution = previous[j - 1] + (a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1);
        current[j] = Math.min(substitution, Math.min(previous[j], current[j - 1]) + 1);
        rowMinimum = Math.min(rowMinimum, current[j]);
      }
      if (rowMinimum > limit) {
        return limit + 1;
      }
      int[] swap = previous;
      previous = current;
      current = swap;
    }
    return Math.min(previous[b.length()], limit + 1);
  }
}
