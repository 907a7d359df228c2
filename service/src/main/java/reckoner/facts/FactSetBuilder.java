package reckoner.facts;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import reckoner.data.ContentDigest;
import reckoner.data.DataFormat.ProblemSink;

/**
 * Indexes one set's raw facts, in load order, and computes its data version. Problems found here
 * (a key that is another key's alias, a repeated fact, a key that normalises to nothing) go to the
 * file and line of the fact that caused them. Single use; not thread-safe.
 */
final class FactSetBuilder {
  private final String name;
  private final boolean foldAccents;
  private final ProblemSink problems;

  // Normalised name (key or alias) -> its key's builder; the same map later holds the built entries.
  private final Map<String, Object> index;
  private int keys;
  private final List<String> names = new ArrayList<>();
  private final List<String> shown = new ArrayList<>();
  private int[] nameOwners = new int[16];

  /** A key's facts so far; most keys have one, held without a list. */
  private static final class EntryBuilder {
    final int number;
    final String key;
    final String shown;
    private Fact first;
    private FactsFormat.RawFact firstOrigin;
    private List<Fact> more;
    private List<FactsFormat.RawFact> moreOrigins;

    EntryBuilder(int number, String key, String shown) {
      this.number = number;
      this.key = key;
      this.shown = shown;
    }

    int size() {
      return first == null ? 0 : 1 + (more == null ? 0 : more.size());
    }

    Fact fact(int i) {
      return i == 0 ? first : more.get(i - 1);
    }

    FactsFormat.RawFact origin(int i) {
      return i == 0 ? firstOrigin : moreOrigins.get(i - 1);
    }

    void add(Fact fact, FactsFormat.RawFact origin) {
      if (first == null) {
        first = fact;
        firstOrigin = origin;
        return;
      }
      if (more == null) {
        more = new ArrayList<>(2);
        moreOrigins = new ArrayList<>(2);
      }
      more.add(fact);
      moreOrigins.add(origin);
    }

    private FactSet.Entry built;

    /** The entry, made once and shared by every name of the key. */
    FactSet.Entry built() {
      if (built == null) {
        List<Fact> all = new ArrayList<>(size());
        for (int i = 0; i < size(); i++) {
          all.add(fact(i));
        }
        built = new FactSet.Entry(shown, all);
      }
      return built;
    }
  }

  FactSetBuilder(String name, boolean foldAccents, ProblemSink problems, int expectedFacts) {
    this.name = name;
    this.foldAccents = foldAccents;
    this.problems = problems;
    this.index = new HashMap<>(Math.max(16, (int) Math.min(1 << 30, expectedFacts * 4L / 3 + 1)));
  }

  /** Indexes {@code facts}; returns the set, whose use the caller skips if any problem was reported. */
  FactSet build(List<FactsFormat.RawFact> facts) {
    ContentDigest digest = ContentDigest.of("reckoner-facts/1").put(name).put(foldAccents ? "fold_accents" : "exact");
    for (FactsFormat.RawFact f : facts) {
      digestFact(digest, f);
      add(f);
    }
    index.replaceAll((n, e) -> ((EntryBuilder) e).built()); // names of one key share its entry
    @SuppressWarnings("unchecked") // every value is an Entry now
    Map<String, FactSet.Entry> byName = (Map<String, FactSet.Entry>) (Map<String, ?>) index;
    String version = digest.version();
    return new FactSet(name, foldAccents, version, facts.size(), byName,
        new NearestKeys(names, shown, Arrays.copyOf(nameOwners, names.size())));
  }

  private void add(FactsFormat.RawFact f) {
    String k = KeyNormalizer.normalize(f.key(), foldAccents);
    if (k.isEmpty()) {
      problems.add(f.file(), f.line(), "key \"" + TextRules.echo(f.key()) + "\" is empty after normalisation");
      return;
    }
    EntryBuilder entry = (EntryBuilder) index.get(k);
    if (entry == null) {
      entry = newKey(k, f.key());
    } else if (!entry.key.equals(k)) {
      problems.add(f.file(), f.line(), "key \"" + TextRules.echo(f.key()) + "\" is already an alias of key \""
          + entry.shown + "\" (" + origin(entry) + ")");
      return;
    }
    for (String alias : f.aliases()) {
      addAlias(f, alias, entry);
    }
    Fact fact = new Fact(f.value(), f.from(), f.to());
    for (int i = 0; i < entry.size(); i++) {
      if (entry.fact(i).equals(fact)) {
        FactsFormat.RawFact first = entry.origin(i);
        problems.add(f.file(), f.line(), "repeats the fact at " + first.file() + ":" + first.line());
        return;
      }
    }
    entry.add(fact, f);
  }

  private EntryBuilder newKey(String k, String written) {
    EntryBuilder entry = new EntryBuilder(keys++, k, written);
    index.put(k, entry);
    addName(k, written, entry);
    return entry;
  }

  private void addAlias(FactsFormat.RawFact f, String alias, EntryBuilder owner) {
    String n = KeyNormalizer.normalize(alias, foldAccents);
    if (n.isEmpty()) {
      problems.add(f.file(), f.line(), "alias \"" + TextRules.echo(alias) + "\" is empty after normalisation");
      return;
    }
    EntryBuilder other = (EntryBuilder) index.putIfAbsent(n, owner);
    if (other == null) {
      addName(n, alias, owner);
    } else if (other != owner) {
      problems.add(f.file(), f.line(), "alias \"" + TextRules.echo(alias) + "\" is already a name of key \""
          + other.shown + "\" (" + origin(other) + ")");
    }
  }

  private void addName(String normalized, String written, EntryBuilder owner) {
    if (names.size() == nameOwners.length) {
      nameOwners = Arrays.copyOf(nameOwners, nameOwners.length * 2);
    }
    nameOwners[names.size()] = owner.number;
    names.add(normalized);
    shown.add(written);
  }

  private static String origin(EntryBuilder e) {
    if (e.size() == 0) {
      return "an earlier line";
    }
    FactsFormat.RawFact first = e.origin(0);
    return first.file() + ":" + first.line();
  }

  /** Every field, length-prefixed (see {@link ContentDigest}), so that no two different fact lists give the same bytes. */
  private static void digestFact(ContentDigest digest, FactsFormat.RawFact f) {
    digest.put(f.key()).put(f.value()).put(Integer.toString(f.aliases().size())); // then that many alias fields
    for (String a : f.aliases()) {
      digest.put(a);
    }
    digest.put(date(f.from())).put(date(f.to())).put(f.source());
  }

  private static String date(LocalDate d) {
    return d == null ? null : d.toString();
  }
}
