package reckoner.facts;

import java.time.LocalDate;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeMap;
import java.util.regex.Pattern;
import reckoner.data.DataFormat;
import reckoner.data.DataLine;

/**
 * The fact file format: each non-blank line is one JSON object, a fact ({@code set, key, value},
 * optional {@code aliases, valid_from, valid_to, source}) or a set declaration ({@code set,
 * options}). Lines are checked as they are read; the sets are built and their data versions
 * computed once all files are read. One instance per load; not thread-safe.
 */
final class FactsFormat implements DataFormat<FactSet> {
  /** Set names: lower-case ASCII letters, digits, {@code _} and {@code -}, at most 64. */
  static final Pattern SET_NAME = Pattern.compile("[a-z0-9][a-z0-9_-]{0,63}");
  /** Longest line, in bytes of UTF-8. */
  static final int MAX_LINE_BYTES = 65_536;
  static final int MAX_ALIASES = 32;

  private static final Set<String> FACT_FIELDS =
      Set.of("set", "key", "value", "aliases", "valid_from", "valid_to", "source");
  private static final String FACT_FIELD_LIST = "set, key, value, aliases, valid_from, valid_to, source";
  private static final Set<String> OPTIONS = Set.of("fold_accents");

  /** A fact as read, before its set is indexed. */
  record RawFact(String set, String key, String value, List<String> aliases, LocalDate from, LocalDate to,
      String source, String file, int line) {}

  /** A set's options, as declared by a {@code {"set":..., "options":{...}}} line. */
  record Declaration(String set, boolean foldAccents, String file, int line) {}

  private final Map<String, List<RawFact>> bySet = new TreeMap<>();
  private final List<Declaration> declarations = new ArrayList<>();
  private final Shared shared = new Shared();

  /** Repeated strings of one load (set names, sources, dates) shared instead of kept once per line. */
  private static final class Shared {
    private static final int MAX_ENTRIES = 4096;
    private final Map<String, String> strings = new HashMap<>();
    private final Map<String, LocalDate> dates = new HashMap<>();

    String string(String s) {
      if (s == null) {
        return null;
      }
      String known = strings.get(s);
      if (known != null) {
        return known;
      }
      if (strings.size() < MAX_ENTRIES) {
        strings.put(s, s);
      }
      return s;
    }

    LocalDate date(String s) throws DateTimeParseException {
      LocalDate d = dates.get(s);
      if (d == null) {
        d = LocalDate.parse(s, DateTimeFormatter.ISO_LOCAL_DATE);
        if (dates.size() < MAX_ENTRIES) {
          dates.put(s, d);
        }
      }
      return d;
    }
  }

  @Override
  public int maxLineBytes() {
    return MAX_LINE_BYTES;
  }

  @Override
  public boolean read(DataLine line) throws DataLine.Problem {
    String set = shared.string(setName(line));
    if (line.members().containsKey("options")) {
      declarations.add(declaration(line, set));
      return false;
    }
    for (String member : line.members().keySet()) {
      if (!FACT_FIELDS.contains(member)) {
        throw new DataLine.Problem("\"" + TextRules.echo(member) + "\" is not a fact field; the fields are " + FACT_FIELD_LIST);
      }
    }
    String key = stored(line, "key", TextRules.MAX_KEY_LENGTH, true);
    String value = stored(line, "value", TextRules.MAX_VALUE_LENGTH, true);
    List<String> aliases = aliases(line);
    LocalDate from = date(line, "valid_from");
    LocalDate to = date(line, "valid_to");
    if (from != null && to != null && !from.isBefore(to)) {
      throw new DataLine.Problem("valid_from " + from + " must be before valid_to " + to
          + " (the interval is half-open: valid_to is the first day it no longer holds)");
    }
    String source = shared.string(stored(line, "source", TextRules.MAX_SOURCE_LENGTH, false));
    bySet.computeIfAbsent(set, n -> new ArrayList<>())
        .add(new RawFact(set, key, value, aliases, from, to, source, line.file(), line.number()));
    return true;
  }

