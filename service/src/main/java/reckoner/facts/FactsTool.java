package reckoner.facts;

import java.time.DateTimeException;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;
import org.apache.commons.text.similarity.LevenshteinDistance;
import reckoner.data.DataSnapshot;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.ErrorCode;
import reckoner.tool.ResultText;
import reckoner.tool.Tool;
import reckoner.tool.ToolError;
import reckoner.tool.ToolException;
import reckoner.tool.ToolId;

/**
 * {@code facts@1}: looks a key up in a loaded fact set and answers its value, with the set's data
 * version. See {@code tool-specs/facts/1.json} for matching, time scoping and errors. Immutable
 * and thread-safe; each call reads one snapshot of the store, so a reload never mixes two sets'
 * data in one answer.
 */
public final class FactsTool implements Tool {
  public static final ToolId ID = ToolId.of("facts", 1);

  static final String KEY = "key";
  static final String SET = "set";
  static final String AS_OF = "as_of";
  /** How several values valid at once are joined, in load order. */
  static final String JOIN = "; ";
  /** Longest key after normalisation (compatibility forms can expand a key many times). */
  static final int MAX_NORMALIZED_LENGTH = 1024;

  private static final Set<String> ARGUMENTS = Set.of(KEY, Arguments.TEXT, SET, AS_OF);

  private final FactStore store;

  public FactsTool(FactStore store) {
    this.store = Objects.requireNonNull(store, "store");
  }

  @Override
  public ToolId id() {
    return ID;
  }

  /**
   * Canonical form: {@code key} normalised (NFKC case folding, white space collapsed), {@code set}
   * (the store's default when omitted), and {@code as_of} reduced to its ISO calendar date when
   * given. The free {@code text} form is the key itself.
   */
  @Override
  public Arguments canonicalize(Arguments args) throws ToolException {
    for (String name : args.asMap().keySet()) {
      if (!ARGUMENTS.contains(name)) {
        throw invalid("unknown argument '" + TextRules.echo(name) + "'; facts@1 takes key (or text), set and as_of");
      }
    }
    Optional<String> text = args.string(Arguments.TEXT);
    Optional<String> key = args.string(KEY);
    if (text.isPresent() && key.isPresent()) {
      throw invalid("give either key or text, not both");
    }
    String raw = text.or(() -> key).orElseThrow(() -> invalid("argument 'key' (or 'text') is required"));
    Arguments canonical = Arguments.empty()
        .with(KEY, normalizeKey(raw))
        .with(SET, setName(args.string(SET).orElse(store.defaultSet())));
    Optional<String> asOf = args.string(AS_OF);
    return asOf.isPresent() ? canonical.with(AS_OF, parseAsOf(asOf.get()).toString()) : canonical;
  }

  /** The version of the set this call reads now; the answer cache keys on it, so a reload is never served stale. */
  @Override
  public Optional<String> dataVersion(Arguments canonical) {
    Object set = canonical.asMap().get(SET);
    return set instanceof String name ? store.dataVersion(name) : Optional.empty();
  }

  @Override
  public Answer invoke(Arguments canonical, CallContext context) throws ToolException {
    String key = canonical.requireString(KEY);
    String setName = canonical.requireString(SET);
    Optional<LocalDate> asOf = canonical.string(AS_OF).isPresent()
        ? Optional.of(parseAsOf(canonical.requireString(AS_OF)))
        : Optional.empty();
    DataSnapshot<FactSet> snapshot = store.snapshot(); // read once: the whole call sees one version
    FactSet set = snapshot.get(setName).orElseThrow(() -> unknownSet(setName, snapshot));
    String probe = set.probe(key);
    FactSet.Entry entry = set.find(probe).orElseThrow(() -> new ToolException(new ToolError(ErrorCode.NOT_FOUND,
        "no fact '" + TextRules.echo(key) + "' in set '" + setName + "'", set.suggestionsFor(probe))));
    if (!entry.isTimeScoped()) {
      return Answer.of(String.join(JOIN, entry.allValues())).withDataVersion(set.version());
    }
    if (asOf.isPresent()) {
      return Answer.of(valuesOn(entry, asOf.get(), setName, "")).withDataVersion(set.version());
    }
    Instant now = context.clock().instant(); // read once
    LocalDate today = LocalDate.ofInstant(now, ZoneOffset.UTC);
    String values = valuesOn(entry, today, setName, " (server clock; pass as_of for a fixed date)");
    String note = " (as of " + today + ", server clock)";
    // the note must survive the answer's length bound, so the values give way to it
    String text = ResultText.clean(values, ResultText.DEFAULT_MAX_LENGTH - note.length()) + note;
    return Answer.fromClock(text, now).withDataVersion(set.version());
  }

