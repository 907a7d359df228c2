package reckoner.units;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Pattern;
import reckoner.tool.ToolException;

/**
 * A unit table: {@code units@1} reads {@code units/units-1.tsv} and {@code units@2} reads
 * {@code units/units-2.tsv} from the classpath, each once. The file is part of the tool's version:
 * a change to it that changes an answer is a new version.
 *
 * <p>Each row is {@code key, symbols, names, dimension, definition, prefixes, source}, separated
 * by tabs. A definition is a base ({@code =L}), an exact literal and a unit expression over rows
 * above it ({@code 0.0254 m}, {@code 5/9 K; offset 459.67}), or {@code one of: k1 k2} for an
 * ambiguous name, optionally followed by default readings by system ({@code ; us=k1; imperial=k2}
 * or {@code ; all=k1}; units@2 reads them). A row whose computed dimension differs from its dimension column, a symbol or
 * name used twice, or a malformed row stops the load, naming the line. Immutable once loaded;
 * thread-safe.
 */
final class UnitTable {
  static final String RESOURCE = "units/units-1.tsv";
  static final String RESOURCE_2 = "units/units-2.tsv";
  /** The dimension column of an ambiguous row whose readings differ in dimension (pint or point). */
  static final String MIXED = "mixed";
  private static final Pattern LITERAL = Pattern.compile(
      "(pi|[0-9]+(\\.[0-9]+)?(e[-+]?[0-9]+)?)([*/](pi|[0-9]+(\\.[0-9]+)?(e[-+]?[0-9]+)?))*");
  /** Every input spelling of every prefix with its prefix, longest spelling first. */
  private static final List<Map.Entry<String, Prefix>> PREFIX_SPELLINGS = Arrays.stream(Prefix.values())
      .flatMap(p -> p.inputSymbols().stream().map(s -> Map.entry(s, p)))
      .sorted(Comparator.comparingInt((Map.Entry<String, Prefix> e) -> -e.getKey().length()))
      .toList();

  /** A word read as a row, possibly with a prefix (null when none). */
  record Resolved(UnitDef def, Prefix prefix) {}

  /** A phrase (a name with spaces or punctuation) matched at a position, up to {@code end}. */
  record PhraseMatch(Resolved resolved, int end) {}

  private record Phrase(String text, boolean caseSensitive, Resolved resolved) {}

  /** Phrases by their first word, folded; each list longest first. */
  private final Map<String, List<Phrase>> phrasesByFirst = new HashMap<>();

  private final List<UnitDef> rows = new ArrayList<>();
  private final Map<String, UnitDef> byKey = new HashMap<>();
  private final Map<String, UnitDef> bySymbol = new HashMap<>();
  private final Map<String, UnitDef> byName = new HashMap<>();
  private final List<Phrase> phrases = new ArrayList<>();
  private Suggester suggester;

  private UnitTable() {}

  /** The table shipped with this version. */
  static UnitTable standard() {
    return Holder.STANDARD;
  }

  /** The table of {@code units@2}. */
  static UnitTable version2() {
    return Holder2.VERSION_2;
  }

  private static final class Holder {
    static final UnitTable STANDARD = load(RESOURCE);
  }

  private static final class Holder2 {
    static final UnitTable VERSION_2 = load(RESOURCE_2);
  }

  static UnitTable load(String resource) {
    try (InputStream in = UnitTable.class.getClassLoader().getResourceAsStream(resource)) {
      if (in == null) {
        throw new IllegalStateException("the unit table " + resource + " is not on the classpath");
      }
      BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
      UnitTable table = new UnitTable();
      List<String[]> ambiguous = new ArrayList<>();
      String line;
      int number = 0;
      while ((line = reader.readLine()) != null) {
        number++;
        if (line.isBlank() || line.startsWith("#")) {
          continue;
        }
        String where = resource + ":" + number;
        String[] cols = line.split("\t", -1);
        if (cols.length != 7) {
          throw new IllegalStateException(where + ": expected 7 tab-separated columns but found " + cols.length);
        }
        try {
          table.addRow(cols, where, ambiguous);
        } catch (ToolException e) {
          throw new IllegalStateException(where + ": definition '" + cols[4] + "' does not parse: " + e.getMessage(), e);
        } catch (RuntimeException e) {
          throw new IllegalStateException(where + ": " + e.getMessage(), e);
        }
      }
      table.resolveAmbiguous(ambiguous);
      table.suggester = new Suggester(table.rows);
      return table;
    } catch (IOException e) {
      throw new UncheckedIOException("cannot read " + resource, e);
    }
  }

