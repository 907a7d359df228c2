package reckoner.facts;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import reckoner.data.Dataset;

/**
 * One loaded fact set: its name, whether it folds accents, its content digest, and an index from
 * every normalised name (key or alias) to the key's facts in load order. Immutable; thread-safe.
 */
final class FactSet implements Dataset {
  /** A key with its facts, in load order. */
  static final class Entry {
    private final String shown;
    private final Fact[] facts;
    private final boolean timeScoped;

    Entry(String shown, List<Fact> facts) {
      this.shown = shown;
      this.facts = facts.toArray(new Fact[0]);
      boolean scoped = false;
      for (Fact f : this.facts) {
        scoped |= f.isTimeScoped();
      }
      this.timeScoped = scoped;
    }

    /** The key as the file first wrote it. */
    String shown() {
      return shown;
    }

    /** Whether any of the key's values has a validity interval. */
    boolean isTimeScoped() {
      return timeScoped;
    }

    /** The values valid on {@code date}, in load order. */
    List<String> valuesOn(LocalDate date) {
      List<String> values = new ArrayList<>(facts.length);
      for (Fact f : facts) {
        if (f.isValidOn(date)) {
          values.add(f.value());
        }
      }
      return values;
    }

    /** Every value, in load order; meaningful for a key without validity intervals. */
    List<String> allValues() {
      List<String> values = new ArrayList<>(facts.length);
      for (Fact f : facts) {
        values.add(f.value());
      }
      return values;
    }

    /** The first and last day any value covers: empty bound for open ends. */
    Optional<LocalDate> earliest() {
      LocalDate min = null;
      for (Fact f : facts) {
        if (f.from() == null) {
          return Optional.empty();
        }
        min = min == null || f.from().isBefore(min) ? f.from() : min;
      }
      return Optional.ofNullable(min);
    }

    /** The end (exclusive) of the latest interval; empty when some value has no end. */
    Optional<LocalDate> latestEnd() {
      LocalDate max = null;
      for (Fact f : facts) {
        if (f.to() == null) {
          return Optional.empty();
        }
        max = max == null || f.to().isAfter(max) ? f.to() : max;
      }
      return Optional.ofNullable(max);
    }
  }

  private final String name;
  private final boolean foldAccents;
  private final String version;
  private final int factCount;
  private final Map<String, Entry> byName;
  private final NearestKeys nearest;

  FactSet(String name, boolean foldAccents, String version, int factCount, Map<String, Entry> byName,
      NearestKeys nearest) {
    this.name = name;
    this.foldAccents = foldAccents;
    this.version = version;
    this.factCount = factCount;
    this.byName = byName;
    this.nearest = nearest;
  }

  String name() {
    return name;
  }

  boolean foldsAccents() {
    return foldAccents;
  }

  /** The content digest, {@code sha256:} and 16 hex digits. */
  @Override
  public String version() {
    return version;
  }

  /** How many facts the set holds. */
  @Override
  public int records() {
    return factCount;
  }

  /** The probe form of an already normalised key in this set (accents folded if the set asks). */
  String probe(String normalizedKey) {
    return foldAccents ? KeyNormalizer.foldAccents(normalizedKey) : normalizedKey;
  }

  Optional<Entry> find(String probe) {
    return Optional.ofNullable(byName.get(probe));
  }

  List<String> suggestionsFor(String probe) {
    return nearest.near(probe);
  }
}
