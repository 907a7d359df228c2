package reckoner.search;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.time.DateTimeException;
import java.time.LocalDate;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;
import org.apache.commons.text.similarity.LevenshteinDistance;
import org.apache.lucene.analysis.Analyzer;
import org.apache.lucene.analysis.TokenStream;
import org.apache.lucene.analysis.tokenattributes.CharTermAttribute;
import reckoner.data.DataSnapshot;
import reckoner.data.DataText;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.ErrorCode;
import reckoner.tool.Tool;
import reckoner.tool.ToolError;
import reckoner.tool.ToolException;
import reckoner.tool.ToolId;

/**
 * {@code search@1}: the best passage of a collection for a query, ranked by BM25, as one line of
 * at most 200 characters, with the collection's data version. See {@code tool-specs/search/1.json}
 * for the passage rule, the analyzer, ranking, {@code as_of} and errors. The caller's text never
 * reaches a query parser: it is analyzed into terms, and the query is built from them. Immutable
 * and thread-safe; each call reads one snapshot of the store.
 */
public final class SearchTool implements Tool {
  public static final ToolId ID = ToolId.of("search", 1);

  static final String QUERY = "query";
  static final String COLLECTION = "collection";
  static final String AS_OF = "as_of";
  /** Longest query, in characters after white space is collapsed. */
  static final int MAX_QUERY_LENGTH = 500;
  /** Most distinct terms a query may have after analysis. */
  static final int MAX_TERMS = 32;
  static final int MAX_SUGGESTIONS = 3;

  private static final Set<String> ARGUMENTS = Set.of(QUERY, Arguments.TEXT, COLLECTION, AS_OF);

  private final SearchStore store;

  public SearchTool(SearchStore store) {
    this.store = Objects.requireNonNull(store, "store");
  }

  @Override
  public ToolId id() {
    return ID;
  }

  /**
   * Canonical form: {@code query} with its white space collapsed (the free {@code text} form is
   * the query itself), {@code collection} (the store's default when omitted), and {@code as_of}
   * reduced to its ISO calendar date when given.
   */
  @Override
  public Arguments canonicalize(Arguments args) throws ToolException {
    for (String name : args.asMap().keySet()) {
      if (!ARGUMENTS.contains(name)) {
        throw invalid("unknown argument '" + DataText.echo(name) + "'; search@1 takes query (or text), collection and as_of");
      }
    }
    Optional<String> text = args.string(Arguments.TEXT);
    Optional<String> query = args.string(QUERY);
    if (text.isPresent() && query.isPresent()) {
      throw invalid("give either query or text, not both");
    }
    String raw = text.or(() -> query).orElseThrow(() -> invalid("argument 'query' (or 'text') is required"));
    Arguments canonical = Arguments.empty()
        .with(QUERY, normalizeQuery(raw))
        .with(COLLECTION, collectionName(args.string(COLLECTION).orElse(store.defaultCollection())));
    Optional<String> asOf = args.string(AS_OF);
    return asOf.isPresent() ? canonical.with(AS_OF, parseAsOf(asOf.get()).toString()) : canonical;
  }

  /** The version of the collection this call reads now; the answer cache keys on it. */
  @Override
  public Optional<String> dataVersion(Arguments canonical) {
    Object collection = canonical.asMap().get(COLLECTION);
    return collection instanceof String name ? store.dataVersion(name) : Optional.empty();
  }