  @Override
  public Map<String, FactSet> assemble(Assembly<FactSet> assembly) {
    ProblemSink sink = assembly.problems();
    Map<String, Declaration> declared = new TreeMap<>();
    for (Declaration d : declarations) {
      Declaration first = declared.putIfAbsent(d.set(), d);
      if (first != null) {
        sink.add(d.file(), d.line(), "options of set \"" + d.set() + "\" are already declared at "
            + first.file() + ":" + first.line());
      }
    }
    Map<String, FactSet> sets = new TreeMap<>();
    bySet.forEach((name, facts) -> {
      Declaration d = declared.get(name);
      sets.put(name, new FactSetBuilder(name, d != null && d.foldAccents(), sink, facts.size()).build(facts));
    });
    return sets;
  }

  private static String setName(DataLine line) throws DataLine.Problem {
    Object set = line.get("set");
    if (set == null) {
      throw new DataLine.Problem("\"set\" is missing");
    }
    if (!(set instanceof String s) || !SET_NAME.matcher(s).matches()) {
      throw new DataLine.Problem("\"set\" must be a name of lower-case letters, digits, '_' and '-' (at most 64,"
          + " starting with a letter or digit) but was " + DataLine.describe(set));
    }
    return s;
  }

  private static Declaration declaration(DataLine line, String set) throws DataLine.Problem {
    if (line.members().size() != 2) {
      throw new DataLine.Problem("a set declaration holds only \"set\" and \"options\"");
    }
    if (!(line.get("options") instanceof Map<?, ?> options)) {
      throw new DataLine.Problem("\"options\" must be an object");
    }
    for (Object name : options.keySet()) {
      if (!OPTIONS.contains(name)) {
        throw new DataLine.Problem("unknown set option \"" + TextRules.echo(name.toString())
            + "\"; the options are fold_accents");
      }
    }
    Object fold = options.get("fold_accents");
    if (fold != null && !(fold instanceof Boolean)) {
      throw new DataLine.Problem("option fold_accents must be true or false but was " + DataLine.describe(fold));
    }
    return new Declaration(set, Boolean.TRUE.equals(fold), line.file(), line.number());
  }

  private static String stored(DataLine line, String field, int maxLength, boolean required) throws DataLine.Problem {
    Object v = line.get(field);
    if (v == null) {
      if (required) {
        throw new DataLine.Problem("\"" + field + "\" is missing");
      }
      return null;
    }
    if (!(v instanceof String s)) {
      throw new DataLine.Problem("\"" + field + "\" must be a string but was " + DataLine.describe(v));
    }
    Optional<String> problem = TextRules.storedTextProblem(field, s, maxLength);
    if (problem.isPresent()) {
      throw new DataLine.Problem(problem.get());
    }
    return s;
  }

  private static List<String> aliases(DataLine line) throws DataLine.Problem {
    Object v = line.get("aliases");
    if (v == null) {
      return List.of();
    }
    if (!(v instanceof List<?> list)) {
      throw new DataLine.Problem("\"aliases\" must be an array of strings but was " + DataLine.describe(v));
    }
    if (list.size() > MAX_ALIASES) {
      throw new DataLine.Problem("a fact may have at most " + MAX_ALIASES + " aliases but this one has " + list.size());
    }
    List<String> aliases = new ArrayList<>(list.size());
    for (Object a : list) {
      if (!(a instanceof String s)) {
        throw new DataLine.Problem("every alias must be a string but one was " + DataLine.describe(a));
      }
      Optional<String> problem = TextRules.storedTextProblem("alias", s, TextRules.MAX_KEY_LENGTH);
      if (problem.isPresent()) {
        throw new DataLine.Problem(problem.get());
      }
      aliases.add(s);
    }
    return List.copyOf(aliases);
  }

  private LocalDate date(DataLine line, String field) throws DataLine.Problem {
    Object v = line.get(field);
    if (v == null) {
      return null;
    }
    if (v instanceof String s) {
      try {
        return shared.date(s);
      } catch (DateTimeParseException e) {
        // fall through to the message below
      }
    }
    throw new DataLine.Problem("\"" + field + "\" must be an ISO 8601 calendar date such as 2031-05-17 but was "
        + DataLine.describe(v));
  }
}
