package reckoner.units;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Finds the known spellings nearest to an unknown unit word, for {@code unknown_unit}
 * suggestions: edit distance (insertions, deletions, substitutions and swaps of neighbours)
 * ignoring case, at most one suggestion per unit, at most three. Deterministic: ties go to the
 * unit nearer the top of the table, then to the spelling's order. Immutable; thread-safe.
 */
final class Suggester {
  static final int MAX_SUGGESTIONS = 3;
  private static final List<Prefix> COMMON = List.of(Prefix.KILO, Prefix.CENTI, Prefix.MILLI, Prefix.MICRO,
      Prefix.MEGA, Prefix.GIGA);

  private record Candidate(String text, String folded, String unitKey, int row) {}

  private final List<Candidate> candidates;

  Suggester(List<UnitDef> rows) {
    Map<String, Candidate> byText = new LinkedHashMap<>();
    int row = 0;
    for (UnitDef def : rows) {
      row++;
      if (def.isAmbiguous()) {
        continue;
      }
      List<String> spellings = new ArrayList<>(def.symbols());
      spellings.addAll(def.names());
      for (String s : spellings) {
        byText.putIfAbsent(s, new Candidate(s, Words.fold(s), def.key(), row));
      }
      if (def.prefixes() == Prefix.Policy.ALL) {
        for (Prefix p : COMMON) {
          String key = def.key() + "@" + p.symbol;
          for (String s : def.symbols()) {
            String t = p.symbol + s;
            byText.putIfAbsent(t, new Candidate(t, Words.fold(t), key, row));
          }
          for (String s : def.names()) {
            String t = p.word + s;
            byText.putIfAbsent(t, new Candidate(t, Words.fold(t), key, row));
          }
        }
      }
    }
    this.candidates = List.copyOf(byText.values());
  }

  List<String> suggest(String word) {
    String folded = Words.fold(word);
    int limit = Math.min(3, Math.max(1, folded.length() / 3));
    record Scored(Candidate c, int score) {}
    List<Scored> scored = new ArrayList<>();
    for (Candidate c : candidates) {
      if (Math.abs(c.folded.length() - folded.length()) > limit) {
        continue;
      }
      int d = distance(folded, c.folded, limit);
      if (d <= limit) {
        scored.add(new Scored(c, d));
      }
    }
    // Ties go to the row nearer the top of the table, where the common units are (km before kM).
    scored.sort(Comparator.comparingInt(Scored::score).thenComparingInt(s -> s.c.row).thenComparing(s -> s.c.text));
    List<String> out = new ArrayList<>();
    Set<String> units = new HashSet<>();
    for (Scored s : scored) {
      if (units.add(s.c.unitKey)) {
        out.add(s.c.text);
        if (out.size() == MAX_SUGGESTIONS) {
          break;
        }
      }
    }
    return out;
  }

  /**
   * Optimal string alignment distance, cut off once it exceeds {@code limit}. Kept here rather than
   * taken from commons-text: its {@code DamerauLevenshteinDistance} (1.15.0) gives 3, not 1, for
   * {@code ångsröm} against {@code ångström}, which would drop a published units@1 suggestion
   * ({@code SuggesterTest} pins the case).
   */
  static int distance(String a, String b, int limit) {
    int n = a.length();
    int m = b.length();
    int[][] d = new int[n + 1][m + 1];
    for (int i = 0; i <= n; i++) {
      d[i][0] = i;
    }
    for (int j = 0; j <= m; j++) {
      d[0][j] = j;
    }
    for (int i = 1; i <= n; i++) {
      int rowMin = Integer.MAX_VALUE;
      for (int j = 1; j <= m; j++) {
        int cost = a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1;
        int v = Math.min(Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1), d[i - 1][j - 1] + cost);
        if (i > 1 && j > 1 && a.charAt(i - 1) == b.charAt(j - 2) && a.charAt(i - 2) == b.charAt(j - 1)) {
          v = Math.min(v, d[i - 2][j - 2] + 1);
        }
        d[i][j] = v;
        rowMin = Math.min(rowMin, v);
      }
      if (rowMin > limit) {
        return limit + 1;
      }
    }
    return d[n][m];
  }
}
