package reckoner.units;

import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * One row of the unit table: a unit (or an ambiguous name standing for several) with its symbols,
 * English names and plurals, dimension, exact scale, affine offset, prefix policy and the
 * published source of its definition. Immutable.
 *
 * @param key the table's unique ASCII key, also accepted as a symbol
 * @param symbols case-sensitive symbols, the first being the one shown in messages
 * @param names case-insensitive names, singular and plural, as written in the table
 * @param dimension the dimension of the unit
 * @param factor the scale: one of this unit is {@code factor} coherent SI units (after the offset)
 * @param offset for a temperature scale, what is added to a value before scaling (273.15 for °C)
 * @param interval whether this is a temperature difference unit (Δ°C), never a point on a scale
 * @param prefixes which SI or binary prefixes the symbols and names take
 * @param definition the definition as written in the table
 * @param source where the definition is published
 * @param readings for an ambiguous name, the keys of the units it may mean; empty otherwise
 * @param defaults for an ambiguous name, the reading it takes under a system ({@code us},
 *     {@code imperial}, {@code metric}, or {@code all} for every system); empty when it has none
 */
record UnitDef(String key, List<String> symbols, List<String> names, Dimension dimension, Factor factor,
    Rational offset, boolean interval, Prefix.Policy prefixes, String definition, String source,
    List<String> readings, Map<String, String> defaults) {
  /** The system name under which a default applies to every system. */
  static final String ALL_SYSTEMS = "all";

  UnitDef {
    Objects.requireNonNull(key, "key");
    symbols = List.copyOf(symbols);
    names = List.copyOf(names);
    Objects.requireNonNull(dimension, "dimension");
    Objects.requireNonNull(factor, "factor");
    Objects.requireNonNull(offset, "offset");
    Objects.requireNonNull(prefixes, "prefixes");
    Objects.requireNonNull(definition, "definition");
    Objects.requireNonNull(source, "source");
    readings = List.copyOf(readings);
    defaults = Map.copyOf(defaults);
  }

  /** The reading (as in {@link #readings}) this ambiguous name takes under {@code system}, if any. */
  Optional<String> defaultReading(String system) {
    String r = defaults.get(system);
    return Optional.ofNullable(r != null ? r : defaults.get(ALL_SYSTEMS));
  }

  boolean isAmbiguous() {
    return !readings.isEmpty();
  }

  /** Whether this is a temperature scale with an offset (°C, °F), which only converts bare. */
  boolean hasOffset() {
    return !offset.isZero();
  }

  /** The symbol shown in messages and suggestions: the first symbol, else the key. */
  String shownSymbol() {
    return symbols.isEmpty() ? key : symbols.get(0);
  }

  /** The singular name shown in messages. */
  String shownName() {
    return names.isEmpty() ? key : names.get(0);
  }
}
