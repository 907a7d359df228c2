package reckoner.facts;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;

/**
 * Indexes one set's raw facts, in load order, and computes its data version. Problems found here
 * (a key that is another key's alias, a repeated fact, a key that normalises to nothing) go to the
 * file and line of the fact that caused them. Single use; not thread-safe.
 */
final class FactSetBuilder {
  /** Reports a problem at a file and line. */
  interface ProblemSink {
    void add(String file, int line, String reason);
  }

  private final String name;
  private final boolean foldAccents;
  private final ProblemSink problems;

  private final Map<String, Integer> owners = new HashMap<>(); // normalised name -> key index
  private final List<String> keyNames = new ArrayList<>();      // key index -> its normalised key
  private final List<EntryBuilder> entries = new ArrayList<>();
  private final List<String> names = new ArrayList<>();
  private final List<String> shown = new ArrayList<>();
  private final List<Integer> nameOwners = new ArrayList<>();

  private static final class EntryBuilder {
    final String shown;
    final List<Fact> facts = new ArrayList<>(1);
    final List<FactFileReader.RawFact> origins = new ArrayList<>(1);

    EntryBuilder(String shown) {
      this.shown = shown;
    }
  }

  FactSetBuilder(String name, boolean foldAccents, ProblemSink problems) {
    this.name = name;
    this.foldAccents = foldAccents;
    this.problems = problems;
  }

  /** Indexes {@code facts}; returns the set, whose use the caller skips if any problem was reported. */
  FactSet build(List<FactFileReader.RawFact> facts) {
    MessageDigest digest = sha256();
    put(digest, "reckoner-facts/1");
    put(digest, name);
    put(digest, foldAccents ? "fold_accents" : "exact");
    for (FactFileReader.RawFact f : facts) {
      digestFact(digest, f);
      add(f);
    }
    Map<String, FactSet.Entry> byName = new HashMap<>(Math.max(16, owners.size() * 4 / 3 + 1));
    List<FactSet.Entry> built = new ArrayList<>(entries.size());
    for (EntryBuilder e : entries) {
      built.add(new FactSet.Entry(e.shown, e.facts));
    }
    owners.forEach((n, owner) -> byName.put(n, built.get(owner)));
    String version = "sha256:" + HexFormat.of().formatHex(digest.digest(), 0, 8);
    return new FactSet(name, foldAccents, version, facts.size(), byName, new NearestKeys(names, shown, nameOwners));
  }

  private void add(FactFileReader.RawFact f) {
    String k = KeyNormalizer.normalize(f.key(), foldAccents);
    if (k.isEmpty()) {
      problems.add(f.file(), f.line(), "key \"" + TextRules.echo(f.key()) + "\" is empty after normalisation");
      return;
    }
    Integer owner = owners.get(k);
    if (owner == null) {
      owner = newKey(k, f.key());
    } else if (!keyNames.get(owner).equals(k)) {
      problems.add(f.file(), f.line(), "key \"" + TextRules.echo(f.key()) + "\" is already an alias of key \""
          + entries.get(owner).shown + "\" (" + origin(entries.get(owner)) + ")");
      return;
    }
    EntryBuilder entry = entries.get(owner);
    for (String alias : f.aliases()) {
      addAlias(f, alias, owner);
    }
    Fact fact = new Fact(f.value(), f.from(), f.to());
    for (int i = 0; i < entry.facts.size(); i++) {
      if (entry.facts.get(i).equals(fact)) {
        FactFileReader.RawFact first = entry.origins.get(i);
        problems.add(f.file(), f.line(), "repeats the fact at " + first.file() + ":" + first.line());
        return;
      }
    }
    entry.facts.add(fact);
    entry.origins.add(f);
  }

  private int newKey(String k, String written) {
    int index = entries.size();
    entries.add(new EntryBuilder(written));
    keyNames.add(k);
    owners.put(k, index);
    addName(k, written, index);
    return index;
  }

  private void addAlias(FactFileReader.RawFact f, String alias, int owner) {
    String n = KeyNormalizer.normalize(alias, foldAccents);
    if (n.isEmpty()) {
      problems.add(f.file(), f.line(), "alias \"" + TextRules.echo(alias) + "\" is empty after normalisation");
      return;
    }
    Integer other = owners.putIfAbsent(n, owner);
    if (other == null) {
      addName(n, alias, owner);
    } else if (other != owner) {
      EntryBuilder taken = entries.get(other);
      problems.add(f.file(), f.line(), "alias \"" + TextRules.echo(alias) + "\" is already a name of key \""
          + taken.shown + "\" (" + origin(taken) + ")");
    }
  }

  private void addName(String normalized, String written, int owner) {
    names.add(normalized);
    shown.add(written);
    nameOwners.add(owner);
  }

  private static String origin(EntryBuilder e) {
    if (e.origins.isEmpty()) {
      return "an earlier line";
    }
    FactFileReader.RawFact first = e.origins.get(0);
    return first.file() + ":" + first.line();
  }

  /** Every field, length-prefixed, so that no two different fact lists give the same bytes. */
  private static void digestFact(MessageDigest digest, FactFileReader.RawFact f) {
    put(digest, f.key());
    put(digest, f.value());
    put(digest, Integer.toString(f.aliases().size()));
    for (String a : f.aliases()) {
      put(digest, a);
    }
    put(digest, date(f.from()));
    put(digest, date(f.to()));
    put(digest, f.source());
  }

  private static String date(LocalDate d) {
    return d == null ? null : d.toString();
  }

  /** {@code LENGTH:BYTES;} for a string, {@code ~;} for an absent field. */
  private static void put(MessageDigest digest, String s) {
    if (s == null) {
      digest.update((byte) '~');
    } else {
      byte[] bytes = s.getBytes(StandardCharsets.UTF_8);
      digest.update(Integer.toString(bytes.length).getBytes(StandardCharsets.US_ASCII));
      digest.update((byte) ':');
      digest.update(bytes);
    }
    digest.update((byte) ';');
  }

  private static MessageDigest sha256() {
    try {
      return MessageDigest.getInstance("SHA-256");
    } catch (NoSuchAlgorithmException e) {
      throw new AssertionError("every Java platform has SHA-256", e); // Java SE requires it
    }
  }
}
