package reckoner.units;

import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import reckoner.tool.ErrorCode;
import reckoner.tool.ResultText;
import reckoner.tool.ToolError;
import reckoner.tool.ToolException;

/**
 * How {@code units@2} reads the words its table does not settle alone, for one unit expression of
 * one call: a name with several readings takes its system's default ({@code cup} is the US cup
 * under {@code us}); a bare name whose readings differ in dimension takes the one that fits the
 * other unit ({@code pt} beside {@code px} is the point); a bare {@code C} or {@code F} beside a
 * temperature is °C or °F; a word in the wrong case is the one spelling it can be ({@code KM} is
 * {@code km}, while {@code MM} may be {@code mm} or {@code Mm} and is refused); and °C or °F inside
 * a compound is a temperature difference. Each reading taken is noted, for the answer to show.
 * Not thread-safe: one instance reads one expression.
 */
final class SystemReadings implements UnitParser.Readings {
  static final String US = "us";
  static final String IMPERIAL = "imperial";
  static final String METRIC = "metric";
  static final List<String> SYSTEMS = List.of(US, IMPERIAL, METRIC);

  static final Dimension TEMPERATURE = Dimension.of(Dimension.Base.TEMPERATURE);
  static final Dimension VOLUME = Dimension.parse("L3");

  /**
   * The rows whose prefixed symbols take part in case readings: the units that are prefixed in
   * everyday writing. A rarer row (molar, gauss, poise) is left out, so that {@code KM} is read as
   * the kilometre and not also as the kilomolar.
   */
  static final Set<String> EVERYDAY = Set.of("metre", "gram", "second", "litre", "watt", "watt_hour", "joule",
      "hertz", "pascal", "volt", "ampere", "newton", "byte", "bit", "electronvolt", "bar", "ampere_hour", "farad",
      "ohm", "tonne", "volt_ampere", "bit_per_second");

  /** A spelling the case index knows, with how the table reads it. */
  record Spelling(String text, UnitTable.Resolved resolved) {}

  /** Fewer capitals first (mm before Mm), then by the characters: a fixed order on every machine. */
  private static final java.util.Comparator<Spelling> SPELLING_ORDER = java.util.Comparator
      .comparingLong((Spelling s) -> s.text.chars().filter(Character::isUpperCase).count())
      .thenComparing(Spelling::text);

  private final UnitTable table;
  private final Map<String, List<Spelling>> caseIndex;
  private final String system;
  private final Dimension hint;
  private final Set<String> notes = new LinkedHashSet<>();

  /**
   * @param hint the dimension of the other side of the conversion, when known; it settles a bare
   *     word whose readings differ in dimension, and a bare C or F
   */
  SystemReadings(UnitTable table, Map<String, List<Spelling>> caseIndex, String system, Dimension hint) {
    this.table = table;
    this.caseIndex = caseIndex;
    this.system = system;
    this.hint = hint;
  }

  /** The readings taken, in the order they were taken, each once. */
  List<String> notes() {
    return new ArrayList<>(notes);
  }

  // ---- the case index -----------------------------------------------------------------------------

  /**
   * Every plain symbol of {@code table} and every prefixed symbol of an {@link #EVERYDAY} row, by
   * its lower-case form, each with the reading the table gives its exact spelling.
   */
  static Map<String, List<Spelling>> caseIndex(UnitTable table) {
    Map<String, Map<String, Spelling>> byFold = new HashMap<>();
    for (String symbol : table.symbols().keySet()) {
      add(byFold, table, symbol);
    }
    for (UnitDef def : table.rows()) {
      if (!EVERYDAY.contains(def.key())) {
        continue;
      }
      for (Prefix p : Prefix.values()) {
        if (!def.prefixes().allows(p)) {
          continue;
        }
        for (String spelling : p.inputSymbols()) {
          for (String symbol : def.symbols()) {
            add(byFold, table, spelling + symbol);
          }
        }
      }
    }
    Map<String, List<Spelling>> out = new HashMap<>();
    byFold.forEach((fold, spellings) -> {
      List<Spelling> sorted = new ArrayList<>(spellings.values());
      sorted.sort(SPELLING_ORDER);
      out.put(fold, List.copyOf(sorted));
    });
    return Collections.unmodifiableMap(out);
  }