  private void addRow(String[] cols, String where, List<String[]> ambiguous) throws ToolException {
    String key = cols[0].trim();
    List<String> symbols = cols[1].isBlank() || cols[1].trim().equals("-") ? List.of()
        : Arrays.stream(cols[1].trim().split(" +")).map(Words::normalize).toList();
    List<String> names = parseNames(cols[2]);
    boolean mixed = cols[3].trim().equals(MIXED);
    Dimension stated = mixed ? Dimension.NONE : DimensionNames.forName(cols[3].trim())
        .orElseThrow(() -> new IllegalArgumentException("unknown dimension name '" + cols[3] + "'"));
    String definition = cols[4].trim();
    Prefix.Policy prefixes = Prefix.Policy.parse(cols[5].trim());
    String source = cols[6].trim();
    if (source.isEmpty()) {
      throw new IllegalArgumentException("every row names the published source of its definition");
    }
    if (byKey.containsKey(key) || !key.matches("[A-Za-z][A-Za-z0-9_]*")) {
      throw new IllegalArgumentException("key '" + key + "' is used twice or is not an ASCII identifier");
    }
    UnitDef def;
    if (definition.startsWith("one of:")) {
      String[] parts = definition.substring("one of:".length()).split(";");
      List<String> readings = List.of(parts[0].trim().split(" +"));
      Map<String, String> defaults = new LinkedHashMap<>();
      for (int i = 1; i < parts.length; i++) {
        String[] kv = parts[i].trim().split("=", -1);
        if (kv.length != 2 || !readings.contains(kv[1].trim()) || defaults.put(kv[0].trim(), kv[1].trim()) != null) {
          throw new IllegalArgumentException("a default must be 'system=reading' naming one of the row's readings: '"
              + parts[i].trim() + "'");
        }
      }
      def = new UnitDef(key, symbols, names, stated, Factor.ONE, Rational.ZERO, false, prefixes, definition, source,
          readings, defaults);
      ambiguous.add(new String[] {key, where, mixed ? MIXED : ""});
    } else if (mixed) {
      throw new IllegalArgumentException("only an ambiguous row may have readings of mixed dimensions");
    } else {
      def = define(key, symbols, names, stated, definition, prefixes, source);
    }
    register(def);
  }

  private UnitDef define(String key, List<String> symbols, List<String> names, Dimension stated, String definition,
      Prefix.Policy prefixes, String source) throws ToolException {
    String[] parts = definition.split(";");
    Rational offset = Rational.ZERO;
    boolean interval = false;
    for (int i = 1; i < parts.length; i++) {
      String flag = parts[i].trim();
      if (flag.startsWith("offset ")) {
        offset = Rational.parse(flag.substring("offset ".length()).trim());
      } else if (flag.equals("interval")) {
        interval = true;
      } else {
        throw new IllegalArgumentException("unknown definition flag '" + flag + "'");
      }
    }
    String main = parts[0].trim();
    Factor factor;
    Dimension dimension;
    if (main.startsWith("=")) {
      dimension = Dimension.parse(main.substring(1));
      factor = Factor.ONE;
    } else {
      int space = main.indexOf(' ');
      String first = space < 0 ? main : main.substring(0, space);
      Factor literal = Factor.ONE;
      String expression = main;
      if (LITERAL.matcher(first).matches()) {
        literal = parseLiteral(first);
        expression = space < 0 ? "" : main.substring(space + 1).trim();
      }
      Unit unit = expression.isEmpty() ? Unit.of(Factor.ONE, Dimension.NONE) : UnitParser.parse(expression, this);
      factor = literal.times(unit.factor());
      dimension = unit.dimension();
    }
    if (!dimension.equals(stated)) {
      throw new IllegalArgumentException("the definition has dimension " + DimensionNames.describe(dimension)
          + " but the row says " + DimensionNames.describe(stated));
    }
    if (factor.coefficient().signum() <= 0) {
      throw new IllegalArgumentException("a unit's factor must be positive");
    }
    return new UnitDef(key, symbols, names, dimension, factor, offset, interval, prefixes, definition, source, List.of(),
        Map.of());
  }