  private static String valuesOn(FactSet.Entry entry, LocalDate date, String setName, String note)
      throws ToolException {
    List<String> values = entry.valuesOn(date);
    if (values.isEmpty()) {
      throw new ToolException(ErrorCode.NOT_FOUND, "'" + entry.shown() + "' has no value on " + date + note
          + " in set '" + setName + "'; " + coverage(entry));
    }
    return String.join(JOIN, values);
  }

  private static String coverage(FactSet.Entry entry) {
    Optional<LocalDate> start = entry.earliest();
    Optional<LocalDate> end = entry.latestEnd();
    if (start.isPresent() && end.isPresent()) {
      return "its values cover " + start.get() + " up to (not including) " + end.get();
    }
    if (start.isPresent()) {
      return "its values start on " + start.get();
    }
    if (end.isPresent()) {
      return "its values end before " + end.get();
    }
    return "no value covers that date";
  }

  static String normalizeKey(String raw) throws ToolException {
    Optional<String> problem = TextRules.queryProblem("key", raw);
    if (problem.isPresent()) {
      throw invalid(problem.get());
    }
    int length = raw.codePointCount(0, raw.length());
    if (length > TextRules.MAX_KEY_LENGTH) {
      throw invalid("key is " + length + " characters long; at most " + TextRules.MAX_KEY_LENGTH + " are allowed");
    }
    String normalized = KeyNormalizer.normalize(raw);
    if (normalized.isEmpty()) {
      throw invalid("key is empty after normalisation (it holds only white space or invisible characters)");
    }
    if (normalized.length() > MAX_NORMALIZED_LENGTH) {
      throw invalid("key grows to " + normalized.length() + " characters under compatibility normalisation; at most "
          + MAX_NORMALIZED_LENGTH + " are allowed");
    }
    return normalized;
  }

  private static String setName(String name) throws ToolException {
    if (!FactsFormat.SET_NAME.matcher(name).matches()) {
      throw invalid("set must be a name of lower-case letters, digits, '_' and '-' (at most 64) but was '"
          + TextRules.echo(name) + "'");
    }
    return name;
  }

  /**
   * An ISO 8601 calendar date ({@code 2031-05-17}) or date-time with optional offset and zone
   * ({@code 2031-05-17T09:30:00+02:00}); a date-time counts as its own calendar date, as written.
   */
  static LocalDate parseAsOf(String text) throws ToolException {
    try {
      if (isPlainDate(text)) { // the common YYYY-MM-DD, without the formatter's cost; of() checks the day
        return LocalDate.of(Integer.parseInt(text, 0, 4, 10), Integer.parseInt(text, 5, 7, 10),
            Integer.parseInt(text, 8, 10, 10));
      }
      return LocalDate.parse(text, DateTimeFormatter.ISO_LOCAL_DATE);
    } catch (DateTimeException e) {
      // not a bare date; try a date-time below
    }
    try {
      return LocalDate.from(DateTimeFormatter.ISO_DATE_TIME.parse(text));
    } catch (DateTimeException e) {
      throw invalid("as_of must be an ISO 8601 date such as 2031-05-17 or a date-time such as 2031-05-17T09:30:00Z"
          + " but was '" + TextRules.echo(text) + "'");
    }
  }

  private static boolean isPlainDate(String s) {
    if (s.length() != 10 || s.charAt(4) != '-' || s.charAt(7) != '-') {
      return false;
    }
    for (int i = 0; i < 10; i++) {
      if (i != 4 && i != 7 && (s.charAt(i) < '0' || s.charAt(i) > '9')) {
        return false;
      }
    }
    return true;
  }

  private static ToolException unknownSet(String name, DataSnapshot<FactSet> snapshot) {
    LevenshteinDistance distance = new LevenshteinDistance(NearestKeys.thresholdFor(name));
    List<Map.Entry<String, Integer>> near = new ArrayList<>();
    for (String served : snapshot.all().keySet()) {
      int d = distance.apply(name, served);
      if (d >= 0) {
        near.add(Map.entry(served, d));
      }
    }
    near.sort(Map.Entry.<String, Integer>comparingByValue().thenComparing(Map.Entry.comparingByKey()));
    List<String> suggestions = near.stream().limit(NearestKeys.MAX_SUGGESTIONS).map(Map.Entry::getKey).toList();
    String served = snapshot.all().isEmpty() ? "none" : String.join(", ", snapshot.all().keySet());
    if (served.length() > 80) {
      served = served.substring(0, 77) + "...";
    }
    return new ToolException(new ToolError(ErrorCode.NOT_FOUND, "no fact set '" + name + "'; served sets: " + served,
        suggestions));
  }

  private static ToolException invalid(String detail) {
    return new ToolException(ErrorCode.INVALID_ARGUMENT, detail);
  }
}
