package reckoner.ledger;

import java.time.DateTimeException;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.UUID;
import java.util.stream.Collectors;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;
import reckoner.tool.ToolId;

/**
 * One read of the ledger: whose records ({@link Scope}), which ones (filters, all optional and
 * combined with AND), and where to continue ({@code after}, the last id of the previous page).
 * Results come in id order, which is time order. Immutable; every {@code with} method returns a
 * copy.
 *
 * @param scope whose records may be read; never null
 * @param run only this run, or null
 * @param tool only this tool name, or null
 * @param version only this tool version, or null
 * @param outcome {@code ok}, {@code error} (any error), an error code, or null
 * @param refPrefix only refs starting with this (code point by code point, case-sensitive), or null
 * @param since only calls that arrived at or after this instant, or null
 * @param until only calls that arrived before this instant, or null
 * @param after only ids greater than this one (the cursor), or null
 * @param limit at most this many records, or null for the default (a page of
 *     {@value #DEFAULT_PAGE_SIZE}; an export without a limit reads every match)
 */
public record InvocationQuery(Scope scope, String run, String tool, Integer version, String outcome,
    String refPrefix, Instant since, Instant until, String after, Integer limit) {

  /** A page holds this many records unless the query asks otherwise. */
  public static final int DEFAULT_PAGE_SIZE = 100;
  /** A page never holds more than this; the cursor reads on. */
  public static final int MAX_PAGE_SIZE = 1000;
  /** The outcome filter that matches every error. */
  public static final String ANY_ERROR = "error";

  private static final List<String> PARAMETERS =
      List.of("run", "tool", "version", "outcome", "ref_prefix", "since", "until", "limit", "after");
  private static final Set<String> CODES =
      Arrays.stream(ErrorCode.values()).map(ErrorCode::wireName).collect(Collectors.toUnmodifiableSet());

  public InvocationQuery {
    Objects.requireNonNull(scope, "scope");
    run = withoutNul(run); // as Invocation stores them, so that such a filter matches and PostgreSQL accepts it
    refPrefix = withoutNul(refPrefix);
    tool = withoutNul(tool);
    requireNonEmpty("run", run);
    requireNonEmpty("tool", tool);
    requireNonEmpty("outcome", outcome);
    requireNonEmpty("refPrefix", refPrefix);
    if (version != null && version < 1) {
      throw new IllegalArgumentException("version must be positive: " + version);
    }
    if (outcome != null && !outcome.equals(Invocation.OK) && !outcome.equals(ANY_ERROR) && !CODES.contains(outcome)) {
      throw new IllegalArgumentException("outcome must be ok, error or an error code: " + outcome);
    }
    if (after != null) {
      after = UUID.fromString(after).toString(); // canonical lower case; throws on a malformed id
    }
    if (limit != null && limit < 1) {
      throw new IllegalArgumentException("limit must be positive: " + limit);
    }
  }

  /** Every record the scope may read, oldest first. */
  public static InvocationQuery of(Scope scope) {
    return new InvocationQuery(scope, null, null, null, null, null, null, null, null, null);
  }

  /**
   * A query from HTTP query parameters ({@code run}, {@code tool} (a name or {@code name@version}),
   * {@code version}, {@code outcome}, {@code ref_prefix}, {@code since}, {@code until} (ISO 8601
   * instants with {@code Z} or an offset), {@code limit}, {@code after}), each given at most once.
   *
   * @throws ToolException {@code invalid_argument} naming the parameter, what it expects and what it got
   */
  public static InvocationQuery fromParameters(Scope scope, Map<String, List<String>> parameters) throws ToolException {
    InvocationQuery q = of(scope);
    for (Map.Entry<String, List<String>> e : parameters.entrySet()) {
      String name = e.getKey();
      if (!PARAMETERS.contains(name)) {
        throw invalid("unknown query parameter '" + name + "'; known: " + String.join(", ", PARAMETERS));
      }
      if (e.getValue().size() != 1) {
        throw invalid("query parameter '" + name + "' must be given once but was given " + e.getValue().size() + " times");
      }
      String value = e.getValue().get(0);
      if (value == null || value.isEmpty()) {
        throw invalid("query parameter '" + name + "' must not be empty");
      }
      q = q.withParameter(name, value);
    }
    if (q.since != null && q.until != null && !q.since.isBefore(q.until)) {
      throw invalid("'since' must be before 'until' but was " + q.since + " and " + q.until);
    }
    return q;
  }

  public InvocationQuery withRun(String run) {
    return new InvocationQuery(scope, run, tool, version, outcome, refPrefix, since, until, after, limit);
  }

  public InvocationQuery withTool(String tool) {
    return new InvocationQuery(scope, run, tool, version, outcome, refPrefix, since, until, after, limit);
  }

  public InvocationQuery withVersion(Integer version) {
    return new InvocationQuery(scope, run, tool, version, outcome, refPrefix, since, until, after, limit);
  }

  public InvocationQuery withOutcome(String outcome) {
    return new InvocationQuery(scope, run, tool, version, outcome, refPrefix, since, until, after, limit);
  }

  public InvocationQuery withRefPrefix(String refPrefix) {
    return new InvocationQuery(scope, run, tool, version, outcome, refPrefix, since, until, after, limit);
  }

  public InvocationQuery withSince(Instant since) {
    return new InvocationQuery(scope, run, tool, version, outcome, refPrefix, since, until, after, limit);
  }

  public InvocationQuery withUntil(Instant until) {
    return new InvocationQuery(scope, run, tool, version, outcome, refPrefix, since, until, after, limit);
  }

  public InvocationQuery withAfter(String after) {
    return new InvocationQuery(scope, run, tool, version, outcome, refPrefix, since, until, after, limit);
  }

  public InvocationQuery withLimit(Integer limit) {
    return new InvocationQuery(scope, run, tool, version, outcome, refPrefix, since, until, after, limit);
  }

  /** The number of records one page of this query holds. */
  public int pageSize() {
    return limit == null ? DEFAULT_PAGE_SIZE : Math.min(limit, MAX_PAGE_SIZE);
  }

  /** Whether {@code invocation} matches this query (the store's WHERE clause, in Java). */
  public boolean matches(Invocation invocation) {
    return (scope.isAll() || scope.keyId().equals(invocation.keyId()))
        && (run == null || run.equals(invocation.run()))
        && (tool == null || tool.equals(invocation.tool()))
        && (version == null || version.equals(invocation.version()))
        && (outcome == null || (outcome.equals(ANY_ERROR) ? !invocation.isOk() : outcome.equals(invocation.outcome())))
        && (refPrefix == null || (invocation.ref() != null && invocation.ref().startsWith(refPrefix)))
        && (since == null || !invocation.ts().isBefore(since))
        && (until == null || invocation.ts().isBefore(until))
        && (after == null || IdBounds.compare(invocation.id(), after) > 0);
  }

  private InvocationQuery withParameter(String name, String value) throws ToolException {
    switch (name) {
      case "run": return withRun(value);
      case "tool": {
        int at = value.indexOf('@');
        String toolName = at < 0 ? value : value.substring(0, at);
        if (!ToolId.isValidName(toolName)) {
          throw invalid("query parameter 'tool' must be a tool name or NAME@VERSION but was '" + shorten(value) + "'");
        }
        return at < 0 ? withTool(value) : withTool(toolName).withVersion(version("tool", value.substring(at + 1)));
      }
      case "version": return withVersion(version("version", value));
      case "outcome": {
        if (!value.equals(Invocation.OK) && !value.equals(ANY_ERROR) && !CODES.contains(value)) {
          throw invalid("query parameter 'outcome' must be ok, error or an error code such as syntax_error but was '"
              + shorten(value) + "'");
        }
        return withOutcome(value);
      }
      case "ref_prefix": return withRefPrefix(value);
      case "since": return withSince(instant(name, value));
      case "until": return withUntil(instant(name, value));
      case "limit": {
        if (!value.chars().allMatch(c -> c >= '0' && c <= '9') || value.length() > 9 || Integer.parseInt(value) < 1) {
          throw invalid("query parameter 'limit' must be a whole number from 1 but was '" + shorten(value) + "'");
        }
        return withLimit(Integer.parseInt(value));
      }
      case "after": {
        if (!IdBounds.isUuid(value)) {
          throw invalid("query parameter 'after' must be an invocation id (a UUID) but was '" + shorten(value) + "'");
        }
        return withAfter(value.toLowerCase(Locale.ROOT));
      }
      default: throw new AssertionError(name); // PARAMETERS lists every case above.
    }
  }

  private static int version(String name, String value) throws ToolException {
    try {
      return ToolId.parseVersion(value);
    } catch (IllegalArgumentException e) {
      throw invalid("query parameter '" + name + "' must hold a positive whole version number but was '" + shorten(value) + "'");
    }
  }

  private static Instant instant(String name, String value) throws ToolException {
    try {
      return OffsetDateTime.parse(value).toInstant();
    } catch (DateTimeException e) {
      throw invalid("query parameter '" + name + "' must be an ISO 8601 instant such as 2031-05-17T09:30:00Z but was '"
          + shorten(value) + "'");
    }
  }

  private static String shorten(String s) {
    return s.length() <= 60 ? s : s.substring(0, 59) + "…";
  }

  private static ToolException invalid(String detail) {
    return new ToolException(ErrorCode.INVALID_ARGUMENT, detail);
  }

  private static String withoutNul(String s) {
    return s == null || s.indexOf('\0') < 0 ? s : s.replace('\0', '\uFFFD');
  }

  private static void requireNonEmpty(String name, String value) {
    if (value != null && value.isEmpty()) {
      throw new IllegalArgumentException(name + " must not be empty");
    }
  }

  /**
   * Whose records a query may read: one key's, or, for an admin key, everyone's. Immutable. There is
   * no public constructor, so that a missing key id can never turn into "all keys".
   */
  public static final class Scope {
    private static final Scope ALL = new Scope(null);
    private final String keyId;

    private Scope(String keyId) {
      this.keyId = keyId;
    }

    /** The records made under {@code keyId}, and no others. */
    public static Scope key(String keyId) {
      Objects.requireNonNull(keyId, "keyId");
      if (keyId.isEmpty()) {
        throw new IllegalArgumentException("keyId must not be empty");
      }
      return new Scope(keyId);
    }

    /** Every record, whatever key made it: for admin keys only. */
    public static Scope all() {
      return ALL;
    }

    public boolean isAll() {
      return keyId == null;
    }

    /** The key whose records may be read; throws for {@link #all()}. */
    public String keyId() {
      if (keyId == null) {
        throw new IllegalStateException("the scope of all keys has no key id");
      }
      return keyId;
    }

    @Override
    public boolean equals(Object o) {
      return o instanceof Scope other && Objects.equals(keyId, other.keyId);
    }

    @Override
    public int hashCode() {
      return Objects.hashCode(keyId);
    }

    @Override
    public String toString() {
      return isAll() ? "all keys" : "key " + keyId;
    }
  }
}