  /** {@code 0.0254}, {@code 5/9}, {@code pi/180}, {@code 648000/pi}: products and quotients of decimals and pi. */
  static Factor parseLiteral(String text) {
    Factor result = Factor.ONE;
    int i = 0;
    char op = '*';
    while (i <= text.length()) {
      int next = i;
      while (next < text.length() && text.charAt(next) != '*' && text.charAt(next) != '/') {
        next++;
      }
      String part = text.substring(i, next);
      Factor f = part.equals("pi") ? new Factor(Rational.ONE, 1) : Factor.of(Rational.parse(part));
      result = op == '*' ? result.times(f) : result.divide(f);
      if (next >= text.length()) {
        break;
      }
      op = text.charAt(next);
      i = next + 1;
    }
    return result;
  }

  private static List<String> parseNames(String column) {
    String c = column.trim();
    if (c.isEmpty() || c.equals("-")) {
      return List.of();
    }
    List<String> names = new ArrayList<>();
    for (String entry : c.split(";")) {
      for (String name : entry.split("/")) {
        String n = Words.normalize(name);
        if (!n.isEmpty()) {
          names.add(n);
        }
      }
    }
    return names;
  }

  private void register(UnitDef def) {
    rows.add(def);
    byKey.put(def.key(), def);
    putUnique(bySymbol, def.key(), def, "symbol");
    for (String symbol : def.symbols()) {
      if (!symbol.equals(def.key())) {
        if (Words.isPlainWord(symbol)) {
          putUnique(bySymbol, symbol, def, "symbol");
        } else {
          addPhrase(symbol, true, new Resolved(def, null));
        }
      }
    }
    for (String name : def.names()) {
      String folded = Words.fold(name);
      if (Words.isPlainWord(folded)) {
        putUnique(byName, folded, def, "name");
      } else {
        addPhrase(folded, false, new Resolved(def, null));
        if (def.prefixes() != Prefix.Policy.NONE) {
          for (Prefix p : Prefix.values()) {
            if (def.prefixes().allows(p)) {
              addPhrase(p.word + folded, false, new Resolved(def, p));
            }
          }
        }
      }
    }
  }

  private void addPhrase(String text, boolean caseSensitive, Resolved resolved) {
    for (Phrase p : phrases) {
      if (p.caseSensitive == caseSensitive && p.text.equals(text)) {
        throw new IllegalArgumentException("phrase '" + text + "' is used twice");
      }
    }
    Phrase phrase = new Phrase(text, caseSensitive, resolved);
    phrases.add(phrase);
    List<Phrase> bucket = phrasesByFirst.computeIfAbsent(firstWord(text, 0), c -> new ArrayList<>());
    bucket.add(phrase);
    bucket.sort(Comparator.comparingInt((Phrase p) -> -p.text.length()).thenComparing(Phrase::text));
  }

  private static void putUnique(Map<String, UnitDef> map, String k, UnitDef def, String what) {
    UnitDef previous = map.putIfAbsent(k, def);
    if (previous != null && previous != def) {
      throw new IllegalArgumentException(what + " '" + k + "' of " + def.key() + " is already used by " + previous.key());
    }
  }