  @Override
  public Answer invoke(Arguments canonical, CallContext context) throws ToolException {
    String query = canonical.requireString(QUERY);
    String name = canonical.requireString(COLLECTION);
    Optional<LocalDate> asOf = canonical.string(AS_OF).isPresent()
        ? Optional.of(parseAsOf(canonical.requireString(AS_OF)))
        : Optional.empty();
    Collection collection = acquire(name);
    try {
      List<String> terms = terms(query, collection.analyzer());
      if (terms.isEmpty()) {
        throw new ToolException(ErrorCode.NOT_FOUND, "the query '" + DataText.echo(query)
            + "' has no words to search for (only stop words, punctuation or symbols)");
      }
      if (terms.size() > MAX_TERMS) {
        throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "the query has " + terms.size() + " distinct words; at most "
            + MAX_TERMS + " are searched");
      }
      Collection.Hit hit = collection.best(terms, asOf).orElseThrow(() -> new ToolException(ErrorCode.NOT_FOUND,
          "no passage of collection '" + name + "'" + asOf.map(d -> " dated on or before " + d).orElse("")
              + " matches '" + DataText.echo(query) + "'"));
      String text = Snippet.of(hit.text(), new LinkedHashSet<>(terms), collection.analyzer());
      return Answer.of(text).withDataVersion(collection.version());
    } finally {
      collection.releaseCall();
    }
  }

  /** The collection, held for this call; read from the snapshot again if a reload released it meanwhile. */
  private Collection acquire(String name) throws ToolException {
    while (true) {
      DataSnapshot<Collection> snapshot = store.snapshot();
      Collection c = snapshot.get(name).orElseThrow(() -> unknownCollection(name, snapshot));
      if (c.acquire()) {
        return c;
      }
    }
  }

  /** The distinct terms of {@code query} under {@code analyzer}, in order of first appearance. */
  static List<String> terms(String query, Analyzer analyzer) {
    Set<String> terms = new LinkedHashSet<>();
    try (TokenStream stream = analyzer.tokenStream(SearchFields.BODY, query)) {
      CharTermAttribute term = stream.addAttribute(CharTermAttribute.class);
      stream.reset();
      while (stream.incrementToken()) {
        terms.add(term.toString());
      }
      stream.end();
    } catch (IOException e) {
      throw new UncheckedIOException("analysing a string cannot fail", e); // no I/O: the reader is a string
    }
    return new ArrayList<>(terms);
  }

  static String normalizeQuery(String raw) throws ToolException {
    Optional<String> problem = TextChecks.characters("query", raw, true);
    if (problem.isPresent()) {
      throw invalid(problem.get());
    }
    String query = Passages.collapse(raw);
    if (query.isEmpty()) {
      throw invalid("query is empty (it holds only white space)");
    }
    int length = query.codePointCount(0, query.length());
    if (length > MAX_QUERY_LENGTH) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "query is " + length + " characters long; at most "
          + MAX_QUERY_LENGTH + " are allowed");
    }
    return query;
  }

  private static String collectionName(String name) throws ToolException {
    if (!SearchFormat.NAME.matcher(name).matches()) {
      throw invalid("collection must be a name of lower-case letters, digits, '_' and '-' (at most 64) but was '"
          + DataText.echo(name) + "'");
    }
    return name;
  }

  /**
   * An ISO 8601 calendar date ({@code 2031-05-17}) or date-time with optional offset and zone
   * ({@code 2031-05-17T09:30:00+02:00}); a date-time counts as its own calendar date, as written.
   */
  static LocalDate parseAsOf(String text) throws ToolException {
    try {
      return LocalDate.parse(text, DateTimeFormatter.ISO_LOCAL_DATE);
    } catch (DateTimeException e) {
      // not a bare date; try a date-time below
    }
    try {
      return LocalDate.from(DateTimeFormatter.ISO_DATE_TIME.parse(text));
    } catch (DateTimeException e) {
      throw invalid("as_of must be an ISO 8601 date such as 2031-05-17 or a date-time such as 2031-05-17T09:30:00Z"
          + " but was '" + DataText.echo(text) + "'");
    }
  }

  private static ToolException unknownCollection(String name, DataSnapshot<Collection> snapshot) {
    LevenshteinDistance distance = new LevenshteinDistance(name.length() <= 4 ? 1 : name.length() <= 8 ? 2 : 3);
    List<Map.Entry<String, Integer>> near = new ArrayList<>();
    for (String served : snapshot.all().keySet()) {
      int d = distance.apply(name, served);
      if (d >= 0) {
        near.add(Map.entry(served, d));
      }
    }
    near.sort(Map.Entry.<String, Integer>comparingByValue().thenComparing(Map.Entry.comparingByKey()));
    List<String> suggestions = near.stream().limit(MAX_SUGGESTIONS).map(Map.Entry::getKey).toList();
    String served = snapshot.all().isEmpty() ? "none" : String.join(", ", snapshot.all().keySet());
    if (served.length() > 80) {
      served = served.substring(0, 77) + "...";
    }
    return new ToolException(new ToolError(ErrorCode.NOT_FOUND, "no collection '" + name + "'; served collections: "
        + served, suggestions));
  }

  private static ToolException invalid(String detail) {
    return new ToolException(ErrorCode.INVALID_ARGUMENT, detail);
  }
}