  private static void add(Map<String, Map<String, Spelling>> byFold, UnitTable table, String spelling) {
    if (!Words.isPlainWord(spelling)) {
      return;
    }
    Optional<UnitTable.Resolved> r = table.resolve(spelling);
    if (r.isPresent()) {
      byFold.computeIfAbsent(Words.fold(spelling), k -> new LinkedHashMap<>()).putIfAbsent(spelling,
          new Spelling(spelling, r.get()));
    }
  }

  // ---- the readings -------------------------------------------------------------------------------

  @Override
  public UnitTable.Resolved exact(UnitTable.Resolved r, String written, boolean whole) throws ToolException {
    if (!whole || hint == null || r.def().isAmbiguous()) {
      return r;
    }
    if (hint.equals(TEMPERATURE) && r.prefix() == null && Resolver.isTemperatureLetter(written)) {
      return temperatureScale(written);
    }
    if (fits(r)) {
      return r;
    }
    if (hint.equals(VOLUME) && r.prefix() == null && r.def().key().equals("ounce")) {
      UnitDef fluid = table.byKey("x_floz").orElseThrow(); // 8 oz beside a cup: the fluid ounce
      notes.add("'" + clip(written) + "' beside a volume read as the fluid ounce");
      return new UnitTable.Resolved(fluid, null);
    }
    // A word that reads as a unit of another kind than the other side may be a case slip: MG beside g.
    List<Spelling> others = new ArrayList<>();
    for (Spelling s : distinct(caseIndex.getOrDefault(Words.fold(written), List.of()))) {
      if (!s.text.equals(written) && fits(s.resolved)) {
        others.add(s);
      }
    }
    if (others.size() == 1) {
      return noteCase(written, others.get(0));
    }
    if (others.size() > 1) {
      throw caseAmbiguity(written, others, ", as " + nameOf(r) + " (" + written + ") does not fit");
    }
    return r;
  }

  @Override
  public Optional<UnitTable.Resolved> unknown(String written, boolean whole) throws ToolException {
    if (whole && TEMPERATURE.equals(hint) && Resolver.isTemperatureLetter(written)) {
      return Optional.of(temperatureScale(written)); // 100 c to f
    }
    List<Spelling> candidates = distinct(caseIndex.getOrDefault(Words.fold(written), List.of()));
    if (candidates.size() > 1 && whole && hint != null) {
      List<Spelling> fitting = candidates.stream().filter(s -> fits(s.resolved)).toList();
      candidates = fitting.isEmpty() ? candidates : fitting;
    }
    if (candidates.size() == 1) {
      return Optional.of(noteCase(written, candidates.get(0)));
    }
    if (candidates.size() > 1) {
      throw caseAmbiguity(written, candidates, "");
    }
    // kms, mls: a symbol with an English plural s
    if (written.length() >= 3 && (written.endsWith("s") || written.endsWith("S"))) {
      String stem = written.substring(0, written.length() - 1);
      Optional<UnitTable.Resolved> r = table.symbols().containsKey(stem) ? table.resolve(stem) : Optional.empty();
      if (r.isEmpty()) {
        List<Spelling> c = distinct(caseIndex.getOrDefault(Words.fold(stem), List.of()));
        r = c.size() == 1 ? Optional.of(c.get(0).resolved) : Optional.empty();
      }
      if (r.isPresent() && !r.get().def().isAmbiguous()) {
        notes.add("'" + clip(written) + "' read as " + table.symbolOf(r.get()));
        return r;
      }
    }
    return Optional.empty();
  }

  @Override
  public Optional<UnitTable.Resolved> ambiguous(UnitTable.Resolved r, String written, boolean whole)
      throws ToolException {
    UnitDef def = r.def();
    List<UnitTable.Resolved> readings = table.readingsOf(def, r.prefix());
    boolean mixed = readings.stream().map(SystemReadings::dimensionOf).distinct().count() > 1;
    boolean narrowed = false;
    if (whole && hint != null) {
      List<UnitTable.Resolved> fitting = readings.stream().filter(this::fits).toList();
      if (fitting.size() == 1) {
        UnitTable.Resolved chosen = fitting.get(0);
        notes.add("'" + clip(written) + "' read as " + table.nameOf(chosen) + " (" + table.symbolOf(chosen) + ")");
        return Optional.of(chosen);
      }
      if (!fitting.isEmpty()) {
        readings = fitting;
        narrowed = true;
      }
    }
    Optional<UnitTable.Resolved> chosen = table.defaultReading(def, r.prefix(), system);
    if (chosen.isPresent() && (!mixed || narrowed) && readings.contains(chosen.get())) {
      boolean everySystem = def.defaults().containsKey(UnitDef.ALL_SYSTEMS);
      notes.add("'" + clip(written) + "' read as " + table.nameOf(chosen.get()) + " (" + table.symbolOf(chosen.get())
          + "), the default" + (everySystem ? "" : " for system " + system));
      return chosen;
    }
    List<String> symbols = new ArrayList<>();
    List<String> described = new ArrayList<>();
    for (UnitTable.Resolved reading : readings) {
      symbols.add(table.symbolOf(reading));
      described.add(table.symbolOf(reading) + " (" + shortName(reading) + ")");
    }
    String why = !def.defaults().isEmpty() && chosen.isEmpty() ? "; system " + system + " gives it no default" : "";
    throw new ToolException(new ToolError(ErrorCode.AMBIGUOUS_UNIT,
        "'" + clip(written) + "' is ambiguous: " + orList(described) + why, symbols));
  }