  private void resolveAmbiguous(List<String[]> ambiguous) {
    for (String[] a : ambiguous) {
      UnitDef def = byKey.get(a[0]);
      for (String reading : def.readings()) {
        Reading r = reading(reading);
        if (r == null || r.def.isAmbiguous() || (r.prefix != null && !r.def.prefixes().allows(r.prefix))) {
          throw new IllegalStateException(a[1] + ": reading '" + reading + "' is not an unambiguous row");
        }
        if (r.prefix != null && def.prefixes() != Prefix.Policy.NONE) {
          throw new IllegalStateException(a[1] + ": a row with prefixed readings cannot take prefixes itself");
        }
        if (!a[2].equals(MIXED) && !r.def.dimension().equals(def.dimension())) {
          throw new IllegalStateException(a[1] + ": reading '" + reading + "' has another dimension");
        }
        if (!def.prefixes().equals(Prefix.Policy.NONE) && !def.prefixes().equals(r.def.prefixes())) {
          throw new IllegalStateException(a[1] + ": reading '" + reading + "' takes other prefixes than the row");
        }
      }
    }
  }

  /** A reading of an ambiguous row: {@code KEY} or {@code PREFIX:KEY} ({@code k:byte}). */
  private record Reading(Prefix prefix, UnitDef def) {
    String symbol(Prefix outer) {
      return (outer == null ? "" : outer.symbol) + (prefix == null ? "" : prefix.symbol) + def.shownSymbol();
    }

    String name(Prefix outer) {
      String n = def.shownName();
      if (prefix != null) {
        return prefix.word + n;
      }
      return outer == null ? n : outer.word + n;
    }
  }

  private Reading reading(String spec) {
    int colon = spec.indexOf(':');
    if (colon < 0) {
      UnitDef d = byKey.containsKey(spec) ? byKey.get(spec) : bySymbol.get(spec);
      return d == null ? null : new Reading(null, d);
    }
    Prefix prefix = null;
    for (Prefix p : Prefix.values()) {
      if (p.symbol.equals(spec.substring(0, colon))) {
        prefix = p;
      }
    }
    String k = spec.substring(colon + 1);
    UnitDef d = byKey.containsKey(k) ? byKey.get(k) : bySymbol.get(k);
    return prefix == null || d == null ? null : new Reading(prefix, d);
  }

  // ---- lookups --------------------------------------------------------------------------------

  /** Every row in file order, ambiguous ones included. */
  List<UnitDef> rows() {
    return Collections.unmodifiableList(rows);
  }

  Optional<UnitDef> byKey(String key) {
    return Optional.ofNullable(byKey.get(key));
  }

  /**
   * Reads one word: an exact symbol (case-sensitive), a name (any case), then a prefix symbol
   * before a symbol, then a prefix name before a name. Empty if nothing matches.
   */
  Optional<Resolved> resolve(String word) {
    UnitDef def = bySymbol.get(word);
    if (def != null) {
      return Optional.of(new Resolved(def, null));
    }
    String folded = Words.fold(word);
    def = byName.get(folded);
    if (def != null) {
      return Optional.of(new Resolved(def, null));
    }
    for (Map.Entry<String, Prefix> e : PREFIX_SPELLINGS) {
      String spelling = e.getKey();
      if (word.length() > spelling.length() && word.startsWith(spelling)) {
        UnitDef d = bySymbol.get(word.substring(spelling.length()));
        if (d != null && d.prefixes().allows(e.getValue())) {
          return Optional.of(new Resolved(d, e.getValue()));
        }
      }
    }
    for (Prefix p : Prefix.values()) {
      if (folded.length() > p.word.length() && folded.startsWith(p.word)) {
        UnitDef d = byName.get(folded.substring(p.word.length()));
        if (d != null && d.prefixes().allows(p)) {
          return Optional.of(new Resolved(d, p));
        }
      }
    }
    return Optional.empty();
  }

  /**
   * The longest phrase (a name or symbol with spaces or punctuation, such as {@code fluid ounce}
   * or {@code pound-force}) that starts at {@code pos} of {@code text} and ends at a word boundary.
   */
  Optional<PhraseMatch> phrase(String text, int pos) {
    if (pos >= text.length()) {
      return Optional.empty();
    }
    List<Phrase> bucket = phrasesByFirst.get(firstWord(text, pos));
    if (bucket == null) {
      return Optional.empty();
    }
    for (Phrase p : bucket) {
      int end = pos + p.text.length();
      if (end <= text.length() && text.regionMatches(!p.caseSensitive, pos, p.text, 0, p.text.length())
          && (end == text.length() || !Words.isWordPart(text.charAt(end)) || !Words.isWordPart(p.text.charAt(p.text.length() - 1)))) {
        return Optional.of(new PhraseMatch(p.resolved, end));
      }
    }
    return Optional.empty();
  }

