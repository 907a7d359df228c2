package reckoner.facts;

import java.util.Collections;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;

/** Every set served at one moment, by name. Immutable; a reload swaps in a new one whole. */
final class Snapshot {
  static final Snapshot EMPTY = new Snapshot(Map.of());

  private final Map<String, FactSet> sets;

  Snapshot(Map<String, FactSet> sets) {
    this.sets = Collections.unmodifiableMap(new TreeMap<>(sets));
  }

  Optional<FactSet> set(String name) {
    return Optional.ofNullable(sets.get(name));
  }

  /** The sets by name, in name order. */
  Map<String, FactSet> sets() {
    return sets;
  }
}