  @Override
  public boolean offsetInCompound(UnitDef scale) {
    notes.add(scale.shownSymbol() + " in a compound read as a temperature difference (1 " + scale.shownSymbol()
        + " = " + (scale.key().equals("degC") ? "1 K" : "5/9 K") + ")");
    return true;
  }

  // ---- helpers ------------------------------------------------------------------------------------

  /** °C for a bare C, °F for a bare F (either case), noted. */
  private UnitTable.Resolved temperatureScale(String written) {
    UnitDef scale = table.byKey(written.equalsIgnoreCase("C") ? "degC" : "degF").orElseThrow();
    notes.add("'" + written + "' read as " + scale.shownSymbol() + " (" + scale.shownName() + ")");
    return new UnitTable.Resolved(scale, null);
  }

  private boolean fits(UnitTable.Resolved r) {
    Dimension d = dimensionOf(r);
    return d.equals(hint) || Resolver.reciprocal(d, hint);
  }

  static Dimension dimensionOf(UnitTable.Resolved r) {
    return r.def().dimension();
  }

  private UnitTable.Resolved noteCase(String written, Spelling s) {
    notes.add("'" + clip(written) + "' read as " + s.text + (s.resolved.def().isAmbiguous() ? "" : " (" + nameOf(s.resolved) + ")"));
    return s.resolved;
  }

  private String nameOf(UnitTable.Resolved r) {
    return table.nameOf(r);
  }

  /** A name without a parenthesis: {@code thermochemical calorie} rather than {@code calorie (thermochemical)}. */
  private String shortName(UnitTable.Resolved r) {
    UnitDef def = r.def();
    if (r.prefix() != null) {
      String n = def.shownName();
      int paren = n.indexOf(" (");
      return r.prefix().word + (paren < 0 ? n : n.substring(0, paren));
    }
    for (String n : def.names()) {
      if (n.indexOf('(') < 0) {
        return n;
      }
    }
    return def.shownName();
  }

  /** Spellings that read as different units; of two reading alike (mL, ml) the first stays. */
  private static List<Spelling> distinct(List<Spelling> spellings) {
    List<Spelling> out = new ArrayList<>();
    Set<UnitTable.Resolved> seen = new java.util.HashSet<>();
    boolean plain = spellings.stream().anyMatch(s -> !s.resolved.def().isAmbiguous());
    for (Spelling s : spellings) {
      if (plain && s.resolved.def().isAmbiguous() && spellings.size() > 1) {
        continue; // KB beside kB and kb: list the units, not the ambiguous name
      }
      if (seen.add(s.resolved)) {
        out.add(s);
      }
    }
    return out;
  }

  private ToolException caseAmbiguity(String written, List<Spelling> candidates, String why) {
    List<String> described = new ArrayList<>();
    List<String> symbols = new ArrayList<>();
    for (Spelling s : candidates) {
      described.add(s.text + " (" + shortName(s.resolved) + ")");
      symbols.add(s.text);
    }
    return new ToolException(new ToolError(ErrorCode.AMBIGUOUS_UNIT, "'" + clip(written) + "' is ambiguous: "
        + orList(described) + why + "; symbols are case-sensitive", symbols));
  }

  static String orList(List<String> parts) {
    if (parts.size() == 1) {
      return parts.get(0);
    }
    return String.join(", ", parts.subList(0, parts.size() - 1)) + " or " + parts.get(parts.size() - 1);
  }

  private static String clip(String s) {
    return ResultText.clean(s, 40);
  }
}