  /** The run of word characters at {@code pos}, folded: the key phrases are filed under. */
  private static String firstWord(String text, int pos) {
    int end = pos;
    while (end < text.length() && Words.isWordPart(text.charAt(end))) {
      end++;
    }
    return Words.fold(text.substring(pos, Math.max(end, Math.min(pos + 1, text.length()))));
  }

  /** Up to three known spellings nearest to an unknown word. */
  List<String> suggest(String word) {
    return suggester.suggest(word);
  }

  /** The readings of an ambiguous row as they should be written, with the prefix applied. */
  List<String> readingSymbols(UnitDef ambiguous, Prefix prefix) {
    List<String> out = new ArrayList<>();
    for (String spec : ambiguous.readings()) {
      out.add(written(reading(spec), prefix));
    }
    return out;
  }

  /** The readings described in words: {@code US gallon (gal_us) or imperial gallon (gal_imp)}. */
  String describeReadings(UnitDef ambiguous, Prefix prefix) {
    List<String> parts = new ArrayList<>();
    for (String spec : ambiguous.readings()) {
      Reading r = reading(spec);
      parts.add(r.name(prefix) + " (" + written(r, prefix) + ")");
    }
    if (parts.size() == 1) {
      return parts.get(0);
    }
    return String.join(", ", parts.subList(0, parts.size() - 1)) + " or " + parts.get(parts.size() - 1);
  }

  /** How a reading is written so that it parses as itself: its symbol, or its name where the symbol is ambiguous (kt). */
  private String written(Reading r, Prefix outer) {
    String symbol = r.symbol(outer);
    UnitDef d = bySymbol.get(symbol);
    return d != null && d.isAmbiguous() ? r.name(outer) : symbol;
  }

  // ---- version 2: readings of ambiguous rows ------------------------------------------------------

  /** The readings of an ambiguous row as resolved words, with the outer prefix applied. */
  List<Resolved> readingsOf(UnitDef ambiguous, Prefix outer) {
    List<Resolved> out = new ArrayList<>();
    for (String spec : ambiguous.readings()) {
      out.add(resolvedOf(reading(spec), outer));
    }
    return out;
  }

  /** The reading an ambiguous row takes under {@code system}, if it names one. */
  Optional<Resolved> defaultReading(UnitDef ambiguous, Prefix outer, String system) {
    return ambiguous.defaultReading(system).map(spec -> resolvedOf(reading(spec), outer));
  }

  private static Resolved resolvedOf(Reading r, Prefix outer) {
    return new Resolved(r.def, r.prefix != null ? r.prefix : outer);
  }

  /** A resolved word's name in words: {@code US cup}, {@code kilometre}. */
  String nameOf(Resolved r) {
    return new Reading(null, r.def()).name(r.prefix());
  }

  /** How a resolved word is written so that it parses as itself: {@code cup_us}, {@code km}. */
  String symbolOf(Resolved r) {
    return written(new Reading(null, r.def()), r.prefix());
  }

  /** Every case-sensitive symbol with its row, ambiguous rows included. */
  Map<String, UnitDef> symbols() {
    return Collections.unmodifiableMap(bySymbol);
  }

  /** Symbols that are also a prefix before another symbol; the exact symbol wins. For review in tests. */
  Map<String, String> shadowedPrefixReadings() {
    Map<String, String> out = new LinkedHashMap<>();
    for (Map.Entry<String, UnitDef> e : bySymbol.entrySet()) {
      String s = e.getKey();
      for (Prefix p : Prefix.values()) {
        for (String spelling : p.inputSymbols()) {
          if (s.length() > spelling.length() && s.startsWith(spelling)) {
            UnitDef d = bySymbol.get(s.substring(spelling.length()));
            if (d != null && d.prefixes().allows(p) && d != e.getValue()) {
              out.put(s, p.word + d.shownName());
            }
          }
        }
      }
    }
    return out;
  }
}
